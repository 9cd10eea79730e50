import Decimal from 'decimal.js';
import { EngineInputError } from './errors';

/**
 * Parse a money amount (USD) exactly with decimal.js: a decimal string such as "1249.90" or a
 * finite number (taken by its shortest decimal form). Money never goes through float arithmetic.
 *
 * Bad input: an empty or malformed string, NaN, ±Infinity or a negative amount throws
 * EngineInputError naming the field.
 *
 * @example
 * parseMoneyUsd('1249.90', 'dishes[0].priceUsd').toFixed(2) // => '1249.90'
 */
export function parseMoneyUsd(value: unknown, field: string): Decimal {
  let d: Decimal;
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw new EngineInputError(field, `must be a finite amount; got ${value}`, value);
    d = new Decimal(value);
  } else if (typeof value === 'string' && /^\s*\d+(\.\d+)?\s*$/.test(value)) {
    d = new Decimal(value.trim());
  } else {
    throw new EngineInputError(field, 'must be an amount in USD such as "1249.90"', value);
  }
  if (d.isNegative()) throw new EngineInputError(field, `must not be negative; got ${d.toString()}`, value);
  return d;
}
