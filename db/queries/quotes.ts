import 'server-only';
import Decimal from 'decimal.js';
import { QueryTypes, type Transaction } from 'sequelize';
import { models } from '../models';
import type { CompanyLock } from './company-lock';
import type { QuoteEventKind } from '../models/quote-event';
import { auditQuoteEvent } from '@/server/audit/quote-events';
import type { Paged } from '@/server/validation/paging';
import type { QuoteOptionSnapshot, QuoteStudySnapshot } from '@/server/quotes/snapshot';
import { OPEN_STATUSES, QUOTE_STATUSES, type QuoteStatus } from '@/server/quotes/status';
import { containsPattern, paged } from './paging';

/** A row of the quotes list: summary columns only, never the JSON snapshots. */
export interface QuoteListItem {
  id: number;
  number: number;
  title: string;
  status: QuoteStatus;
  customerName: string;
  customerEmail: string | null;
  siteName: string;
  serviceName: string;
  chosenDishName: string;
  total: string;
  currency: string;
  validUntil: string;
  studyId: number | null;
  createdByName: string | null;
  activeLinks: number;
  views: number;
  decidedAt: string | null;
  createdAt: string;
  updatedAt: string;
}

export type QuoteListFilter = 'all' | 'open' | QuoteStatus;

type ListRow = {
  id: number;
  number: number;
  title: string;
  status: QuoteStatus;
  customer_name: string;
  customer_email: string | null;
  site_name: string;
  service_name: string;
  chosen_dish_name: string | null;
  total: string | number;
  currency: string;
  valid_until: string | Date;
  study_id: number | null;
  created_by_name: string | null;
  active_links: number | string | null;
  views: number | string | null;
  decided_at: Date | null;
  created_at: Date;
  updated_at: Date;
};

/** DECIMAL as read (the connector gives 189 for 189.00, '189.50' otherwise) → exact decimal string. */
const dec = (v: unknown, places = 2): string => new Decimal(String(v ?? 0)).toFixed(places);

const day = (v: string | Date) => (typeof v === 'string' ? v.slice(0, 10) : v.toISOString().slice(0, 10));

function toListItem(r: ListRow): QuoteListItem {
  return {
    id: r.id,
    number: r.number,
    title: r.title,
    status: r.status,
    customerName: r.customer_name,
    customerEmail: r.customer_email,
    siteName: r.site_name,
    serviceName: r.service_name,
    chosenDishName: r.chosen_dish_name ?? '',
    total: dec(r.total),
    currency: r.currency,
    validUntil: day(r.valid_until),
    studyId: r.study_id,
    createdByName: r.created_by_name,
    activeLinks: Number(r.active_links ?? 0),
    views: Number(r.views ?? 0),
    decidedAt: r.decided_at ? new Date(r.decided_at).toISOString() : null,
    createdAt: new Date(r.created_at).toISOString(),
    updatedAt: new Date(r.updated_at).toISOString(),
  };
}

const LIST_COLUMNS = `q.id, q.number, q.title, q.status, q.customer_name, q.customer_email, q.site_name, q.service_name,
  JSON_UNQUOTE(JSON_EXTRACT(q.chosen_option, '$.dishName')) AS chosen_dish_name, q.total, q.currency, q.valid_until,
  q.study_id, u.name AS created_by_name, q.decided_at, q.created_at, q.updated_at,
  (SELECT COUNT(*) FROM share_links l WHERE l.quote_id = q.id AND l.revoked_at IS NULL AND l.expires_at > :now) AS active_links,
  (SELECT COALESCE(SUM(l.view_count), 0) FROM share_links l WHERE l.quote_id = q.id) AS views`;

/**
 * The company's quotes, newest first. `q` matches the customer, site, title, service or the
 * number ("Q-0042" or "42"); `status` filters ('open' = sent or viewed).
 */
