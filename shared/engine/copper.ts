import { COPPER_RESISTIVITY_20C, COPPER_TEMPERATURE_COEFFICIENT } from './constants';

/** Copper resistivity at temperature T (°C): ρ20·[1 + α20·(T − 20)]. */
export function copperResistivity(temperature: number): number {
  return COPPER_RESISTIVITY_20C * (1 + COPPER_TEMPERATURE_COEFFICIENT * (temperature - 20));
}

/** DC resistance of N turns of mean length MLT in `strands` parallel strands of bare diameter d (Ω). */
export function windingResistance(
  turns: number,
  meanTurnLength: number,
  strandDiameter: number,
  strands: number,
  temperature: number,
): number {
  const copperArea = (strands * Math.PI * strandDiameter * strandDiameter) / 4;
  return (copperResistivity(temperature) * turns * meanTurnLength) / copperArea;
}
