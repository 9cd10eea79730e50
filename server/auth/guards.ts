import 'server-only';
import { cache } from 'react';
import { redirect, notFound, forbidden } from 'next/navigation';
import { ForbiddenError, UnauthenticatedError } from '@/server/errors';
import { findMembership, firstMembership } from '@/db/queries/team';
import { setSessionActiveCompany } from '@/db/queries/sessions';
import { can, PERMISSIONS, type Permission, type Role } from './permissions';
import { validateRequest } from './session';
import type { ApiScope } from './api-scopes';
import { planLimitsFromRow, type PlanLimits } from '@/server/billing/limits';

export type AuthUser = { id: string; email: string; name: string; isStaff: boolean };

export type AuthContext = {
  user: AuthUser;
  /** The session's public handle (digest of the cookie token): safe to log and to compare. */
  sessionId: string;
  /** Null only for staff, who work on the staff pages and hold no company rows. */
  companyId: number | null;
  company: { id: number; name: string; planId: number } | null;
  role: Role;
  /** Set when the caller is an API key rather than a person (server/api/key-access.ts). */
  apiKey?: { id: number; name: string; prefix: string; scopes: ApiScope[] };
  /**
   * The company's plan limits as read with the caller (same query as the session or the key), for
   * checks that take no lock (API access of a read-only route). Limit checks before an insert still
   * use assertWithinPlan under the company lock.
   */
  plan?: PlanLimits;
};

/** The context of a company member: company scoping is guaranteed. */
export type CompanyAuthContext = AuthContext & { companyId: number; company: { id: number; name: string; planId: number }; role: Exclude<Role, 'staff'> };

/** Permissions no staff role holds: a context authorised for one of them is a company member's. */
export type CompanyPermission = { [K in Permission]: 'staff' extends (typeof PERMISSIONS)[K][number] ? never : K }[Permission];
export type ContextFor<P extends Permission | null> = P extends CompanyPermission ? CompanyAuthContext : AuthContext;

/**
 * Who is asking, or null. Resolved once per request: the session, then the role in the session's
 * active company. A session whose company no longer has the person falls back to their oldest
 * membership; a person with no membership left (and not staff) has no context at all.
 */
export const getAuthContext = cache(async (): Promise<AuthContext | null> => {
  const validated = await validateRequest();
  if (!validated) return null;
  const { user, session, digest } = validated;
  const authUser: AuthUser = { id: user.id, email: user.email, name: user.name, isStaff: user.isStaff };
  if (user.isStaff) {
    return { user: authUser, sessionId: digest, companyId: null, company: null, role: 'staff' };
  }
  // Normally read with the session in one query (sequelize-adapter.ts); the look-ups below are
  // for a session whose company no longer has the person, or one read without it.
  const active = session.activeMembership;
  if (active) {
    const plan = await planLimitsFromRow(active.plan);
    return { user: authUser, sessionId: digest, companyId: active.company.id, company: active.company, role: active.role, plan };
  }
  let membership = session.activeCompanyId != null && active === undefined ? await findMembership(user.id, session.activeCompanyId) : null;
  if (!membership) {
    membership = await firstMembership(user.id);
    if (!membership) return null;
    await setSessionActiveCompany(digest, membership.company.id);
  }
  return { user: authUser, sessionId: digest, companyId: membership.company.id, company: membership.company, role: membership.role };
});

// ---- pages and layouts: redirect or 404 rather than throw -----------------------------------

/** Pages and layouts: the signed-in person, or a redirect to the sign-in page. */
export async function requireUser(): Promise<AuthContext> {
  const ctx = await getAuthContext();
  if (!ctx) redirect('/sign-in');
  return ctx;
}

/** Pages and layouts: one of these roles, else a 404 (a hidden area stays hidden). */
export async function requireRole(...roles: Role[]): Promise<AuthContext> {
  const ctx = await requireUser();
  if (!roles.includes(ctx.role)) notFound();
  return ctx;
}

/**
 * Pages: the permission, else a 403 page naming the role and who can grant access (forbidden()
 * renders app/forbidden.tsx). The page itself is no secret — every member sees it in the menu
 * of the roles that have it — so a 404 only confused people. Rows of another company still
 * answer 404 in the pages that read them. Company permissions yield a company-scoped context.
 */
export async function requirePermission<P extends Permission>(permission: P): Promise<ContextFor<P>> {
  const ctx = await requireUser();
  if (!can(ctx.role, permission)) forbidden();
  return ctx as ContextFor<P>;
}

/**
 * Staff pages: the staff permission, else a 404 — the operator's area stays hidden from company
 * members (unlike company pages, which answer 403 with the role message).
 */
export async function requireStaffPermission<P extends Permission>(permission: P): Promise<AuthContext> {
  const ctx = await requireUser();
  if (ctx.role !== 'staff' || !can(ctx.role, permission)) notFound();
  return ctx;
}

/** Pages inside the company app: a company member (staff are sent to their own pages). */
export async function requireCompanyUser(): Promise<CompanyAuthContext> {
  const ctx = await requireUser();
  if (ctx.companyId == null || ctx.role === 'staff') redirect('/staff');
  return ctx as CompanyAuthContext;
}

// ---- actions and route handlers: throw, and the wrapper turns it into a response --------------

/**
 * Actions and route handlers: throws UnauthenticatedError (401) without a session and
 * ForbiddenError (403) when the role lacks the permission. Pass null to require only a session.
 */
export async function authorize<P extends Permission | null>(permission: P): Promise<ContextFor<P>> {
  const ctx = await getAuthContext();
  if (!ctx) throw new UnauthenticatedError();
  if (permission !== null) {
    if (!can(ctx.role, permission)) throw new ForbiddenError();
    const companyOnly = !(PERMISSIONS[permission] as readonly Role[]).includes('staff');
    if (companyOnly && ctx.companyId == null) throw new ForbiddenError();
  }
  return ctx as ContextFor<P>;
}
