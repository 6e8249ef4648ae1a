// Round enamelled wire (AWG and IEC 60317 metric sizes) and litz bundles, and the
// list of conductor options the design search tries. Pure: the tables come in as
// arguments (core-data/wire-catalogue.ts loads the shipped ones).

import { COPPER_RESISTIVITY_20C } from '@shared/engine/constants';
import type { WireOption } from '@shared/engine/types';

// ASTM B258: AWG 36 is 0.005 in and AWG 0000 is 0.46 in; 39 equal ratio steps span them (0.46/0.005 = 92).
const AWG_36_DIAMETER = 0.127e-3;
const AWG_SPAN_RATIO = 92;
const AWG_SPAN_STEPS = 39;

/** Gauge number of an n/0 size for the AWG formula: 4/0 → −3. */
export function awgNumberOfAught(zeros: number): number {
  return 1 - zeros;
}

/** Bare diameter (m) of AWG gauge n; pass awgNumberOfAught(m) for m/0 sizes. */
export function awgDiameter(gauge: number): number {
  return AWG_36_DIAMETER * AWG_SPAN_RATIO ** ((36 - gauge) / AWG_SPAN_STEPS);
}

export function awgLabel(gauge: number): string {
  return gauge <= 0 ? `${1 - gauge}/0` : String(gauge);
}

export function roundWireArea(diameter: number): number {
  return (Math.PI * diameter ** 2) / 4;
}

/** DC resistance per metre of one round copper conductor at 20 °C (Ω/m). */
export function resistancePerMetre20(diameter: number): number {
  return COPPER_RESISTIVITY_20C / roundWireArea(diameter);
}

/** An IEC 60317 nominal size with its maximum overall diameters, in metres. */
export interface MetricWireSize {
  nominalDiameter: number;
  grade1MaxDiameter: number;
  grade2MaxDiameter: number;
  source: string;
}

/** A litz construction, in metres: strand nominal diameter, strand count, serving thickness per side. */
export interface LitzConstruction {
  strandDiameter: number;
  strandCount: number;
  servingThickness: number;
  source: string;
}

export interface WireTables {
  metric: readonly MetricWireSize[];
  litz: readonly LitzConstruction[];
}

export type EnamelGrade = 1 | 2;

function gradeDiameter(size: MetricWireSize, grade: EnamelGrade): number {
  return grade === 1 ? size.grade1MaxDiameter : size.grade2MaxDiameter;
}

/**
 * Overall diameter of an enamelled wire of any bare diameter: the enamel build (overall − bare)
 * interpolated linearly between the neighbouring IEC 60317 sizes; beyond the table the end
 * size's build is scaled in proportion to the diameter. Used for AWG sizes, which IEC 60317
 * does not list.
 */
export function enamelledDiameter(bareDiameter: number, grade: EnamelGrade, metric: readonly MetricWireSize[]): number {
  if (metric.length === 0) throw new RangeError('enamelledDiameter needs at least one IEC 60317 size');
  const sizes = [...metric].sort((a, b) => a.nominalDiameter - b.nominalDiameter);
  const build = (size: MetricWireSize) => gradeDiameter(size, grade) - size.nominalDiameter;
  const first = sizes[0]!;
  const last = sizes[sizes.length - 1]!;
  if (bareDiameter <= first.nominalDiameter) return bareDiameter + (build(first) * bareDiameter) / first.nominalDiameter;
  if (bareDiameter >= last.nominalDiameter) return bareDiameter + (build(last) * bareDiameter) / last.nominalDiameter;
  const upperIndex = sizes.findIndex((size) => size.nominalDiameter >= bareDiameter);
  const upper = sizes[upperIndex]!;
  const lower = sizes[upperIndex - 1]!;
  const fraction = (bareDiameter - lower.nominalDiameter) / (upper.nominalDiameter - lower.nominalDiameter);
  return bareDiameter + build(lower) + fraction * (build(upper) - build(lower));
}

