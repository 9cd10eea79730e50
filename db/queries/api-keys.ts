import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { models } from '@/db/models';
import { PLAN_LIMIT_COLUMNS, PLAN_LIMITS_JOIN, type PlanLimitRow } from '@/server/billing/limits';

/** An API key as the settings page lists it: never the hash. */
export type ApiKeyRow = {
  id: number;
  name: string;
  prefix: string;
  scopes: string;
  rateLimitPerMinute: number;
  createdAt: Date;
  createdByName: string | null;
  lastUsedAt: Date | null;
  lastUsedIp: string | null;
  revokedAt: Date | null;
};

/** The company's keys, live ones first, newest first. */
export async function listApiKeys(companyId: number): Promise<ApiKeyRow[]> {
  const { sequelize } = models();
  const rows = await sequelize.query<{
    id: number; name: string; prefix: string; scopes: string; rate_limit_per_minute: number; created_at: Date;
    created_by_name: string | null; last_used_at: Date | null; last_used_ip: string | null; revoked_at: Date | null;
  }>(
    `SELECT k.id, k.name, k.prefix, k.scopes, k.rate_limit_per_minute, k.created_at, u.name AS created_by_name,
            k.last_used_at, k.last_used_ip, k.revoked_at
       FROM api_keys k LEFT JOIN users u ON u.id = k.created_by_user_id
      WHERE k.company_id = :companyId
      ORDER BY k.revoked_at IS NULL DESC, k.id DESC`,
    { replacements: { companyId }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    id: r.id, name: r.name, prefix: r.prefix, scopes: r.scopes, rateLimitPerMinute: r.rate_limit_per_minute, createdAt: r.created_at,
    createdByName: r.created_by_name, lastUsedAt: r.last_used_at, lastUsedIp: r.last_used_ip, revokedAt: r.revoked_at,
  }));
}

/** Live (not revoked) keys of the company; a locking read inside a transaction. */
export async function countLiveApiKeys(companyId: number, t: Transaction): Promise<number> {
  const { sequelize } = models();
  const [row] = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM api_keys WHERE company_id = :companyId AND revoked_at IS NULL LOCK IN SHARE MODE', {
    replacements: { companyId },
    type: QueryTypes.SELECT,
    transaction: t,
  });
  return Number(row.n);
}

export async function insertApiKey(
  row: { companyId: number; name: string; prefix: string; tokenHash: string; scopes: string; rateLimitPerMinute: number; createdByUserId: string },
  t: Transaction,
): Promise<{ id: number }> {
  const { ApiKey } = models();
  const created = await ApiKey.create(row, { transaction: t });
  return { id: created.id };
}

/**
 * Revokes the company's key. Null when no such key is the company's (another company's id
 * answers like a missing one); the key's name otherwise (already revoked: unchanged).
 */
export async function revokeApiKeyRow(companyId: number, id: number, byUserId: string, t: Transaction): Promise<{ name: string; alreadyRevoked: boolean } | null> {
  const { ApiKey } = models();
  const key = await ApiKey.findOne({ where: { id, companyId }, transaction: t, lock: t.LOCK.UPDATE });
  if (!key) return null;
  if (key.revokedAt) return { name: key.name, alreadyRevoked: true };
  await key.update({ revokedAt: new Date(), revokedByUserId: byUserId }, { transaction: t });
  return { name: key.name, alreadyRevoked: false };
}

/** A key candidate for authentication, with its company. */
export type ApiKeyCandidate = {
  id: number;
  companyId: number;
  companyName: string;
  planId: number;
  name: string;
  prefix: string;
  tokenHash: string;
  scopes: string;
  rateLimitPerMinute: number;
  revokedAt: Date | null;
  lastUsedAt: Date | null;
  lastUsedIp: string | null;
  /** The company's plan row (PLAN_LIMIT_COLUMNS), read in the same query. */
  plan: PlanLimitRow;
};

