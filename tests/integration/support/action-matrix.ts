import { randomBytes } from 'node:crypto';
import { models } from '@/db/models';
import type { CompanyRole } from '@/db/models';
import { PERMISSIONS, type Permission } from '@/server/auth/permissions';
import type { Access } from '@/server/auth/access';
import type { ActionState } from '@/server/actions/safe-action';
import { hashToken } from '@/server/auth/tokens';
import { apiRequest, callAction, type ActionOutcome } from './next-request';
import { createCompanyWithSeats, createStaffUser, createUserWithRole, uniqueEmail, type TestCompany, type TestUser } from './factories';

/**
 * The permission matrix: every server action and route handler × every role, each cell
 * asserted allowed or denied (tests/integration/permissions-matrix.test.ts runs it).
 *
 * HOW TO ADD ROWS: drop a file in tests/integration/matrix/<area>.ts that exports
 * `cases: MatrixCase[]` (and, for rows read or changed by id, `crossCompany: CrossCompanyCase[]`).
 * The runner picks every file up by glob; nobody edits a shared list. Use `actionCase` and
 * `routeCase` below. Each cell runs as its own request with a fresh session of that role in
 * company A; `prepare` runs first (without a session) to make whatever the call needs, fresh
 * per cell (a member to remove, a study to read…).
 *
 * A cell is DENIED when the action answers code 'unauthenticated' or 'forbidden' (route: 401/403
 * with that code); anything else that passed the guard is ALLOWED — but an allowed cell must not
 * be a crash (code 'internal' / 500 fails the test), so inputs should be valid.
 */
export const MATRIX_ROLES = ['admin', 'installer', 'sales', 'staff', 'signed-out'] as const;
export type MatrixRole = (typeof MATRIX_ROLES)[number];

export type MatrixWorld = {
  /** Company A: admin, installer and sales below are its members (plenty of seats). */
  company: TestCompany;
  /** Company B: another customer, for cross-company cases. */
  otherCompany: TestCompany;
  users: Record<Exclude<MatrixRole, 'signed-out'>, TestUser>;
  /** Company B's admin (owner of B's rows in cross-company cases). */
  otherAdmin: TestUser;
  /** A fresh member of company A (or B) with the role. */
  member(role: CompanyRole, company?: TestCompany): Promise<TestUser>;
  /** A fresh pending invitation in company A (or B); returns its id and the link token. */
  invitation(company?: TestCompany): Promise<{ id: number; token: string; email: string }>;
};

export type CellResult = ActionOutcome | Response;

// Method syntax on purpose: rows with different `prepared` types sit in one array (parameters
// of methods are compared bivariantly), so an area file needs no casts.
export interface MatrixCase<P = unknown> {
  /** Unique; actions as 'action <file>#<export>', routes as '<METHOD> <path pattern>' (used by the completeness check). */
  name: string;
  kind: 'action' | 'route';
  access: Access;
  /** The roles expected to pass the guard. Checked against PERMISSIONS[access] too. */
  allow: readonly MatrixRole[];
  prepare?(world: MatrixWorld, role: MatrixRole): Promise<unknown>;
  run(world: MatrixWorld, prepared: P, role: MatrixRole): Promise<CellResult>;
}

/** A foreign row by id must answer 404 (never the row, never 403 that confirms it exists). */
export interface CrossCompanyCase<P = unknown> {
  name: string;
  /** Which member of company A tries it (default admin: the widest rights). */
  as?: 'admin' | 'installer' | 'sales';
  prepare?(world: MatrixWorld): Promise<unknown>;
  run(world: MatrixWorld, prepared: P): Promise<CellResult>;
  /** Optional: assert the foreign row is unchanged afterwards. */
  unchanged?(world: MatrixWorld, prepared: P): Promise<void>;
}

type AnyAction = (prev: ActionState<never> | null, input: FormData | Record<string, unknown>) => Promise<ActionState<unknown>>;

/** A server action row: `input` builds valid input for the cell. */
export function actionCase<P = undefined>(def: {
  file: string;
  exportName: string;
  action: AnyAction;
  access: Access;
  allow: readonly MatrixRole[];
  prepare?: (world: MatrixWorld, role: MatrixRole) => Promise<P>;
  input: (world: MatrixWorld, prepared: P, role: MatrixRole) => Record<string, unknown> | Promise<Record<string, unknown>>;
}): MatrixCase<P> {
  return {
    name: `action ${def.file}#${def.exportName}`,
    kind: 'action',
    access: def.access,
    allow: def.allow,
    prepare: def.prepare,
    run: async (world, prepared, role) => callAction(def.action as never, await def.input(world, prepared, role)),
  };
}

