// Typed reads of decoded form parameters, with Stripe's wording for bad values so that an app
// bug surfaces here the same way it would against the real API.
import type { FormObject, FormValue } from './form';
import { StripeApiError, invalidParam, missingParam } from './errors';

export type Metadata = Record<string, string>;

export class Params {
  constructor(
    private readonly raw: FormObject,
    private readonly prefix = '',
  ) {}

  /** The Stripe-style name of a nested parameter, e.g. `line_items[0][price]`. */
  name(key: string): string {
    return this.prefix ? `${this.prefix}[${key}]` : key;
  }

  has(key: string): boolean {
    return this.raw[key] !== undefined;
  }

  keys(): string[] {
    return Object.keys(this.raw);
  }

  private scalar(key: string): string | undefined {
    const value = this.raw[key];
    if (value === undefined) return undefined;
    if (typeof value !== 'string') {
      throw invalidParam(this.name(key), `Invalid string: ${this.name(key)} must be a string, not a hash or array.`);
    }
    return value;
  }

  string(key: string): string | undefined {
    return this.scalar(key);
  }

  requiredString(key: string): string {
    const value = this.scalar(key);
    if (value === undefined || value === '') throw missingParam(this.name(key));
    return value;
  }

  /** Stripe treats an empty string as "unset this field". */
  nullableString(key: string): string | null | undefined {
    const value = this.scalar(key);
    if (value === undefined) return undefined;
    return value === '' ? null : value;
  }

  int(key: string, min = Number.MIN_SAFE_INTEGER, max = Number.MAX_SAFE_INTEGER): number | undefined {
    const value = this.scalar(key);
    if (value === undefined) return undefined;
    if (!/^-?\d+$/.test(value)) throw invalidParam(this.name(key), `Invalid integer: ${value}`);
    const n = Number(value);
    if (n < min || n > max) {
      throw invalidParam(this.name(key), `Invalid ${this.name(key)}: must be between ${min} and ${max}`);
    }
    return n;
  }

  bool(key: string): boolean | undefined {
    const value = this.scalar(key);
    if (value === undefined) return undefined;
    if (value === 'true') return true;
    if (value === 'false') return false;
    throw invalidParam(this.name(key), `Invalid boolean: ${value}`);
  }

  oneOf<T extends string>(key: string, allowed: readonly T[]): T | undefined {
    const value = this.scalar(key);
    if (value === undefined) return undefined;
    if (!(allowed as readonly string[]).includes(value)) {
      throw invalidParam(this.name(key), `Invalid ${this.name(key)}: must be one of ${allowed.join(', ')}`);
    }
    return value as T;
  }

  requiredOneOf<T extends string>(key: string, allowed: readonly T[]): T {
    const value = this.oneOf(key, allowed);
    if (value === undefined) throw missingParam(this.name(key));
    return value;
  }

  object(key: string): Params | undefined {
    const value = this.raw[key];
    if (value === undefined || value === '') return undefined;
    if (typeof value !== 'object' || Array.isArray(value)) {
      throw invalidParam(this.name(key), `Invalid object: ${this.name(key)} must be a hash.`);
    }
    return new Params(value, this.name(key));
  }

  objectArray(key: string): Params[] | undefined {
    const value = this.raw[key];
    if (value === undefined) return undefined;
    if (value === '') return [];
    if (!Array.isArray(value)) {
      throw invalidParam(this.name(key), `Invalid array: ${this.name(key)} must be an array (${this.name(key)}[0][...]).`);
    }
    return value.map((item: FormValue, i) => {
      if (typeof item !== 'object' || Array.isArray(item)) {
        throw invalidParam(`${this.name(key)}[${i}]`, `Invalid object: ${this.name(key)}[${i}] must be a hash.`);
      }
      return new Params(item, `${this.name(key)}[${i}]`);
    });
  }

  stringArray(key: string): string[] | undefined {
    const value = this.raw[key];
    if (value === undefined) return undefined;
    if (value === '') return [];
    // A single `expand=foo` is accepted by Stripe as a one-element list.
    if (typeof value === 'string') return [value];
    if (!Array.isArray(value) || value.some((v) => typeof v !== 'string')) {
      throw invalidParam(this.name(key), `Invalid array: ${this.name(key)} must be a list of strings.`);
    }
    return value as string[];
  }

  /**
   * Metadata as Stripe applies it on update: `metadata=` clears all keys, `metadata[k]=` deletes k,
   * other keys are merged. Returns the new metadata or undefined when not sent.
   */
  metadata(current: Metadata = {}, key = 'metadata'): Metadata | undefined {
    const value = this.raw[key];
    if (value === undefined) return undefined;
    if (value === '') return {};
    if (typeof value !== 'object' || Array.isArray(value)) {
      throw invalidParam(this.name(key), 'Invalid metadata: must be a hash of string keys and values.');
    }
    const next: Metadata = { ...current };
    for (const [k, v] of Object.entries(value)) {
      if (typeof v !== 'string') {
        throw invalidParam(`${this.name(key)}[${k}]`, 'Invalid metadata: values must be strings.');
      }
      if (k.length > 40) throw invalidParam(`${this.name(key)}[${k}]`, 'Metadata keys can be at most 40 characters.');
      if (v.length > 500) throw invalidParam(`${this.name(key)}[${k}]`, 'Metadata values can be at most 500 characters.');
      if (v === '') delete next[k];
      else next[k] = v;
    }
    if (Object.keys(next).length > 50) throw invalidParam(this.name(key), 'Metadata can have at most 50 keys.');
    return next;
  }
}

export function requireFound<T>(value: T | undefined, error: () => StripeApiError): T {
  if (value === undefined) throw error();
  return value;
}
