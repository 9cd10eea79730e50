import 'server-only';
import { Op, QueryTypes, type Transaction } from 'sequelize';
import { models } from '@/db/models';
import type { SubscriptionStatus } from '@/db/models';
import { LIVE_STATUSES } from '@/server/billing/policy';

/**
 * Named queries for plans, subscriptions, checkouts and the company's billing columns.
 * Company-owned rows are always read through a companyId.
 */

export type PlanRow = InstanceType<ReturnType<typeof models>['Plan']>;
export type SubscriptionRow = InstanceType<ReturnType<typeof models>['Subscription']>;
export type CheckoutRow = InstanceType<ReturnType<typeof models>['BillingCheckout']>;

// ---- companies ------------------------------------------------------------------------------

export type CompanyBilling = { id: number; name: string; planId: number; trialEndsAt: Date | null; stripeCustomerId: string | null };

type CompanyBillingRaw = { id: number; name: string; plan_id: number; trial_ends_at: Date | null; stripe_customer_id: string | null };

const toCompanyBilling = (r: CompanyBillingRaw): CompanyBilling => ({
  id: r.id,
  name: r.name,
  planId: r.plan_id,
  trialEndsAt: r.trial_ends_at,
  stripeCustomerId: r.stripe_customer_id,
});

/** The company's billing columns; `lock` takes the row FOR UPDATE inside `t`. */
export async function getCompanyBilling(companyId: number, t?: Transaction, lock = false): Promise<CompanyBilling | null> {
  const { sequelize } = models();
  const rows = await sequelize.query<CompanyBillingRaw>(
    `SELECT id, name, plan_id, trial_ends_at, stripe_customer_id FROM companies WHERE id = :companyId${lock && t ? ' FOR UPDATE' : ''}`,
    { replacements: { companyId }, type: QueryTypes.SELECT, transaction: t },
  );
  return rows[0] ? toCompanyBilling(rows[0]) : null;
}

export async function findCompanyByStripeCustomer(customerId: string, t?: Transaction): Promise<CompanyBilling | null> {
  const { sequelize } = models();
  const rows = await sequelize.query<CompanyBillingRaw>(
    'SELECT id, name, plan_id, trial_ends_at, stripe_customer_id FROM companies WHERE stripe_customer_id = :customerId',
    { replacements: { customerId }, type: QueryTypes.SELECT, transaction: t },
  );
  return rows[0] ? toCompanyBilling(rows[0]) : null;
}

/** Records the provider customer once; returns the id the company ends up with. */
export async function setCompanyStripeCustomer(companyId: number, customerId: string, t?: Transaction): Promise<string | null> {
  const { sequelize } = models();
  await sequelize.query('UPDATE companies SET stripe_customer_id = :customerId, updated_at = NOW() WHERE id = :companyId AND stripe_customer_id IS NULL', {
    replacements: { companyId, customerId },
    transaction: t,
  });
  return (await getCompanyBilling(companyId, t))?.stripeCustomerId ?? null;
}

/** Replaces a customer id the provider no longer knows (another account or mode, or a reset). */
export async function replaceCompanyStripeCustomer(companyId: number, staleId: string, customerId: string): Promise<void> {
  const { sequelize } = models();
  await sequelize.query('UPDATE companies SET stripe_customer_id = :customerId, updated_at = NOW() WHERE id = :companyId AND stripe_customer_id = :staleId', {
    replacements: { companyId, customerId, staleId },
  });
}

export async function setCompanyPlan(companyId: number, planId: number, t: Transaction): Promise<void> {
  const { Company } = models();
  await Company.update({ planId }, { where: { id: companyId }, transaction: t });
}

// ---- plans ------------------------------------------------------------------------------------

export async function getPlanById(planId: number, t?: Transaction): Promise<PlanRow | null> {
  const { Plan } = models();
  return Plan.findByPk(planId, { transaction: t });
}

/** Every plan, public ones first in their display order (staff pages). */
export async function listAllPlans(): Promise<PlanRow[]> {
  const { Plan } = models();
  return Plan.findAll({ order: [['sortOrder', 'ASC'], ['id', 'ASC']] });
}

/** Plans shown on the pricing page and the plan picker. */
export async function listPublicPlans(): Promise<PlanRow[]> {
  const { Plan } = models();
  return Plan.findAll({ where: { isPublic: true, kind: { [Op.in]: ['free', 'paid'] } }, order: [['sortOrder', 'ASC'], ['id', 'ASC']] });
}