// Bundle diameter ≈ 1.15–1.2·√n·(strand overall diameter) plus serving; the upper end keeps
// window-fill estimates on the safe side.
export const LITZ_BUNDLE_FACTOR = 1.2;
/** Litz strands are normally grade 1 enamelled. */
export const LITZ_STRAND_GRADE: EnamelGrade = 1;

export function litzBundleDiameter(construction: LitzConstruction, metric: readonly MetricWireSize[]): number {
  const strandOverall = enamelledDiameter(construction.strandDiameter, LITZ_STRAND_GRADE, metric);
  return LITZ_BUNDLE_FACTOR * Math.sqrt(construction.strandCount) * strandOverall + 2 * construction.servingThickness;
}

/** "0.50", "0.112", "1.00": the way IEC 60317 sizes are called out, in mm. */
export function formatNominalMillimetres(diameter: number): string {
  const text = (diameter * 1e3).toFixed(3);
  return text.endsWith('0') ? text.slice(0, -1) : text;
}

export interface StandardWireSettings {
  /** Enamel grade of round wire (default 2). */
  grade?: EnamelGrade;
  /** Largest number of round wires in hand (default 8). */
  maxInHand?: number;
  /** Thickest and thinnest AWG gauge, inclusive (default 10 and 40). */
  awgThickest?: number;
  awgThinnest?: number;
  /** Metric nominal diameters offered as round wire, inclusive, in metres (default 0.10 mm … 2.50 mm). */
  metricMin?: number;
  metricMax?: number;
  includeLitz?: boolean;
}

function roundWireOption(
  kind: 'awg' | 'metric',
  label: string,
  bareDiameter: number,
  overallDiameter: number,
  inHand: number,
  grade: EnamelGrade,
): WireOption {
  return {
    id: `${label} ×${inHand} G${grade}`,
    kind,
    strandDiameter: bareDiameter,
    strands: inHand,
    overallDiameter,
    conductorsPerTurn: inHand,
    grade,
  };
}

/** The conductor options the design search tries: AWG and metric round wire 1…n in hand, and litz. */
export function standardWireOptions(tables: WireTables, settings: StandardWireSettings = {}): WireOption[] {
  const grade = settings.grade ?? 2;
  const maxInHand = settings.maxInHand ?? 8;
  const awgThickest = settings.awgThickest ?? 10;
  const awgThinnest = settings.awgThinnest ?? 40;
  const metricMin = settings.metricMin ?? 0.1e-3;
  const metricMax = settings.metricMax ?? 2.5e-3;
  // Table values are read from mm text, so compare with a little slack.
  const slack = 1e-9;

  const options: WireOption[] = [];
  for (let gauge = awgThickest; gauge <= awgThinnest; gauge++) {
    const bare = awgDiameter(gauge);
    const overall = enamelledDiameter(bare, grade, tables.metric);
    for (let inHand = 1; inHand <= maxInHand; inHand++) {
      options.push(roundWireOption('awg', `AWG ${awgLabel(gauge)}`, bare, overall, inHand, grade));
    }
  }
  const metricSizes = [...tables.metric]
    .filter((size) => size.nominalDiameter >= metricMin - slack && size.nominalDiameter <= metricMax + slack)
    .sort((a, b) => a.nominalDiameter - b.nominalDiameter);
  for (const size of metricSizes) {
    const label = `${formatNominalMillimetres(size.nominalDiameter)} mm`;
    for (let inHand = 1; inHand <= maxInHand; inHand++) {
      options.push(roundWireOption('metric', label, size.nominalDiameter, gradeDiameter(size, grade), inHand, grade));
    }
  }
  if (settings.includeLitz ?? true) {
    for (const construction of tables.litz) {
      options.push({
        id: `litz ${construction.strandCount} × ${formatNominalMillimetres(construction.strandDiameter)} mm`,
        kind: 'litz',
        strandDiameter: construction.strandDiameter,
        strands: construction.strandCount,
        overallDiameter: litzBundleDiameter(construction, tables.metric),
        conductorsPerTurn: 1,
        grade: LITZ_STRAND_GRADE,
      });
    }
  }
  return options;
}
