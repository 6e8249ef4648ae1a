/** Thrown when a design input cannot describe a buildable CCM buck inductor; `field` names the offending input. */
export class EngineInputError extends Error {
  override readonly name = 'EngineInputError';

  constructor(
    readonly field: string,
    message: string,
  ) {
    super(message);
  }
}
