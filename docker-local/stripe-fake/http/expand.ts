// `expand[]` as Stripe applies it: each dotted path replaces an id string with the object it
// names; `data.` walks into lists. Works on a copy so stored objects keep their ids.
import { StripeApiError } from './errors';

export type Lookup = (id: string) => object | undefined;
/** Fields that are not in the object until expanded, such as a checkout session's line_items. */
export type Virtual = (owner: Record<string, unknown>, field: string) => unknown;

const MAX_DEPTH = 4;

function expandPath(value: unknown, segments: string[], full: string, lookup: Lookup, virtual: Virtual): unknown {
  if (Array.isArray(value)) return value.map((v) => expandPath(v, segments, full, lookup, virtual));
  if (value === null || typeof value !== 'object') return value;
  const owner = value as Record<string, unknown>;
  const [field, ...rest] = segments;
  let child = field in owner ? owner[field] : virtual(owner, field);
  if (child === undefined) {
    throw new StripeApiError(400, `This property cannot be expanded (${full}).`, { param: 'expand' });
  }
  if (typeof child === 'string') {
    const found = lookup(child);
    if (!found) throw new StripeApiError(400, `This property cannot be expanded (${full}).`, { param: 'expand' });
    child = structuredClone(found);
  }
  if (rest.length) child = expandPath(child, rest, full, lookup, virtual);
  owner[field] = child;
  return owner;
}

export function applyExpand<T>(object: T, paths: string[], lookup: Lookup, virtual: Virtual): T {
  const copy = structuredClone(object);
  for (const path of paths) {
    const segments = path.split('.');
    if (segments.length > MAX_DEPTH) {
      throw new StripeApiError(400, `You cannot expand more than ${MAX_DEPTH} levels of a property (${path}).`, {
        param: 'expand',
      });
    }
    expandPath(copy, segments, path, lookup, virtual);
  }
  return copy;
}