export async function listQuotes(companyId: number, query: { q: string; page: number; pageSize: number; status: QuoteListFilter }): Promise<Paged<QuoteListItem>> {
  const { sequelize } = models();
  const where = ['q.company_id = :companyId'];
  const replacements: Record<string, unknown> = { companyId, limit: query.pageSize, offset: (query.page - 1) * query.pageSize, now: new Date() };
  if (query.q) {
    const parts = ['q.customer_name LIKE :q', 'q.site_name LIKE :q', 'q.title LIKE :q', 'q.service_name LIKE :q', 'q.customer_email LIKE :q'];
    const num = /^(?:q-?)?0*(\d{1,9})$/i.exec(query.q);
    if (num) {
      parts.push('q.number = :number');
      replacements.number = Number(num[1]);
    }
    where.push(`(${parts.join(' OR ')})`);
    replacements.q = containsPattern(query.q);
  }
  if (query.status === 'open') {
    where.push('q.status IN (:open)');
    replacements.open = [...OPEN_STATUSES];
  }
  else if (query.status !== 'all') {
    where.push('q.status = :status');
    replacements.status = query.status;
  }
  const whereSql = where.join(' AND ');
  const [{ total }] = await sequelize.query<{ total: number }>(`SELECT COUNT(*) AS total FROM quotes q WHERE ${whereSql}`, { replacements, type: QueryTypes.SELECT });
  const rows = await sequelize.query<ListRow>(
    `SELECT ${LIST_COLUMNS}
       FROM (SELECT q.id FROM quotes q WHERE ${whereSql} ORDER BY q.created_at DESC, q.id DESC LIMIT :limit OFFSET :offset) page
       JOIN quotes q ON q.id = page.id
       LEFT JOIN users u ON u.id = q.created_by_user_id
      ORDER BY q.created_at DESC, q.id DESC`,
    { replacements, type: QueryTypes.SELECT },
  );
  return paged(rows.map(toListItem), Number(total), query.page, query.pageSize);
}

/** How many quotes of each status the company has (the filter chips of the list). */
export async function countQuotesByStatus(companyId: number): Promise<Record<QuoteStatus, number>> {
  const { sequelize } = models();
  const rows = await sequelize.query<{ status: QuoteStatus; n: number | string }>('SELECT status, COUNT(*) AS n FROM quotes WHERE company_id = :companyId GROUP BY status', {
    replacements: { companyId },
    type: QueryTypes.SELECT,
  });
  const out = Object.fromEntries(QUOTE_STATUSES.map((s) => [s, 0])) as Record<QuoteStatus, number>;
  for (const r of rows) out[r.status] = Number(r.n);
  return out;
}

export interface QuoteDetail extends QuoteListItem {
  chosenOptionIndex: number;
  recommendedOptionIndex: number | null;
  chosenOption: QuoteOptionSnapshot;
  options: QuoteOptionSnapshot[];
  studySnapshot: QuoteStudySnapshot;
  hardwarePrice: string;
  labourPrice: string;
  extrasLabel: string | null;
  extrasPrice: string;
  discountAmount: string;
  taxRatePercent: string;
  subtotal: string;
  taxAmount: string;
  notes: string | null;
  sentAt: string | null;
  firstViewedAt: string | null;
  decidedByName: string | null;
  decisionComment: string | null;
  decisionIp: string | null;
  createdByUserId: string | null;
  sentByUserId: string | null;
}

type DetailRow = ListRow & {
  chosen_option_index: number;
  recommended_option_index: number | null;
  chosen_option: unknown;
  options: unknown;
  study_snapshot: unknown;
  hardware_price: string;
  labour_price: string;
  extras_label: string | null;
  extras_price: string;
  discount_amount: string;
  tax_rate_percent: string;
  subtotal: string;
  tax_amount: string;
  notes: string | null;
  sent_at: Date | null;
  first_viewed_at: Date | null;
  decided_by_name: string | null;
  decision_comment: string | null;
  decision_ip: string | null;
  created_by_user_id: string | null;
  sent_by_user_id: string | null;
};

const json = <T>(v: unknown): T => (typeof v === 'string' ? JSON.parse(v) : v) as T;
const iso = (d: Date | null) => (d ? new Date(d).toISOString() : null);

function toDetail(r: DetailRow): QuoteDetail {
  return {
    ...toListItem(r),
    chosenOptionIndex: r.chosen_option_index,
    recommendedOptionIndex: r.recommended_option_index,
    chosenOption: json<QuoteOptionSnapshot>(r.chosen_option),
    options: json<QuoteOptionSnapshot[]>(r.options),
    studySnapshot: json<QuoteStudySnapshot>(r.study_snapshot),
    hardwarePrice: dec(r.hardware_price),
    labourPrice: dec(r.labour_price),
    extrasLabel: r.extras_label,
    extrasPrice: dec(r.extras_price),
    discountAmount: dec(r.discount_amount),
    taxRatePercent: dec(r.tax_rate_percent, 3),
    subtotal: dec(r.subtotal),
    taxAmount: dec(r.tax_amount),
    notes: r.notes,
    sentAt: iso(r.sent_at),
    firstViewedAt: iso(r.first_viewed_at),
    decidedByName: r.decided_by_name,
    decisionComment: r.decision_comment,
    decisionIp: r.decision_ip,
    createdByUserId: r.created_by_user_id,
    sentByUserId: r.sent_by_user_id,
  };
}

