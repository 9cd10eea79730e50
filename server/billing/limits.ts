import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { models } from '@/db/models';
import type { SubscriptionStatus } from '@/db/models';
import { countActiveLinks, countStudiesThisMonth, countUploadsThisMonth, findLiveSubscription, getFreeTierPlan } from '@/db/queries/billing';
import { countMembers, countPendingInvitations } from '@/db/queries/team';
import { NotFoundError } from '@/server/errors';
import { LIVE_STATUSES, OVERDUE_STATUSES } from './policy';

/**
 * A company's plan limits — the one place limits are read (first version by the accounts work:
 * seats; billing added the rest).
 *
 * Which plan's limits apply:
 *  - the company's plan, while its trial runs or its subscription is paid up;
 *  - still the paid plan while a payment is overdue, until the grace period ends;
 *  - the free tier's limits once a trial has ended, the grace period is over, or the provider
 *    paused the subscription. Nothing is deleted: existing rows stay, only new ones are refused.
 */
export type LimitName = 'seats' | 'studiesPerMonth' | 'activeLinks' | 'uploadsPerMonth' | 'apiAccess' | 'quoteBranding' | 'campaignSites';

/** Why these limits apply; the billing banner and every limit message read it. */
export type LimitsBasis =
  | { kind: 'plan' }
  | { kind: 'trial'; endsAt: Date | null }
  | { kind: 'trial_ended'; endedAt: Date }
  | { kind: 'past_due_grace'; graceEndsAt: Date; status: SubscriptionStatus }
  | { kind: 'past_due_expired'; graceEndedAt: Date; status: SubscriptionStatus }
  | { kind: 'paused' };

export type PlanLimits = {
  /** The plan whose limits apply now (the free tier when the company has fallen back to it). */
  planId: number;
  planCode: string;
  planName: string;
  seats: number;
  studiesPerMonth: number;
  activeLinks: number;
  uploadsPerMonth: number;
  /** Sites one upgrade campaign may hold (checked per campaign, not counted over a month). */
  campaignSites: number;
  apiAccess: boolean;
  quoteBranding: boolean;
  /** The plan the company is on (subscribed, trial or assigned), which may differ from the above. */
  companyPlan: { id: number; code: string; name: string; kind: 'trial' | 'free' | 'paid' };
  basis: LimitsBasis;
};

export type PlanUsage = { seats: number; studiesPerMonth: number; activeLinks: number; uploadsPerMonth: number };

type PlanRow = {
  id: number;
  code: string;
  name: string;
  kind: 'trial' | 'free' | 'paid';
  seat_limit: number;
  studies_per_month: number;
  active_links_limit: number;
  uploads_per_month: number;
  campaign_sites_limit: number;
  api_access: number | boolean;
  quote_branding: number | boolean;
  trial_ends_at: Date | null;
};

const limitsOf = (p: { id: number; code: string; name: string; seatLimit: number; studiesPerMonth: number; activeLinksLimit: number; uploadsPerMonth: number; campaignSitesLimit: number; apiAccess: boolean; quoteBranding: boolean }) => ({
  planId: p.id,
  planCode: p.code,
  planName: p.name,
  seats: p.seatLimit,
  studiesPerMonth: p.studiesPerMonth,
  activeLinks: p.activeLinksLimit,
  uploadsPerMonth: p.uploadsPerMonth,
  campaignSites: p.campaignSitesLimit,
  apiAccess: Boolean(p.apiAccess),
  quoteBranding: Boolean(p.quoteBranding),
});

/**
 * The columns planLimitsFromRow reads, for a query that has the company as `c` and LEFT JOINs
 * PLAN_LIMITS_JOIN: session and API-key look-ups fetch the plan (and the live subscription's
 * state, as two scalar sub-queries) in the same round trip as who is calling.
 */
export const PLAN_LIMIT_COLUMNS = `pl.id AS pl_id, pl.code AS pl_code, pl.name AS pl_name, pl.kind AS pl_kind, pl.seat_limit AS pl_seat_limit,
  pl.studies_per_month AS pl_studies_per_month, pl.active_links_limit AS pl_active_links_limit, pl.uploads_per_month AS pl_uploads_per_month, pl.campaign_sites_limit AS pl_campaign_sites_limit,
  pl.api_access AS pl_api_access, pl.quote_branding AS pl_quote_branding, c.trial_ends_at AS pl_trial_ends_at,
  (SELECT s.status FROM subscriptions s WHERE s.company_id = c.id AND s.status IN (${LIVE_STATUSES.map((x) => `'${x}'`).join(',')}) ORDER BY s.created_at DESC, s.id DESC LIMIT 1) AS pl_live_status,
  (SELECT s.grace_ends_at FROM subscriptions s WHERE s.company_id = c.id AND s.status IN (${LIVE_STATUSES.map((x) => `'${x}'`).join(',')}) ORDER BY s.created_at DESC, s.id DESC LIMIT 1) AS pl_live_grace_ends_at`;
export const PLAN_LIMITS_JOIN = 'LEFT JOIN plans pl ON pl.id = c.plan_id';

