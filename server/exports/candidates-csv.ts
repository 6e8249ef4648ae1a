// Candidates of a search and the bill of materials as CSV, each ending in the sheet's caution row. Cells that a spreadsheet
// would run as formulas are escaped.
import { stringify } from 'csv-stringify/sync';
import type { SearchResult } from '@shared/engine/index';
import { SHEET_CAUTION } from '@shared/shop/sheet';

export const CANDIDATE_COLUMNS = [
  'design',
  'title',
  'rank',
  'pareto',
  'feasible',
  'extrapolated_loss_data',
  'core',
  'material',
  'conductor',
  'wire',
  'turns',
  'gap_placement',
  'gap_mm',
  'spacer_mm',
  'inductance_uH',
  'total_loss_W',
  'copper_dc_loss_W',
  'copper_ac_loss_W',
  'core_loss_W',
  'core_volume_cm3',
  'mass_g',
  'temperature_rise_K',
  'copper_fill',
  'saturation_margin',
  'reasons',
] as const;

const round = (x: number, digits: number) => Number(x.toFixed(digits));

export function candidatesCsv(
  design: { number: string; title: string },
  search: SearchResult,
  materialNames: ReadonlyMap<string, string>,
): string {
  const rows: (string | number | boolean)[][] = [];
  for (const c of search.candidates) {
    const r = c.result;
    const airGap = r.core.gapKind === 'air-gap';
    rows.push([
      design.number,
      design.title,
      c.rank,
      c.pareto,
      true,
      c.extrapolated,
      r.core.id,
      materialNames.get(r.material.id) ?? r.material.name,
      c.conductor,
      c.wire.id,
      r.turns,
      airGap ? r.gap.placement : '',
      // The sum of the gaps in the path: the ground gap, or both gaps of a spacer.
      round(r.gap.total * 1e3, 4),
      airGap && r.gap.placement === 'spacer' ? round(r.gap.spacer * 1e3, 4) : '',
      round(r.inductance.atLoad * 1e6, 4),
      round(r.totalLoss, 4),
      round(r.copper.dcLoss, 4),
      round(r.copper.acLoss, 4),
      round(r.coreLoss.loss, 4),
      round(r.core.ve * 1e6, 4),
      round(c.mass * 1e3, 2),
      round(r.thermal.rise, 2),
      round(r.winding.copperFill, 4),
      round(r.flux.saturationMargin, 4),
      r.issues
        .filter((i) => i.severity === 'warning')
        .map((i) => i.message)
        .join(' | '),
    ]);
  }
  for (const x of search.infeasible) {
    rows.push([
      design.number,
      design.title,
      '',
      false,
      false,
      '',
      x.coreId,
      x.materialId ? (materialNames.get(x.materialId) ?? x.materialId) : '',
      '',
      x.wireId ?? '',
      x.turns ?? '',
      x.placement ?? '',
      '',
      '',
      '',
      x.totalLoss !== undefined ? round(x.totalLoss, 4) : '',
      '',
      '',
      '',
      '',
      '',
      '',
      '',
      '',
      x.reasons.map((i) => i.message).join(' | '),
    ]);
  }
  rows.push(cautionRow(CANDIDATE_COLUMNS.length));
  return stringify(rows, {
    header: true,
    columns: [...CANDIDATE_COLUMNS],
    escape_formulas: true,
    cast: { boolean: (b) => (b ? 'yes' : 'no') },
  });
}

/**
 * The sheet's caution as the file's last row ('Caution' in the first column, the text in the second, the rest empty):
 * a spreadsheet shows it, and the file stays one table a parser reads (skip the row whose first cell is 'Caution').
 */
export function cautionRow(columns: number): string[] {
  return ['Caution', SHEET_CAUTION, ...Array<string>(columns - 2).fill('')];
}

export function bomCsv(rows: readonly { item: string; description: string; quantity: number; unit: string; note: string }[]): string {
  return stringify([...rows.map((r) => [r.item, r.description, r.quantity, r.unit, r.note]), cautionRow(5)], {
    header: true,
    columns: ['item', 'description', 'quantity', 'unit', 'note'],
    escape_formulas: true,
  });
}
