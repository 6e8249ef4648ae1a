import { describe, expect, it } from 'vitest';
import { fringingFactor, spacerEquivalentGap } from '@shared/engine/gap';
import { gapFieldLoss, gapFieldSum, gapFieldSumInWindow, gapMmfShare, transverseFieldLoss } from '@shared/engine/gap-field-loss';
import { loadCoreCatalogue } from '../../../core-data/catalogue.ts';
import { solveFieldDesign } from '../../../server/solvers/field/design-field.ts';
import type { FieldDesignInput } from '../../../server/solvers/field/design-model.ts';
import { revolvedCore } from '../../../server/solvers/field/gapped-core.ts';

// The engine's gap-field loss against the axisymmetric field solution (gmsh + GetDP, massive conductors) of the same
// winding: 0.5 mm wires (0.55 mm over insulation) at 100 kHz, μr 2000, on a pot core (P26/16) and an ETD34, one to
// three layers, ground gaps 0.3 and 1 mm and a 0.5 mm spacer, keep-out (leg face to the wire's outside) 0.5–3 mm. The
// field's gap term is its AC resistance with the gap less that of the same winding on the ungapped core.
// Two engine figures: the search's (gapFieldSum: Roshen's half-plane field, W. A. Roshen, IEEE Trans. Magnetics
// 43(8), 2007, its normal component only, no cross term) and the design page's (gapFieldSumInWindow: the method of
// images in the window, J. Hu and C. R. Sullivan, IEEE Trans. Power Electronics 16(4), 2001, with the gap as a strip
// current, the cross term and the round leg's √(r_s/r)). Measured (this file's table):
// - image method: P26/16 within −12…+7 % everywhere; ETD34 within −14…−1 % at 0.5 mm keep-out and −17…−33 % at
//   1 mm, but −34…−71 % at 2–3 mm (there the term is a few % of the AC resistance: the difference of two large
//   figures; which approximation leaves the rest — the dropped u/(4r²) of the axisymmetric substitution, the
//   neighbours' shielding — is not resolved);
// - Roshen's half-plane (the search's): +8…+273 % on one layer, −53…+21 % with two or three layers (the cross term it
//   leaves out grows with the layers), −19 % on one long layer at 0.5 mm.
// The spacer's term is near zero or negative (its two gaps' field partly cancels the winding's own): the image method
// finds the sign at 2 mm keep-out (within 33 %), not at 0.5 mm; Roshen's gives +1100…+1300 % there.

const RHO = 1.7241e-8; // copper at 20 °C (IEC 60028)
const FREQUENCY = 100e3;
const PERMEABILITY = 2000;
const D = 0.5e-3;
const OVERALL = 0.55e-3;
const cores = loadCoreCatalogue();

interface Case {
  id: string;
  placement: 'ground' | 'spacer';
  gap: number;
  keepOut: number;
  turns: number;
  perLayer: number;
  layers: number;
  /** |image method / field − 1| within this (measured, with a margin of a few %). */
  imageBand: number;
}

const design = (c: Case, gap: number): FieldDesignInput => ({
  core: cores.find((k) => k.id === c.id)!,
  permeability: PERMEABILITY,
  gap: { placement: gap > 0 ? c.placement : 'ground', length: gap },
  turns: c.turns,
  winding: { turnsPerLayer: c.perLayer, layers: c.layers },
  wire: { kind: 'metric', strandDiameter: D, strands: 1, overallDiameter: OVERALL, conductorsPerTurn: 1 },
  clearance: c.keepOut,
});

/** Both engine figures as resistances at one frequency (Ω): P/I_rms² at I_rms = 1 A. */
function engineGapResistance(c: Case): { search: number; image: number } {
  const core = cores.find((k) => k.id === c.id)!;
  const r = revolvedCore(core);
  const spacer = c.placement === 'spacer';
  const ratio = core.centreToOuterLegAreaRatio ?? 1;
  const equivalent = spacer ? spacerEquivalentGap(c.gap, ratio) : c.gap;
  const share = gapMmfShare(equivalent, fringingFactor(equivalent, core.ae, core.windowHeight), core.le, PERMEABILITY);
  const layout = {
    turns: c.turns,
    turnsPerLayer: c.perLayer,
    layers: c.layers,
    conductorsPerTurn: 1,
    overallDiameter: OVERALL,
    keepOut: c.keepOut,
    // The field model's turns are rings about the round-leg equivalent of the core's centre leg.
    legPerimeter: 2 * Math.PI * r.legRadius,
  };
  const sources = {
    centreGap: c.gap,
    centreShare: spacer ? share / (1 + ratio) : share,
    outerGap: spacer ? c.gap : 0,
    outerShare: spacer ? (share * ratio) / (1 + ratio) : 0,
    windowWidth: r.windowOuter - r.windowInner,
  };
  const perField = transverseFieldLoss(D, FREQUENCY, RHO);
  const height = core.windowHeight + (spacer ? c.gap : 0);
  return {
    search: gapFieldLoss(c.turns, gapFieldSum(layout, sources), perField, 1),
    image: gapFieldLoss(c.turns, gapFieldSumInWindow(layout, sources, { height }), perField, 1),
  };
}