/** The plan new companies start on (sign-up), if the catalogue has one. */
export async function getTrialPlan(t?: Transaction): Promise<PlanRow | null> {
  const { Plan } = models();
  return Plan.findOne({ where: { kind: 'trial' }, order: [['sortOrder', 'ASC'], ['id', 'ASC']], transaction: t });
}

/** The free tier every unpaid or expired account falls back to: the first free plan in display order. */
export async function getFreeTierPlan(t?: Transaction): Promise<PlanRow | null> {
  const { Plan } = models();
  return Plan.findOne({ where: { kind: 'free' }, order: [['sortOrder', 'ASC'], ['id', 'ASC']], transaction: t });
}

/**
 * Our plan for a provider price: by product (stable per plan across price changes), then by the
 * current price id. Subscriptions on an archived price still map to their plan through the product.
 */
export async function findPlanForProviderPrice(productId: string | null, priceId: string | null, t?: Transaction): Promise<PlanRow | null> {
  const { Plan } = models();
  if (productId) {
    const byProduct = await Plan.findOne({ where: { stripeProductId: productId }, transaction: t });
    if (byProduct) return byProduct;
  }
  if (priceId) return Plan.findOne({ where: { stripePriceId: priceId }, transaction: t });
  return null;
}

export type PlanProviderSync = { syncedAt: Date | null; error: string | null };

export async function getPlanProviderSync(planIds: number[]): Promise<Map<number, PlanProviderSync>> {
  const out = new Map<number, PlanProviderSync>();
  if (planIds.length === 0) return out;
  const { sequelize } = models();
  const rows = await sequelize.query<{ id: number; provider_synced_at: Date | null; provider_sync_error: string | null }>(
    'SELECT id, provider_synced_at, provider_sync_error FROM plans WHERE id IN (:planIds)',
    { replacements: { planIds }, type: QueryTypes.SELECT },
  );
  for (const r of rows) out.set(r.id, { syncedAt: r.provider_synced_at, error: r.provider_sync_error });
  return out;
}

export async function recordPlanSync(planId: number, result: { productId?: string; priceId?: string | null; error: string | null }): Promise<void> {
  const { sequelize } = models();
  const sets = ['provider_sync_error = :error', 'updated_at = NOW()'];
  if (result.error === null) sets.push('provider_synced_at = NOW()');
  if (result.productId !== undefined) sets.push('stripe_product_id = :productId');
  if (result.priceId !== undefined) sets.push('stripe_price_id = :priceId');
  await sequelize.query(`UPDATE plans SET ${sets.join(', ')} WHERE id = :planId`, {
    replacements: { planId, error: result.error?.slice(0, 500) ?? null, productId: result.productId ?? null, priceId: result.priceId ?? null },
  });
}

/** Marks the plan as changed since its last push, so staff see it needs a sync. */
export async function markPlanUnsynced(planId: number, t?: Transaction): Promise<void> {
  const { sequelize } = models();
  await sequelize.query('UPDATE plans SET provider_synced_at = NULL WHERE id = :planId', { replacements: { planId }, transaction: t });
}

export type PlanFields = {
  code: string;
  name: string;
  description: string | null;
  monthlyPriceUsd: string;
  seatLimit: number;
  studiesPerMonth: number;
  activeLinksLimit: number;
  uploadsPerMonth: number;
  campaignSitesLimit: number;
  apiAccess: boolean;
  quoteBranding: boolean;
  kind: 'trial' | 'free' | 'paid';
  trialDays: number | null;
  isPublic: boolean;
  sortOrder: number;
};

export async function findPlanByCode(code: string, t?: Transaction): Promise<PlanRow | null> {
  const { Plan } = models();
  return Plan.findOne({ where: { code }, transaction: t });
}

export async function insertPlan(fields: PlanFields, t: Transaction): Promise<PlanRow> {
  const { Plan } = models();
  return Plan.create({ ...fields, stripeProductId: null, stripePriceId: null }, { transaction: t });
}

export async function updatePlanFields(planId: number, fields: Omit<PlanFields, 'code'>, t: Transaction): Promise<void> {
  const { Plan } = models();
  await Plan.update(fields, { where: { id: planId }, transaction: t });
}

export async function countCompaniesOnPlan(planId: number, t?: Transaction): Promise<number> {
  const { Company } = models();
  return Company.count({ where: { planId }, transaction: t });
}

// ---- subscriptions ----------------------------------------------------------------------------

