'use server';

import { revalidatePath } from 'next/cache';
import { redirect } from 'next/navigation';
import { safeAction } from './safe-action';
import { changeRoleSchema, invitationIdSchema, inviteSchema, memberIdSchema } from '@/server/auth/schemas';
import * as invitations from '@/server/auth/invitations';
import * as team from '@/server/auth/team';
import { getRequestMeta } from '@/server/auth/request-meta';
import { ROLE_LABELS } from '@/server/auth/permissions';

const TEAM_PAGE = '/settings/team';

export const inviteMember = safeAction({ schema: inviteSchema, permission: 'team.manage' }, async (input, ctx) => {
  const result = await invitations.inviteMember(ctx, input, await getRequestMeta());
  revalidatePath(TEAM_PAGE);
  return { data: result, message: `Invitation sent to ${input.email} as ${ROLE_LABELS[input.role]}.` };
});

export const resendInvitation = safeAction({ schema: invitationIdSchema, permission: 'team.manage' }, async (input, ctx) => {
  await invitations.resendInvitation(ctx, input.invitationId, await getRequestMeta());
  revalidatePath(TEAM_PAGE);
  return { message: 'Invitation sent again with a new link; the earlier link no longer works.' };
});

export const revokeInvitation = safeAction({ schema: invitationIdSchema, permission: 'team.manage' }, async (input, ctx) => {
  const { email } = await invitations.revokeInvitation(ctx, input.invitationId, await getRequestMeta());
  revalidatePath(TEAM_PAGE);
  return { message: `Invitation to ${email} withdrawn; its seat is free.` };
});

export const changeMemberRole = safeAction({ schema: changeRoleSchema, permission: 'team.manage' }, async (input, ctx) => {
  const { name, changed } = await team.changeMemberRole(ctx, input.membershipId, input.role, await getRequestMeta());
  revalidatePath(TEAM_PAGE);
  return { message: changed ? `${name} is now ${ROLE_LABELS[input.role]}.` : `${name} already is ${ROLE_LABELS[input.role]}.` };
});

export const removeMember = safeAction({ schema: memberIdSchema, permission: 'team.manage' }, async (input, ctx) => {
  const { name, self } = await team.removeMember(ctx, input.membershipId, await getRequestMeta());
  if (self) redirect('/sign-in?left=1');
  revalidatePath(TEAM_PAGE);
  return { message: `${name} was removed from the team; their seat is free.` };
});
