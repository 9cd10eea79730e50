import Decimal from 'decimal.js';

/**
 * Quote arithmetic, exact (decimal.js, never floats): amounts are decimal strings with at most
 * two places, the tax rate a percentage with at most three.
 *
 *   subtotal = hardware + labour + extras − discount   (must not go below zero)
 *   tax      = subtotal × rate / 100, rounded half-up to the cent
 *   total    = subtotal + tax
 *
 * Rounding once, on the tax line, is the usual invoice convention (common practice, no source).
 */

// A private Decimal so nobody else's global precision/rounding settings change our cents.
const Money = Decimal.clone({ precision: 40, rounding: Decimal.ROUND_HALF_UP });

export interface QuotePrices {
  hardwarePrice: string;
  labourPrice: string;
  extrasPrice: string;
  discountAmount: string;
  taxRatePercent: string;
}

export interface QuoteTotals {
  subtotal: string;
  taxAmount: string;
  total: string;
}

/** The largest amount a DECIMAL(12,2) column holds. */
export const MAX_AMOUNT = '9999999999.99';
const AMOUNT = /^\d{1,10}(\.\d{1,2})?$/;
const RATE = /^\d{1,3}(\.\d{1,3})?$/;

export class QuotePriceError extends Error {
  constructor(
    public readonly field: keyof QuotePrices | 'total',
    message: string,
  ) {
    super(message);
    this.name = 'QuotePriceError';
  }
}

/** An amount string as typed ("1 249,90" is refused; "1249.9" is fine) → canonical "1249.90". */
function normaliseAmount(value: string, field: keyof QuotePrices): string {
  const v = value.trim();
  if (!AMOUNT.test(v)) throw new QuotePriceError(field, 'Enter an amount such as 1249.90 (digits, at most two decimals).');
  return new Money(v).toFixed(2);
}

/**
 * Subtotal, tax and total of a quote.
 *
 * Bad input: a malformed amount or rate, a rate above 100 %, a discount larger than the
 * hardware + labour + extras, or a total beyond the column's range throws QuotePriceError
 * naming the field.
 *
 * @example
 * quoteTotals({ hardwarePrice: '389.00', labourPrice: '180.00', extrasPrice: '45.50', discountAmount: '20.00', taxRatePercent: '8.25' })
 * // => { subtotal: '594.50', taxAmount: '49.05', total: '643.55' }
 */
export function quoteTotals(p: QuotePrices): QuoteTotals {
  const hardware = new Money(normaliseAmount(p.hardwarePrice, 'hardwarePrice'));
  const labour = new Money(normaliseAmount(p.labourPrice, 'labourPrice'));
  const extras = new Money(normaliseAmount(p.extrasPrice, 'extrasPrice'));
  const discount = new Money(normaliseAmount(p.discountAmount, 'discountAmount'));
  const rateText = p.taxRatePercent.trim();
  if (!RATE.test(rateText)) throw new QuotePriceError('taxRatePercent', 'Enter the tax rate as a percentage such as 8.25 (at most three decimals).');
  const rate = new Money(rateText);
  if (rate.gt(100)) throw new QuotePriceError('taxRatePercent', 'The tax rate must be at most 100 %.');

  const gross = hardware.plus(labour).plus(extras);
  if (discount.gt(gross)) throw new QuotePriceError('discountAmount', `The discount is larger than hardware, labour and extras together (${gross.toFixed(2)}).`);
  const subtotal = gross.minus(discount);
  const tax = subtotal.times(rate).dividedBy(100).toDecimalPlaces(2, Money.ROUND_HALF_UP);
  const total = subtotal.plus(tax);
  if (total.gt(MAX_AMOUNT)) throw new QuotePriceError('total', `The total is larger than we can store (${MAX_AMOUNT}).`);
  return { subtotal: subtotal.toFixed(2), taxAmount: tax.toFixed(2), total: total.toFixed(2) };
}

/** Sum of decimal strings, exact: used for an option's catalogue price (hardware + labour). */
export function sumAmounts(...amounts: string[]): string {
  return amounts.reduce((acc, a) => acc.plus(new Money(a)), new Money(0)).toFixed(2);
}
