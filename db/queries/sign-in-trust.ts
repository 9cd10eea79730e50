import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { models } from '@/db/models';

/**
 * Browsers trusted to sign in to an address (sha256 of their client cookie), and the mailed
 * single-use links that make a browser trusted. Plain SQL over two small tables.
 */

/** A trusted browser that has not been used for this long has to earn its trust again. */
export const TRUSTED_CLIENT_DAYS = 180;

export async function isTrustedClient(email: string, clientHash: string, now = new Date()): Promise<boolean> {
  const { sequelize } = models();
  const rows = await sequelize.query<{ one: number }>(
    'SELECT 1 AS one FROM sign_in_trusted_clients WHERE email = :email AND client_hash = :clientHash AND last_used_at >= :since LIMIT 1',
    { replacements: { email, clientHash, since: new Date(now.getTime() - TRUSTED_CLIENT_DAYS * 86_400_000) }, type: QueryTypes.SELECT },
  );
  return rows.length > 0;
}

/** Trusts (or keeps trusting) this browser for the address; one row per pair. */
export async function trustClient(email: string, clientHash: string, t?: Transaction): Promise<void> {
  const { sequelize } = models();
  await sequelize.query(
    `INSERT INTO sign_in_trusted_clients (email, client_hash, created_at, last_used_at) VALUES (:email, :clientHash, :now, :now)
     ON DUPLICATE KEY UPDATE last_used_at = :now`,
    { replacements: { email, clientHash, now: new Date() }, transaction: t },
  );
}

export async function deleteStaleTrustedClients(now = new Date()): Promise<void> {
  const { sequelize } = models();
  await sequelize.query('DELETE FROM sign_in_trusted_clients WHERE last_used_at < :cutoff', { replacements: { cutoff: new Date(now.getTime() - TRUSTED_CLIENT_DAYS * 86_400_000) } });
}

export type UnlockTokenRow = { id: number; userId: string; expiresAt: Date; usedAt: Date | null; createdAt: Date };

export async function findUnlockTokenByHash(tokenHash: string, t?: Transaction, lock = false): Promise<UnlockTokenRow | null> {
  const { sequelize } = models();
  const rows = await sequelize.query<{ id: number; user_id: string; expires_at: Date; used_at: Date | null; created_at: Date }>(
    `SELECT id, user_id, expires_at, used_at, created_at FROM sign_in_unlock_tokens WHERE token_hash = :tokenHash${lock ? ' FOR UPDATE' : ''}`,
    { replacements: { tokenHash }, type: QueryTypes.SELECT, transaction: t },
  );
  const r = rows[0];
  return r ? { id: r.id, userId: r.user_id, expiresAt: new Date(r.expires_at), usedAt: r.used_at ? new Date(r.used_at) : null, createdAt: new Date(r.created_at) } : null;
}

/** The newest live link of a person made after `since`, if any (so a flood of refusals mails once). */
export async function recentLiveUnlockToken(userId: string, since: Date, t: Transaction): Promise<boolean> {
  const { sequelize } = models();
  const rows = await sequelize.query('SELECT 1 FROM sign_in_unlock_tokens WHERE user_id = :userId AND used_at IS NULL AND created_at >= :since AND expires_at > :now LIMIT 1', {
    replacements: { userId, since, now: new Date() },
    type: QueryTypes.SELECT,
    transaction: t,
  });
  return rows.length > 0;
}

/** Stores a new link and retires every earlier unused one of that person (only the newest works). */
export async function replaceUnlockTokens(data: { userId: string; tokenHash: string; expiresAt: Date }, t: Transaction): Promise<void> {
  const { sequelize } = models();
  const now = new Date();
  await sequelize.query('UPDATE sign_in_unlock_tokens SET used_at = :now WHERE user_id = :userId AND used_at IS NULL', { replacements: { userId: data.userId, now }, transaction: t });
  await sequelize.query('INSERT INTO sign_in_unlock_tokens (user_id, token_hash, expires_at, created_at) VALUES (:userId, :tokenHash, :expiresAt, :now)', { replacements: { ...data, now }, transaction: t });
}

export async function markUnlockTokenUsed(id: number, t: Transaction): Promise<void> {
  const { sequelize } = models();
  await sequelize.query('UPDATE sign_in_unlock_tokens SET used_at = :now WHERE id = :id', { replacements: { id, now: new Date() }, transaction: t });
}

export async function deleteStaleUnlockTokens(): Promise<void> {
  const { sequelize } = models();
  await sequelize.query('DELETE FROM sign_in_unlock_tokens WHERE expires_at < :cutoff', { replacements: { cutoff: new Date(Date.now() - 86_400_000) } });
}
