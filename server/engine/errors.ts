/**
 * The one error the engine throws for bad input. `field` names the offending input by its path
 * in the caller's object (e.g. `'frequencyGHz'`, `'dishes[2].diameterM'`) so a form can put the
 * message beside the right box. The engine never returns NaN: anything that would produce one is
 * caught at the door and reported with this class.
 *
 * @example
 * try { rainAttenuation({ ...site, frequencyGHz: 80 }) }
 * catch (e) { e instanceof EngineInputError && e.field } // => 'frequencyGHz'
 */
export class EngineInputError extends Error {
  /** Path of the offending input, e.g. `'downlink.frequencyGHz'`. */
  readonly field: string;
  /** The value that was refused, kept for logs (never used for a computation). */
  readonly value: unknown;

  constructor(field: string, message: string, value?: unknown) {
    super(`${field}: ${message}`);
    this.name = 'EngineInputError';
    this.field = field;
    this.value = value;
  }
}

/** True for an {@link EngineInputError}, also across module copies (checks the name). */
export function isEngineInputError(error: unknown): error is EngineInputError {
  return error instanceof EngineInputError || (error instanceof Error && error.name === 'EngineInputError');
}
