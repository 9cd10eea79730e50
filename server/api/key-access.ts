import 'server-only';
import { countApiKeyRequest, findApiKeysByPrefix, recordApiKeyUse, type ApiKeyCandidate } from '@/db/queries/api-keys';
import type { Access, ContextForAccess } from '@/server/auth/access';
import { apiKeyPrefix, hashApiKey, looksLikeApiKey, sameDigest } from '@/server/auth/api-key-token';
import { parseScopes, scopesAllow, SCOPE_PERMISSIONS, type ApiScope } from '@/server/auth/api-scopes';
import type { CompanyAuthContext } from '@/server/auth/guards';
import { can, type Permission } from '@/server/auth/permissions';
import { requestMetaFrom } from '@/server/auth/request-meta';
import { howToRaise, planLimitsFromRow } from '@/server/billing/limits';
import { ForbiddenError, PlanLimitError, RateLimitedError, UnauthenticatedError } from '@/server/errors';

export const RATE_WINDOW_MS = 60_000;

/**
 * The caller of an /api/v1 request that carries `Authorization: Bearer <key>`, in the same shape
 * a session gives (so handlers need not care), or an AppError:
 *   401 the key is malformed, unknown or revoked;
 *   429 the key went over its requests per minute (fixed one-minute window counted in MariaDB;
 *       Retry-After says when the window ends);
 *   403 plan_limit — the company's plan has no API access (any more);
 *   403 forbidden — none of the key's scopes opens the route (keyScope, when the route names one,
 *       else the scope that holds the route's permission in server/auth/api-scopes.ts).
 * A key acts for its company with an admin's role inside its scopes: handlers that look at the
 * role (an upload's kind) treat it as the admin who made it would be treated.
 */
export async function resolveKeyAccess<A extends Access>(token: string, access: A, req: Request, keyScope?: ApiScope, now = new Date()): Promise<ContextForAccess<A>> {
  // Two round trips on an ordinary call: the key with its company and plan, and the rate-window
  // upsert; last use is written at most about once a minute (recordApiKeyUse).
  const key = await authenticate(token);
  await countRequest(key, now);
  await recordApiKeyUse(key, { at: now, ip: requestMetaFrom(req.headers).ip });
  const limits = await planLimitsFromRow(key.plan, { now });
  if (!limits.apiAccess) throw new PlanLimitError('apiAccess', `API access is not part of the ${limits.planName} plan, so its API keys are refused. ${howToRaise(limits)}`);
  const scopes = parseScopes(key.scopes);
  if (access !== 'signed-in' && access !== 'public') assertScope(scopes, access as Permission, keyScope);
  const ctx: CompanyAuthContext & { apiKey: NonNullable<CompanyAuthContext['apiKey']> } = {
    // Not a person: a stand-in whose id can never match a users row (no foreign key will take it).
    user: { id: `apikey_${key.id}`, email: '', name: `API key “${key.name}”`, isStaff: false },
    sessionId: `apikey:${key.id}`,
    companyId: key.companyId,
    company: { id: key.companyId, name: key.companyName, planId: key.planId },
    role: 'admin',
    apiKey: { id: key.id, name: key.name, prefix: key.prefix, scopes },
    plan: limits,
  };
  return ctx as unknown as ContextForAccess<A>;
}

async function authenticate(token: string): Promise<ApiKeyCandidate> {
  if (!token || !looksLikeApiKey(token)) throw new UnauthenticatedError('Send a valid API key as `Authorization: Bearer <key>`.');
  const digest = hashApiKey(token);
  // Found by its public prefix, then matched on the digest in constant time.
  const key = (await findApiKeysByPrefix(apiKeyPrefix(token))).find((k) => sameDigest(k.tokenHash, digest));
  if (!key) throw new UnauthenticatedError('This API key is not valid.');
  if (key.revokedAt) throw new UnauthenticatedError('This API key was revoked. An admin can make a new one in Settings → API keys.');
  return key;
}

async function countRequest(key: ApiKeyCandidate, now: Date): Promise<void> {
  const windowStartMs = Math.floor(now.getTime() / RATE_WINDOW_MS) * RATE_WINDOW_MS;
  const count = await countApiKeyRequest(key.id, new Date(windowStartMs));
  if (count > key.rateLimitPerMinute) {
    const retryAfter = Math.max(1, Math.ceil((windowStartMs + RATE_WINDOW_MS - now.getTime()) / 1000));
    throw new RateLimitedError(retryAfter, `This API key allows ${key.rateLimitPerMinute} requests a minute. Try again in ${retryAfter} s.`);
  }
}

function assertScope(scopes: ApiScope[], permission: Permission, keyScope: ApiScope | undefined): void {
  // Never more than an admin may do, whatever the scope table says.
  const allowed = can('admin', permission) && (keyScope ? scopes.includes(keyScope) : scopesAllow(scopes, permission));
  if (allowed) return;
  const needed = keyScope ?? (Object.keys(SCOPE_PERMISSIONS) as ApiScope[]).find((s) => SCOPE_PERMISSIONS[s].includes(permission));
  throw new ForbiddenError(
    needed
      ? `This API key's scopes (${scopes.join(', ') || 'none'}) do not include "${needed}", which this route needs.`
      : 'API keys cannot call this route; sign in instead.',
  );
}
