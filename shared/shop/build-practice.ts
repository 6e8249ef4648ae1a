// The rules of the trade the winding sheet, its test limits and the bill of materials follow, kept in one place so
// they agree. SI units. Each number is common practice, no source, unless it says otherwise.
import { COPPER_DENSITY, COPPER_RESISTIVITY_20C } from '../engine/constants';
import type { CoreFamily } from '../engine/types';

/** Each end of the winding is left this long to its termination (m). */
export const LEAD_LENGTH = 0.05;

/** Copper one bobbin pin takes, wrapped 2–3 turns and soldered (m²). */
export const PIN_COPPER_AREA = 1.0e-6;
/** Current one bobbin pin and its solder joint carry (A rms). */
export const PIN_CURRENT = 4;
/** Thickness of a copper termination strap (m); its width follows from the copper it must carry. */
export const STRAP_THICKNESS = 0.5e-3;

/** Resistance of one soldered or brazed termination joint (Ω); a winding has two. */
export const JOINT_RESISTANCE = 0.1e-3;
/** Manufacturing allowance on the DC resistance (wire diameter tolerance). */
export const RESISTANCE_TOLERANCE = 0.1;
/** Below this DC resistance limit a two-wire reading is swamped by its test leads: measure four-wire (Ω). */
export const FOUR_WIRE_BELOW = 10e-3;

/** Test frequencies a bench LCR meter offers (Hz). */
export const LCR_FREQUENCIES = [100, 1e3, 10e3, 100e3] as const;
/** Reactance the inductance test should reach to be read well (Ω). */
export const MIN_TEST_REACTANCE = 1;
/** Highest test frequency for a ferrite or powder core, where its permeability is still the low-frequency one (Hz). */
export const MAX_TEST_FREQUENCY = 100e3;
/** Test levels a bench LCR meter offers (V rms), largest first. */
export const LCR_LEVELS = [1, 0.5, 0.2, 0.1, 0.05, 0.02, 0.01] as const;
/** The test's peak flux stays below this share of the operating ripple's peak flux (small-signal). */
export const TEST_FLUX_SHARE = 0.1;
/** The meter must resolve this share of the test reactance to read L to about the same share. */
export const METER_RESOLUTION = 0.01;
/** An inductance-under-DC-bias test is asked for where less than this saturation margin is left at the hot spot. */
export const BIAS_TEST_MARGIN = 0.4;

export { COPPER_DENSITY, COPPER_RESISTIVITY_20C };

/** Resistance of both leads of a winding whose conductors together have this copper area (Ω at 20 °C). */
export const leadsResistance20 = (copperArea: number) => (2 * LEAD_LENGTH * COPPER_RESISTIVITY_20C) / copperArea;

/** One conductor's length with both leads (m): the winding's own length + 2 leads. */
export const lengthWithLeads = (windingLength: number) => windingLength + 2 * LEAD_LENGTH;

/**
 * Pins of a bobbin for a core, an estimate by family and size (common practice, no source): the catalogue gives no
 * bobbin, and bobbins of one core size come with different pin counts. 0 for rings (no bobbin: flying leads).
 * Size is the first number of the designation (mm), e.g. 20 for "PQ20/16", 4 for "RM4".
 */
const PIN_COUNTS: Record<CoreFamily, readonly [upToSize: number, pins: number][]> = {
  E: [
    [16, 8],
    [25, 10],
    [42, 14],
    [Infinity, 16],
  ],
  ETD: [
    [34, 14],
    [44, 18],
    [Infinity, 20],
  ],
  EFD: [
    [15, 8],
    [25, 10],
    [Infinity, 12],
  ],
  EQ: [
    [20, 8],
    [Infinity, 10],
  ],
  PQ: [
    [20, 10],
    [32, 12],
    [Infinity, 14],
  ],
  RM: [
    [6, 6],
    [8, 8],
    [Infinity, 12],
  ],
  POT: [
    [14, 4],
    [22, 6],
    [Infinity, 8],
  ],
  RING: [[Infinity, 0]],
  POWDER_TOROID: [[Infinity, 0]],
};

export const PIN_COUNT_SOURCE = 'estimated by core family and size (common practice, no source)';

export function bobbinPinCount(family: CoreFamily, coreId: string): number {
  const size = Number(/(\d+(?:\.\d+)?)/.exec(coreId)?.[1] ?? NaN);
  const rows = PIN_COUNTS[family];
  const row = rows.find(([upTo]) => (Number.isFinite(size) ? size <= upTo : false)) ?? rows[0];
  return row[1];
}
