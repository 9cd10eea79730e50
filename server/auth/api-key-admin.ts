import 'server-only';
import { models } from '@/db/models';
import { countLiveApiKeys, insertApiKey, revokeApiKeyRow } from '@/db/queries/api-keys';
import { lockCompanyRow } from '@/db/queries/company-lock';
import { assertWithinPlan } from '@/server/plan-limit';
import { ConflictError, NotFoundError } from '@/server/errors';
import type { CreateApiKeyInput } from '@/server/validation/api-key';
import type { CompanyAuthContext } from './guards';
import { audit } from './audit';
import type { RequestMeta } from './request-meta';
import { apiKeyPrefix, hashApiKey, newApiKeyToken } from './api-key-token';

/** Live keys a company may hold at once: enough for every system of a reseller, few enough to review. */
export const MAX_LIVE_API_KEYS = 25;

const actorOf = (ctx: CompanyAuthContext) => ({ id: ctx.user.id, name: ctx.user.name, email: ctx.user.email });

/**
 * Makes a key for the admin's company and returns it — the only time the key exists outside the
 * caller's hands; the database keeps its sha256 and prefix. The plan must include API access
 * (checked under the company row lock, so the live-key count and the insert are one step).
 */
export async function createApiKey(ctx: CompanyAuthContext, input: CreateApiKeyInput, meta: RequestMeta): Promise<{ id: number; token: string; prefix: string }> {
  const token = newApiKeyToken();
  const prefix = apiKeyPrefix(token);
  const { sequelize } = models();
  const { id } = await sequelize.transaction(async (t) => {
    await assertWithinPlan(await lockCompanyRow(ctx.companyId, t), 'apiAccess');
    if ((await countLiveApiKeys(ctx.companyId, t)) >= MAX_LIVE_API_KEYS) {
      throw new ConflictError(`A company can hold ${MAX_LIVE_API_KEYS} live API keys; revoke one you no longer use first.`);
    }
    const created = await insertApiKey({ companyId: ctx.companyId, name: input.name, prefix, tokenHash: hashApiKey(token), scopes: input.scopes.join(','), rateLimitPerMinute: input.rateLimitPerMinute, createdByUserId: ctx.user.id }, t);
    await audit({ companyId: ctx.companyId, actor: actorOf(ctx), action: 'api_key.created', target: `${input.name} (${prefix}…)`, detail: { scopes: input.scopes } }, meta, t);
    return created;
  });
  return { id, token, prefix };
}

/** Revokes one of the company's keys at once (its next request answers 401). Another company's id is a 404. */
export async function revokeApiKey(ctx: CompanyAuthContext, id: number, meta: RequestMeta): Promise<{ name: string; alreadyRevoked: boolean }> {
  const { sequelize } = models();
  return sequelize.transaction(async (t) => {
    const revoked = await revokeApiKeyRow(ctx.companyId, id, ctx.user.id, t);
    if (!revoked) throw new NotFoundError('That API key');
    if (!revoked.alreadyRevoked) await audit({ companyId: ctx.companyId, actor: actorOf(ctx), action: 'api_key.revoked', target: revoked.name }, meta, t);
    return revoked;
  });
}
