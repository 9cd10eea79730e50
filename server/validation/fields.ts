import { z } from 'zod';
import Decimal from 'decimal.js';
import { parseCoordinate, type CoordinateAxis } from './coordinates';

/**
 * Field builders shared by every form schema. Forms post strings; actions called with plain
 * objects and route handlers post JSON numbers — each builder takes both, so one schema serves
 * the browser, the server action and the API.
 */

/** '' and whitespace-only count as "not given" (a blank box), so optional fields stay optional. */
const blankToUndefined = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v);

export function requiredText(label: string, max: number) {
  return z.preprocess(
    (v) => (typeof v === 'string' ? v.trim() : v),
    z
      .string({ error: `${label} is required.` })
      .min(1, `${label} is required.`)
      .max(max, `${label} must be at most ${max} characters.`),
  );
}

/** Optional free text; blank becomes null so it is stored as "not given". */
export function optionalText(label: string, max: number) {
  return z.preprocess(
    (v) => (v === undefined || v === null || (typeof v === 'string' && v.trim() === '') ? null : typeof v === 'string' ? v.trim() : v),
    z.string().max(max, `${label} must be at most ${max} characters.`).nullable(),
  );
}

export function optionalEmail(label = 'E-mail') {
  return z.preprocess(
    (v) => (v === undefined || v === null || (typeof v === 'string' && v.trim() === '') ? null : typeof v === 'string' ? v.trim().toLowerCase() : v),
    z.email({ error: `${label} must be an e-mail address.` }).max(254).nullable(),
  );
}

function toNumber(v: unknown): unknown {
  if (typeof v === 'string') {
    const s = v.trim().replace(',', '.');
    if (s === '') return undefined;
    // Number('0x10') and Number('1e3') are valid JS but not what a person types in a form.
    return /^[+-]?(\d+(\.\d*)?|\.\d+)$/.test(s) ? Number(s) : Number.NaN;
  }
  return v;
}

/** A finite number in [min, max] with a unit named in the message. */
export function numberIn(label: string, min: number, max: number, unit = '') {
  const u = unit ? ` ${unit}` : '';
  return z.preprocess(
    toNumber,
    z
      .number({ error: (issue) => (issue.input === undefined ? `${label} is required.` : `${label} must be a number.`) })
      .refine(Number.isFinite, `${label} must be a number.`)
      .refine((n) => !Number.isFinite(n) || (n >= min && n <= max), `${label} must be between ${min} and ${max}${u}.`),
  );
}

export function optionalNumberIn(label: string, min: number, max: number, unit = '') {
  return z.preprocess((v) => (v === null ? undefined : blankToUndefined(v)), numberIn(label, min, max, unit).optional());
}

/** A positive integer id (select boxes post strings). */
export function idField(label: string) {
  return z.preprocess(
    (v) => (typeof v === 'string' && /^\d+$/.test(v.trim()) ? Number(v.trim()) : blankToUndefined(v)),
    z.number({ error: (issue) => (issue.input === undefined ? `Choose a ${label}.` : `Choose a ${label}.`) }).int().positive(`Choose a ${label}.`),
  );
}

/** A list of ids: an array, or one comma-separated string (a hidden input). */
export function idListField(label: string, min: number, max: number, singular = label.replace(/e?s$/, '')) {
  const atLeast = min === 1 ? `Choose at least one ${singular}.` : `Choose at least ${min} ${label}.`;
  return z.preprocess(
    (v) => {
      if (typeof v === 'string') return v.split(',').map((s) => s.trim()).filter((s) => s !== '').map((s) => (/^\d+$/.test(s) ? Number(s) : s));
      if (Array.isArray(v)) return v.map((s) => (typeof s === 'string' && /^\d+$/.test(s) ? Number(s) : s));
      return v;
    },
    z
      .array(z.number().int().positive(), { error: atLeast })
      .min(min, atLeast)
      .max(max, `Choose at most ${max} ${label}.`)
      .refine((a) => new Set(a).size === a.length, `Each ${singular} only once.`),
  );
}

/** Exact money: "1249.9" → "1249.90" (decimal.js, never a float). Non-negative, 2 decimals at most. */
export function moneyField(label: string, max = '99999999.99') {
  return z.preprocess(
    (v) => (typeof v === 'number' && Number.isFinite(v) ? String(v) : typeof v === 'string' ? v.trim().replace(/^\$/, '').replace(/,/g, '') : v),
    z
      .string({ error: `${label} is required.` })
      .min(1, `${label} is required.`)
      .regex(/^\d+(\.\d{1,2})?$/, `${label} must be an amount like 1249.00 (at most 2 decimals).`)
      // Refinements run even after the regex failed: only compare amounts that parsed.
      .refine((s) => !/^\d+(\.\d{1,2})?$/.test(s) || new Decimal(s).lte(max), `${label} must be at most ${max}.`)
      .transform((s) => new Decimal(s).toFixed(2)),
  );
}

/** A checkbox: 'on'/'true'/'1' or boolean true; absent means false. */
export function checkboxField() {
  return z.preprocess((v) => v === true || v === 'on' || v === 'true' || v === '1', z.boolean());
}

/** Latitude or longitude typed in decimal degrees or DMS; always decimal degrees afterwards. */
export function coordinateField(axis: CoordinateAxis, label?: string) {
  const word = axis === 'lat' ? 'Latitude' : 'Longitude';
  return z.union([z.string(), z.number()], { error: `${label ?? word} is required.` }).transform((v, ctx) => {
    const r = parseCoordinate(String(v), axis);
    if (!r.ok) {
      ctx.addIssue({ code: 'custom', message: label ? r.error.replace(word, label) : r.error });
      return z.NEVER;
    }
    return r.value;
  });
}

/** An optional latitude or longitude (decimal or DMS): blank is "not given" (undefined). */
export function optionalCoordinateField(axis: CoordinateAxis, label?: string) {
  return z.preprocess((v) => (v === null ? undefined : blankToUndefined(v)), coordinateField(axis, label).optional());
}

/**
 * The field errors of a failed parse, for forms (in the browser and from actions) and for the
 * API alike: `{ field: [messages] }` keyed by the dotted path ("dishes.2.diameterM"), "" for the
 * whole input. A form field shows the messages under its name and any path inside it.
 */
export function fieldErrorsFrom(error: z.ZodError): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.map(String).join('.');
    (out[key] ??= []).push(issue.message);
  }
  return out;
}
