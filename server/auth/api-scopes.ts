import type { Permission } from './permissions';

/**
 * What an API key may reach, as data. An admin picks scopes when making a key; a route handler
 * names one permission (server/api/route.ts) and a key passes only if one of its scopes opens that
 * permission here. A permission listed under no scope is never open to a key (the billing,
 * team-management and catalogue-editing permissions stay with signed-in people).
 *
 * Keys never gain more than the permission map gives an admin: every permission below is an
 * admin's too (checked by tests/unit/auth-api-keys.test.ts).
 */
export const API_SCOPES = ['read', 'trade-off', 'studies', 'quotes'] as const;
export type ApiScope = (typeof API_SCOPES)[number];

export const SCOPE_PERMISSIONS: Readonly<Record<ApiScope, readonly Permission[]>> = {
  // The company's own records: customers, sites and the team list.
  read: ['customer.read', 'team.read'],
  'trade-off': ['tradeoff.api'],
  studies: ['study.read'],
  quotes: ['quote.read'],
};

export const SCOPE_LABELS: Readonly<Record<ApiScope, string>> = {
  read: 'Read — customers, sites, team, kept uploads',
  'trade-off': 'Trade-off — POST /api/v1/tradeoff',
  studies: 'Studies — list and read studies, the dashboard',
  quotes: 'Quotes — list and read quotes, their PDFs and the logo',
};

/** True when one of the scopes opens the permission. */
export function scopesAllow(scopes: readonly ApiScope[], permission: Permission): boolean {
  return scopes.some((s) => SCOPE_PERMISSIONS[s].includes(permission));
}

/** The permissions a set of scopes opens (for GET /api/v1/me answered to a key). */
export function permissionsOfScopes(scopes: readonly ApiScope[]): Permission[] {
  return [...new Set(scopes.flatMap((s) => SCOPE_PERMISSIONS[s]))];
}

/** Scopes as stored (comma-separated) back to the list; unknown names are dropped, never widened. */
export function parseScopes(stored: string): ApiScope[] {
  return stored.split(',').filter((s): s is ApiScope => (API_SCOPES as readonly string[]).includes(s));
}