/** The PLAN_LIMIT_COLUMNS of one row (null when the row had no company). */
export type PlanLimitRow = {
  pl_id: number | null; pl_code: string; pl_name: string; pl_kind: 'trial' | 'free' | 'paid'; pl_seat_limit: number; pl_studies_per_month: number;
  pl_active_links_limit: number; pl_uploads_per_month: number; pl_campaign_sites_limit: number; pl_api_access: number | boolean; pl_quote_branding: number | boolean; pl_trial_ends_at: Date | null;
  pl_live_status: SubscriptionStatus | null; pl_live_grace_ends_at: Date | null;
};

/**
 * `lockedRead` (used by assertWithinPlan, which already holds the company row) makes the reads
 * locking reads, so a limit check sees the plan and subscription as last committed (a webhook's
 * plan change), not an older snapshot of the caller's transaction. Otherwise one query.
 */
export async function getPlanLimits(companyId: number, t?: Transaction, opts: { now?: Date; lockedRead?: boolean } = {}): Promise<PlanLimits> {
  const locking = Boolean(t && opts.lockedRead);
  const { sequelize } = models();
  const now = opts.now ?? new Date();
  if (!locking) {
    const [row] = await sequelize.query<PlanLimitRow>(`SELECT ${PLAN_LIMIT_COLUMNS} FROM companies c ${PLAN_LIMITS_JOIN} WHERE c.id = :companyId`, {
      replacements: { companyId }, type: QueryTypes.SELECT, transaction: t,
    });
    if (!row?.pl_id) throw new NotFoundError('That company');
    return planLimitsFromRow(row, { now, t });
  }
  const rows = await sequelize.query<PlanRow>(
    `SELECT p.id, p.code, p.name, p.kind, p.seat_limit, p.studies_per_month, p.active_links_limit, p.uploads_per_month, p.campaign_sites_limit, p.api_access, p.quote_branding, c.trial_ends_at
       FROM companies c JOIN plans p ON p.id = c.plan_id
      WHERE c.id = :companyId LOCK IN SHARE MODE`,
    { replacements: { companyId }, type: QueryTypes.SELECT, transaction: t },
  );
  const p = rows[0];
  if (!p) throw new NotFoundError('That company');
  const live = p.kind === 'paid' ? await findLiveSubscription(companyId, t, true) : null;
  return limitsFor(p, live ? { status: live.status, graceEndsAt: live.graceEndsAt } : null, now, t);
}

/** Limits from a row that carried PLAN_LIMIT_COLUMNS (no query, unless the company fell back to the free tier). */
export async function planLimitsFromRow(r: PlanLimitRow, opts: { now?: Date; t?: Transaction } = {}): Promise<PlanLimits> {
  const p: PlanRow = {
    id: r.pl_id!, code: r.pl_code, name: r.pl_name, kind: r.pl_kind, seat_limit: r.pl_seat_limit, studies_per_month: r.pl_studies_per_month, active_links_limit: r.pl_active_links_limit,
    uploads_per_month: r.pl_uploads_per_month, campaign_sites_limit: r.pl_campaign_sites_limit, api_access: r.pl_api_access, quote_branding: r.pl_quote_branding, trial_ends_at: r.pl_trial_ends_at === null ? null : new Date(r.pl_trial_ends_at),
  };
  const live = r.pl_live_status ? { status: r.pl_live_status, graceEndsAt: r.pl_live_grace_ends_at === null ? null : new Date(r.pl_live_grace_ends_at) } : null;
  return limitsFor(p, live, opts.now ?? new Date(), opts.t);
}

async function limitsFor(p: PlanRow, live: { status: SubscriptionStatus; graceEndsAt: Date | null } | null, now: Date, t?: Transaction): Promise<PlanLimits> {
  const own = limitsOf({
    id: p.id,
    code: p.code,
    name: p.name,
    seatLimit: p.seat_limit,
    studiesPerMonth: p.studies_per_month,
    activeLinksLimit: p.active_links_limit,
    uploadsPerMonth: p.uploads_per_month,
    campaignSitesLimit: p.campaign_sites_limit,
    apiAccess: Boolean(p.api_access),
    quoteBranding: Boolean(p.quote_branding),
  });
  const companyPlan = { id: p.id, code: p.code, name: p.name, kind: p.kind };

  const fallBack = async (basis: LimitsBasis): Promise<PlanLimits> => {
    const free = await getFreeTierPlan(t);
    // Without a free tier in the catalogue the company keeps its plan rather than losing everything.
    if (!free || free.id === p.id) return { ...own, companyPlan, basis };
    return { ...limitsOf(free), companyPlan, basis };
  };

  if (p.kind === 'trial') {
    if (p.trial_ends_at && p.trial_ends_at.getTime() <= now.getTime()) return fallBack({ kind: 'trial_ended', endedAt: p.trial_ends_at });
    return { ...own, companyPlan, basis: { kind: 'trial', endsAt: p.trial_ends_at } };
  }
  if (p.kind === 'paid') {
    if (live && (OVERDUE_STATUSES as readonly string[]).includes(live.status)) {
      const graceEndsAt = live.graceEndsAt ?? now;
      if (graceEndsAt.getTime() > now.getTime()) return { ...own, companyPlan, basis: { kind: 'past_due_grace', graceEndsAt, status: live.status } };
      return fallBack({ kind: 'past_due_expired', graceEndedAt: graceEndsAt, status: live.status });
    }
    if (live?.status === 'paused') return fallBack({ kind: 'paused' });
  }
  return { ...own, companyPlan, basis: { kind: 'plan' } };
}

