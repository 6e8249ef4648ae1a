import type { CoreShape } from './types';
import { ringMeanTurnLength } from './winding';

/** Required area product Ap = L·Ipk·Irms/(Bmax·J·Ku) (m⁴). */
export function requiredAreaProduct(
  inductance: number,
  peakCurrent: number,
  rmsCurrent: number,
  bMax: number,
  currentDensity: number,
  windowUtilisation: number,
): number {
  return (inductance * peakCurrent * rmsCurrent) / (bMax * currentDensity * windowUtilisation);
}

/** Available area product Wa·Ae (m⁴). */
export function availableAreaProduct(core: CoreShape): number {
  return core.windowArea * core.ae;
}

/** Required geometry constant Kg ≥ ρ·L²·Ipk²/(Bmax²·R·Ku) (m⁵), R the allowed winding resistance. */
export function requiredGeometryConstant(
  resistivity: number,
  inductance: number,
  peakCurrent: number,
  bMax: number,
  resistance: number,
  windowUtilisation: number,
): number {
  return (resistivity * inductance * inductance * peakCurrent * peakCurrent) / (bMax * bMax * resistance * windowUtilisation);
}

/** Available geometry constant Kg = Ae²·Wa/MLT (m⁵). */
export function availableGeometryConstant(core: CoreShape): number {
  return (core.ae * core.ae * core.windowArea) / nominalMeanTurnLength(core);
}

/** The core's MLT, or for a ring without one the bare section perimeter (OD − ID) + 2·h. */
export function nominalMeanTurnLength(core: CoreShape): number {
  if (core.mlt > 0 || !core.ring) return core.mlt;
  return ringMeanTurnLength(core.ring, 0);
}

export interface AreaProductRow {
  core: CoreShape;
  available: number;
  required: number;
  /** available / required. */
  ratio: number;
}

/** Cores smallest area product first, each with the required value beside it. */
export function rankByAreaProduct(cores: readonly CoreShape[], required: number): AreaProductRow[] {
  return cores
    .map((core) => {
      const available = availableAreaProduct(core);
      return { core, available, required, ratio: available / required };
    })
    .sort((a, b) => a.available - b.available);
}
