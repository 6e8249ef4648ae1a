import type { ConductorType, EngineIssue, SearchCandidate, SearchResult } from '@shared/engine/index';
import { toDisplay } from '@shared/units/index';

/** A warning shown as a compact mark in the table: a short word, an accessible name and the full text on demand. */
export interface CandidateMark {
  kind: string;
  short: string;
  name: string;
  text: string;
}

/** One ranked candidate as the table and the chart show it (SI values; the template picks the display unit). */
export interface CandidateRow {
  key: string;
  rank: number;
  pareto: boolean;
  paretoByMass: boolean;
  extrapolated: boolean;
  conductor: ConductorType;
  coreId: string;
  materialName: string;
  wireId: string;
  turns: number;
  /** Total air gap in the path (m); null for a distributed-gap core. */
  gap: number | null;
  /** Spacer thickness (m) of a spacer design (two gaps of it in series); null for a ground gap or no gap. */
  spacer: number | null;
  totalLoss: number;
  volume: number;
  mass: number;
  /** Loss × core volume in W·cm³: the balanced objective's figure. */
  lossVolume: number;
  rise: number;
  fill: number;
  fluxMargin: number;
  marks: CandidateMark[];
  /** "RM10 · Demo ferrite Teal · foil 0.15 mm": a point's name on the chart and in the keyboard list. */
  label: string;
  candidate: SearchCandidate;
}

/** A core × material the search could not make meet every limit, with the reasons. */
export interface InfeasibleRow {
  key: string;
  coreId: string;
  materialName: string;
  wireId: string;
  turns: number | null;
  /** 'ground centre gap' or 'spacer under all legs' for the closest air-gap miss; '—' otherwise. */
  gap: string;
  totalLoss: number | null;
  reasons: string;
}

const LOSS_FIT_CODES = new Set(['loss-fit-frequency', 'loss-fit-flux']);

const MARK_WORDS: Record<string, { short: string; name: string }> = {
  'fringing-range': { short: 'Fringing', name: 'Gap beyond the fringing formula' },
  'flux-limit': { short: 'B limit', name: 'Peak flux above the design limit' },
  'thermal-iteration': { short: 'T ≈', name: 'Temperature approximate' },
  'foil-beside-gap': { short: 'Foil/gap', name: 'Foil beside a gap: edge loss not modelled; ranked after fully modelled parts' },
  'wires-in-hand': { short: 'Share', name: 'Wires in hand share the ripple unequally unless twisted' },
};

/** Shown as the first mark of a candidate whose core loss rests on data outside the material's fitted range. */
export const EXTRAPOLATED_MARK = { short: 'Extrap.', name: 'Extrapolated loss data' } as const;

/**
 * The candidate's warnings as marks. Loss-fit warnings make one "extrapolated" mark; warnings of the operating
 * point (the same on every candidate) are left to the operating-point panel.
 */
export function candidateMarks(c: SearchCandidate): CandidateMark[] {
  const sharedCodes = new Set(c.result.operatingPoint.warnings.map((w) => w.code));
  const warnings = c.result.issues.filter((i) => i.severity === 'warning' && !sharedCodes.has(i.code));
  const fit = warnings.filter((w) => LOSS_FIT_CODES.has(w.code));
  const marks: CandidateMark[] = [];
  if (c.extrapolated || fit.length) {
    const text = fit.length
      ? fit.map((w) => w.message).join(' ')
      : 'The core loss rests on material data used outside its fitted frequency or flux range.';
    marks.push({ kind: 'extrapolated', ...EXTRAPOLATED_MARK, text: `${text} Ranked after every candidate on fitted data.` });
  }
  for (const w of warnings.filter((x) => !LOSS_FIT_CODES.has(x.code))) marks.push(markOf(w));
  return marks;
}

function markOf(issue: EngineIssue): CandidateMark {
  const words = MARK_WORDS[issue.code] ?? { short: 'Warning', name: 'Warning' };
  return { kind: issue.code, ...words, text: issue.message };
}

export function candidateRow(c: SearchCandidate, materialNames: ReadonlyMap<string, string>): CandidateRow {
  const r = c.result;
  const materialName = materialNames.get(r.material.id) ?? r.material.name;
  return {
    key: `${r.core.id}|${r.material.id}|${c.wire.id}|${r.turns}|${c.placement}`,
    rank: c.rank,
    pareto: c.pareto,
    paretoByMass: c.paretoByMass,
    extrapolated: c.extrapolated,
    conductor: c.conductor,
    coreId: r.core.id,
    materialName,
    wireId: c.wire.id,
    turns: r.turns,
    gap: r.core.gapKind === 'air-gap' ? r.gap.total : null,
    spacer: r.core.gapKind === 'air-gap' && c.placement === 'spacer' ? r.gap.spacer : null,
    totalLoss: r.totalLoss,
    volume: c.volume,
    mass: c.mass,
    lossVolume: r.totalLoss * toDisplay(c.volume, 'cm³'),
    rise: r.thermal.rise,
    fill: r.winding.copperFill,
    fluxMargin: r.flux.saturationMargin,
    marks: candidateMarks(c),
    label: `${r.core.id} · ${materialName} · ${c.wire.id}${c.placement === 'spacer' && r.core.gapKind === 'air-gap' ? ' · spacer' : ''}`,
    candidate: c,
  };
}

const PLACEMENT_WORDS = { ground: 'ground centre gap', spacer: 'spacer under all legs' } as const;

export function infeasibleRows(search: SearchResult, materialNames: ReadonlyMap<string, string>): InfeasibleRow[] {
  return search.infeasible.map((x, i) => ({
    key: `${i}|${x.coreId}|${x.materialId ?? ''}`,
    coreId: x.coreId,
    materialName: x.materialId ? (materialNames.get(x.materialId) ?? x.materialId) : '—',
    wireId: x.wireId ?? '—',
    turns: x.turns ?? null,
    gap: x.placement ? PLACEMENT_WORDS[x.placement] : '—',
    totalLoss: x.totalLoss ?? null,
    reasons: x.reasons.map((r) => r.message).join(' '),
  }));
}
