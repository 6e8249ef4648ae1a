// Test fixtures. Core numbers are recalled IEC 61185 / IEC 63093-8 nominal values (from memory); bobbin, MLT and
// surface figures are rough estimates. Materials and wires are invented for illustration, not any real product.
import type { CoreMaterial, CoreShape, WireOption } from '@shared/engine/types';
import type { ConverterSpec } from '@shared/engine/inputs';
import type { EvaluateInput } from '@shared/engine/evaluate';

const mm = 1e-3;
const mm2 = 1e-6;
const mm3 = 1e-9;

/** ETD34-like pair: Ae 97.1 mm², le 78.6 mm, Ve 7640 mm³, window ≈175 mm² (IEC 61185 nominal, from memory). */
export const etd34Like: CoreShape = {
  id: 'ETD34-like',
  family: 'ETD',
  gapKind: 'air-gap',
  ae: 97.1 * mm2,
  amin: 91.6 * mm2,
  le: 78.6 * mm,
  ve: 7640 * mm3,
  windowArea: 175 * mm2,
  windowHeight: 23.6 * mm,
  bobbinWidth: 21 * mm,
  bobbinHeight: 6 * mm,
  mlt: 60 * mm,
  surfaceArea: 60e-4,
  centreToOuterLegAreaRatio: 1,
  source: 'test fixture, IEC 61185 nominal (from memory); bobbin, MLT and surface estimated',
};

/** E25/13/7-like pair (IEC 63093-8 nominal, from memory): too small for the worked buck example. */
export const e25Like: CoreShape = {
  id: 'E25-like',
  family: 'E',
  gapKind: 'air-gap',
  ae: 52.5 * mm2,
  le: 57.5 * mm,
  ve: 3020 * mm3,
  windowArea: 87 * mm2,
  windowHeight: 17.4 * mm,
  bobbinWidth: 15 * mm,
  bobbinHeight: 4.2 * mm,
  mlt: 49 * mm,
  surfaceArea: 28e-4,
  source: 'test fixture, IEC 63093-8 nominal (from memory); bobbin, MLT and surface estimated',
};

/** A tiny core whose area product is far below the worked buck example's requirement. */
export const tinyLike: CoreShape = {
  ...e25Like,
  id: 'tiny-like',
  ae: 20 * mm2,
  le: 35 * mm,
  ve: 700 * mm3,
  windowArea: 30 * mm2,
  surfaceArea: 10e-4,
};

/** ETD44-like pair (IEC 61185 nominal, from memory). */
export const etd44Like: CoreShape = {
  ...etd34Like,
  id: 'ETD44-like',
  ae: 173 * mm2,
  amin: 172 * mm2,
  le: 103 * mm,
  ve: 17800 * mm3,
  windowArea: 279 * mm2,
  windowHeight: 32.2 * mm,
  bobbinWidth: 29.5 * mm,
  bobbinHeight: 7.4 * mm,
  mlt: 77 * mm,
  surfaceArea: 110e-4,
};

/** 26.9/14.7/11.2 ring, computed [C] from the IEC 60205 sharp-edged ring formulas (from memory). */
export const powderRing: CoreShape = {
  id: 'R26.9-like',
  family: 'POWDER_TOROID',
  gapKind: 'distributed',
  ae: 66.28 * mm2,
  le: 61.53 * mm,
  ve: 4078 * mm3,
  windowArea: 169.7 * mm2,
  windowHeight: 11.2 * mm,
  bobbinWidth: Math.PI * 14.7 * mm,
  bobbinHeight: (14.7 * mm) / 2,
  mlt: 0,
  surfaceArea: 30e-4,
  ring: { od: 26.9 * mm, id: 14.7 * mm, height: 11.2 * mm },
  source: 'test fixture, IEC 60205 sharp-edged values (computed)',
};

