import { signIn, signOut, signUp, confirmSignUp, requestPasswordReset, resetPassword, acceptInvitation, acceptInvitationWithAccount, unlockSignIn } from '@/server/actions/auth';
import { inviteMember, resendInvitation, revokeInvitation, changeMemberRole, removeMember } from '@/server/actions/team';
import { revokeSession, signOutEverywhere, changePassword, switchCompany } from '@/server/actions/security';
import { GET as getMe } from '@/app/api/v1/me/route';
import { GET as getTeam } from '@/app/api/v1/team/route';
import { GET as getHealth } from '@/app/api/health/route';
import { models } from '@/db/models';
import { hashToken } from '@/server/auth/tokens';
import { actionCase, routeCase, type CrossCompanyCase, type MatrixCase } from '../support/action-matrix';
import { signInAs, uniqueEmail, TEST_PASSWORD } from '../support/factories';

const EVERYONE = ['admin', 'installer', 'sales', 'staff', 'signed-out'] as const;
const SIGNED_IN = ['admin', 'installer', 'sales', 'staff'] as const;
const ADMIN = ['admin'] as const;

/** The account layer's rows. */
export const cases: MatrixCase[] = [
  actionCase({ file: 'auth', exportName: 'signUp', action: signUp, access: 'public', allow: EVERYONE, input: () => ({ name: 'Matrix Founder', companyName: 'Matrix Trial Co', email: uniqueEmail('matrix-signup'), password: 'matrix-password-1' }) }),
  // A spent-looking token: the action is open to everyone and answers "link no longer works".
  actionCase({ file: 'auth', exportName: 'confirmSignUp', action: confirmSignUp, access: 'public', allow: EVERYONE, input: () => ({ token: 'B'.repeat(43) }) }),
  actionCase({
    file: 'auth',
    exportName: 'signIn',
    action: signIn,
    access: 'public',
    allow: EVERYONE,
    prepare: (w) => w.member('sales'),
    input: (_w, u) => ({ email: u.email, password: TEST_PASSWORD }),
  }),
  actionCase({ file: 'auth', exportName: 'signOut', action: signOut, access: 'public', allow: EVERYONE, input: () => ({}) }),
  actionCase({ file: 'auth', exportName: 'requestPasswordReset', action: requestPasswordReset, access: 'public', allow: EVERYONE, input: () => ({ email: uniqueEmail('matrix-nobody') }) }),
  actionCase({ file: 'auth', exportName: 'resetPassword', action: resetPassword, access: 'public', allow: EVERYONE, input: () => ({ token: 'A'.repeat(43), password: 'matrix-password-2', confirm: 'matrix-password-2' }) }),
  // Public like the reset link: the mailed token is the authority (an unknown one is a form error, nothing trusted).
  actionCase({ file: 'auth', exportName: 'unlockSignIn', action: unlockSignIn, access: 'public', allow: EVERYONE, input: () => ({ token: 'U'.repeat(43) }) }),
  actionCase({ file: 'auth', exportName: 'acceptInvitation', action: acceptInvitation, access: 'public', allow: EVERYONE, prepare: (w) => w.invitation(), input: (_w, inv) => ({ token: inv.token, name: 'Matrix Invitee', password: 'matrix-password-3' }) }),
  actionCase({
    file: 'auth',
    exportName: 'acceptInvitationWithAccount',
    action: acceptInvitationWithAccount,
    access: 'public',
    allow: EVERYONE,
    prepare: (w) => w.invitation(),
    input: (_w, inv) => ({ token: inv.token, password: 'whatever-password' }),
  }),

  actionCase({ file: 'team', exportName: 'inviteMember', action: inviteMember, access: 'team.manage', allow: ADMIN, input: () => ({ email: uniqueEmail('matrix-invite'), role: 'installer' }) }),
  actionCase({ file: 'team', exportName: 'resendInvitation', action: resendInvitation, access: 'team.manage', allow: ADMIN, prepare: (w) => w.invitation(), input: (_w, inv) => ({ invitationId: inv.id }) }),
  actionCase({ file: 'team', exportName: 'revokeInvitation', action: revokeInvitation, access: 'team.manage', allow: ADMIN, prepare: (w) => w.invitation(), input: (_w, inv) => ({ invitationId: inv.id }) }),
  actionCase({ file: 'team', exportName: 'changeMemberRole', action: changeMemberRole, access: 'team.manage', allow: ADMIN, prepare: (w) => w.member('installer'), input: (_w, m) => ({ membershipId: m.membershipId, role: 'sales' }) }),
  actionCase({ file: 'team', exportName: 'removeMember', action: removeMember, access: 'team.manage', allow: ADMIN, prepare: (w) => w.member('sales'), input: (_w, m) => ({ membershipId: m.membershipId }) }),

  actionCase({
    file: 'security',
    exportName: 'revokeSession',
    action: revokeSession,
    access: 'signed-in',
    allow: SIGNED_IN,
    // Another session (another device) of the same person, revoked by its digest.
    prepare: async (w, role) => (role === 'signed-out' ? 'f'.repeat(64) : hashToken(await signInAs(w.users[role]))),
    input: (_w, digest: string) => ({ session: digest }),
  }),
  actionCase({ file: 'security', exportName: 'signOutEverywhere', action: signOutEverywhere, access: 'signed-in', allow: SIGNED_IN, input: () => ({}) }),
  actionCase({ file: 'security', exportName: 'changePassword', action: changePassword, access: 'signed-in', allow: SIGNED_IN, input: () => ({ current: 'not-the-current-password', password: 'matrix-password-4', confirm: 'matrix-password-4' }) }),
  actionCase({ file: 'security', exportName: 'switchCompany', action: switchCompany, access: 'signed-in', allow: SIGNED_IN, input: (w) => ({ companyId: w.company.id }) }),

  routeCase({ method: 'GET', path: '/api/v1/me', handler: getMe, access: 'signed-in', allow: SIGNED_IN, request: () => ({ url: '/api/v1/me' }) }),
  routeCase({ method: 'GET', path: '/api/v1/team', handler: getTeam, access: 'team.read', allow: ADMIN, request: () => ({ url: '/api/v1/team' }) }),
  routeCase({ method: 'GET', path: '/api/health', handler: getHealth as never, access: 'public', allow: EVERYONE, request: () => ({ url: '/api/health' }) }),
];

