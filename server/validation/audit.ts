import { z } from 'zod';
import { AUDIT_KINDS, type AuditKind } from '@/server/audit/kinds';

const day = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date like 2026-03-31.')
  .refine((v) => !Number.isNaN(Date.parse(`${v}T00:00:00Z`)), 'That is not a date.');
const blankToUndefined = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v);

/**
 * The audit log's filter, from the page's query string and the CSV export's: kind of event,
 * part of the actor's name or address, and a UTC date range (both days included).
 */
export const auditFilterSchema = z
  .object({
    kind: z.preprocess(blankToUndefined, z.enum(Object.keys(AUDIT_KINDS) as [AuditKind, ...AuditKind[]], { error: 'Choose a kind from the list.' }).optional()),
    actor: z.preprocess(blankToUndefined, z.string().trim().max(120, 'Use at most 120 characters.').optional()),
    from: z.preprocess(blankToUndefined, day.optional()),
    to: z.preprocess(blankToUndefined, day.optional()),
    before: z.preprocess(blankToUndefined, z.coerce.number().int().positive().max(Number.MAX_SAFE_INTEGER).optional()),
  })
  .refine((f) => !f.from || !f.to || f.from <= f.to, { message: 'The first day must not be after the last.', path: ['to'] });

export type AuditFilterInput = z.output<typeof auditFilterSchema>;

/** The filter as the query takes it: prefixes and inclusive UTC instants. */
export function auditQueryOf(f: AuditFilterInput): { prefixes?: readonly string[]; actor?: string; from?: Date; to?: Date } {
  return {
    prefixes: f.kind ? AUDIT_KINDS[f.kind].prefixes : undefined,
    actor: f.actor,
    from: f.from ? new Date(`${f.from}T00:00:00.000Z`) : undefined,
    to: f.to ? new Date(`${f.to}T23:59:59.999Z`) : undefined,
  };
}
