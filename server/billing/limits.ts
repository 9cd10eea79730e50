import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { models } from '@/db/models';
import { NotFoundError, PlanLimitError } from '@/server/errors';
import { countMembers, countPendingInvitations } from '@/db/queries/team';

/**
 * A company's plan limits, read from the plans table through the company's plan: the one place
 * limits are read. (First version by the accounts work: seats. Billing extends it with past-due
 * grace, the free-tier fallback and the other limits.)
 */
export type PlanLimits = {
  planId: number;
  planCode: string;
  planName: string;
  seats: number;
  studiesPerMonth: number;
  activeLinks: number;
  uploadsPerMonth: number;
  apiAccess: boolean;
  quoteBranding: boolean;
};

export type LimitName = 'seats';

type PlanRow = {
  id: number;
  code: string;
  name: string;
  seat_limit: number;
  studies_per_month: number;
  active_links_limit: number;
  uploads_per_month: number;
  api_access: number | boolean;
  quote_branding: number | boolean;
};

export async function getPlanLimits(companyId: number, t?: Transaction): Promise<PlanLimits> {
  const { sequelize } = models();
  const rows = await sequelize.query<PlanRow>(
    `SELECT p.id, p.code, p.name, p.seat_limit, p.studies_per_month, p.active_links_limit, p.uploads_per_month, p.api_access, p.quote_branding
       FROM companies c JOIN plans p ON p.id = c.plan_id
      WHERE c.id = :companyId`,
    { replacements: { companyId }, type: QueryTypes.SELECT, transaction: t },
  );
  const p = rows[0];
  if (!p) throw new NotFoundError('That company');
  return {
    planId: p.id,
    planCode: p.code,
    planName: p.name,
    seats: p.seat_limit,
    studiesPerMonth: p.studies_per_month,
    activeLinks: p.active_links_limit,
    uploadsPerMonth: p.uploads_per_month,
    apiAccess: Boolean(p.api_access),
    quoteBranding: Boolean(p.quote_branding),
  };
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

/**
 * Inside the caller's transaction: locks the company row (SELECT … FOR UPDATE) so that parallel
 * requests for the same company queue here, then throws PlanLimitError when `adding` more would
 * go over the limit. The lock is held until the caller commits, so the check and the insert
 * that follows it are one step for everyone else.
 */
export async function assertWithinLimit(companyId: number, limit: LimitName, t: Transaction, opts: { adding?: number } = {}): Promise<void> {
  const { sequelize } = models();
  const locked = await sequelize.query<{ id: number }>('SELECT id FROM companies WHERE id = :companyId FOR UPDATE', {
    replacements: { companyId },
    type: QueryTypes.SELECT,
    transaction: t,
  });
  if (!locked[0]) throw new NotFoundError('That company');
  const limits = await getPlanLimits(companyId, t);
  const adding = opts.adding ?? 1;
  if (limit === 'seats') {
    const used = await seatsInUse(companyId, t);
    if (used + adding > limits.seats) {
      throw new PlanLimitError(
        'seats',
        `All ${limits.seats} ${limits.seats === 1 ? 'seat' : 'seats'} of the ${limits.planName} plan are taken (members and pending invitations). Revoke an invitation, remove a member, or move to a larger plan.`,
      );
    }
  }
}
