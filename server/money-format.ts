import Decimal from 'decimal.js';

/**
 * Money as people read it, from exact decimal strings (decimal.js, never floats): "$1,249.90",
 * "1,249.90 EUR", "−$20.00". Half-up to the cent, the usual invoice convention (common practice,
 * no source). The one money formatter of the app: quotes, PDF, e-mails, study, catalogue, billing.
 */

// A private Decimal so nobody else's global precision/rounding settings change our cents.
const Money = Decimal.clone({ precision: 40, rounding: Decimal.ROUND_HALF_UP });

function grouped(amount: Decimal, places: number, currency: string): string {
  const rounded = amount.toDecimalPlaces(places);
  const [whole, fraction] = rounded.abs().toFixed(places).split('.');
  const digits = `${whole.replace(/\B(?=(\d{3})+(?!\d))/g, ',')}${fraction === undefined ? '' : `.${fraction}`}`;
  // The sign of what is shown: −0.001 prints as $0.00, not −$0.00.
  const sign = rounded.isNegative() && !rounded.isZero() ? '−' : '';
  return currency === 'USD' ? `${sign}$${digits}` : `${sign}${digits} ${currency}`;
}

function parse(amount: string | number): Decimal {
  const d = new Money(amount);
  if (!d.isFinite()) throw new RangeError(`an amount of money must be a finite number; got ${amount}`);
  return d;
}

/**
 * Bad input: a string that is not a number throws (decimal.js DecimalError); NaN or ±Infinity
 * throws RangeError. null (no price given) reads "—".
 *
 * @example formatMoney('1249.9') // => '$1,249.90'
 * @example formatMoney('-20', 'EUR') // => '−20.00 EUR'
 */
export function formatMoney(amount: string | number | null, currency = 'USD'): string {
  if (amount === null) return '—';
  return grouped(parse(amount), 2, currency);
}

/**
 * Price per minute of outage saved a year: below a dollar the tenth of a cent matters.
 *
 * @example formatCostPerMinute('0.0456') // => '$0.046'
 */
export function formatCostPerMinute(amount: string | null, currency = 'USD'): string {
  if (amount === null) return '—';
  const d = parse(amount);
  return grouped(d, d.abs().lt(1) ? 3 : 2, currency);
}
