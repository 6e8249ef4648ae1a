import { MU0 } from './constants';
import { copperResistivity } from './copper';

/** Skin depth δ = sqrt(ρ/(π·f·μ0·μr)) (m). */
export function skinDepthForResistivity(resistivity: number, frequency: number, relativePermeability = 1): number {
  return Math.sqrt(resistivity / (Math.PI * frequency * MU0 * relativePermeability));
}

/** Skin depth in copper at frequency f and temperature T (°C). */
export function copperSkinDepth(frequency: number, temperature: number): number {
  return skinDepthForResistivity(copperResistivity(temperature), frequency);
}