type AnyRoute = (req: Request, context: { params: Promise<never> }) => Promise<Response>;

/** A route handler row: `path` is the route pattern (e.g. /api/v1/studies/[id]); `request` builds the call. */
export function routeCase<P = undefined>(def: {
  method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  path: string;
  handler: AnyRoute;
  access: Access;
  allow: readonly MatrixRole[];
  prepare?: (world: MatrixWorld, role: MatrixRole) => Promise<P>;
  request: (world: MatrixWorld, prepared: P, role: MatrixRole) => { url: string; params?: Record<string, string>; json?: unknown; headers?: Record<string, string> } | Promise<{ url: string; params?: Record<string, string>; json?: unknown; headers?: Record<string, string> }>;
}): MatrixCase<P> {
  return {
    name: `${def.method} ${def.path}`,
    kind: 'route',
    access: def.access,
    allow: def.allow,
    prepare: def.prepare,
    run: async (world, prepared, role) => {
      const r = await def.request(world, prepared, role);
      const req = apiRequest(r.url, { method: def.method, json: r.json, headers: r.headers });
      return def.handler(req, { params: Promise.resolve((r.params ?? {}) as never) });
    },
  };
}

/** The roles an access level lets through, from the permission map (for the consistency check). */
export function rolesFor(access: Access): MatrixRole[] {
  if (access === 'public') return [...MATRIX_ROLES];
  if (access === 'signed-in') return ['admin', 'installer', 'sales', 'staff'];
  return [...(PERMISSIONS[access as Permission] as readonly MatrixRole[])];
}

export async function buildWorld(): Promise<MatrixWorld> {
  const company = await createCompanyWithSeats(500);
  const otherCompany = await createCompanyWithSeats(500);
  const users = {
    admin: await createUserWithRole(company.id, 'admin'),
    installer: await createUserWithRole(company.id, 'installer'),
    sales: await createUserWithRole(company.id, 'sales'),
    staff: await createStaffUser(),
  };
  const otherAdmin = await createUserWithRole(otherCompany.id, 'admin');
  return {
    company,
    otherCompany,
    users,
    otherAdmin,
    member: (role, c = company) => createUserWithRole(c.id, role),
    invitation: async (c = company) => {
      const token = randomBytes(32).toString('base64url');
      const email = uniqueEmail('invitee');
      const row = await models().Invitation.create({
        companyId: c.id,
        email,
        role: 'sales',
        tokenHash: hashToken(token),
        invitedByUserId: null,
        expiresAt: new Date(Date.now() + 7 * 86_400_000),
        // Sent long ago, so a resend is not refused by the one-minute cooldown.
        lastSentAt: new Date(Date.now() - 3600_000),
      });
      return { id: row.id, token, email };
    },
  };
}

/** 'denied' | 'allowed', or a description of what went wrong (a crash is never "allowed"). */
export async function classify(result: CellResult): Promise<{ verdict: 'allowed' | 'denied' | 'crashed'; detail: string }> {
  if (result instanceof Response) {
    let code = '';
    try {
      code = ((await result.clone().json()) as { error?: { code?: string } })?.error?.code ?? '';
    } catch {
      code = '';
    }
    if ((result.status === 401 && code === 'unauthenticated') || (result.status === 403 && code === 'forbidden')) return { verdict: 'denied', detail: `${result.status} ${code}` };
    if (result.status >= 500) return { verdict: 'crashed', detail: `${result.status} ${code}` };
    return { verdict: 'allowed', detail: `${result.status}${code ? ' ' + code : ''}` };
  }
  if (result.redirect !== undefined) return { verdict: 'allowed', detail: `redirect ${result.redirect}` };
  if (result.notFound !== undefined) return { verdict: 'allowed', detail: `notFound ${result.notFound}` };
  const s = result.state;
  if (!s.ok && (s.code === 'unauthenticated' || s.code === 'forbidden')) return { verdict: 'denied', detail: s.code };
  if (!s.ok && s.code === 'internal') return { verdict: 'crashed', detail: s.error };
  return { verdict: 'allowed', detail: s.ok ? 'ok' : `${s.code}: ${s.error}` };
}

/** True when a cross-company attempt answered "not found". */
export async function isNotFound(result: CellResult): Promise<{ ok: boolean; detail: string }> {
  if (result instanceof Response) return { ok: result.status === 404, detail: `status ${result.status}` };
  if (result.notFound !== undefined) return { ok: result.notFound === 404, detail: `notFound ${result.notFound}` };
  if (result.redirect !== undefined) return { ok: false, detail: `redirect ${result.redirect}` };
  const s = result.state;
  return { ok: !s.ok && s.code === 'not_found', detail: s.ok ? 'ok' : `${s.code}: ${s.error}` };
}