/**
 * Members plus pending invitations: what the seat limit counts. Inside a transaction the counts
 * are locking reads, so they see the latest committed rows even if the caller's transaction
 * already took a snapshot earlier (REPEATABLE READ would otherwise show old counts).
 */
export async function seatsInUse(companyId: number, t?: Transaction): Promise<number> {
  if (!t) {
    const [members, pending] = await Promise.all([countMembers(companyId), countPendingInvitations(companyId)]);
    return members + pending;
  }
  const { sequelize } = models();
  const [m] = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM memberships WHERE company_id = :companyId LOCK IN SHARE MODE', {
    replacements: { companyId },
    type: QueryTypes.SELECT,
    transaction: t,
  });
  const [i] = await sequelize.query<{ n: number }>(
    'SELECT COUNT(*) AS n FROM invitations WHERE company_id = :companyId AND accepted_at IS NULL AND revoked_at IS NULL AND expires_at > :now LOCK IN SHARE MODE',
    { replacements: { companyId, now: new Date() }, type: QueryTypes.SELECT, transaction: t },
  );
  return Number(m.n) + Number(i.n);
}

/** What each counted limit has used (monthly ones since the 1st of this month, UTC). */
export async function getPlanUsage(companyId: number, t?: Transaction): Promise<PlanUsage> {
  const [seats, studiesPerMonth, activeLinks, uploadsPerMonth] = await Promise.all([
    seatsInUse(companyId, t),
    countStudiesThisMonth(companyId, t),
    countActiveLinks(companyId, t),
    countUploadsThisMonth(companyId, t),
  ]);
  return { seats, studiesPerMonth, activeLinks, uploadsPerMonth };
}

/** The counters behind each counted limit, as locking reads inside the caller's transaction. */
export const COUNTED = {
  seats: seatsInUse,
  studiesPerMonth: (id: number, t: Transaction) => countStudiesThisMonth(id, t),
  activeLinks: (id: number, t: Transaction) => countActiveLinks(id, t),
  uploadsPerMonth: (id: number, t: Transaction) => countUploadsThisMonth(id, t),
} as const;

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;
const day = (d: Date) => d.toISOString().slice(0, 10);

/** How to get past the limit, given why these limits apply. */
export function howToRaise(limits: PlanLimits): string {
  const b = limits.basis;
  switch (b.kind) {
    case 'trial_ended':
      return `Your field trial ended on ${day(b.endedAt)}, so the ${limits.planName} limits apply: an admin can choose a plan in Settings → Billing.`;
    case 'past_due_expired':
      return `A payment is overdue and the grace period ended on ${day(b.graceEndedAt)}, so the ${limits.planName} limits apply: an admin can pay the open invoice in Settings → Billing to restore ${limits.companyPlan.name}.`;
    case 'paused':
      return `The subscription is paused, so the ${limits.planName} limits apply: an admin can resume it in Settings → Billing.`;
    default:
      return 'An admin can move to a larger plan in Settings → Billing.';
  }
}

export function limitMessage(limit: LimitName, limits: PlanLimits, used: number): string {
  const plan = limits.planName;
  const raise = howToRaise(limits);
  switch (limit) {
    case 'seats':
      return `All ${plural(limits.seats, 'seat', 'seats')} of the ${plan} plan are taken (members and pending invitations). Revoke an invitation or remove a member — or: ${raise}`;
    case 'studiesPerMonth':
      return `The ${plan} plan allows ${plural(limits.studiesPerMonth, 'study', 'studies')} a month and ${used} have been run this month (the count restarts on the 1st, UTC). ${raise}`;
    case 'activeLinks':
      return `The ${plan} plan allows ${plural(limits.activeLinks, 'active comparison link', 'active comparison links')} and ${used} are active. Revoke a link or let one expire — or: ${raise}`;
    case 'uploadsPerMonth':
      return `The ${plan} plan allows ${plural(limits.uploadsPerMonth, 'upload', 'uploads')} a month and ${used} have been made this month (the count restarts on the 1st, UTC). ${raise}`;
    case 'apiAccess':
      return `The trade-off API is not part of the ${plan} plan. ${raise}`;
    case 'campaignSites':
      return `The ${plan} plan allows ${limits.campaignSites.toLocaleString('en-US')} sites in one campaign and this file has more (${used.toLocaleString('en-US')} so far). Split it into several campaigns — or: ${raise}`;
    case 'quoteBranding':
      return `Quote branding (your logo and colours on quotes) is not part of the ${plan} plan. ${raise}`;
  }
}
