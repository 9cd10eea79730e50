import { asUser, callAction, apiRequest, asSignedOut } from './next-request';
import { createApiKey } from '@/server/actions/api-keys';
import type { ApiScope } from '@/server/auth/api-scopes';

/**
 * API keys for integration tests, made the way an admin makes them (the createApiKey action with
 * the admin's session), and requests that carry one. Import './next-request' first in the test.
 */
export async function makeKey(adminSession: string, scopes: readonly ApiScope[], opts: { name?: string; rateLimitPerMinute?: number } = {}): Promise<{ token: string; prefix: string }> {
  asUser(adminSession);
  const out = await callAction(createApiKey, { name: opts.name ?? `Test key ${scopes.join('+')}`, scopes: [...scopes], rateLimitPerMinute: String(opts.rateLimitPerMinute ?? 600) });
  asSignedOut();
  if (!out.state?.ok) throw new Error(`createApiKey failed: ${JSON.stringify(out.state ?? out)}`);
  const data = out.state.data as { token: string; prefix: string };
  return { token: data.token, prefix: data.prefix };
}

/** A Request carrying the key (and no cookie unless the test's jar holds one). */
export function keyRequest(token: string, path: string, init: { method?: string; json?: unknown; headers?: Record<string, string> } = {}): Request {
  return apiRequest(path, { ...init, headers: { authorization: `Bearer ${token}`, ...(init.headers ?? {}) } });
}
