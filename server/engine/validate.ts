import { EngineInputError } from './errors';

/**
 * Guards shared by every engine entry point. Rule for bad input, everywhere in the engine:
 * a value that is not a finite number, or lies outside the range the cited method was written
 * for, throws {@link EngineInputError} naming the field; nothing is clamped silently.
 *
 * @example
 * requireNumberInRange(14.25, 'frequencyGHz', 1, 55, 'ITU-R P.618-14 is stated for 1–55 GHz') // => 14.25
 */
export function requireNumberInRange(
  value: unknown,
  field: string,
  min: number,
  max: number,
  why?: string,
): number {
  const x = requireFinite(value, field);
  if (x < min || x > max) {
    throw new EngineInputError(field, `must be between ${min} and ${max}${why ? ` (${why})` : ''}; got ${x}`, value);
  }
  return x;
}

/** A finite number (not NaN, not ±Infinity, not a string). */
export function requireFinite(value: unknown, field: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new EngineInputError(field, `must be a finite number; got ${describe(value)}`, value);
  }
  return value;
}

/** A finite number strictly above zero. */
export function requirePositive(value: unknown, field: string): number {
  const x = requireFinite(value, field);
  if (x <= 0) throw new EngineInputError(field, `must be greater than 0; got ${x}`, value);
  return x;
}

/** A finite number at or above zero. */
export function requireNonNegative(value: unknown, field: string): number {
  const x = requireFinite(value, field);
  if (x < 0) throw new EngineInputError(field, `must not be negative; got ${x}`, value);
  return x;
}

/** An array of exactly `length` finite numbers. */
export function requireFiniteArray(value: unknown, field: string, length: number): readonly number[] {
  if (!Array.isArray(value) || value.length !== length) {
    throw new EngineInputError(field, `must be a list of ${length} numbers`, value);
  }
  value.forEach((v, i) => requireFinite(v, `${field}[${i}]`));
  return value as number[];
}

function describe(value: unknown): string {
  if (typeof value === 'number') return String(value);
  if (value === undefined) return 'nothing';
  if (value === null) return 'null';
  return typeof value;
}