/** Keys whose visible prefix matches (normally one); the caller compares hashes in constant time. */
export async function findApiKeysByPrefix(prefix: string): Promise<ApiKeyCandidate[]> {
  const { sequelize } = models();
  const rows = await sequelize.query<{
    id: number; company_id: number; company_name: string; plan_id: number; name: string; prefix: string; token_hash: string;
    scopes: string; rate_limit_per_minute: number; revoked_at: Date | null; last_used_at: Date | null; last_used_ip: string | null;
  } & PlanLimitRow>(
    `SELECT k.id, k.company_id, c.name AS company_name, c.plan_id, k.name, k.prefix, k.token_hash, k.scopes, k.rate_limit_per_minute, k.revoked_at,
            k.last_used_at, k.last_used_ip, ${PLAN_LIMIT_COLUMNS}
       FROM api_keys k JOIN companies c ON c.id = k.company_id ${PLAN_LIMITS_JOIN}
      WHERE k.prefix = :prefix LIMIT 10`,
    { replacements: { prefix }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    id: r.id, companyId: r.company_id, companyName: r.company_name, planId: r.plan_id, name: r.name, prefix: r.prefix,
    tokenHash: r.token_hash, scopes: r.scopes, rateLimitPerMinute: r.rate_limit_per_minute, revokedAt: r.revoked_at,
    lastUsedAt: r.last_used_at, lastUsedIp: r.last_used_ip, plan: r,
  }));
}

/**
 * Counts one request of the key in the fixed window starting at windowStart; returns the window's
 * count including this request. One statement, no transaction: the upsert is atomic on the window
 * row (parallel requests of one key queue on its row lock), and LAST_INSERT_ID(expr) hands this
 * connection the count it wrote — a new window reports no id (affectedRows 1), so its count is 1.
 * The first request of a window clears the key's older windows (the table stays one row per key).
 */
export async function countApiKeyRequest(keyId: number, windowStart: Date): Promise<number> {
  const { sequelize } = models();
  const [insertId, affected] = (await sequelize.query(
    `INSERT INTO api_key_rate_windows (api_key_id, window_start, request_count) VALUES (:keyId, :windowStart, 1)
     ON DUPLICATE KEY UPDATE request_count = LAST_INSERT_ID(request_count + 1)`,
    { replacements: { keyId, windowStart }, type: QueryTypes.INSERT },
  )) as unknown as [number, number];
  const count = Number(affected) === 1 ? 1 : Number(insertId);
  if (count === 1) {
    await sequelize.query('DELETE FROM api_key_rate_windows WHERE api_key_id = :keyId AND window_start < :windowStart', {
      replacements: { keyId, windowStart },
      type: QueryTypes.DELETE,
    });
  }
  return count;
}

/** How stale last use may get before it is written again: an ordinary call writes nothing to the key row. */
export const LAST_USED_PRECISION_MS = 60_000;

/**
 * Records when and from where the key was last used — only when the stored time is older than
 * LAST_USED_PRECISION_MS or the address changed, so a busy key writes its row about once a minute.
 * The WHERE repeats the check, so parallel requests that all saw a stale time write once.
 */
export async function recordApiKeyUse(key: { id: number; lastUsedAt: Date | null; lastUsedIp: string | null }, used: { at: Date; ip: string | null }): Promise<boolean> {
  const stale = !key.lastUsedAt || used.at.getTime() - new Date(key.lastUsedAt).getTime() >= LAST_USED_PRECISION_MS;
  if (!stale && key.lastUsedIp === used.ip) return false;
  await models().sequelize.query(
    `UPDATE api_keys SET last_used_at = :at, last_used_ip = :ip
      WHERE id = :keyId AND (last_used_at IS NULL OR last_used_at <= :staleBefore OR NOT (last_used_ip <=> :ip))`,
    { replacements: { keyId: key.id, at: used.at, ip: used.ip, staleBefore: new Date(used.at.getTime() - LAST_USED_PRECISION_MS) }, type: QueryTypes.UPDATE },
  );
  return true;
}
