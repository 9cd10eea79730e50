import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { models } from '@/db/models';
import type { SubscriptionStatus } from '@/db/models';
import { countActiveLinks, countStudiesThisMonth, countUploadsThisMonth, findLiveSubscription, getFreeTierPlan } from '@/db/queries/billing';
import { countMembers, countPendingInvitations } from '@/db/queries/team';
import { NotFoundError, PlanLimitError } from '@/server/errors';
import { OVERDUE_STATUSES } from './policy';

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
 * `lockedRead` (used by assertWithinLimit, which already holds the company row) makes the reads
 * locking reads, so a limit check sees the plan and subscription as last committed (a webhook's
 * plan change), not an older snapshot of the caller's transaction.
 */
export async function getPlanLimits(companyId: number, t?: Transaction, opts: { now?: Date; lockedRead?: boolean } = {}): Promise<PlanLimits> {
  const locking = Boolean(t && opts.lockedRead);
  const { sequelize } = models();
  const now = opts.now ?? new Date();
  const rows = await sequelize.query<PlanRow>(
    `SELECT p.id, p.code, p.name, p.kind, p.seat_limit, p.studies_per_month, p.active_links_limit, p.uploads_per_month, p.campaign_sites_limit, p.api_access, p.quote_branding, c.trial_ends_at
       FROM companies c JOIN plans p ON p.id = c.plan_id
      WHERE c.id = :companyId${locking ? ' LOCK IN SHARE MODE' : ''}`,
    { replacements: { companyId }, type: QueryTypes.SELECT, transaction: t },
  );
  const p = rows[0];
  if (!p) throw new NotFoundError('That company');
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
    const live = await findLiveSubscription(companyId, t, locking);
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

const COUNTED = {
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

/**
 * Inside the caller's transaction: locks the company row (SELECT … FOR UPDATE) so that parallel
 * requests for the same company queue here, then throws PlanLimitError naming the limit and how
 * to raise it when `adding` more would go over. The lock is held until the caller commits, so
 * the check and the insert that follows it are one step for everyone else. Webhooks that change
 * the plan take the same lock.
 *
 * Call it BEFORE the transaction's first insert or update: inserting a row with a foreign key to
 * the company (a customer, a site…) takes a shared lock on the company row, and two parallel
 * transactions that both hold it deadlock when each then asks for FOR UPDATE here.
 *
 * @example
 *   await sequelize.transaction(async (t) => {
 *     await assertWithinLimit(companyId, 'studiesPerMonth', t); // throws PlanLimitError at the limit
 *     await Study.create({ … }, { transaction: t });
 *   });
 */
export async function assertWithinLimit(companyId: number, limit: LimitName, t: Transaction, opts: { adding?: number } = {}): Promise<void> {
  const { sequelize } = models();
  const locked = await sequelize.query<{ id: number }>('SELECT id FROM companies WHERE id = :companyId FOR UPDATE', {
    replacements: { companyId },
    type: QueryTypes.SELECT,
    transaction: t,
  });
  if (!locked[0]) throw new NotFoundError('That company');
  const limits = await getPlanLimits(companyId, t, { lockedRead: true });
  if (limit === 'apiAccess' || limit === 'quoteBranding') {
    if (!limits[limit]) throw new PlanLimitError(limit, limitMessage(limit, limits, 0));
    return;
  }
  const adding = opts.adding ?? 1;
  if (limit === 'campaignSites') {
    if (adding > limits.campaignSites) throw new PlanLimitError(limit, limitMessage(limit, limits, adding));
    return;
  }
  const used = await COUNTED[limit](companyId, t);
  if (used + adding > limits[limit]) throw new PlanLimitError(limit, limitMessage(limit, limits, used));
}
