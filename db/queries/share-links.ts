import 'server-only';
import { Op, QueryTypes, type Transaction } from 'sequelize';
import { models } from '../models';
import type { QuoteStatus } from '@/server/quotes/status';

export interface ShareLinkItem {
  id: number;
  quoteId: number;
  expiresAt: string;
  revokedAt: string | null;
  viewCount: number;
  lastViewedAt: string | null;
  createdByName: string | null;
  createdAt: string;
  /** Not revoked and not past its expiry: a customer can open it now. */
  active: boolean;
  /** Its token is kept sealed, so the team can copy it (links made before that was kept cannot). */
  copyable: boolean;
}

const iso = (d: Date | null) => (d ? new Date(d).toISOString() : null);

/** The quote's links, newest first (never their tokens: those are opened one at a time, on request). */
export async function listShareLinks(companyId: number, quoteId: number, now = new Date()): Promise<ShareLinkItem[]> {
  const { sequelize } = models();
  const rows = await sequelize.query<{ id: number; quote_id: number; expires_at: Date; revoked_at: Date | null; view_count: number; last_viewed_at: Date | null; created_by_name: string | null; created_at: Date; copyable: number }>(
    `SELECT l.id, l.quote_id, l.expires_at, l.revoked_at, l.view_count, l.last_viewed_at, u.name AS created_by_name, l.created_at,
            l.token_sealed IS NOT NULL AS copyable
       FROM share_links l LEFT JOIN users u ON u.id = l.created_by_user_id
      WHERE l.company_id = :companyId AND l.quote_id = :quoteId ORDER BY l.id DESC`,
    { replacements: { companyId, quoteId }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    id: r.id,
    quoteId: r.quote_id,
    expiresAt: new Date(r.expires_at).toISOString(),
    revokedAt: iso(r.revoked_at),
    viewCount: Number(r.view_count),
    lastViewedAt: iso(r.last_viewed_at),
    createdByName: r.created_by_name,
    createdAt: new Date(r.created_at).toISOString(),
    active: r.revoked_at === null && new Date(r.expires_at).getTime() > now.getTime(),
    copyable: Number(r.copyable) === 1,
  }));
}

/** One of the quote's links with its sealed token, for copying it again; null outside this company. */
export async function findSealedLink(companyId: number, quoteId: number, linkId: number): Promise<{ tokenHash: string; tokenSealed: string | null; expiresAt: Date; revokedAt: Date | null } | null> {
  const { ShareLink } = models();
  const row = await ShareLink.findOne({ where: { companyId, quoteId, id: linkId }, attributes: ['tokenHash', 'tokenSealed', 'expiresAt', 'revokedAt'] });
  return row ? { tokenHash: row.tokenHash, tokenSealed: row.tokenSealed, expiresAt: row.expiresAt, revokedAt: row.revokedAt } : null;
}

export async function insertShareLink(row: { companyId: number; quoteId: number; tokenHash: string; tokenSealed: string; expiresAt: Date; createdByUserId: string }, t: Transaction): Promise<number> {
  const { ShareLink } = models();
  const created = await ShareLink.create({ ...row, revokedAt: null, revokedByUserId: null, lastViewedAt: null }, { transaction: t });
  return created.id;
}

/** Revokes one of the quote's links; false when there is no such active link in this company. */
export async function revokeShareLink(companyId: number, quoteId: number, linkId: number, userId: string, t: Transaction): Promise<boolean> {
  const { ShareLink } = models();
  const [n] = await ShareLink.update({ revokedAt: new Date(), revokedByUserId: userId }, { where: { companyId, quoteId, id: linkId, revokedAt: null }, transaction: t });
  return n === 1;
}

/** Revokes every active link of a quote (a deleted draft must not stay reachable). */
export async function revokeAllShareLinks(companyId: number, quoteId: number, userId: string | null, t: Transaction): Promise<number> {
  const { ShareLink } = models();
  const [n] = await ShareLink.update({ revokedAt: new Date(), revokedByUserId: userId }, { where: { companyId, quoteId, revokedAt: null, expiresAt: { [Op.gt]: new Date() } }, transaction: t });
  return n;
}

/** What the customer's page needs to find its quote: the link, and whose quote it is. */
export interface LinkByToken {
  linkId: number;
  companyId: number;
  quoteId: number;
  expiresAt: Date;
  revokedAt: Date | null;
  quoteStatus: QuoteStatus;
}

/**
 * The link whose token digest this is, or null. Expired and revoked links are returned too
 * (the caller answers 404 for all three without telling which); with `lock`, FOR UPDATE.
 */
export async function findLinkByTokenHash(tokenHash: string, opts: { t?: Transaction; lock?: boolean } = {}): Promise<LinkByToken | null> {
  const { sequelize } = models();
  const [row] = await sequelize.query<{ id: number; company_id: number; quote_id: number; expires_at: Date; revoked_at: Date | null; status: QuoteStatus }>(
    `SELECT l.id, l.company_id, l.quote_id, l.expires_at, l.revoked_at, q.status
       FROM share_links l JOIN quotes q ON q.id = l.quote_id AND q.company_id = l.company_id
      WHERE l.token_hash = :tokenHash${opts.lock ? ' FOR UPDATE' : ''}`,
    { replacements: { tokenHash }, type: QueryTypes.SELECT, transaction: opts.t },
  );
  if (!row) return null;
  return { linkId: row.id, companyId: row.company_id, quoteId: row.quote_id, expiresAt: new Date(row.expires_at), revokedAt: row.revoked_at ? new Date(row.revoked_at) : null, quoteStatus: row.status };
}

/** Counts one view of a link (atomic in SQL: parallel views never lose a count). */
export async function recordLinkView(linkId: number, t?: Transaction): Promise<void> {
  const { sequelize } = models();
  await sequelize.query('UPDATE share_links SET view_count = view_count + 1, last_viewed_at = :now, updated_at = :now WHERE id = :linkId', {
    replacements: { linkId, now: new Date() },
    type: QueryTypes.UPDATE,
    transaction: t,
  });
}

/**
 * Everyone (still in the company) who shared the quote, by link or by e-mail: all are told when
 * the customer decides. The maker of the link the customer used comes first.
 */
export async function quoteSharers(companyId: number, quoteId: number, usedLinkId: number, t?: Transaction): Promise<{ name: string; email: string }[]> {
  const { sequelize } = models();
  return sequelize.query<{ name: string; email: string }>(
    `SELECT u.name, u.email FROM share_links l
       JOIN memberships m ON m.user_id = l.created_by_user_id AND m.company_id = l.company_id
       JOIN users u ON u.id = m.user_id
      WHERE l.company_id = :companyId AND l.quote_id = :quoteId
      GROUP BY u.id, u.name, u.email
      ORDER BY MAX(l.id = :usedLinkId) DESC, MIN(l.id) ASC`,
    { replacements: { companyId, quoteId, usedLinkId }, type: QueryTypes.SELECT, transaction: t },
  );
}