/** Illustrative ferrite A (invented): α, β within the generic MnZn ranges α ≈ 1.1–1.9, β ≈ 2.2–3.0 (common practice, no source). */
export const ferriteA: CoreMaterial = {
  id: 'illustrative-ferrite-a',
  name: 'illustrative ferrite A',
  family: 'ferrite',
  k: 3.0,
  alpha: 1.4,
  beta: 2.6,
  fitFrequencyMin: 25e3,
  fitFrequencyMax: 500e3,
  fitFluxMin: 0.01,
  fitFluxMax: 0.3,
  tempCoefficients: { ct2: 1e-4, ct1: 2e-4 * 90, ct0: 1 + 1e-4 * 90 * 90 },
  bsat25: 0.5,
  bsat100: 0.39,
  permeability: 2200,
  density: 4800,
  maxTemperature: 200,
};

/** Illustrative ferrite B (invented): lossier, lower α. */
export const ferriteB: CoreMaterial = {
  ...ferriteA,
  id: 'illustrative-ferrite-b',
  name: 'illustrative ferrite B',
  k: 12,
  alpha: 1.25,
  beta: 2.5,
};

/** Illustrative powder P (invented): μi 60, roll-off with H50 = 8 kA/m and c = 1.3 [CP form]. */
export const powderP: CoreMaterial = {
  id: 'illustrative-powder-p',
  name: 'illustrative powder P',
  family: 'powder',
  k: 60,
  alpha: 1.3,
  beta: 2.2,
  fitFrequencyMin: 10e3,
  fitFrequencyMax: 500e3,
  fitFluxMin: 0.005,
  fitFluxMax: 0.4,
  bsat25: 1.0,
  bsat100: 0.95,
  permeability: 60,
  rollOff: { a: 1, b: Math.pow(8000, -1.3), c: 1.3 },
  density: 7000,
  maxTemperature: 200,
};

/** Round enamelled wire, invented overall diameters ≈ d·1.06 + 0.01 mm, close to IEC 60317-0-1 grade 1 builds (from memory). */
export function roundWire(diameter: number, strands = 1): WireOption {
  return {
    id: `${(diameter * 1e3).toFixed(3)} mm${strands > 1 ? ` ×${strands}` : ''}`,
    kind: 'metric',
    strandDiameter: diameter,
    strands,
    overallDiameter: diameter * 1.06 + 0.01e-3,
    conductorsPerTurn: strands,
    grade: 1,
  };
}

export function litz(strands: number, strandDiameter: number): WireOption {
  return {
    id: `litz ${strands}×${(strandDiameter * 1e3).toFixed(3)} mm`,
    kind: 'litz',
    strandDiameter,
    strands,
    overallDiameter: 1.2 * Math.sqrt(strands) * strandDiameter * 1.08,
    conductorsPerTurn: 1,
  };
}

export const wireSet: WireOption[] = [
  ...[0.2, 0.25, 0.315, 0.355, 0.4, 0.45, 0.5, 0.56, 0.63, 0.71, 0.8, 0.9, 1.0, 1.12, 1.25].map((d) => roundWire(d * mm)),
  litz(100, 0.1 * mm),
  litz(200, 0.1 * mm),
  litz(400, 0.071 * mm),
  litz(420, 0.1 * mm),
  litz(660, 0.1 * mm),
];

/**
 * Spec of the worked buck example (ideal CCM buck relations, computed by hand): Vin max 36 V, Vout 12 V, 100 kHz, 10 A, r = 0.3 gives
 * L = 12·(1 − 12/36)/(1e5·3) = 26.67 µH, Ipk = 11.5 A, Irms = 10.04 A.
 */
export const sectionOneSpec: ConverterSpec = {
  vinMin: 24,
  vinMax: 36,
  vout: 12,
  ioutMax: 10,
  frequency: 100e3,
  rippleRatio: 0.3,
  rectifier: 'ideal',
};

/** The worked example built on the ETD34-like core in ferrite A with three 0.8 mm wires in hand, turns and gap 'auto'. */
export const workedDesign: EvaluateInput = {
  spec: sectionOneSpec,
  limits: { inductanceTolerance: 0 },
  core: etd34Like,
  material: ferriteA,
  turns: 'auto',
  gap: 'auto',
  wire: roundWire(0.8e-3, 3),
};
