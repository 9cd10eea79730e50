import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { models } from '@/db/models';

export type AccountSummary = { id: number; name: string; planName: string; planCode: string; trialEndsAt: Date | null; members: number; pendingInvitations: number; createdAt: Date };

/** Every company account with its plan and head-count, for the platform operator (staff only). */
export async function listCompanyAccounts(limit = 200): Promise<AccountSummary[]> {
  const { sequelize } = models();
  const rows = await sequelize.query<Record<string, unknown>>(
    `SELECT c.id, c.name, c.trial_ends_at, c.created_at, p.name AS plan_name, p.code AS plan_code,
            (SELECT COUNT(*) FROM memberships m WHERE m.company_id = c.id) AS members,
            (SELECT COUNT(*) FROM invitations i WHERE i.company_id = c.id AND i.accepted_at IS NULL AND i.revoked_at IS NULL AND i.expires_at > :now) AS pending
       FROM companies c JOIN plans p ON p.id = c.plan_id
      ORDER BY c.created_at DESC, c.id DESC
      LIMIT ${Math.min(Math.max(limit, 1), 1000)}`,
    { replacements: { now: new Date() }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    id: Number(r.id),
    name: String(r.name),
    planName: String(r.plan_name),
    planCode: String(r.plan_code),
    trialEndsAt: r.trial_ends_at ? new Date(r.trial_ends_at as string) : null,
    members: Number(r.members),
    pendingInvitations: Number(r.pending),
    createdAt: new Date(r.created_at as string),
  }));
}

/** Reads and writes of the staff account pages (the operator works across companies, by id). */

export type SubscriptionHistoryRow = {
  id: number;
  providerSubscriptionId: string;
  planName: string | null;
  status: string;
  currentPeriodEnd: Date | null;
  cancelAtPeriodEnd: boolean;
  createdAt: Date;
  endedAt: Date | null;
};

/** Every subscription the company ever had, newest first. */
export async function listSubscriptionHistory(companyId: number, limit = 20): Promise<SubscriptionHistoryRow[]> {
  const { Subscription, Plan } = models();
  const rows = await Subscription.findAll({ where: { companyId }, order: [['createdAt', 'DESC'], ['id', 'DESC']], limit });
  const plans = new Map((await Plan.findAll({ attributes: ['id', 'name'] })).map((p) => [p.id, p.name]));
  return rows.map((r) => ({
    id: r.id,
    providerSubscriptionId: r.providerSubscriptionId,
    planName: r.planId != null ? (plans.get(r.planId) ?? null) : null,
    status: r.status,
    currentPeriodEnd: r.currentPeriodEnd,
    cancelAtPeriodEnd: r.cancelAtPeriodEnd,
    createdAt: r.createdAt,
    endedAt: r.endedAt,
  }));
}

export type CheckoutHistoryRow = { id: number; planName: string | null; status: string; createdAt: Date; completedAt: Date | null };

/** The company's checkouts (opened, completed, expired), newest first. */
export async function listCheckoutHistory(companyId: number, limit = 20): Promise<CheckoutHistoryRow[]> {
  const { BillingCheckout, Plan } = models();
  const rows = await BillingCheckout.findAll({ where: { companyId }, order: [['createdAt', 'DESC'], ['id', 'DESC']], limit });
  const plans = new Map((await Plan.findAll({ attributes: ['id', 'name'] })).map((p) => [p.id, p.name]));
  return rows.map((r) => ({ id: r.id, planName: plans.get(r.planId) ?? null, status: r.status, createdAt: r.createdAt, completedAt: r.completedAt ?? null }));
}

export async function setCompanyTrialEnd(companyId: number, trialEndsAt: Date | null, t: Transaction): Promise<void> {
  const { Company } = models();
  await Company.update({ trialEndsAt }, { where: { id: companyId }, transaction: t });
}