const DETAIL_COLUMNS = `${LIST_COLUMNS}, q.chosen_option_index, q.recommended_option_index, q.chosen_option, q.options, q.study_snapshot,
  q.hardware_price, q.labour_price, q.extras_label, q.extras_price, q.discount_amount, q.tax_rate_percent, q.subtotal, q.tax_amount,
  q.notes, q.sent_at, q.first_viewed_at, q.decided_by_name, q.decision_comment, q.decision_ip, q.created_by_user_id, q.sent_by_user_id`;

/**
 * One quote of this company, or null (another company's quote is "not there"). With `lock` the
 * row is read FOR UPDATE inside the caller's transaction, so status changes queue behind it.
 */
export async function getQuote(companyId: number, id: number, opts: { t?: Transaction; lock?: boolean } = {}): Promise<QuoteDetail | null> {
  const { sequelize } = models();
  if (opts.lock) {
    if (!opts.t) throw new Error('getQuote: lock needs a transaction');
    await sequelize.query('SELECT id FROM quotes WHERE company_id = :companyId AND id = :id FOR UPDATE', { replacements: { companyId, id }, type: QueryTypes.SELECT, transaction: opts.t });
  }
  const [row] = await sequelize.query<DetailRow>(
    `SELECT ${DETAIL_COLUMNS} FROM quotes q LEFT JOIN users u ON u.id = q.created_by_user_id WHERE q.company_id = :companyId AND q.id = :id`,
    { replacements: { companyId, id, now: new Date() }, type: QueryTypes.SELECT, transaction: opts.t },
  );
  return row ? toDetail(row) : null;
}

/** The next per-company quote number, under the company row lock: two quotes never share a number. */
export async function nextQuoteNumber(lock: CompanyLock): Promise<number> {
  const { sequelize } = models();
  const [{ max }] = await sequelize.query<{ max: number | null }>('SELECT MAX(number) AS max FROM quotes WHERE company_id = :companyId FOR UPDATE', {
    replacements: { companyId: lock.companyId },
    type: QueryTypes.SELECT,
    transaction: lock.transaction,
  });
  return Number(max ?? 0) + 1;
}

export interface QuoteTermsRow {
  title: string;
  customerName: string;
  customerEmail: string | null;
  validUntil: string;
  notes: string | null;
  hardwarePrice: string;
  labourPrice: string;
  extrasLabel: string | null;
  extrasPrice: string;
  discountAmount: string;
  taxRatePercent: string;
  subtotal: string;
  taxAmount: string;
  total: string;
}

export interface NewQuoteRow extends QuoteTermsRow {
  number: number;
  studyId: number;
  siteName: string;
  serviceName: string;
  chosenOptionIndex: number;
  recommendedOptionIndex: number | null;
  chosenOption: QuoteOptionSnapshot;
  options: QuoteOptionSnapshot[];
  studySnapshot: QuoteStudySnapshot;
  currency: string;
  createdByUserId: string;
}

export async function insertQuote(companyId: number, row: NewQuoteRow, t: Transaction): Promise<number> {
  const { Quote } = models();
  const created = await Quote.create({ companyId, status: 'draft', sentAt: null, firstViewedAt: null, decidedAt: null, decidedByName: null, decisionComment: null, decisionIp: null, decisionUserAgent: null, decisionLinkId: null, sentByUserId: null, ...row }, { transaction: t });
  return created.id;
}

/** Rewrites the terms of a draft (the caller checked the status under the row lock). */
export async function updateQuoteTerms(companyId: number, id: number, terms: QuoteTermsRow, t: Transaction): Promise<void> {
  const { Quote } = models();
  await Quote.update(terms, { where: { companyId, id, status: 'draft' }, transaction: t });
}

export async function deleteDraftQuote(companyId: number, id: number, t: Transaction): Promise<boolean> {
  const { Quote } = models();
  return (await Quote.destroy({ where: { companyId, id, status: 'draft' }, transaction: t })) === 1;
}

/**
 * Moves a quote from one of `from` to `to` with extra columns; returns false when the quote was
 * not in one of those statuses any more (someone else got there first).
 */
export async function moveQuoteStatus(
  companyId: number,
  id: number,
  from: readonly QuoteStatus[],
  to: QuoteStatus,
  extra: Partial<{ sentAt: Date; sentByUserId: string; firstViewedAt: Date; decidedAt: Date; decidedByName: string; decisionComment: string | null; decisionIp: string | null; decisionUserAgent: string | null; decisionLinkId: number }>,
  t: Transaction,
): Promise<boolean> {
  const { Quote } = models();
  const [n] = await Quote.update({ status: to, ...extra }, { where: { companyId, id, status: [...from] }, transaction: t });
  return n === 1;
}

