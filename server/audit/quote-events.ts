import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { models } from '@/db/models';
import type { AuditAction } from '@/db/queries/audit';
import type { QuoteEventKind } from '@/db/models/quote-event';
import { currentRequestMeta } from '@/server/auth/request-meta';
import { quoteReference } from '@/server/quotes/status';
import { recordAudit } from './record';

/** Quote events that also belong in the company's audit log, and the name they carry there. */
const AUDITED: Partial<Record<QuoteEventKind, AuditAction>> = {
  link_created: 'share_link.created',
  link_revoked: 'share_link.revoked',
  accepted: 'quote.accepted',
  declined: 'quote.declined',
};

export type QuoteEventForAudit = {
  companyId: number;
  quoteId: number;
  kind: QuoteEventKind;
  actorUserId?: string | null;
  actorLabel?: string | null;
  detail?: Record<string, unknown> | null;
  ip?: string | null;
};

/**
 * Mirrors a link or decision event into the audit log inside the event's own transaction, so the
 * one place every quote event is written (insertQuoteEvent) keeps both logs in step whichever
 * service — comparison link, e-mail, the customer's decision — made the change. The customer has
 * no account: their row carries the name they typed, "(customer)", and the address of the request.
 */
export async function auditQuoteEvent(e: QuoteEventForAudit, t?: Transaction): Promise<void> {
  const action = AUDITED[e.kind];
  if (!action) return;
  const [quote] = await models().sequelize.query<{ number: number }>('SELECT number FROM quotes WHERE id = :id AND company_id = :companyId', {
    replacements: { id: e.quoteId, companyId: e.companyId },
    type: QueryTypes.SELECT,
    transaction: t,
  });
  const meta = await currentRequestMeta();
  const detail: Record<string, unknown> = { quoteId: e.quoteId };
  if (e.detail && typeof e.detail.linkId === 'number') detail.linkId = e.detail.linkId;
  if (e.detail && typeof e.detail.via === 'string') detail.via = e.detail.via === 'email' ? 'an e-mailed link' : 'a link';
  if (action.startsWith('quote.')) detail.via = 'the customer link';
  await recordAudit(
    { companyId: e.companyId, actor: null, actorUserId: e.actorUserId ?? null, actorLabel: e.actorLabel ?? null },
    { action, target: quote ? quoteReference(quote.number) : `quote ${e.quoteId}`, detail },
    t,
    { ip: e.ip ?? meta.ip, userAgent: meta.userAgent },
  );
}
