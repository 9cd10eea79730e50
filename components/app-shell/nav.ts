import { can, type Permission, type Role } from '@/server/auth/permissions';

/**
 * The app's navigation as data. An item shows only to roles holding its permission (hiding is
 * a courtesy; every page and action checks again on the server). Add or move items here.
 */
export type NavItem = { label: string; href: string; permission: Permission; section: 'work' | 'setup' | 'account' };

export const NAV: readonly NavItem[] = [
  { label: 'Studies', href: '/studies', permission: 'study.read', section: 'work' },
  { label: 'Quotes', href: '/quotes', permission: 'quote.read', section: 'work' },
  { label: 'Customers', href: '/customers', permission: 'customer.read', section: 'work' },
  { label: 'Sites', href: '/sites', permission: 'customer.read', section: 'work' },
  { label: 'Campaigns', href: '/campaigns', permission: 'study.write', section: 'work' },
  { label: 'Dishes', href: '/dishes', permission: 'study.read', section: 'setup' },
  { label: 'Climate', href: '/climate', permission: 'study.read', section: 'setup' },
  { label: 'Services', href: '/services', permission: 'study.read', section: 'setup' },
  { label: 'Team', href: '/settings/team', permission: 'team.read', section: 'account' },
  { label: 'Billing', href: '/settings/billing', permission: 'billing.manage', section: 'account' },
];

/** Settings pages, shown as tabs on the settings screens. 'signed-in' items show to everyone. */
export const SETTINGS_NAV: readonly { label: string; href: string; permission: Permission | 'signed-in' }[] = [
  { label: 'Team', href: '/settings/team', permission: 'team.read' },
  { label: 'Billing', href: '/settings/billing', permission: 'billing.manage' },
  { label: 'Branding', href: '/settings/branding', permission: 'branding.manage' },
  { label: 'API keys', href: '/settings/api-keys', permission: 'apikey.manage' },
  { label: 'Webhooks', href: '/settings/webhooks', permission: 'webhook.manage' },
  { label: 'Audit log', href: '/settings/audit', permission: 'audit.read' },
  { label: 'Your security', href: '/settings/security', permission: 'signed-in' },
];

export function navFor(role: Role): NavItem[] {
  return NAV.filter((item) => can(role, item.permission));
}

export function settingsNavFor(role: Role) {
  return SETTINGS_NAV.filter((item) => item.permission === 'signed-in' || can(role, item.permission));
}

/** True when the path is the item's page or below it. */
export function isActive(pathname: string, href: string): boolean {
  return pathname === href || pathname.startsWith(href + '/');
}

/** The staff area's navigation (platform operator). */
export const STAFF_NAV: readonly NavItem[] = [
  { label: 'Staff home', href: '/staff', permission: 'accounts.read', section: 'work' },
  { label: 'Accounts', href: '/accounts', permission: 'accounts.read', section: 'work' },
  { label: 'Plans', href: '/plans', permission: 'plans.manage', section: 'setup' },
];

export function staffNavFor(role: Role): NavItem[] {
  return STAFF_NAV.filter((item) => can(role, item.permission));
}