export interface QuoteEventInput {
  companyId: number;
  quoteId: number;
  kind: QuoteEventKind;
  fromStatus?: QuoteStatus | null;
  toStatus?: QuoteStatus | null;
  actorUserId?: string | null;
  actorLabel?: string | null;
  detail?: Record<string, unknown> | null;
  ip?: string | null;
}

export async function insertQuoteEvent(e: QuoteEventInput, t?: Transaction): Promise<void> {
  const { QuoteEvent } = models();
  await QuoteEvent.create(
    {
      companyId: e.companyId,
      quoteId: e.quoteId,
      kind: e.kind,
      fromStatus: e.fromStatus ?? null,
      toStatus: e.toStatus ?? null,
      actorUserId: e.actorUserId ?? null,
      actorLabel: e.actorLabel ?? null,
      detail: e.detail ?? null,
      ip: e.ip ?? null,
    },
    { transaction: t },
  );
  await auditQuoteEvent(e, t);
}

export interface QuoteEventItem {
  id: number;
  kind: QuoteEventKind;
  fromStatus: string | null;
  toStatus: string | null;
  actorLabel: string | null;
  detail: Record<string, unknown> | null;
  createdAt: string;
}

/** The quote's timeline, oldest first. */
export async function listQuoteEvents(companyId: number, quoteId: number): Promise<QuoteEventItem[]> {
  const { QuoteEvent } = models();
  const rows = await QuoteEvent.findAll({ where: { companyId, quoteId }, order: [['id', 'ASC']] });
  return rows.map((r) => ({
    id: r.id,
    kind: r.kind,
    fromStatus: r.fromStatus,
    toStatus: r.toStatus,
    actorLabel: r.actorLabel,
    detail: json<Record<string, unknown> | null>(r.detail),
    createdAt: new Date(r.createdAt).toISOString(),
  }));
}

/**
 * Sent or viewed quotes of the company whose validity day has passed, locked for the caller to
 * mark expired (with an event each). `today` is the UTC date.
 */
export async function lockOverdueQuotes(companyId: number, today: string, t: Transaction): Promise<{ id: number; status: QuoteStatus }[]> {
  const { sequelize } = models();
  return sequelize.query<{ id: number; status: QuoteStatus }>(
    'SELECT id, status FROM quotes WHERE company_id = :companyId AND status IN (:open) AND valid_until < :today FOR UPDATE',
    { replacements: { companyId, today, open: [...OPEN_STATUSES] }, type: QueryTypes.SELECT, transaction: t },
  );
}

/** Whether the company has any sent or viewed quote past its validity (cheap check before locking). */
export async function hasOverdueQuotes(companyId: number, today: string): Promise<boolean> {
  const { sequelize } = models();
  const rows = await sequelize.query<{ id: number }>('SELECT id FROM quotes WHERE company_id = :companyId AND status IN (:open) AND valid_until < :today LIMIT 1', {
    replacements: { companyId, today, open: [...OPEN_STATUSES] },
    type: QueryTypes.SELECT,
  });
  return rows.length > 0;
}

/** Names and addresses of the people a decision e-mail goes to (the sender, else the creator). */
export async function quotePeople(companyId: number, quoteId: number, t?: Transaction): Promise<{ sender: { name: string; email: string } | null; creator: { name: string; email: string } | null }> {
  const { sequelize } = models();
  // Only people still in the company: a colleague who left gets no customer news.
  const [row] = await sequelize.query<{ s_name: string | null; s_email: string | null; c_name: string | null; c_email: string | null }>(
    `SELECT s.name AS s_name, s.email AS s_email, c.name AS c_name, c.email AS c_email
       FROM quotes q
       LEFT JOIN memberships sm ON sm.user_id = q.sent_by_user_id AND sm.company_id = q.company_id
       LEFT JOIN users s ON s.id = sm.user_id
       LEFT JOIN memberships cm ON cm.user_id = q.created_by_user_id AND cm.company_id = q.company_id
       LEFT JOIN users c ON c.id = cm.user_id
      WHERE q.company_id = :companyId AND q.id = :quoteId`,
    { replacements: { companyId, quoteId }, type: QueryTypes.SELECT, transaction: t },
  );
  return {
    sender: row?.s_email ? { name: row.s_name ?? '', email: row.s_email } : null,
    creator: row?.c_email ? { name: row.c_name ?? '', email: row.c_email } : null,
  };
}
