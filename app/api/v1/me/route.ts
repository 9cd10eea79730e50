import { apiRoute } from '@/server/api/route';
import { permissionsOf } from '@/server/auth/permissions';
import { permissionsOfScopes } from '@/server/auth/api-scopes';
import { listMembershipsOfUser } from '@/db/queries/team';

/**
 * GET /api/v1/me — who is calling, in which company, with which role and permissions (the
 * client uses the list only to hide controls; every action checks again on the server). Called
 * with an API key: the key (name, prefix, scopes) instead of a person, and the permissions its
 * scopes open — an integrator's way to check a key before using it.
 */
export const GET = apiRoute({ permission: 'signed-in' }, async ({ ctx }) => {
  const company = ctx.company ? { id: ctx.company.id, name: ctx.company.name } : null;
  if (ctx.apiKey) {
    const { id, name, prefix, scopes } = ctx.apiKey;
    return { user: null, apiKey: { id, name, prefix, scopes }, company, role: null, permissions: permissionsOfScopes(scopes), companies: [] };
  }
  return {
    user: { id: ctx.user.id, name: ctx.user.name, email: ctx.user.email },
    apiKey: null,
    company,
    role: ctx.role,
    permissions: permissionsOf(ctx.role),
    companies: ctx.user.isStaff ? [] : await listMembershipsOfUser(ctx.user.id),
  };
});
