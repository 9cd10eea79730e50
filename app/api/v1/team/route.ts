import { apiRoute } from '@/server/api/route';
import { listMembers } from '@/db/queries/team';
import { listOpenInvitations } from '@/db/queries/invitations';
import { getPlanLimits, seatsInUse } from '@/server/billing/limits';

/** GET /api/v1/team — this company's members, open invitations and seat use (admins). */
export const GET = apiRoute({ permission: 'team.read' }, async ({ ctx }) => {
  const [members, invitations, limits, used] = await Promise.all([
    listMembers(ctx.companyId),
    listOpenInvitations(ctx.companyId),
    getPlanLimits(ctx.companyId),
    seatsInUse(ctx.companyId),
  ]);
  return {
    members: members.map((m) => ({ membershipId: m.membershipId, name: m.name, email: m.email, role: m.role, joinedAt: m.joinedAt })),
    invitations: invitations.map((i) => ({ id: i.id, email: i.email, role: i.role, expiresAt: i.expiresAt, expired: i.expired, lastSentAt: i.lastSentAt })),
    seats: { used, limit: limits.seats, plan: limits.planName },
  };
});
