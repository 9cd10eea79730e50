import 'server-only';
import type { Permission } from './permissions';
import { authorize, type AuthContext, type ContextFor } from './guards';

/**
 * What a wrapped action or route handler demands: a permission from the map, 'signed-in' (any
 * session: one's own sessions, switching company), or 'public' (sign-in, sign-up, reset,
 * invitation links) — public entry points do their own throttling.
 */
export type Access = Permission | 'signed-in' | 'public';

export type ContextForAccess<A extends Access> = A extends 'public' ? null : A extends 'signed-in' ? AuthContext : A extends Permission ? ContextFor<A> : never;

export async function resolveAccess<A extends Access>(access: A): Promise<ContextForAccess<A>> {
  if (access === 'public') return null as ContextForAccess<A>;
  if (access === 'signed-in') return (await authorize(null)) as ContextForAccess<A>;
  return (await authorize(access as Permission)) as ContextForAccess<A>;
}
