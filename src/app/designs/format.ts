import { formatEngineering, formatQuantity, type QuantityKind } from '@shared/units/index';

/** Display helpers for templates: SI in, engineering notation out; '—' when absent. */
export function show(value: number | null | undefined, kind: QuantityKind, digits = 4): string {
  return value === null || value === undefined || !Number.isFinite(value) ? '—' : formatQuantity(value, kind, digits);
}

export function showUnit(value: number | null | undefined, symbol: string, digits = 4): string {
  return value === null || value === undefined || !Number.isFinite(value) ? '—' : formatEngineering(value, symbol, digits);
}

export function percent(value: number | null | undefined, digits = 1): string {
  return value === null || value === undefined || !Number.isFinite(value) ? '—' : `${(value * 100).toFixed(digits)} %`;
}

/** A revision status as people read it. */
export const STATUS_LABELS: Record<string, string> = {
  draft: 'Draft',
  in_review: 'In review',
  approved: 'Approved',
  released: 'Released',
  superseded: 'Superseded',
};
