// A second estimate of the winding loss from the gap's field, shown beside the design's own figure as a cross-check.
//
// The design's figure (and the search's) takes Roshen's half-plane field at every conductor (gapFieldSum, fast enough
// for every candidate). This one sums the whole window field by the method of images with the cross term and the
// core's own MMF (gapFieldSumInWindow: J. Hu and C. R. Sullivan, IEEE Trans. Power Electronics 16(4), 2001, from
// memory), O(conductors²): a few milliseconds per design, so it runs once, for the design page, not in the search.
// Against the axisymmetric field solution (tests/unit/solvers/gap-field-loss.test.ts) it is the closer of the two
// where the term matters: −14…+7 % at 0.5 mm keep-out on a pot core and an ETD, −12…+7 % everywhere on the pot core;
// on the tall ETD window at 1–3 mm it reads low (−17…−151 %, where the term is a few % of the AC resistance).
// Both estimates share the harmonics' per-field loss at the design's winding temperature, so their ratio is the
// ratio of the two field sums; the temperatures are the design's (not iterated with this loss).
import type { EvaluateInput, EvaluationResult } from './evaluate';
import { CandidateFigures, gapLossScale, gapLossScaleInWindow, prepareSpec } from './kernel';
import { designMagnetics } from './magnetic-design';
import { layWinding } from './winding';

/** The image method's winding loss from the gap's field for an evaluated design (W); undefined where it has none. */
export function gapLossByWindowImages(input: EvaluateInput, result: EvaluationResult): number | undefined {
  const gapLoss = result.copper.gapLoss;
  const keepOut = result.winding.keepOut;
  if (!(gapLoss !== undefined && gapLoss > 0 && keepOut !== undefined)) return undefined;
  const ctx = prepareSpec(input.spec, input.limits);
  const mag = designMagnetics(input.core, input.material, ctx, input.turns, input.gap, input.placement);
  const layout = new CandidateFigures();
  layWinding(mag.turns, input.wire, input.core, layout);
  const halfPlane = gapLossScale(input.core, input.material, mag, layout, input.wire, keepOut);
  if (!(halfPlane > 0)) return undefined;
  return (gapLoss * gapLossScaleInWindow(input.core, input.material, mag, layout, input.wire, keepOut)) / halfPlane;
}
