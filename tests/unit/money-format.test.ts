import { describe, expect, it } from 'vitest';
import { formatCostPerMinute, formatMoney } from '@/server/money-format';

describe('formatMoney: the one money formatter', () => {
  it('rounds half up to the cent from the exact decimal, never through a float', () => {
    // 0.125 and 2.675 have no exact binary form: a float formatter gives 0.12 / 2.67 on some engines.
    expect(formatMoney('0.125')).toBe('$0.13');
    expect(formatMoney('2.675')).toBe('$2.68');
    expect(formatMoney('9999999999.99')).toBe('$9,999,999,999.99');
  });
  it('writes other currencies after the amount, and a minus sign for negatives', () => {
    expect(formatMoney('-20', 'EUR')).toBe('−20.00 EUR');
    expect(formatMoney(49)).toBe('$49.00');
  });
  it('cost per minute saved keeps a tenth of a cent below a dollar', () => {
    expect(formatCostPerMinute('0.0456')).toBe('$0.046');
    expect(formatCostPerMinute('1.2345')).toBe('$1.23');
  });

  describe('edge cases', () => {
    it('no price reads as a dash; a malformed or infinite amount is refused', () => {
      expect(formatMoney(null)).toBe('—');
      expect(formatCostPerMinute(null)).toBe('—');
      expect(() => formatMoney('12,50')).toThrow();
      expect(() => formatMoney(Number.POSITIVE_INFINITY)).toThrow(RangeError);
    });
    it('negative zero prints without a sign', () => {
      expect(formatMoney('-0.001')).toBe('$0.00');
    });
  });
});
