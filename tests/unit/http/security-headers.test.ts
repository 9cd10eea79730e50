import { describe, expect, it } from 'vitest';
import { newNonce, pageCsp, paymentFormTargets, servedOverHttps, STATIC_SECURITY_HEADERS } from '@/server/http/security-headers';

describe('pageCsp', () => {
  const base = { nonce: 'abc123', dev: false, https: false, formTargets: [] };
  it('allows scripts only with the nonce, no eval and no inline script in production', () => {
    const csp = pageCsp(base);
    expect(csp).toContain("script-src 'self' 'nonce-abc123' 'strict-dynamic'");
    expect(csp).not.toMatch(/script-src[^;]*'unsafe-(inline|eval)'/);
    expect(csp).toContain("style-src 'self' 'nonce-abc123'");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).toContain("object-src 'none'");
    expect(csp).not.toContain('upgrade-insecure-requests');
  });
  it('upgrades stray http requests only over https, and names the payment pages a form may lead to', () => {
    const csp = pageCsp({ ...base, https: true, formTargets: ['https://checkout.stripe.com'] });
    expect(csp).toContain('upgrade-insecure-requests');
    expect(csp).toContain("form-action 'self' https://checkout.stripe.com");
  });
  it('relaxes only what next dev needs', () => {
    expect(pageCsp({ ...base, dev: true })).toContain("'unsafe-eval'");
  });
});

describe('servedOverHttps (decides HSTS)', () => {
  it('is true for an https APP_URL', () => expect(servedOverHttps('https://app.example', false, null)).toBe(true));
  it('believes X-Forwarded-Proto only behind a trusted proxy, reading the value our proxy appended', () => {
    expect(servedOverHttps('http://localhost:3100', false, 'https')).toBe(false);
    expect(servedOverHttps('http://localhost:3100', true, 'https')).toBe(true);
    expect(servedOverHttps('http://localhost:3100', true, 'https, http')).toBe(false);
    expect(servedOverHttps('http://localhost:3100', true, null)).toBe(false);
  });
});

describe('headers', () => {
  it('deny framing, sniffing and referrers; geolocation for ourselves only', () => {
    expect(STATIC_SECURITY_HEADERS).toMatchObject({ 'X-Frame-Options': 'DENY', 'X-Content-Type-Options': 'nosniff', 'Referrer-Policy': 'no-referrer' });
    expect(STATIC_SECURITY_HEADERS['Permissions-Policy']).toContain('geolocation=(self)');
  });
  it('a fresh unguessable nonce each time', () => {
    const a = newNonce();
    expect(a).toMatch(/^[A-Za-z0-9+/]{22}==$/);
    expect(newNonce()).not.toBe(a);
  });
  it('the payment fake is a form target when configured, Stripe otherwise', () => {
    expect(paymentFormTargets({ STRIPE_API_HOST: '127.0.0.1', STRIPE_API_PORT: 12112, STRIPE_API_PROTOCOL: 'http' })).toEqual(['http://127.0.0.1:12112']);
    expect(paymentFormTargets({})).toEqual(['https://checkout.stripe.com', 'https://billing.stripe.com']);
  });
});
