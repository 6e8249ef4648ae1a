import type { LossPoint } from '@shared/fitting/loss-points';

/** Measured points drawn on a curve lie within this many °C of the chart's core temperature (our own choice). */
export const SLICE_TEMPERATURE_BAND = 5;
/** …and within this fraction of the chart's fixed peak flux (against frequency) or frequency (against ΔB). */
export const SLICE_RELATIVE_BAND = 0.02;

/** Where a chart cuts the measured data: core temperature (°C), the frequency sweep's ΔB (T), the ΔB sweep's frequency (Hz). */
export interface ChartSlice {
  temperature: number;
  deltaB: number;
  frequency: number;
}

const near = (value: number, target: number, band: number) => Math.abs(value - target) <= band * target;

/**
 * The points of a material that belong on one chart, as [x, loss density] in SI: against frequency, those at the
 * chart's B̂ = ΔB/2 (x the frequency); against ΔB, those at its frequency (x the swing 2·B̂, as the axis is drawn).
 */
export function pointsInSlice(points: readonly LossPoint[], axis: 'frequency' | 'flux', slice: ChartSlice): [number, number][] {
  return points
    .filter((p) => Math.abs(p.temperature - slice.temperature) <= SLICE_TEMPERATURE_BAND)
    .filter((p) =>
      axis === 'frequency'
        ? near(p.peakFlux, slice.deltaB / 2, SLICE_RELATIVE_BAND)
        : near(p.frequency, slice.frequency, SLICE_RELATIVE_BAND),
    )
    .map((p) => [axis === 'frequency' ? p.frequency : 2 * p.peakFlux, p.lossDensity]);
}
