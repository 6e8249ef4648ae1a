import type { RankBy, SearchResult } from '@shared/engine/index';

/** What each objective means to a designer: the control's label, how the ranked list reads, the column it sorts. */
export interface Objective {
  value: RankBy;
  label: string;
  /** "smallest part first": completes "Candidates 1–20 of 388, …". */
  order: string;
  /** The table column whose header ranks by this objective. */
  column: 'volume' | 'totalLoss' | 'rise' | 'lossVolume';
  explanation: string;
}

export const OBJECTIVES: readonly Objective[] = [
  {
    value: 'smallest',
    label: 'Smallest part',
    order: 'smallest part first',
    column: 'volume',
    explanation: 'The smallest core that meets every limit; equal sizes by loss',
  },
  {
    value: 'loss',
    label: 'Lowest loss',
    order: 'lowest loss first',
    column: 'totalLoss',
    explanation: 'The lowest total loss (copper and core), whatever the size',
  },
  {
    value: 'temperature',
    label: 'Lowest rise',
    order: 'lowest temperature rise first',
    column: 'rise',
    explanation: 'The lowest temperature rise above ambient',
  },
  {
    value: 'balanced',
    label: 'Balanced',
    order: 'lowest loss × volume first',
    column: 'lossVolume',
    explanation: 'The lowest loss × core volume: halving either counts the same',
  },
];

export function objectiveOf(rankBy: RankBy): Objective {
  return OBJECTIVES.find((o) => o.value === rankBy)!;
}

const count = (n: number) => n.toLocaleString('en-US');

/**
 * "Candidates 21–40 of 388, smallest part first; 37 rest on extrapolated loss data and follow the in-fit ones.
 * 388 feasible of 5,210 evaluated (79 cores × 5 materials) in 84 ms."
 */
export function searchStatus(result: SearchResult, ms: number): string {
  const { page, counts } = result;
  const order = objectiveOf(result.rankBy).order;
  const evaluated = `${count(counts.feasible)} feasible of ${count(counts.evaluated)} evaluated (${count(counts.cores)} cores × ${count(counts.materials)} materials) in ${Math.round(ms)} ms.`;
  if (page.total === 0) return `No candidate meets every limit; the reasons are listed under the table. ${evaluated}`;
  const first = Math.min(page.offset + 1, page.total);
  const last = Math.min(page.offset + result.candidates.length, page.total);
  const extrapolated = extrapolatedClause(counts.extrapolated, counts.feasible);
  return `Candidates ${count(first)}–${count(last)} of ${count(page.total)}, ${order}${extrapolated}. ${evaluated}`;
}

function extrapolatedClause(extrapolated: number, feasible: number): string {
  if (!extrapolated) return '';
  if (extrapolated >= feasible) return '; every one rests on extrapolated loss data';
  const one = extrapolated === 1;
  return `; ${count(extrapolated)} ${one ? 'rests' : 'rest'} on extrapolated loss data and ${one ? 'follows' : 'follow'} the in-fit ones`;
}
