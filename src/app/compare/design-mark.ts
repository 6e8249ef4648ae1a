import type { DesignDetail } from '@shared/schemas/designs';

/** Where a saved design's core works, from its latest revision's stored result (SI, temperature in °C). */
export interface DesignMark {
  /** "GW-0012 r2": the design's number and revision. */
  label: string;
  frequency: number;
  /** Peak-to-peak flux swing ΔB (T); the peak AC flux B̂ is half of it. */
  deltaB: number;
  /** Core-loss density (W/m³) at the design's own core temperature, by either loss model. */
  igse: number;
  steinmetz: number;
  /** The core temperature the stored loss is at (the surface estimate the engine's temperature factor uses). */
  temperature: number;
  materialName: string;
}

/** The mark of a design's latest revision, or null when it has no stored result (none chosen yet, or no longer readable). */
export function designMark(detail: DesignDetail): DesignMark | null {
  const evaluation = detail.latest.result?.evaluation;
  if (!evaluation) return null;
  return {
    label: `${detail.number} r${detail.latest.revision}`,
    frequency: evaluation.operatingPoint.frequency,
    deltaB: evaluation.flux.swing,
    igse: evaluation.coreLoss.igseDensity,
    steinmetz: evaluation.coreLoss.steinmetzDensity,
    temperature: evaluation.thermal.surfaceTemperature,
    materialName: evaluation.material.name,
  };
}
