import { COPPER_RESISTIVITY_20C, COPPER_TEMPERATURE_COEFFICIENT } from './constants';

/** ρ(T)/ρ20 = 1 + α20·(T − 20), T in °C. */
export function copperResistanceRatio(temperature: number): number {
  return 1 + COPPER_TEMPERATURE_COEFFICIENT * (temperature - 20);
}

/** Copper resistivity at temperature T (°C): ρ20·[1 + α20·(T − 20)]. */
export function copperResistivity(temperature: number): number {
  return COPPER_RESISTIVITY_20C * copperResistanceRatio(temperature);
}

/** DC resistance ρ(T)·N·MLT/A of N turns of mean length MLT with copper area A per turn (Ω). */
export function windingResistance(turns: number, meanTurnLength: number, copperArea: number, temperature: number): number {
  return (copperResistivity(temperature) * turns * meanTurnLength) / copperArea;
}
