// Decodes Stripe's request encoding: application/x-www-form-urlencoded with bracket keys
// (`line_items[0][price]`, `metadata[plan]`, `expand[0]` or `expand[]`), the format the
// official SDK produces (see node_modules/stripe/cjs/utils.js stringifyRequestData).
import { StripeApiError } from './errors';

export type FormValue = string | FormValue[] | FormObject;
export interface FormObject {
  [key: string]: FormValue;
}

// While decoding, arrays are kept as objects keyed by index so `[]` and `[3]` can mix.
type Draft = { [key: string]: string | Draft };

const KEY_PATTERN = /^([^[\]]+)((?:\[[^[\]]*\])*)$/;

function splitKey(key: string): string[] {
  const match = KEY_PATTERN.exec(key);
  if (!match) {
    throw new StripeApiError(400, `Invalid parameter name: ${key}`, { param: key });
  }
  const rest = match[2].length ? match[2].slice(1, -1).split('][') : [];
  return [match[1], ...rest];
}

function place(root: Draft, segments: string[], value: string, fullKey: string): void {
  let node = root;
  for (let i = 0; i < segments.length; i++) {
    let segment = segments[i];
    if (segment === '') segment = String(Object.keys(node).length);
    const last = i === segments.length - 1;
    if (last) {
      if (typeof node[segment] === 'object') {
        throw new StripeApiError(400, `Invalid value for ${fullKey}: it is both a value and a hash.`, { param: fullKey });
      }
      node[segment] = value;
      return;
    }
    const next = node[segment];
    if (typeof next === 'string') {
      throw new StripeApiError(400, `Invalid value for ${fullKey}: it is both a value and a hash.`, { param: fullKey });
    }
    if (next === undefined) node[segment] = {};
    node = node[segment] as Draft;
  }
}

function finish(draft: Draft): FormObject | FormValue[] {
  const keys = Object.keys(draft);
  const isArray = keys.length > 0 && keys.every((k) => /^\d+$/.test(k));
  const convert = (v: string | Draft): FormValue => (typeof v === 'string' ? v : finish(v));
  if (isArray) {
    return keys
      .map(Number)
      .sort((a, b) => a - b)
      .map((k) => convert(draft[String(k)]));
  }
  const out: FormObject = {};
  for (const k of keys) out[k] = convert(draft[k]);
  return out;
}

export function parseForm(encoded: string): FormObject {
  const root: Draft = {};
  for (const [key, value] of new URLSearchParams(encoded)) {
    place(root, splitKey(key), value, key);
  }
  const result = finish(root);
  return Array.isArray(result) ? {} : result;
}
