import { describe, expect, it } from 'vitest';
import { auditAddressFrom, clientIpFrom } from '@/server/auth/request-meta';
import { csvField } from '@/server/audit/csv';
import { priceChanges } from '@/server/audit/price-changes';
import { auditFilterSchema, auditQueryOf } from '@/server/validation/audit';
import { AUDIT_LABELS, describeDetail } from '@/components/account/describe';
import { AUDIT_KINDS } from '@/server/audit/kinds';

describe('auditAddressFrom', () => {
  it('behind our proxy takes the entry the proxy appended, as the throttles do', () => {
    const h = new Headers({ 'x-forwarded-for': '198.51.100.1, 192.0.2.44' });
    expect(auditAddressFrom(h, true)).toBe('192.0.2.44');
    expect(auditAddressFrom(h, true)).toBe(clientIpFrom(h, true));
  });
  it('without a proxy takes the single address Next copied from the socket, IPv4-mapped or IPv6', () => {
    expect(auditAddressFrom(new Headers({ 'x-forwarded-for': '::ffff:203.0.113.5' }), false)).toBe('203.0.113.5');
    expect(auditAddressFrom(new Headers({ 'x-forwarded-for': '2001:db8::7' }), false)).toBe('2001:db8::7');
    expect(auditAddressFrom(new Headers({ 'x-forwarded-for': '::1' }), false)).toBe('::1');
  });
  it('without a proxy records nothing for a chain or a non-address (only a client sends those)', () => {
    expect(auditAddressFrom(new Headers({ 'x-forwarded-for': '198.51.100.1, 192.0.2.44' }), false)).toBeNull();
    expect(auditAddressFrom(new Headers({ 'x-forwarded-for': '<script>' }), false)).toBeNull();
    expect(auditAddressFrom(new Headers(), false)).toBeNull();
    // The throttles still never use it.
    expect(clientIpFrom(new Headers({ 'x-forwarded-for': '203.0.113.5' }), false)).toBeNull();
  });
});

describe('csvField', () => {
  it('quotes commas, quotes and line breaks, and defuses spreadsheet formulas', () => {
    expect(csvField('plain')).toBe('plain');
    expect(csvField('a, b')).toBe('"a, b"');
    expect(csvField('say "hi"')).toBe('"say ""hi"""');
    expect(csvField('two\nlines')).toBe('"two\nlines"');
    expect(csvField('=1+2')).toBe("'=1+2");
    expect(csvField('+44 20')).toBe("'+44 20");
    expect(csvField('-3')).toBe("'-3");
    expect(csvField('@SUM(A1)')).toBe("'@SUM(A1)");
    expect(csvField(null)).toBe('');
  });
});

describe('priceChanges', () => {
  it('lists only the fields that changed, as from → to', () => {
    expect(priceChanges({ name: 'D', hardwarePrice: '210.00', labourPrice: '90.00' }, { name: 'D', hardwarePrice: '235.50', labourPrice: '90.00' })).toEqual({ hardwarePrice: { from: '210.00', to: '235.50' } });
    expect(priceChanges({ a: '1' }, { a: '1' })).toEqual({});
  });
});

describe('audit filter', () => {
  it('takes a kind, an actor and an inclusive UTC day range; blanks mean no filter', () => {
    const f = auditFilterSchema.parse({ kind: 'billing', actor: ' Ada ', from: '2026-03-01', to: '2026-03-31', before: '' });
    expect(auditQueryOf(f)).toEqual({ prefixes: AUDIT_KINDS.billing.prefixes, actor: 'Ada', from: new Date('2026-03-01T00:00:00.000Z'), to: new Date('2026-03-31T23:59:59.999Z') });
    expect(auditQueryOf(auditFilterSchema.parse({ kind: '', actor: '', from: '', to: '' }))).toEqual({ prefixes: undefined, actor: undefined, from: undefined, to: undefined });
  });
  it('refuses an unknown kind, a bad date and a range that ends before it starts', () => {
    expect(auditFilterSchema.safeParse({ kind: 'all' }).success).toBe(false);
    expect(auditFilterSchema.safeParse({ from: '31/03/2026' }).success).toBe(false);
    expect(auditFilterSchema.safeParse({ from: '2026-04-02', to: '2026-04-01' }).success).toBe(false);
  });
});

describe('audit words', () => {
  it('every kind prefix matches at least one labelled action', () => {
    const actions = Object.keys(AUDIT_LABELS);
    for (const k of Object.values(AUDIT_KINDS)) for (const p of k.prefixes) expect(actions.some((a) => a.startsWith(p)), p).toBe(true);
  });
  it('names the reason and the new trial end of a staff action', () => {
    expect(describeDetail('staff.trial_extended', { reason: 'Waiting on survey', trialEndsAt: '2026-12-20T10:00:00.000Z' })).toBe('until 2026-12-20, reason: Waiting on survey');
    expect(describeDetail('catalogue.dish_updated', { hardwarePrice: { from: '1.00', to: '2.00' } })).toBe('hardware price 1.00 → 2.00');
  });
});
