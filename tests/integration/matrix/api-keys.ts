import * as apiKeys from '@/server/actions/api-keys';
import { GET as openApiRoute } from '@/app/api/v1/openapi.json/route';
import { models } from '@/db/models';
import { apiKeyPrefix, hashApiKey, newApiKeyToken } from '@/server/auth/api-key-token';
import { actionCase, MATRIX_ROLES, routeCase, type CrossCompanyCase, type MatrixCase } from '../support/action-matrix';
import { suffix } from '../support/factories';

/** API keys (settings/api-keys) and the public OpenAPI document in the permission matrix. */
const ADMIN = ['admin'] as const;

/** A live key row of the company, written directly (the action itself is the row under test). */
async function keyIn(companyId: number): Promise<{ id: number }> {
  const token = newApiKeyToken();
  const row = await models().ApiKey.create({ companyId, name: `Matrix key ${suffix()}`, prefix: apiKeyPrefix(token), tokenHash: hashApiKey(token), scopes: 'read', rateLimitPerMinute: 60, createdByUserId: null });
  return { id: row.id };
}

export const cases: MatrixCase<never>[] = [
  // The matrix company's plan has no API access: an admin passes the guard and meets plan_limit.
  actionCase({ file: 'api-keys', exportName: 'createApiKey', action: apiKeys.createApiKey, access: 'apikey.manage', allow: ADMIN, input: () => ({ name: `Matrix ${suffix()}`, scopes: ['read', 'quotes'] }) }),
  actionCase({ file: 'api-keys', exportName: 'revokeApiKey', action: apiKeys.revokeApiKey, access: 'apikey.manage', allow: ADMIN, prepare: (w) => keyIn(w.company.id), input: (_w, k: { id: number }) => ({ id: String(k.id) }) }),
  routeCase({ method: 'GET', path: '/api/v1/openapi.json', handler: openApiRoute as never, access: 'public', allow: MATRIX_ROLES, request: () => ({ url: '/api/v1/openapi.json' }) }),
] as MatrixCase<never>[];

export const crossCompany: CrossCompanyCase<never>[] = [
  {
    name: 'action api-keys#revokeApiKey',
    prepare: (w) => keyIn(w.otherCompany.id),
    run: async (_w, k: { id: number }) => (await import('../support/next-request')).callAction(apiKeys.revokeApiKey as never, { id: String(k.id) }),
    unchanged: async (_w, k: { id: number }) => {
      const row = await models().ApiKey.findByPk(k.id);
      if (!row || row.revokedAt) throw new Error(`API key ${k.id} of the other company was revoked`);
    },
  },
] as CrossCompanyCase<never>[];
