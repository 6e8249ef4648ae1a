// Bill of materials of one evaluated design. Pure: figures in, rows out.
import type { EvaluationResult } from '@shared/engine/index';
import { COPPER_DENSITY, LEAD_LENGTH, lengthWithLeads } from '@shared/shop/build-practice';
import { gapSensitivityText } from '@shared/shop/sheet-text';

export { COPPER_DENSITY, LEAD_LENGTH };
/** Tape overlap on a wrap (common practice, no source). */
const TAPE_OVERLAP = 1.2;

export interface BomRow {
  item: string;
  description: string;
  quantity: number;
  unit: string;
  note: string;
}

export interface BomInput {
  result: EvaluationResult;
  materialName: string;
}

const mm = (m: number, digits = 2) => (m * 1e3).toFixed(digits);

/** One conductor in hand: the winding's length + 2 leads (m), as on the winding sheet. */
export function wireLengthWithLeads(result: EvaluationResult): number {
  return lengthWithLeads(result.winding.wireLength);
}

/** Round wires in hand are that many conductors; litz and foil are one each. */
export function conductorsInHand(result: EvaluationResult): number {
  return result.wire.kind === 'litz' || result.wire.kind === 'foil' ? 1 : result.wire.strands;
}

/** Copper of all conductors in hand over their length with leads (kg). */
export function copperMass(result: EvaluationResult): number {
  return result.wire.copperArea * wireLengthWithLeads(result) * COPPER_DENSITY;
}

/**
 * What to build, exactly: a ground centre gap (and the spacer giving the same L, never half the gap: a spacer makes
 * two gaps in series), or a spacer under all legs.
 */
function coreGapNote(result: EvaluationResult): string {
  if (result.core.gapKind === 'distributed') return 'distributed gap in the material; no ground gap';
  if (result.gap.total <= 0) return 'ungapped';
  const change = gapSensitivityText(result.gap.sensitivity10um);
  if (result.gap.placement === 'spacer') {
    return `spacer ${mm(result.gap.spacer, 3)} mm thick under all legs (non-magnetic, e.g. polyester film), two gaps in series; no ground gap; ${change}`;
  }
  return `grind the centre leg to a gap of ${mm(result.gap.total, 3)} mm (${change}); same L without grinding: a spacer ${mm(result.gap.spacer, 3)} mm thick under all legs`;
}

export function buildBom({ result, materialName }: BomInput): BomRow[] {
  const ring = result.core.family === 'RING' || result.core.family === 'POWDER_TOROID';
  const rows: BomRow[] = [];
  const gapNote = coreGapNote(result);
  rows.push({ item: 'Core set', description: `${result.core.id} in ${materialName}`, quantity: 1, unit: 'set', note: gapNote });
  if (result.core.gapKind === 'air-gap' && result.gap.placement === 'spacer' && result.gap.total > 0) {
    rows.push({
      item: 'Spacer',
      description: `non-magnetic spacer film ${mm(result.gap.spacer, 3)} mm thick (e.g. polyester), cut to cover every leg`,
      quantity: 1,
      unit: 'set',
      note: 'the same thickness under the centre and the outer legs',
    });
  }
  if (!ring) {
    rows.push({
      item: 'Bobbin',
      description: `coil former for ${result.core.id}, ${result.winding.layers} layer(s) of ${result.winding.turnsPerLayer} turns`,
      quantity: 1,
      unit: 'pc',
      note: 'pin count and orientation to the board layout',
    });
    rows.push({
      item: 'Clips',
      description: `clamps or clips for ${result.core.id}`,
      quantity: 2,
      unit: 'pc',
      note: 'or glue the halves; keep the gap free of stress',
    });
  } else {
    rows.push({
      item: 'Edge insulation',
      description: 'coating or edge protection of the ring',
      quantity: 1,
      unit: 'pc',
      note: 'toroid: no bobbin',
    });
  }
  const length = wireLengthWithLeads(result);
  const inHand = conductorsInHand(result);
  const wireKind = result.wire.kind === 'litz' ? 'litz' : 'enamelled round copper wire (IEC 60317)';
  const foil = result.wire.kind === 'foil';
  rows.push({
    item: foil ? 'Copper foil' : 'Wire',
    description: foil
      ? `${result.wire.id}: ${mm(result.wire.strandDiameter, 3)} mm × ${mm(result.wire.copperArea / result.wire.strandDiameter, 1)} mm copper foil, one turn per layer, interlayer film between turns`
      : `${result.wire.id}: ${wireKind}, ${result.wire.strands} × ${mm(result.wire.strandDiameter, 3)} mm bare`,
    quantity: Number((inHand * length).toFixed(3)),
    unit: 'm',
    note:
      `total of ${inHand} conductor(s) in hand; each ${length.toFixed(3)} m = ${result.turns} turns × ${mm(result.winding.meanTurnLength, 1)} mm mean turn ` +
      `(${result.winding.wireLength.toFixed(3)} m) plus ${mm(LEAD_LENGTH, 0)} mm lead at each end, as on the winding sheet`,
  });
  rows.push({
    item: 'Copper mass',
    description: `copper of all ${inHand} conductor(s) in hand, winding and leads (density ${COPPER_DENSITY} kg/m³)`,
    quantity: Number((copperMass(result) * 1e3).toFixed(2)),
    unit: 'g',
    note: 'copper only, without enamel',
  });
  const wrap = result.winding.meanTurnLength * TAPE_OVERLAP;
  const tapeLayers = Math.max(0, result.winding.layers - 1) + 1;
  rows.push({
    item: 'Tape',
    description: ring ? 'polyester or polyimide tape, outer wrap' : 'polyester tape, interlayer and outer wrap, bobbin width',
    quantity: Number((wrap * tapeLayers).toFixed(3)),
    unit: 'm',
    note: `${tapeLayers} wrap(s) with ${Math.round((TAPE_OVERLAP - 1) * 100)} % overlap; class at least the insulation class of the design`,
  });
  return rows;
}
