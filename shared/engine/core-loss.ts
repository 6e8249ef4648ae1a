import { logGamma } from './gamma';
import type { CoreMaterial } from './types';

export interface SteinmetzCoefficients {
  k: number;
  alpha: number;
  beta: number;
}

/** Steinmetz Pv = k·f^α·B̂^β (W/m³) with B̂ the peak AC flux, i.e. half the peak-to-peak swing. */
export function steinmetzLoss(m: SteinmetzCoefficients, frequency: number, peakFlux: number): number {
  return m.k * Math.pow(frequency, m.alpha) * Math.pow(peakFlux, m.beta);
}

/** ∫₀^{2π} |cos θ|^α dθ = 2·√π·Γ((α+1)/2)/Γ(α/2 + 1). */
export function cosinePowerIntegral(alpha: number): number {
  return 2 * Math.sqrt(Math.PI) * Math.exp(logGamma((alpha + 1) / 2) - logGamma(alpha / 2 + 1));
}

/** iGSE coefficient ki = k / [(2π)^(α−1)·2^(β−α)·∫|cos θ|^α dθ]. */
export function igseCoefficient(m: SteinmetzCoefficients): number {
  return m.k / (Math.pow(2 * Math.PI, m.alpha - 1) * Math.pow(2, m.beta - m.alpha) * cosinePowerIntegral(m.alpha));
}

/** The duty-cycle bracket D^(1−α) + (1 − D)^(1−α) of the triangular iGSE. */
export function triangleDutyFactor(duty: number, alpha: number): number {
  return Math.pow(duty, 1 - alpha) + Math.pow(1 - duty, 1 - alpha);
}

/** iGSE for triangular (PWM) flux with peak-to-peak ΔB and rise fraction D (W/m³). */
export function igseTriangleLoss(m: SteinmetzCoefficients, frequency: number, fluxSwing: number, duty: number): number {
  return igseCoefficient(m) * Math.pow(fluxSwing, m.beta) * Math.pow(frequency, m.alpha) * triangleDutyFactor(duty, m.alpha);
}

/**
 * iGSE for any periodic flux given as a piecewise-linear waveform over one period: times (s, ascending, first 0,
 * last = period) and flux values (T) with the last equal to the first. ΔB is the peak-to-peak of the samples.
 */
export function igsePiecewiseLinearLoss(m: SteinmetzCoefficients, times: ArrayLike<number>, flux: ArrayLike<number>): number {
  const count = times.length;
  if (count < 2 || flux.length !== count) throw new RangeError('times and flux need the same length, at least 2');
  let min = flux[0]!;
  let max = flux[0]!;
  for (let i = 1; i < count; i++) {
    min = Math.min(min, flux[i]!);
    max = Math.max(max, flux[i]!);
  }
  const period = times[count - 1]! - times[0]!;
  const swing = max - min;
  let integral = 0;
  for (let i = 1; i < count; i++) {
    const dt = times[i]! - times[i - 1]!;
    if (dt <= 0) continue;
    const slope = Math.abs(flux[i]! - flux[i - 1]!) / dt;
    integral += Math.pow(slope, m.alpha) * dt;
  }
  return (igseCoefficient(m) * Math.pow(swing, m.beta - m.alpha) * integral) / period;
}

export type TemperatureCoefficients = NonNullable<CoreMaterial['tempCoefficients']>;

/** Temperature factor ct2·T² − ct1·T + ct0 of a material's coefficients (1 where it has no correction). */
export function coreLossTemperatureFactor(coefficients: TemperatureCoefficients | undefined, temperature: number): number {
  if (!coefficients) return 1;
  return coefficients.ct2 * temperature * temperature - coefficients.ct1 * temperature + coefficients.ct0;
}

/**
 * Coefficients whose k was fitted at `referenceTemperature` (a material's t_ref), divided by their factor there so
 * the factor is 1 at t_ref and k·factor(T) gives the loss at T. Coefficients already referred (factor 1 to rounding)
 * come back as they are, so their figures do not move by rounding; so do ones whose factor at t_ref is not above 0
 * (imports refuse them), which the engine then flags where the core works.
 */
export function referredTemperatureCoefficients(
  coefficients: TemperatureCoefficients,
  referenceTemperature: number,
): TemperatureCoefficients {
  const atReference = coreLossTemperatureFactor(coefficients, referenceTemperature);
  if (Math.abs(atReference - 1) < 1e-12 || !(atReference > 0)) return coefficients;
  return { ct0: coefficients.ct0 / atReference, ct1: coefficients.ct1 / atReference, ct2: coefficients.ct2 / atReference };
}

/**
 * Coefficients of a parabolic temperature correction with its minimum (= 1) at `minimumTemperature` and
 * curvature ct2 (1/K²).
 */
export function parabolicTemperatureCoefficients(minimumTemperature: number, ct2: number): { ct0: number; ct1: number; ct2: number } {
  return { ct2, ct1: 2 * ct2 * minimumTemperature, ct0: 1 + ct2 * minimumTemperature * minimumTemperature };
}

/** k given for mW/cm³, kHz and mT converted to W/m³, Hz and T: k_SI = k′·10^(3·(1 − α + β)). */
export function steinmetzKToSi(kMilliwattPerCm3: number, alpha: number, beta: number): number {
  return kMilliwattPerCm3 * Math.pow(10, 3 * (1 - alpha + beta));
}

/** The inverse of {@link steinmetzKToSi}. */
export function steinmetzKFromSi(kSi: number, alpha: number, beta: number): number {
  return kSi / Math.pow(10, 3 * (1 - alpha + beta));
}

export interface FitRangeCheck {
  frequencyInRange: boolean;
  fluxInRange: boolean;
}

export function frequencyInFitRange(material: CoreMaterial, frequency: number): boolean {
  return frequency >= material.fitFrequencyMin && frequency <= material.fitFrequencyMax;
}

/** Whether the peak AC flux B̂ (half the swing) lies inside the range the coefficients were fitted over. */
export function fluxInFitRange(material: CoreMaterial, peakFlux: number): boolean {
  return peakFlux >= material.fitFluxMin && peakFlux <= material.fitFluxMax;
}

export function fitRangeCheck(material: CoreMaterial, frequency: number, peakFlux: number): FitRangeCheck {
  return { frequencyInRange: frequencyInFitRange(material, frequency), fluxInRange: fluxInFitRange(material, peakFlux) };
}