export async function findSubscriptionByProviderId(providerSubscriptionId: string, t?: Transaction, lock = false): Promise<SubscriptionRow | null> {
  const { Subscription } = models();
  return Subscription.findOne({ where: { providerSubscriptionId }, transaction: t, lock: lock && t ? t.LOCK.UPDATE : undefined });
}

/**
 * The subscription that governs the company now: the newest live one (trialing, active, past due,
 * unpaid, paused). Null when the company has none (free tier, trial, or a plan staff assigned).
 */
export async function findLiveSubscription(companyId: number, t?: Transaction, lockShared = false): Promise<SubscriptionRow | null> {
  const { Subscription } = models();
  return Subscription.findOne({
    where: { companyId, status: { [Op.in]: [...LIVE_STATUSES] } },
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
    transaction: t,
    lock: lockShared && t ? t.LOCK.SHARE : undefined,
  });
}

export async function countOtherLiveSubscriptions(companyId: number, exceptId: number, t: Transaction): Promise<number> {
  const { Subscription } = models();
  return Subscription.count({ where: { companyId, id: { [Op.ne]: exceptId }, status: { [Op.in]: [...LIVE_STATUSES] } }, transaction: t });
}

export type SubscriptionValues = {
  companyId: number;
  planId: number | null;
  providerSubscriptionId: string;
  providerCustomerId: string;
  providerPriceId: string | null;
  status: SubscriptionStatus;
  currentPeriodEnd: Date | null;
  cancelAtPeriodEnd: boolean;
  canceledAt: Date | null;
  endedAt: Date | null;
  pastDueSince: Date | null;
  graceEndsAt: Date | null;
  pendingPlanId: number | null;
  lastEventCreated: number;
};

export async function insertSubscription(values: SubscriptionValues, t: Transaction): Promise<SubscriptionRow> {
  const { Subscription } = models();
  return Subscription.create(values, { transaction: t });
}

export async function updateSubscription(id: number, values: Partial<SubscriptionValues> & { lastPaymentFailedAt?: Date | null }, t: Transaction): Promise<void> {
  const { Subscription } = models();
  await Subscription.update(values, { where: { id }, transaction: t });
}

/** Remembers the plan an admin asked to move to until the provider confirms it. */
export async function setPendingPlan(companyId: number, subscriptionId: number, planId: number, t?: Transaction): Promise<void> {
  const { Subscription } = models();
  await Subscription.update({ pendingPlanId: planId }, { where: { id: subscriptionId, companyId }, transaction: t });
}

// ---- checkouts -------------------------------------------------------------------------------

export async function insertCheckout(values: { companyId: number; planId: number; providerSessionId: string; createdByUserId: string | null; expiresAt: Date }, t?: Transaction): Promise<CheckoutRow> {
  const { BillingCheckout } = models();
  return BillingCheckout.create(values, { transaction: t });
}

/** The company's checkouts that are still open and not past their expiry. */
export async function findOpenCheckouts(companyId: number, t: Transaction, now = new Date()): Promise<CheckoutRow[]> {
  const { BillingCheckout } = models();
  return BillingCheckout.findAll({ where: { companyId, status: 'open', expiresAt: { [Op.gt]: now } }, transaction: t });
}

/** A checkout of this company by the provider's session id (null for another company's). */
export async function findCheckoutForCompany(companyId: number, providerSessionId: string): Promise<CheckoutRow | null> {
  const { BillingCheckout } = models();
  return BillingCheckout.findOne({ where: { companyId, providerSessionId } });
}

export async function findCheckoutBySession(providerSessionId: string, t: Transaction): Promise<CheckoutRow | null> {
  const { BillingCheckout } = models();
  return BillingCheckout.findOne({ where: { providerSessionId }, transaction: t, lock: t.LOCK.UPDATE });
}

export async function markCheckout(id: number, values: { status: 'completed' | 'expired'; providerSubscriptionId?: string | null; completedAt?: Date | null }, t: Transaction): Promise<void> {
  const { BillingCheckout } = models();
  await BillingCheckout.update(values, { where: { id }, transaction: t });
}

// ---- usage (what the limits count) ------------------------------------------------------------

/** First instant of the current calendar month in UTC: monthly allowances reset then. */
export function monthStartUtc(now = new Date()): Date {
  return new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), 1));
}

async function countRows(sql: string, replacements: Record<string, unknown>, t?: Transaction): Promise<number> {
  const { sequelize } = models();
  // Inside a transaction the count is a locking read: it sees the latest committed rows even when
  // the caller's transaction took its REPEATABLE READ snapshot before the company lock.
  const rows = await sequelize.query<{ n: number | string }>(t ? `${sql} LOCK IN SHARE MODE` : sql, {
    replacements,
    type: QueryTypes.SELECT,
    transaction: t,
  });
  return Number(rows[0]?.n ?? 0);
}