/** Company A's admin naming company B's rows by id: always 404, and B's rows stay as they were. */
export const crossCompany: CrossCompanyCase[] = [
  {
    name: 'team#changeMemberRole on another company’s member',
    prepare: (w) => w.member('installer', w.otherCompany),
    run: (w, m: { membershipId: number }) => callRow(changeMemberRole, { membershipId: m.membershipId, role: 'admin' }),
    unchanged: async (_w, m: { membershipId: number }) => expectRole(m.membershipId, 'installer'),
  },
  {
    name: 'team#removeMember on another company’s member',
    prepare: (w) => w.member('sales', w.otherCompany),
    run: (_w, m: { membershipId: number }) => callRow(removeMember, { membershipId: m.membershipId }),
    unchanged: async (_w, m: { membershipId: number }) => expectRole(m.membershipId, 'sales'),
  },
  {
    name: 'team#revokeInvitation on another company’s invitation',
    prepare: (w) => w.invitation(w.otherCompany),
    run: (_w, inv: { id: number }) => callRow(revokeInvitation, { invitationId: inv.id }),
    unchanged: async (_w, inv: { id: number }) => expectPending(inv.id),
  },
  {
    name: 'team#resendInvitation on another company’s invitation',
    prepare: (w) => w.invitation(w.otherCompany),
    run: (_w, inv: { id: number }) => callRow(resendInvitation, { invitationId: inv.id }),
    unchanged: async (_w, inv: { id: number; token: string }) => {
      const row = await models().Invitation.findByPk(inv.id);
      if (row?.tokenHash !== hashToken(inv.token)) throw new Error('the foreign invitation got a new link');
    },
  },
  {
    name: 'security#switchCompany into a company one is not a member of',
    run: (w) => callRow(switchCompany, { companyId: w.otherCompany.id }),
  },
  {
    name: 'security#revokeSession of another person’s session',
    prepare: async (w) => ({ digest: hashToken(await signInAs(w.otherAdmin)) }),
    run: (_w, p: { digest: string }) => callRow(revokeSession, { session: p.digest }),
    unchanged: async (_w, p: { digest: string }) => {
      if (!(await models().Session.findByPk(p.digest))) throw new Error('the other person’s session was deleted');
    },
  },
];

import { callAction } from '../support/next-request';
const callRow = (action: Parameters<typeof callAction>[0], input: Record<string, unknown>) => callAction(action, input);

async function expectRole(membershipId: number, role: string): Promise<void> {
  const row = await models().Membership.findByPk(membershipId);
  if (row?.role !== role) throw new Error(`membership ${membershipId} changed: ${row?.role ?? 'deleted'}`);
}

async function expectPending(invitationId: number): Promise<void> {
  const row = await models().Invitation.findByPk(invitationId);
  if (!row || row.revokedAt || row.acceptedAt) throw new Error(`invitation ${invitationId} changed`);
}
