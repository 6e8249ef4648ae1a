import type { SearchCandidate, SearchResult } from '@shared/engine/index';

export interface CandidateRow {
  key: string;
  rank: number | null;
  feasible: boolean;
  pareto: boolean;
  coreId: string;
  family: string;
  materialId: string;
  materialName: string;
  wireId: string;
  turns: number | null;
  totalLoss: number | null;
  volume: number | null;
  rise: number | null;
  fill: number | null;
  fluxMargin: number | null;
  reasons: string;
  candidate: SearchCandidate | null;
}

const FAMILY_PREFIXES: [RegExp, string][] = [
  [/^ETD/, 'ETD'],
  [/^EFD/, 'EFD'],
  [/^EQ/, 'EQ'],
  [/^PQ/, 'PQ'],
  [/^RM/, 'RM'],
  [/^E\d/, 'E'],
  [/^P\d/, 'POT'],
  [/^R\d/, 'RING'],
  [/^T\d/, 'POWDER_TOROID'],
];

/** Family of a catalogue core from its name, for rows the search could not evaluate. */
export function familyOfCoreId(coreId: string): string {
  return FAMILY_PREFIXES.find(([pattern]) => pattern.test(coreId))?.[1] ?? 'other';
}

export function candidateRows(search: SearchResult, materialNames: ReadonlyMap<string, string>): CandidateRow[] {
  const feasible = search.candidates.map((c): CandidateRow => {
    const r = c.result;
    return {
      key: `${r.core.id}|${r.material.id}|${c.wire.id}`,
      rank: c.rank,
      feasible: true,
      pareto: c.pareto,
      coreId: r.core.id,
      family: r.core.family,
      materialId: r.material.id,
      materialName: materialNames.get(r.material.id) ?? r.material.name,
      wireId: c.wire.id,
      turns: r.turns,
      totalLoss: r.totalLoss,
      volume: r.core.ve,
      rise: r.thermal.rise,
      fill: r.winding.copperFill,
      fluxMargin: r.flux.saturationMargin,
      reasons: r.issues
        .filter((i) => i.severity === 'warning')
        .map((i) => i.message)
        .join(' '),
      candidate: c,
    };
  });
  const infeasible = search.infeasible.map((x, i): CandidateRow => ({
    key: `x${i}|${x.coreId}|${x.materialId ?? ''}`,
    rank: null,
    feasible: false,
    pareto: false,
    coreId: x.coreId,
    family: familyOfCoreId(x.coreId),
    materialId: x.materialId ?? '',
    materialName: x.materialId ? (materialNames.get(x.materialId) ?? x.materialId) : '—',
    wireId: x.wireId ?? '—',
    turns: x.turns ?? null,
    totalLoss: x.totalLoss ?? null,
    volume: null,
    rise: null,
    fill: null,
    fluxMargin: null,
    reasons: x.reasons.map((r) => r.message).join(' '),
    candidate: null,
  }));
  return [...feasible, ...infeasible];
}
