import { describe, expect, it } from 'vitest';
import { API_SCOPES, parseScopes, permissionsOfScopes, SCOPE_PERMISSIONS, scopesAllow } from '@/server/auth/api-scopes';
import { apiKeyPrefix, bearerTokenOf, hashApiKey, looksLikeApiKey, newApiKeyToken, sameDigest } from '@/server/auth/api-key-token';
import { can, PERMISSIONS } from '@/server/auth/permissions';
import { createApiKeySchema } from '@/server/validation/api-key';

describe('API scopes', () => {
  it('open only permissions an admin holds, and never a managing one', () => {
    for (const [scope, permissions] of Object.entries(SCOPE_PERMISSIONS)) {
      for (const p of permissions) {
        expect(can('admin', p), `${scope} → ${p}`).toBe(true);
        expect(p, `${scope} → ${p}`).not.toMatch(/manage|write|share/);
      }
    }
  });

  it('apikey.manage is an admin’s alone', () => {
    expect([...PERMISSIONS['apikey.manage']]).toEqual(['admin']);
  });

  it('a scope opens its own permissions only', () => {
    expect(scopesAllow(['trade-off'], 'tradeoff.api')).toBe(true);
    expect(scopesAllow(['trade-off'], 'study.read')).toBe(false);
    expect(scopesAllow([], 'study.read')).toBe(false);
    expect(permissionsOfScopes(['studies', 'quotes']).sort()).toEqual(['quote.read', 'study.read']);
  });

  it('stored scopes read back without widening: unknown names drop out', () => {
    expect(parseScopes('read,quotes')).toEqual(['read', 'quotes']);
    expect(parseScopes('read,admin,,*')).toEqual(['read']);
    expect(parseScopes('')).toEqual([]);
  });
});

describe('API key strings', () => {
  it('are fl_ + 43 base64url characters, fresh each time, with an 11-character prefix', () => {
    const a = newApiKeyToken();
    const b = newApiKeyToken();
    expect(a).toMatch(/^fl_[A-Za-z0-9_-]{43}$/);
    expect(a).not.toBe(b);
    expect(apiKeyPrefix(a)).toHaveLength(11);
    expect(looksLikeApiKey(a)).toBe(true);
  });

  it('compare digests in constant time, refusing anything but two 32-byte digests', () => {
    const t = newApiKeyToken();
    expect(sameDigest(hashApiKey(t), hashApiKey(t))).toBe(true);
    expect(sameDigest(hashApiKey(t), hashApiKey(t + 'x'))).toBe(false);
    expect(sameDigest(hashApiKey(t), '')).toBe(false);
    expect(sameDigest('zz', 'zz')).toBe(false);
  });

  describe('edge cases', () => {
    it('the Authorization header: absent → null, not a bearer credential → empty', () => {
      expect(bearerTokenOf(new Headers())).toBeNull();
      expect(bearerTokenOf(new Headers({ authorization: 'Bearer fl_abc' }))).toBe('fl_abc');
      expect(bearerTokenOf(new Headers({ authorization: 'bearer  fl_abc ' }))).toBe('fl_abc');
      expect(bearerTokenOf(new Headers({ authorization: 'Basic Zm9vOmJhcg==' }))).toBe('');
      expect(bearerTokenOf(new Headers({ authorization: 'Bearer a b' }))).toBe('');
      expect(bearerTokenOf(new Headers({ authorization: '' }))).toBe('');
    });

    it('shapes that are not ours are refused before any lookup', () => {
      for (const v of ['', 'fl_', `fl_${'a'.repeat(42)}`, `fl_${'a'.repeat(44)}`, `xx_${'a'.repeat(43)}`, `fl_${'a'.repeat(42)}=`]) expect(looksLikeApiKey(v), v).toBe(false);
    });
  });
});

describe('the new-key form schema', () => {
  it('takes one checkbox as a string or several as an array, in the canonical order, without duplicates', () => {
    expect(createApiKeySchema.parse({ name: 'CRM', scopes: 'quotes' }).scopes).toEqual(['quotes']);
    expect(createApiKeySchema.parse({ name: 'CRM', scopes: ['quotes', 'read', 'quotes'] }).scopes).toEqual(['read', 'quotes']);
    expect(createApiKeySchema.parse({ name: 'CRM', scopes: API_SCOPES }).rateLimitPerMinute).toBe(120);
  });

  it('refuses no scope, an unknown scope, a blank name and a rate outside 1…600', () => {
    expect(createApiKeySchema.safeParse({ name: 'CRM' }).success).toBe(false);
    expect(createApiKeySchema.safeParse({ name: 'CRM', scopes: ['admin'] }).success).toBe(false);
    expect(createApiKeySchema.safeParse({ name: '   ', scopes: ['read'] }).success).toBe(false);
    expect(createApiKeySchema.safeParse({ name: 'CRM', scopes: ['read'], rateLimitPerMinute: '0' }).success).toBe(false);
    expect(createApiKeySchema.safeParse({ name: 'CRM', scopes: ['read'], rateLimitPerMinute: '601' }).success).toBe(false);
    expect(createApiKeySchema.safeParse({ name: 'CRM', scopes: ['read'], rateLimitPerMinute: '2.5' }).success).toBe(false);
  });
});
