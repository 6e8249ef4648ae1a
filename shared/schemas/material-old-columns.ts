// The material CSV columns of the previous format version: the engine's bare constants ct0, ct1, ct2 for the
// temperature factor and rolloff_a, rolloff_b, rolloff_c for the powder roll-off. A file that still uses them is read
// for one more format version: each row is converted to our own named parameters with the fitting module's
// conversions, and the preview says so in a notice. What cannot be converted (a factor that is not positive at every
// temperature) is refused naming the old column.
import { FitInputError } from '@shared/fitting/fit-error';
import { rollOffFromEngine, type RollOff } from '@shared/fitting/rolloff-fit';
import { behaviourFromQuadratic, type TemperatureBehaviour } from '@shared/fitting/temperature-fit';

export const OLD_TEMPERATURE_COLUMNS = ['ct0', 'ct1', 'ct2'] as const;
export const OLD_ROLLOFF_COLUMNS = ['rolloff_a', 'rolloff_b', 'rolloff_c'] as const;
export const OLD_MATERIAL_COLUMNS = [...OLD_TEMPERATURE_COLUMNS, ...OLD_ROLLOFF_COLUMNS] as const;
export type OldMaterialColumn = (typeof OLD_MATERIAL_COLUMNS)[number];

export const TEMPERATURE_COLUMNS = ['lowest_loss_temperature', 'lowest_loss_factor', 'loss_curvature'] as const;
export const ROLLOFF_COLUMNS = ['rolloff_half_field', 'rolloff_steepness'] as const;

/** Each quantity's old and new columns: a header or row may use one form of a quantity, never both. */
export const COLUMN_FORMS = [
  { quantity: 'temperature behaviour', old: OLD_TEMPERATURE_COLUMNS, current: TEMPERATURE_COLUMNS },
  { quantity: 'roll-off', old: OLD_ROLLOFF_COLUMNS, current: ROLLOFF_COLUMNS },
] as const;

const UNTIL = 'this old format is read until the next format version';

/** Shown numbers: four significant digits, as a designer reads them. */
const shown = (value: number) => String(Number(value.toPrecision(4)));

/** Problems of a header (or a row's given cells) that mixes the old and the new columns of one quantity. */
export function mixedForms(given: readonly string[]): { column: string; message: string }[] {
  const problems: { column: string; message: string }[] = [];
  for (const form of COLUMN_FORMS) {
    const old = form.old.filter((c) => given.includes(c));
    const current = form.current.filter((c) => given.includes(c));
    if (!old.length || !current.length) continue;
    for (const column of old) {
      problems.push({
        column,
        message: `is an old column of the ${form.quantity} and cannot be used with ${current.join(', ')}; give only ${form.current.join(', ')}`,
      });
    }
  }
  return problems;
}

export type Conversion<T> = { value: T; notice: string } | { problem: { column: OldMaterialColumn; message: string } };

const TEMPERATURE_INSTEAD =
  'give lowest_loss_temperature (°C), lowest_loss_factor (> 0) and loss_curvature (1/K², ≥ 0) instead, which are positive at every temperature';

/**
 * The named temperature behaviour of an old quadratic ct2·T² − ct1·T + ct0 (exact), or the refusal naming the old
 * column when the quadratic is not positive at every temperature (it opens downwards, is a slope, or dips to zero).
 */
export function convertOldTemperature(q: { ct0: number; ct1: number; ct2: number }): Conversion<TemperatureBehaviour> {
  try {
    const value = behaviourFromQuadratic(q);
    const notice =
      `old columns ct0, ct1, ct2 converted to lowest-loss temperature ${shown(value.lowestLossTemperature)} °C, ` +
      `factor ${shown(value.lowestLossFactor)}, curvature ${value.curvature.toExponential(1)} /K²; ${UNTIL}`;
    return { value, notice };
  } catch (error) {
    if (!(error instanceof FitInputError)) throw error;
    const why =
      q.ct2 < 0
        ? `= ${q.ct2} makes the old quadratic open downwards: its factor falls below zero away from its peak`
        : q.ct2 === 0 && q.ct1 !== 0
          ? `= ${q.ct1} with ct2 = 0 makes the old factor a slope, which falls below zero at some temperature`
          : `= ${q.ct0} puts the old factor's lowest value at or below zero`;
    const column = q.ct2 < 0 ? 'ct2' : q.ct2 === 0 && q.ct1 !== 0 ? 'ct1' : 'ct0';
    return { problem: { column, message: `${why}, so it cannot be positive at every temperature; ${TEMPERATURE_INSTEAD}` } };
  }
}

/**
 * The named roll-off of the old constants μ/μi = 1/(a + b·H^c): exact for a = 1; for a ≠ 1 the exact alternative that
 * multiplies μi by 1/a (the curve starts at 1/a, so the shape is kept and the starting permeability moves into μi).
 */
export function convertOldRollOff(fit: { a: number; b: number; c: number }): Conversion<{ rollOff: RollOff; permeabilityScale: number }> {
  if (!(fit.b > 0)) {
    return {
      problem: {
        column: 'rolloff_b',
        message: `= ${fit.b} means the permeability does not roll off; leave the roll-off columns empty instead (or give rolloff_half_field and rolloff_steepness)`,
      },
    };
  }
  // 1/(a + b·H^c) = (1/a)·1/(1 + (b/a)·H^c): the exact conversion of the curve with a = 1, and μi × 1/a.
  const { rollOff } = rollOffFromEngine({ a: 1, b: fit.b / fit.a, c: fit.c });
  const permeabilityScale = 1 / fit.a;
  const scaled =
    fit.a === 1
      ? ''
      : ` (rolloff_a = ${fit.a} is not 1, so mu_i is multiplied by 1/a = ${shown(permeabilityScale)} to keep the curve exactly)`;
  const notice =
    `old columns rolloff_a, rolloff_b, rolloff_c converted to field at half permeability ${shown(rollOff.halfField)} A/m, ` +
    `steepness ${shown(rollOff.steepness)}${scaled}; ${UNTIL}`;
  return { value: { rollOff, permeabilityScale }, notice };
}
