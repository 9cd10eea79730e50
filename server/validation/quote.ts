import { z } from 'zod';
import { checkboxField, idField, idListField, moneyField, optionalEmail, optionalText, requiredText } from './fields';
import { QUOTE_STATUSES } from '@/server/quotes/status';

/** How long a quote may stay open, days from today (our product rule: a year at most). */
export const QUOTE_VALIDITY_DAYS = { min: 0, max: 365, default: 30 } as const;
/** How long a comparison link may stay open, days (our product rule). */
export const LINK_VALIDITY_DAYS = { min: 1, max: 90, default: 30 } as const;
export const QUOTE_NOTES_MAX = 4000;

const DAY = /^\d{4}-\d{2}-\d{2}$/;

/** A calendar date typed as YYYY-MM-DD (the <input type="date"> format). */
function dayField(label: string) {
  return z.preprocess(
    (v) => (typeof v === 'string' ? v.trim() : v),
    z
      .string({ error: `${label} is required.` })
      .regex(DAY, `${label} must be a date (YYYY-MM-DD).`)
      .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s), `${label} is not a real date.`),
  );
}

/** A tax rate in percent with at most 3 decimals, 0–100. Blank means 0. */
function taxRateField(label = 'Tax rate') {
  return z.preprocess(
    (v) => (v === undefined || v === null || (typeof v === 'string' && v.trim() === '') ? '0' : typeof v === 'number' ? String(v) : typeof v === 'string' ? v.trim().replace(/%$/, '').trim() : v),
    z
      .string()
      .regex(/^\d{1,3}(\.\d{1,3})?$/, `${label} must be a percentage like 8.25 (at most 3 decimals).`)
      .refine((s) => Number(s) <= 100, `${label} must be at most 100 %.`),
  );
}

/** Blank money boxes mean zero for the optional lines (extras, discount). */
const optionalMoney = (label: string) => z.preprocess((v) => (v === undefined || v === null || (typeof v === 'string' && v.trim() === '') ? '0' : v), moneyField(label));

/** The prices, customer and validity of a quote: shared by "new quote" and "edit draft". */
const quoteTermsShape = {
  title: optionalText('Title', 200),
  customerName: requiredText('Customer name', 160),
  customerEmail: optionalEmail('Customer e-mail'),
  validUntil: dayField('Valid until'),
  notes: optionalText('Notes', QUOTE_NOTES_MAX),
  hardwarePrice: moneyField('Hardware'),
  labourPrice: moneyField('Labour'),
  extrasLabel: optionalText('Extras description', 120),
  extrasPrice: optionalMoney('Extras'),
  discountAmount: optionalMoney('Discount'),
  taxRatePercent: taxRateField(),
};

/**
 * New quote from one option of a study. `shownOptions` are the study option indexes the
 * customer will see (the chosen one is always among them).
 */
export const newQuoteSchema = z
  .object({
    studyId: idField('study'),
    optionIndex: z.preprocess((v) => (typeof v === 'string' && /^\d+$/.test(v.trim()) ? Number(v.trim()) : v), z.number({ error: 'Choose the option to quote.' }).int().min(0, 'Choose the option to quote.')),
    // Option indexes start at 0; idListField wants positive ids, so they travel shifted by one.
    shownOptions: z.preprocess(
      (v) => (v === undefined ? undefined : Array.isArray(v) ? v.map(shift) : typeof v === 'string' ? v.split(',').filter((s) => s.trim() !== '').map(shift) : v),
      idListField('options to show', 1, 12).optional(),
    ),
    ...quoteTermsShape,
  })
  .transform((v) => ({ ...v, shownOptions: v.shownOptions?.map((n) => n - 1) }));

function shift(s: unknown): unknown {
  const n = typeof s === 'string' && /^\d+$/.test(s.trim()) ? Number(s.trim()) : s;
  return typeof n === 'number' ? n + 1 : n;
}

export type NewQuoteInput = z.output<typeof newQuoteSchema>;

export const updateQuoteSchema = z.object({ quoteId: idField('quote'), ...quoteTermsShape });
export type UpdateQuoteInput = z.output<typeof updateQuoteSchema>;

export const quoteIdSchema = z.object({ quoteId: idField('quote') });

export const createShareLinkSchema = z.object({
  quoteId: idField('quote'),
  expiresInDays: z.preprocess(
    (v) => (v === undefined || v === null || v === '' ? LINK_VALIDITY_DAYS.default : typeof v === 'string' ? Number(v) : v),
    z.number({ error: 'Link validity must be a number of days.' }).int('Link validity must be whole days.').min(LINK_VALIDITY_DAYS.min, `A link lasts at least ${LINK_VALIDITY_DAYS.min} day.`).max(LINK_VALIDITY_DAYS.max, `A link lasts at most ${LINK_VALIDITY_DAYS.max} days.`),
  ),
});

export const revokeShareLinkSchema = z.object({ quoteId: idField('quote'), linkId: idField('link') });
export const copyShareLinkSchema = z.object({ quoteId: idField('quote'), linkId: idField('link') });

export const emailQuoteSchema = z.object({
  quoteId: idField('quote'),
  to: optionalEmail('Send to'),
  message: optionalText('Message', 2000),
  expiresInDays: createShareLinkSchema.shape.expiresInDays,
});

/** The customer's answer on the comparison page (no account). */
export const customerDecisionSchema = z
  .object({
    token: z.string().regex(/^[A-Za-z0-9_-]{20,128}$/, 'This link is not valid.'),
    decision: z.enum(['accept', 'decline'], { error: 'Choose accept or decline.' }),
    name: z.preprocess(
      (v) => (typeof v === 'string' ? v.trim().replace(/\s+/g, ' ') : v),
      z
        .string({ error: 'Your name is required.' })
        .min(1, { message: 'Your name is required.', abort: true })
        .min(2, 'Please type your full name.')
        .max(160, 'Your name must be at most 160 characters.'),
    ),
    comment: optionalText('Comment', 1000),
    // Where the receipt goes; optional, the customer's choice (nothing is sent without it).
    receiptEmail: optionalEmail('E-mail for a receipt'),
    confirm: checkboxField(),
  })
  .refine((v) => v.decision !== 'accept' || v.confirm, { path: ['confirm'], message: 'Tick the box to confirm you accept this quote.' });

export const QUOTE_LIST_STATUSES = ['all', ...QUOTE_STATUSES, 'open'] as const;
