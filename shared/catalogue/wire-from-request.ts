import type { WireOption } from '../engine/types';
import { foilOption } from './foil';
import {
  awgDiameter,
  awgLabel,
  enamelledDiameter,
  formatNominalMillimetres,
  litzBundleDiameter,
  LITZ_STRAND_GRADE,
  type EnamelGrade,
  type WireTables,
} from './wire';

/** A wire as a person names it: a kind, a bare strand size (or AWG gauge) and a count. */
export interface WireChoice {
  kind: 'awg' | 'metric' | 'litz' | 'foil';
  strandDiameter?: number;
  awg?: number;
  strands: number;
  grade?: EnamelGrade;
}

// Serving thickness per side assumed for a litz bundle named only by its strands (common practice, no source).
const DEFAULT_LITZ_SERVING = 0.03e-3;

/** The AWG gauge whose ASTM B258 diameter matches a bare diameter to 0.1 %, if any. */
function gaugeOf(diameter: number): number | undefined {
  const n = Math.round(36 - 39 * (Math.log(diameter / 0.127e-3) / Math.log(92)));
  return Math.abs(awgDiameter(n) - diameter) <= 1e-3 * diameter ? n : undefined;
}

/** Turns a named wire into the engine's WireOption, taking overall diameters from the IEC 60317 table. */
export function wireOptionFromChoice(choice: WireChoice, tables: WireTables): WireOption {
  const grade = choice.grade ?? 2;
  if (choice.kind === 'foil') return foilOption(choice.strandDiameter!);
  if (choice.kind === 'litz') {
    const strandDiameter = choice.strandDiameter ?? awgDiameter(choice.awg ?? 38);
    const overallDiameter = litzBundleDiameter(
      { strandDiameter, strandCount: choice.strands, servingThickness: DEFAULT_LITZ_SERVING, source: 'named by the user' },
      tables.metric,
    );
    return {
      id: `litz ${choice.strands} × ${formatNominalMillimetres(strandDiameter)} mm`,
      kind: 'litz',
      strandDiameter,
      strands: choice.strands,
      overallDiameter,
      conductorsPerTurn: 1,
      grade: LITZ_STRAND_GRADE,
    };
  }
  const gauge = choice.kind === 'awg' ? (choice.awg ?? gaugeOf(choice.strandDiameter!)) : undefined;
  const bare = choice.kind === 'awg' && choice.awg !== undefined ? awgDiameter(choice.awg) : choice.strandDiameter!;
  const listed = tables.metric.find((size) => Math.abs(size.nominalDiameter - bare) < 1e-9);
  const overallDiameter = listed
    ? grade === 1
      ? listed.grade1MaxDiameter
      : listed.grade2MaxDiameter
    : enamelledDiameter(bare, grade, tables.metric);
  const label = gauge !== undefined ? `AWG ${awgLabel(gauge)}` : `${formatNominalMillimetres(bare)} mm`;
  return {
    id: `${label} ×${choice.strands} G${grade}`,
    kind: choice.kind,
    strandDiameter: bare,
    strands: choice.strands,
    overallDiameter,
    conductorsPerTurn: choice.strands,
    grade,
  };
}
