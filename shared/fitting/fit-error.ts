/** Why a fit was refused; `field` names the input (and `index` the point) so a caller can point at the row. */
export type FitErrorReason = 'too-few-points' | 'singular' | 'invalid-value' | 'not-positive';

/** A fit or conversion refused for its input, never for a numerical accident. */
export class FitInputError extends Error {
  override readonly name = 'FitInputError';

  constructor(
    readonly reason: FitErrorReason,
    message: string,
    readonly field?: string,
    readonly index?: number,
  ) {
    super(message);
  }
}
