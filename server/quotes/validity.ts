import { InvalidInputError } from '@/server/errors';
import { QUOTE_VALIDITY_DAYS } from '@/server/validation/quote';
import { QuotePriceError, quoteTotals, type QuotePrices, type QuoteTotals } from './totals';
import { addDays, utcDay } from './status';

/** A new or edited quote must be valid from today to at most a year ahead (UTC days). */
export function assertValidUntil(validUntil: string, now: Date = new Date()): void {
  const today = utcDay(now);
  if (validUntil < today) throw new InvalidInputError('Please check the highlighted fields.', { validUntil: ['Valid until must be today or later.'] });
  const last = addDays(today, QUOTE_VALIDITY_DAYS.max);
  if (validUntil > last) throw new InvalidInputError('Please check the highlighted fields.', { validUntil: [`Valid until can be at most ${QUOTE_VALIDITY_DAYS.max} days ahead (${last}).`] });
}

/** quoteTotals with its errors as field errors of the form. */
export function totalsOrFieldError(prices: QuotePrices): QuoteTotals {
  try {
    return quoteTotals(prices);
  } catch (error) {
    if (error instanceof QuotePriceError) throw new InvalidInputError(error.message, { [error.field]: [error.message] });
    throw error;
  }
}
