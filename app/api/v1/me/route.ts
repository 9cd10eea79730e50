import { apiRoute } from '@/server/api/route';
import { permissionsOf } from '@/server/auth/permissions';
import { listMembershipsOfUser } from '@/db/queries/team';

/**
 * GET /api/v1/me — who is signed in, in which company, with which role and permissions (the
 * client uses the list only to hide controls; every action checks again on the server).
 */
export const GET = apiRoute({ permission: 'signed-in' }, async ({ ctx }) => ({
  user: { id: ctx.user.id, name: ctx.user.name, email: ctx.user.email },
  company: ctx.company ? { id: ctx.company.id, name: ctx.company.name } : null,
  role: ctx.role,
  permissions: permissionsOf(ctx.role),
  companies: ctx.user.isStaff ? [] : await listMembershipsOfUser(ctx.user.id),
}));
