// Whether a material row's core-loss temperature factor ct2·T² − ct1·T + ct0 stays above zero wherever the
// material may be used. A factor at or below zero would make core loss vanish or turn into a gain, so an
// import (or an edit) refuses it naming the coefficient that pulls it down.
import { lowestTemperatureFactor, TEMPERATURE_FACTOR_RANGE } from '@shared/engine/temperature-range';

/** The temperature cells of a row as numbers (undefined where empty or not valid). */
export interface TemperatureCells {
  ct0?: number | undefined;
  ct1?: number | undefined;
  ct2?: number | undefined;
  t_ref?: number | undefined;
  max_temperature?: number | undefined;
}

export type CoefficientColumn = 'ct0' | 'ct1' | 'ct2';

/**
 * Where the factor must hold (°C): from −40 °C up to the row's max_temperature, or to 200 °C when the row states
 * none; widened to take in t_ref, since k is referred to it (the engine divides the factor by its value there).
 */
export function temperatureFactorRange(row: TemperatureCells): { min: number; max: number } {
  const { t_ref: reference, max_temperature: highest } = row;
  return {
    min: Math.min(TEMPERATURE_FACTOR_RANGE.min, reference ?? Number.POSITIVE_INFINITY),
    max: Math.max(highest ?? TEMPERATURE_FACTOR_RANGE.max, reference ?? Number.NEGATIVE_INFINITY),
  };
}

/**
 * The coefficient blamed for a factor ≤ 0 somewhere in the range, with the message (after the column name), or
 * undefined when the factor stays positive or the row has no complete set of coefficients. The blamed column is
 * the one whose term ct0, −ct1·T or ct2·T² is most negative where the factor is lowest.
 */
export function temperatureFactorProblem(row: TemperatureCells): { column: CoefficientColumn; message: string } | undefined {
  const { ct0, ct1, ct2 } = row;
  if (ct0 === undefined || ct1 === undefined || ct2 === undefined) return undefined;
  const range = temperatureFactorRange(row);
  const lowest = lowestTemperatureFactor({ ct0, ct1, ct2 }, range.min, range.max);
  if (lowest.value > 0) return undefined;
  const t = lowest.at;
  const terms: [CoefficientColumn, number][] = [
    ['ct0', ct0],
    ['ct1', -ct1 * t],
    ['ct2', ct2 * t * t],
  ];
  const [column] = terms.reduce((worst, term) => (term[1] < worst[1] ? term : worst));
  const upTo = row.max_temperature !== undefined ? 'max_temperature' : 'the default without max_temperature';
  return {
    column,
    message:
      `makes the temperature factor ct2·T² − ct1·T + ct0 ${lowest.value.toPrecision(3)} at ${Number(t.toFixed(1))} °C; ` +
      `it must stay above 0 from ${range.min} to ${range.max} °C (up to ${upTo})`,
  };
}
