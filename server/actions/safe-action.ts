import 'server-only';
import { z } from 'zod';
import { unstable_rethrow } from 'next/navigation';
import { AppError, InvalidInputError } from '@/server/errors';
import { fieldErrorsFrom } from '@/server/validation/fields';
import { resolveAccess, type Access, type ContextForAccess } from '@/server/auth/access';
import { isDatabaseUnavailable } from '@/db/unavailable';

/**
 * What every server action returns to its form (React's useActionState). Failures carry a
 * message for the status line, an error code (e.g. 'forbidden', 'plan_limit'), field errors,
 * and the non-secret values typed so the form can be refilled — never a password or token.
 */
export type ActionState<T = unknown> =
  /** `tone: 'warning'`: done, but the message says something went less well (shown in amber, not the success colour). */
  | { ok: true; data?: T; message?: string; tone?: 'warning' }
  | { ok: false; error: string; code?: string; fieldErrors?: Record<string, string[]>; values?: Record<string, string> };

export type ActionInput = FormData | Record<string, unknown>;

/** A wrapped action: `(previousState, formData | plainObject) => ActionState`. */
export type SafeAction<T> = (prev: ActionState<T> | null, input: ActionInput) => Promise<ActionState<T>>;

export type ActionResult<T> = { data?: T; message?: string; tone?: 'warning' } | void;

/**
 * Field names that may hold a secret: passwords under any name (current, confirm, repeat, pwd…),
 * link tokens, codes, keys. Matching is by substring, so a new field called "newPassword" or
 * "confirmPin" is covered without anyone remembering to list it.
 */
const SECRET_FIELD = /pass|pwd|current|confirm|repeat|token|secret|code|key|otp|pin|cvc|cvv|card/i;

// Not "nothing was saved": the connection may have dropped after a commit. The form keeps what was typed.
const DATABASE_DOWN = 'FadeLedger is briefly unavailable. Please try again in a minute.';

/** FormData to a plain object: repeated names become arrays; Next's internal fields are dropped. */
export function formDataToObject(form: FormData): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const key of new Set(form.keys())) {
    if (key.startsWith('$ACTION')) continue;
    const all = form.getAll(key);
    out[key] = all.length === 1 ? all[0] : all;
  }
  return out;
}

/**
 * What a failed action sends back so its form can be refilled: only string fields whose name is
 * not secret-like, and never a value that equals a secret field's value of six characters or
 * more (a password retyped into a field with an innocent name still stays out of the answer).
 */
export function echoValues(raw: Record<string, unknown>): Record<string, string> {
  const secrets = new Set<string>();
  for (const [k, v] of Object.entries(raw)) if (typeof v === 'string' && v.length >= 6 && SECRET_FIELD.test(k)) secrets.add(v);
  const values: Record<string, string> = {};
  for (const [k, v] of Object.entries(raw)) {
    if (typeof v !== 'string' || SECRET_FIELD.test(k) || secrets.has(v)) continue;
    values[k] = v.slice(0, 2000);
  }
  return values;
}

/**
 * The one wrapper for server actions: authorise (session, role, company) FIRST, then validate
 * with the shared zod schema, then run. AppErrors become `{ ok: false, error, code }`; redirects
 * and notFound pass through; anything else is logged and reported without detail.
 *
 * @example
 *   export const inviteMember = safeAction({ schema: inviteSchema, permission: 'team.manage' },
 *     async (input, ctx) => { …; return { message: 'Invitation sent.' }; });
 */
export function safeAction<S extends z.ZodType, A extends Access, T = unknown>(
  opts: { schema: S; permission: A },
  fn: (input: z.output<S>, ctx: ContextForAccess<A>) => Promise<ActionResult<T>>,
): SafeAction<T> {
  return async (_prev, input) => {
    const raw = input instanceof FormData ? formDataToObject(input) : { ...(input ?? {}) };
    try {
      const ctx = await resolveAccess(opts.permission);
      const parsed = opts.schema.safeParse(raw);
      if (!parsed.success) {
        return { ok: false, error: 'Please check the highlighted fields.', code: 'invalid_input', fieldErrors: fieldErrorsFrom(parsed.error), values: echoValues(raw) };
      }
      const result = await fn(parsed.data, ctx);
      return { ok: true, ...(result ?? {}) };
    } catch (error) {
      unstable_rethrow(error);
      if (error instanceof InvalidInputError) {
        return { ok: false, error: error.message, code: error.code, fieldErrors: error.fieldErrors, values: echoValues(raw) };
      }
      if (error instanceof AppError) return { ok: false, error: error.message, code: error.code, values: echoValues(raw) };
      if (isDatabaseUnavailable(error)) return { ok: false, error: DATABASE_DOWN, code: 'unavailable', values: echoValues(raw) };
      console.error('action failed:', error);
      return { ok: false, error: 'Something went wrong on our side. Nothing was changed; please try again.', code: 'internal', values: echoValues(raw) };
    }
  };
}