export async function countStudiesThisMonth(companyId: number, t?: Transaction, now = new Date()): Promise<number> {
  // A study comparing several services for one site is one study (its further services are rows that name it).
  return countRows('SELECT COUNT(*) AS n FROM studies WHERE company_id = :companyId AND comparison_of_study_id IS NULL AND created_at >= :since', { companyId, since: monthStartUtc(now) }, t);
}

export async function countUploadsThisMonth(companyId: number, t?: Transaction, now = new Date()): Promise<number> {
  return countRows('SELECT COUNT(*) AS n FROM uploads WHERE company_id = :companyId AND created_at >= :since', { companyId, since: monthStartUtc(now) }, t);
}

/** Comparison links that a customer could open now: not revoked and not expired. */
export async function countActiveLinks(companyId: number, t?: Transaction, now = new Date()): Promise<number> {
  return countRows('SELECT COUNT(*) AS n FROM share_links WHERE company_id = :companyId AND revoked_at IS NULL AND expires_at > :now', { companyId, now }, t);
}

// ---- staff: accounts ----------------------------------------------------------------------------

export type AccountRow = {
  companyId: number;
  companyName: string;
  planName: string;
  planKind: 'trial' | 'free' | 'paid';
  trialEndsAt: Date | null;
  members: number;
  pendingInvitations: number;
  subscriptionStatus: SubscriptionStatus | null;
  currentPeriodEnd: Date | null;
  cancelAtPeriodEnd: boolean;
  graceEndsAt: Date | null;
  createdAt: Date;
};

/** Every company with its plan and newest subscription (staff only; search by name). */
export async function listAccounts(opts: { search?: string; limit?: number; offset?: number } = {}): Promise<{ rows: AccountRow[]; total: number }> {
  const { sequelize } = models();
  const search = opts.search?.trim() ? `%${opts.search.trim().replace(/[\\%_]/g, (c) => `\\${c}`)}%` : null;
  const where = search ? 'WHERE c.name LIKE :search' : '';
  const limit = Math.min(Math.max(opts.limit ?? 50, 1), 200);
  const offset = Math.max(opts.offset ?? 0, 0);
  const rows = await sequelize.query<{
    id: number; name: string; plan_name: string; plan_kind: AccountRow['planKind']; trial_ends_at: Date | null; created_at: Date;
    members: number | string; pending: number | string; status: SubscriptionStatus | null; current_period_end: Date | null;
    cancel_at_period_end: number | null; grace_ends_at: Date | null;
  }>(
    `SELECT c.id, c.name, p.name AS plan_name, p.kind AS plan_kind, c.trial_ends_at, c.created_at,
            (SELECT COUNT(*) FROM memberships m WHERE m.company_id = c.id) AS members,
            (SELECT COUNT(*) FROM invitations i WHERE i.company_id = c.id AND i.accepted_at IS NULL AND i.revoked_at IS NULL AND i.expires_at > NOW()) AS pending,
            s.status, s.current_period_end, s.cancel_at_period_end, s.grace_ends_at
       FROM companies c
       JOIN plans p ON p.id = c.plan_id
       LEFT JOIN subscriptions s ON s.id = (SELECT s2.id FROM subscriptions s2 WHERE s2.company_id = c.id ORDER BY s2.created_at DESC, s2.id DESC LIMIT 1)
       ${where}
      ORDER BY c.name ASC, c.id ASC
      LIMIT ${limit} OFFSET ${offset}`,
    { replacements: { search }, type: QueryTypes.SELECT },
  );
  const [count] = await sequelize.query<{ n: number | string }>(`SELECT COUNT(*) AS n FROM companies c ${where}`, { replacements: { search }, type: QueryTypes.SELECT });
  return {
    total: Number(count?.n ?? 0),
    rows: rows.map((r) => ({
      companyId: r.id,
      companyName: r.name,
      planName: r.plan_name,
      planKind: r.plan_kind,
      trialEndsAt: r.trial_ends_at,
      members: Number(r.members),
      pendingInvitations: Number(r.pending),
      subscriptionStatus: r.status,
      currentPeriodEnd: r.current_period_end,
      cancelAtPeriodEnd: Boolean(r.cancel_at_period_end),
      graceEndsAt: r.grace_ends_at,
      createdAt: r.created_at,
    })),
  };
}
