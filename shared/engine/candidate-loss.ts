import { copperResistanceRatio } from './copper';
import { coreLossTemperatureFactor, type TemperatureCoefficients } from './core-loss';
import type { TemperatureDependentLoss } from './thermal';

/**
 * The total loss of one candidate at a temperature: copper resistance follows ρ(T)/ρ20, core loss the material's
 * temperature factor. One instance is reused for every candidate; each call leaves the figures it used behind.
 */
export class CandidateLoss implements TemperatureDependentLoss {
  /** Winding resistance at 20 °C (Ω). */
  resistance20 = 0;
  /** Iout² + Σ Fr·I_n²/2: the squared current the DC resistance sees, ripple weighted by its AC factors (A²). */
  weightedCurrentSquare = 0;
  /** Core loss with the temperature factor 1 (W). */
  coreLossReference = 0;
  /** The material's core-loss temperature coefficients, if it has any. */
  temperatureCoefficients: TemperatureCoefficients | undefined;
  /** Figures of the last call. */
  resistance = 0;
  temperatureFactor = 1;
  total = 0;

  lossAt(temperature: number): number {
    this.resistance = this.resistance20 * copperResistanceRatio(temperature);
    this.temperatureFactor = coreLossTemperatureFactor(this.temperatureCoefficients, temperature);
    this.total = this.resistance * this.weightedCurrentSquare + this.coreLossReference * this.temperatureFactor;
    return this.total;
  }
}
