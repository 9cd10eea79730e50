import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { emailField, resetPasswordSchema, safeNextPath, signUpSchema, inviteSchema } from '@/server/auth/schemas';
import { clientIpFrom } from '@/server/auth/request-meta';
import { hashToken, looksLikeToken, newToken } from '@/server/auth/tokens';
import { formDataToObject } from '@/server/actions/safe-action';
import { fieldErrorsFrom } from '@/server/validation/fields';
import { invitationMail } from '@/server/mail/templates/invitation';
import { passwordResetMail } from '@/server/mail/templates/password-reset';
import { escapeHtml } from '@/server/mail/templates/layout';
import { describeDevice } from '@/components/account/describe';

describe('tokens', () => {
  it('are 32 random bytes in base64url, and stored as a sha256 hex digest', () => {
    const a = newToken();
    expect(a).toMatch(/^[A-Za-z0-9_-]{43}$/);
    expect(newToken()).not.toBe(a);
    expect(hashToken(a)).toMatch(/^[0-9a-f]{64}$/);
    expect(hashToken(a)).toBe(hashToken(a));
    // sha256("abc"), FIPS 180-2 appendix B.1 test vector (from memory)
    expect(hashToken('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
  });

  it('only well-formed tokens reach the database', () => {
    expect(looksLikeToken(newToken())).toBe(true);
    expect(looksLikeToken('../../etc/passwd')).toBe(false);
    expect(looksLikeToken('short')).toBe(false);
    expect(looksLikeToken(undefined)).toBe(false);
  });
});

describe('schemas', () => {
  it('addresses are trimmed and lower-cased', () => {
    expect(emailField.parse('  Orla@Example.COM ')).toBe('orla@example.com');
    expect(emailField.safeParse('not an address').success).toBe(false);
  });

  it('sign-up asks for a 10-character password and names each missing field', () => {
    const r = signUpSchema.safeParse({ name: ' ', companyName: '', email: 'x', password: 'short' });
    expect(r.success).toBe(false);
    if (!r.success) expect(Object.keys(fieldErrorsFrom(r.error)).sort()).toEqual(['companyName', 'email', 'name', 'password']);
  });

  it('the reset form wants the same password twice', () => {
    const token = newToken();
    expect(resetPasswordSchema.safeParse({ token, password: 'long-enough-1', confirm: 'long-enough-1' }).success).toBe(true);
    const r = resetPasswordSchema.safeParse({ token, password: 'long-enough-1', confirm: 'long-enough-2' });
    expect(r.success || fieldErrorsFrom(r.error)).toEqual({ confirm: ['The two passwords differ.'] });
  });

  it('invitations take only company roles', () => {
    expect(inviteSchema.safeParse({ email: 'a@b.example', role: 'installer' }).success).toBe(true);
    expect(inviteSchema.safeParse({ email: 'a@b.example', role: 'staff' }).success).toBe(false);
  });

  describe('edge cases', () => {
    it('"next" after sign-in is a same-site path only', () => {
      expect(safeNextPath('/studies/4', 'http://localhost:3100')).toBe('/studies/4');
      expect(safeNextPath('//evil.example', 'http://localhost:3100')).toBeNull();
      expect(safeNextPath('/\\evil.example', 'http://localhost:3100')).toBeNull();
      expect(safeNextPath('https://evil.example', 'http://localhost:3100')).toBeNull();
      expect(safeNextPath('', 'http://localhost:3100')).toBeNull();
      expect(safeNextPath(undefined, 'http://localhost:3100')).toBeNull();
    });
  });
});

describe('client address', () => {
  it('is read from X-Forwarded-For only behind a trusted proxy, taking the entry the proxy appended', () => {
    const h = new Headers({ 'x-forwarded-for': '6.6.6.6, 192.0.2.44' });
    expect(clientIpFrom(h, true)).toBe('192.0.2.44');
    expect(clientIpFrom(h, false)).toBeNull();
    expect(clientIpFrom(new Headers({ 'x-forwarded-for': '::ffff:192.0.2.9' }), true)).toBe('192.0.2.9');
    expect(clientIpFrom(new Headers(), true)).toBeNull();
  });
});

describe('form data for actions', () => {
  it('becomes a plain object; repeated names become arrays; Next.js internals are dropped', () => {
    const fd = new FormData();
    fd.append('email', 'a@b.example');
    fd.append('tag', 'x');
    fd.append('tag', 'y');
    fd.append('$ACTION_ID_abc', '');
    expect(formDataToObject(fd)).toEqual({ email: 'a@b.example', tag: ['x', 'y'] });
  });

  it('zod issues map to dotted field names', () => {
    const r = z.object({ a: z.object({ b: z.string() }) }).safeParse({ a: { b: 1 } });
    expect(r.success ? null : Object.keys(fieldErrorsFrom(r.error))).toEqual(['a.b']);
  });
});

describe('mail templates', () => {
  it('invitation: both bodies carry the link; names from users are escaped in HTML', () => {
    const m = invitationMail({ companyName: 'Rook & <Pike>', inviterName: 'Ana "A" Vell', roleLabel: 'Sales', acceptUrl: 'http://localhost:3100/invite/abc', expiresAt: new Date('2026-12-08T10:00:00Z') });
    expect(m.subject).toBe('Ana "A" Vell invited you to Rook & <Pike> on FadeLedger');
    expect(m.text).toContain('http://localhost:3100/invite/abc');
    expect(m.text).toContain('expires on 2026-12-08 10:00 UTC');
    expect(m.html).toContain('href="http://localhost:3100/invite/abc"');
    expect(m.html).toContain('Rook &amp; &lt;Pike&gt;');
    expect(m.html).not.toContain('<Pike>');
  });

  it('password reset: says what happens and what to do if it was not you', () => {
    const m = passwordResetMail({ name: 'Orla', resetUrl: 'http://x/reset-password/t', expiresAt: new Date('2026-12-01T12:00:00Z') });
    expect(m.text).toContain('http://x/reset-password/t');
    expect(m.text).toContain('If you did not ask for this');
    expect(escapeHtml(`<a href="x">'`)).toBe('&lt;a href=&quot;x&quot;&gt;&#39;');
  });
});

describe('device names on the sessions page', () => {
  it('names the common browsers and systems, and falls back plainly', () => {
    expect(describeDevice('Mozilla/5.0 (X11; Linux x86_64) AppleWebKit/537.36 (KHTML, like Gecko) Chrome/140.0 Safari/537.36')).toBe('Chrome on Linux');
    expect(describeDevice('Mozilla/5.0 (iPhone; CPU iPhone OS 18_0 like Mac OS X) AppleWebKit/605.1.15 Version/18.0 Mobile/15E148 Safari/604.1')).toBe('Safari on iOS');
    expect(describeDevice('Mozilla/5.0 (Windows NT 10.0; Win64; x64; rv:130.0) Gecko/20100101 Firefox/130.0')).toBe('Firefox on Windows');
    expect(describeDevice(null)).toBe('Unknown device');
  });
});
