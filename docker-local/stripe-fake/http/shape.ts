// The parameters each endpoint takes. Stripe refuses any other parameter with
// `parameter_unknown` instead of ignoring it, so a misspelt or retired parameter in the app
// fails here as it would against Stripe, rather than being silently dropped.
import { unknownParam } from './errors';
import type { FormObject, FormValue } from './form';

/**
 * `scalar`: one value; `hash`: free-form keys (metadata, or a sub-object the handler refuses
 * with its own message); `list`: an array of values (`expand[]`); a Shape: a sub-object with
 * these keys; `[Shape]`: an array of such sub-objects (`items[0][price]`).
 */
export type Field = 'scalar' | 'hash' | 'list' | Shape | readonly [Shape];
export interface Shape {
  readonly [key: string]: Field;
}

/** Every endpoint accepts `expand[]`. */
export const EXPANDABLE: Shape = { expand: 'list' };
/** Cursor pagination of list endpoints. */
export const PAGINATED: Shape = { ...EXPANDABLE, limit: 'scalar', starting_after: 'scalar', ending_before: 'scalar' };

function check(value: FormValue, field: Field, name: string): void {
  if (field === 'scalar' || field === 'hash' || field === 'list') return;
  // A wrong kind of value (a string where a hash belongs) is the typed readers' error to report.
  if (Array.isArray(field)) {
    if (Array.isArray(value)) value.forEach((item, i) => check(item, field[0], `${name}[${i}]`));
    return;
  }
  if (typeof value === 'object' && !Array.isArray(value)) assertKnownParams(value, field as Shape, name);
}

/** Throws Stripe's `Received unknown parameter: x` for the first parameter `shape` does not name. */
export function assertKnownParams(raw: FormObject, shape: Shape, prefix = ''): void {
  for (const [key, value] of Object.entries(raw)) {
    const name = prefix ? `${prefix}[${key}]` : key;
    const field = Object.prototype.hasOwnProperty.call(shape, key) ? shape[key] : undefined;
    if (field === undefined) throw unknownParam(name);
    check(value, field, name);
  }
}
