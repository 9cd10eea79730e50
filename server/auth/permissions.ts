/**
 * Who may do what, as data. Every server action and route handler names one permission and
 * the guards look it up here; the UI reads the same map only to hide what a role cannot use.
 *
 * Roles: admin, installer and sales hold a membership in one company; staff is the platform
 * operator and works across companies on the staff pages only (no company rows).
 */
export const ROLES = ['admin', 'installer', 'sales', 'staff'] as const;
export type Role = (typeof ROLES)[number];
export type CompanyRole = Exclude<Role, 'staff'>;

const ADMIN = ['admin'] as const;
const MAKERS = ['admin', 'installer'] as const;
const COMPANY = ['admin', 'installer', 'sales'] as const;
const STAFF = ['staff'] as const;

export const PERMISSIONS = {
  'study.read': COMPANY,
  'study.write': MAKERS,
  'quote.read': COMPANY,
  'quote.write': MAKERS,
  // Comparison links (create, revoke) and e-mailing quotes to customers.
  'quote.share': COMPANY,
  'customer.read': COMPANY,
  // Customers and their sites.
  'customer.write': MAKERS,
  'service.write': ['admin', 'installer'],
  'catalogue.write': ADMIN,
  'climate.write': ADMIN,
  'upload.create': MAKERS,
  'tradeoff.api': MAKERS,
  'team.read': ADMIN,
  'team.manage': ADMIN,
  'billing.manage': ADMIN,
  'branding.manage': ADMIN,
  'audit.read': ADMIN,
  // Create, scope and revoke the company's API keys (settings/api-keys).
  'apikey.manage': ADMIN,
  // Register and remove the company's outbound webhook endpoints, send test events (settings/webhooks).
  'webhook.manage': ADMIN,
  'plans.manage': STAFF,
  'accounts.read': STAFF,
  // Operator actions on a company's account: extend a trial, change its plan (each with a reason, audited).
  'accounts.manage': STAFF,
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof PERMISSIONS;
export const PERMISSION_NAMES = Object.keys(PERMISSIONS) as Permission[];

/** True when the role holds the permission. Unknown roles hold nothing. */
export function can(role: Role | null | undefined, permission: Permission): boolean {
  if (!role) return false;
  return (PERMISSIONS[permission] as readonly Role[]).includes(role);
}

/** The permissions a role holds, e.g. for the client to hide controls. */
export function permissionsOf(role: Role): Permission[] {
  return PERMISSION_NAMES.filter((p) => can(role, p));
}

/** Plain-English names for the roles, shown in the team page and e-mails. */
export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Admin',
  installer: 'Installer',
  sales: 'Sales',
  staff: 'FadeLedger staff',
};

export const ROLE_DESCRIPTIONS: Record<CompanyRole, string> = {
  admin: 'Manages the team, plan and billing, the dish catalogue and climate profiles; can do everything an installer can.',
  installer: 'Creates customer sites, runs trade-off studies and issues quotes.',
  sales: 'Reads studies and quotes, shares comparison links and e-mails quotes to customers.',
};