const cases: Case[] = [];
const add = (
  id: string,
  keepOuts: number[],
  gaps: number[],
  bands: number[],
  turns = 8,
  perLayer = 8,
  layers = 1,
  placement: Case['placement'] = 'ground',
) =>
  keepOuts.forEach((keepOut, i) =>
    gaps.forEach((gap) => cases.push({ id, placement, gap, keepOut, turns, perLayer, layers, imageBand: bands[i]! })),
  );
// P26/16's window is 4.85 mm wide: one 0.55 mm layer leaves room for keep-outs up to 2.1 mm, two for 1.6 mm.
// The suite runs 22 of the 30 cases measured (this file's header and README give all 30; the 1 mm keep-outs on one
// layer, the ETD34's 3 mm on two layers and 2 mm on three are left out to keep the suite's time).
add('P26/16', [0.5e-3, 2e-3], [0.3e-3, 1e-3], [0.15, 0.15]);
add('P26/16', [0.5e-3, 1.5e-3], [0.3e-3, 1e-3], [0.15, 0.15], 16, 8, 2);
add('ETD34/17/11', [0.5e-3, 2e-3], [0.3e-3, 1e-3], [0.15, 1.6]);
add('ETD34/17/11', [3e-3], [1e-3], [1.4]);
add('ETD34/17/11', [0.5e-3, 2e-3], [0.3e-3, 1e-3], [0.2, 0.6], 16, 8, 2);
add('ETD34/17/11', [0.5e-3], [1e-3], [0.15], 24, 8, 3);
add('ETD34/17/11', [0.5e-3, 2e-3], [1e-3], [0.15, 0.2], 20, 20, 1);
add('P26/16', [2e-3], [0.5e-3], [0.15], 8, 8, 1, 'spacer');
add('ETD34/17/11', [2e-3], [0.5e-3], [0.4], 8, 8, 1, 'spacer');

/**
 * The half-plane estimate (the search's and the design figures') within its measured envelope (this file's table,
 * a few % of margin): −19…+44 % on ground gaps at 0.5 mm keep-out, −53…+273 % at 1–3 mm where the term is small.
 * The spacer's near-zero term has no band (the half-plane gives it > +1000 %).
 */
function halfPlaneBand(c: Case): [number, number] | undefined {
  if (c.placement === 'spacer') return undefined;
  return c.keepOut <= 0.5e-3 ? [-0.25, 0.5] : [-0.6, 2.9];
}

/** Runs `task` over `items` with at most `width` at a time (the field solves use a core each), answers in order. */
async function inTurns<T, R>(items: readonly T[], width: number, task: (item: T) => Promise<R>): Promise<R[]> {
  const answers: R[] = new Array(items.length);
  let next = 0;
  const lane = async () => {
    while (next < items.length) {
      const i = next++;
      answers[i] = await task(items[i]!);
    }
  };
  await Promise.all(Array.from({ length: width }, lane));
  return answers;
}

const label = (c: Case) =>
  `${c.id} ${c.placement} ${c.gap * 1e3} mm, keep-out ${c.keepOut * 1e3} mm, ${c.layers}×${c.perLayer}${c.turns < c.layers * c.perLayer ? ` (${c.turns})` : ''}`;

describe('gap-field loss: the engine against the field solution', () => {
  it('every case: the image method and the half-plane estimate each within its measured band', async () => {
    const options = { resistivity: RHO, frequencies: [FREQUENCY] };
    const plain = new Map<string, Promise<number>>();
    const rows: string[] = ['case | field ΔR mΩ | image mΩ (%) | half-plane mΩ (%) | field Rac mΩ'];
    const failures: string[] = [];
    const solved = await inTurns(cases, 2, async (c) => {
      const refKey = `${c.id}|${c.keepOut}|${c.turns}|${c.perLayer}|${c.layers}`;
      if (!plain.has(refKey))
        plain.set(
          refKey,
          solveFieldDesign(design(c, 0), options).then((r) => r.harmonics[0]!.resistance),
        );
      const gapped = (await solveFieldDesign(design(c, c.gap), options)).harmonics[0]!.resistance;
      return { gapped, field: gapped - (await plain.get(refKey)!) };
    });
    cases.forEach((c, i) => {
      const { gapped, field } = solved[i]!;
      const { search, image } = engineGapResistance(c);
      const pc = (x: number) => `${((x / field - 1) * 100).toFixed(0)} %`;
      rows.push(
        `${label(c)} | ${(field * 1e3).toFixed(2)} | ${(image * 1e3).toFixed(2)} (${pc(image)}) | ${(search * 1e3).toFixed(2)} (${pc(search)}) | ${(gapped * 1e3).toFixed(1)}`,
      );
      if (!(Math.abs(image / field - 1) <= c.imageBand)) failures.push(`${label(c)}: image ${pc(image)}, band ±${c.imageBand * 100} %`);
      const band = halfPlaneBand(c);
      if (band && !(search / field - 1 >= band[0] && search / field - 1 <= band[1]))
        failures.push(`${label(c)}: half-plane ${pc(search)}, band ${band[0] * 100}…+${band[1] * 100} %`);
    });
    console.log(rows.join('\n'));
    expect(failures).toEqual([]);
  }, 900_000);
});
