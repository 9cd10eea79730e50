import { randomBytes } from 'node:crypto';
import { models } from '@/db/models';
import type { CompanyRole } from '@/db/models';
import { hashPassword } from '@/server/auth/password';
import { getLucia } from '@/server/auth/lucia';
import { hashToken } from '@/server/auth/tokens';

/**
 * Rows for integration tests, straight into the real MariaDB. Every name is invented and every
 * address uses the reserved .example domain; a random suffix keeps runs from colliding.
 */
export const TEST_PASSWORD = 'correct-horse-battery-2026';
let cachedHash: Promise<string> | undefined;
const defaultHash = () => (cachedHash ??= hashPassword(TEST_PASSWORD));

export const suffix = () => randomBytes(4).toString('hex');
export const uniqueEmail = (prefix = 'person') => `${prefix}-${suffix()}@test.example`;

export type TestCompany = { id: number; name: string; planId: number };
export type TestUser = { id: string; email: string; name: string; password: string; membershipId: number | null; companyId: number | null; role: CompanyRole | 'staff' };

export async function createCompany(opts: { planCode?: string; name?: string; trialEndsAt?: Date | null } = {}): Promise<TestCompany> {
  const { Plan, Company } = models();
  const plan = await Plan.findOne({ where: { code: opts.planCode ?? 'crew' } });
  if (!plan) throw new Error(`no plan ${opts.planCode ?? 'crew'}: run the migrations`);
  const company = await Company.create({ name: opts.name ?? `Testing Aerials ${suffix()}`, planId: plan.id, trialEndsAt: opts.trialEndsAt ?? null });
  return { id: company.id, name: company.name, planId: company.planId };
}

/** A plan of our own with the given seat limit (for seat tests), and a company on it. */
export async function createCompanyWithSeats(seats: number): Promise<TestCompany> {
  const { Plan } = models();
  const code = `test-seats-${suffix()}`;
  await Plan.create({ code, name: `Test ${seats}-seat`, seatLimit: seats, studiesPerMonth: 10, activeLinksLimit: 5, uploadsPerMonth: 5, kind: 'paid', trialDays: null, isPublic: false, description: null, stripeProductId: null, stripePriceId: null });
  return createCompany({ planCode: code });
}

export async function createUserWithRole(companyId: number, role: CompanyRole, opts: { email?: string; name?: string; password?: string } = {}): Promise<TestUser> {
  const { User, Membership } = models();
  const password = opts.password ?? TEST_PASSWORD;
  const user = await User.create({
    id: 'usr_' + randomBytes(12).toString('base64url'),
    email: (opts.email ?? uniqueEmail(role)).toLowerCase(),
    name: opts.name ?? `Test ${role} ${suffix()}`,
    passwordHash: opts.password ? await hashPassword(password) : await defaultHash(),
  });
  const m = await Membership.create({ companyId, userId: user.id, role });
  return { id: user.id, email: user.email, name: user.name, password, membershipId: m.id, companyId, role };
}

export async function addMembership(userId: string, companyId: number, role: CompanyRole): Promise<number> {
  const { Membership } = models();
  return (await Membership.create({ companyId, userId, role })).id;
}

export async function createStaffUser(): Promise<TestUser> {
  const { User } = models();
  const user = await User.create({ id: 'usr_' + randomBytes(12).toString('base64url'), email: uniqueEmail('staff'), name: `Test staff ${suffix()}`, passwordHash: await defaultHash(), isStaff: true });
  return { id: user.id, email: user.email, name: user.name, password: TEST_PASSWORD, membershipId: null, companyId: null, role: 'staff' };
}

/** A live session for the user (as sign-in would make), working in the given company. Returns the cookie token. */
export async function signInAs(user: { id: string; companyId?: number | null }, companyId: number | null = user.companyId ?? null): Promise<string> {
  const session = await getLucia().createSession(user.id, { activeCompanyId: companyId, ip: '198.51.100.10', userAgent: 'vitest factory' });
  return session.id;
}

export const digestOf = hashToken;
