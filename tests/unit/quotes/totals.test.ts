import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import Decimal from 'decimal.js';
import { QuotePriceError, quoteTotals, sumAmounts } from '@/server/quotes/totals';
import { formatMoney } from '@/server/money-format';

const base = { hardwarePrice: '389.00', labourPrice: '180.00', extrasPrice: '0', discountAmount: '0', taxRatePercent: '0' };

describe('quoteTotals', () => {
  it('adds hardware, labour and extras, takes the discount, then tax rounded half-up to the cent', () => {
    // 389 + 180 + 45.50 − 20 = 594.50; 8.25 % of it = 49.04625 → 49.05 (half-up); total 643.55.
    expect(quoteTotals({ ...base, extrasPrice: '45.50', discountAmount: '20.00', taxRatePercent: '8.25' })).toEqual({ subtotal: '594.50', taxAmount: '49.05', total: '643.55' });
  });

  it('is exact where floats are not', () => {
    // 0.1 + 0.2 in floating point is 0.30000000000000004.
    expect(quoteTotals({ ...base, hardwarePrice: '0.10', labourPrice: '0.20' }).total).toBe('0.30');
  });

  it('rounds a half cent up, and below half down', () => {
    expect(quoteTotals({ ...base, hardwarePrice: '10.10', labourPrice: '0', taxRatePercent: '5' }).taxAmount).toBe('0.51'); // 0.505
    expect(quoteTotals({ ...base, hardwarePrice: '10.08', labourPrice: '0', taxRatePercent: '5' }).taxAmount).toBe('0.50'); // 0.504
  });

  it('accepts a discount equal to everything (a free installation) but not more', () => {
    expect(quoteTotals({ ...base, discountAmount: '569.00' }).total).toBe('0.00');
    expect(() => quoteTotals({ ...base, discountAmount: '569.01' })).toThrow(QuotePriceError);
    try {
      quoteTotals({ ...base, discountAmount: '600' });
    } catch (e) {
      expect((e as QuotePriceError).field).toBe('discountAmount');
    }
  });

  it('holds, for any amounts, total = subtotal + tax and tax within half a cent of the exact product', () => {
    const cents = fc.integer({ min: 0, max: 50_000_000 }).map((c) => new Decimal(c).dividedBy(100).toFixed(2));
    const rate = fc.integer({ min: 0, max: 100_000 }).map((r) => new Decimal(r).dividedBy(1000).toFixed(3));
    fc.assert(
      fc.property(cents, cents, cents, rate, (hardwarePrice, labourPrice, extrasPrice, taxRatePercent) => {
        const t = quoteTotals({ hardwarePrice, labourPrice, extrasPrice, discountAmount: '0', taxRatePercent });
        const subtotal = new Decimal(hardwarePrice).plus(labourPrice).plus(extrasPrice);
        expect(t.subtotal).toBe(subtotal.toFixed(2));
        expect(new Decimal(t.subtotal).plus(t.taxAmount).toFixed(2)).toBe(t.total);
        const exactTax = subtotal.times(taxRatePercent).dividedBy(100);
        expect(new Decimal(t.taxAmount).minus(exactTax).abs().lte('0.005')).toBe(true);
      }),
      { numRuns: 300 },
    );
  });

  describe('edge cases', () => {
    it('names the field of a malformed amount or rate', () => {
      const field = (p: Partial<typeof base>) => {
        try {
          quoteTotals({ ...base, ...p });
        } catch (e) {
          return (e as QuotePriceError).field;
        }
        return null;
      };
      expect(field({ hardwarePrice: '12,50' })).toBe('hardwarePrice');
      expect(field({ labourPrice: '-5' })).toBe('labourPrice');
      expect(field({ extrasPrice: '1.234' })).toBe('extrasPrice');
      expect(field({ taxRatePercent: '100.5' })).toBe('taxRatePercent');
      expect(field({ taxRatePercent: 'eight' })).toBe('taxRatePercent');
      expect(field({ hardwarePrice: '9999999999.99', labourPrice: '1' })).toBe('total');
    });
    it('accepts 0 % and 100 % tax', () => {
      expect(quoteTotals({ ...base, taxRatePercent: '100' }).total).toBe('1138.00');
      expect(quoteTotals(base).taxAmount).toBe('0.00');
    });
  });
});

describe('sumAmounts and formatMoney', () => {
  it('sums decimal strings exactly and prints them with grouping', () => {
    expect(sumAmounts('0.10', '0.20')).toBe('0.30');
    expect(formatMoney('1249.9', 'USD')).toBe('$1,249.90');
    expect(formatMoney('1234567.5', 'EUR')).toBe('1,234,567.50 EUR');
    expect(formatMoney('0', 'USD')).toBe('$0.00');
  });
});
