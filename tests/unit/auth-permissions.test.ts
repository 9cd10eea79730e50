import { describe, expect, it } from 'vitest';
import { can, PERMISSIONS, PERMISSION_NAMES, permissionsOf, ROLES, type Permission, type Role } from '@/server/auth/permissions';
import { navFor, settingsNavFor, STAFF_NAV } from '@/components/app-shell/nav';

/**
 * The permission map against the roles table of ../shared/docs/product.md and the contract in
 * notes/contracts.md, written out here by hand so a change to the map has to be a decision.
 */
const EXPECTED: Record<Role, Permission[]> = {
  admin: ['study.read', 'study.write', 'quote.read', 'quote.write', 'quote.share', 'customer.read', 'customer.write', 'service.write', 'catalogue.write', 'climate.write', 'upload.create', 'tradeoff.api', 'team.read', 'team.manage', 'billing.manage', 'branding.manage', 'audit.read', 'apikey.manage', 'webhook.manage'],
  installer: ['study.read', 'study.write', 'quote.read', 'quote.write', 'quote.share', 'customer.read', 'customer.write', 'service.write', 'upload.create', 'tradeoff.api'],
  sales: ['study.read', 'quote.read', 'quote.share', 'customer.read'],
  staff: ['plans.manage', 'accounts.read', 'accounts.manage'],
};

describe('permission map', () => {
  it.each(ROLES)('%s holds exactly its listed permissions', (role) => {
    expect(permissionsOf(role).sort()).toEqual([...EXPECTED[role]].sort());
  });

  it('every permission belongs to at least one role, and only to known roles', () => {
    for (const p of PERMISSION_NAMES) {
      expect(PERMISSIONS[p].length, p).toBeGreaterThan(0);
      for (const r of PERMISSIONS[p]) expect(ROLES).toContain(r);
    }
  });

  it('staff hold no company permission and company roles hold no staff permission', () => {
    for (const p of PERMISSION_NAMES) {
      const roles = PERMISSIONS[p] as readonly Role[];
      if (roles.includes('staff')) expect(roles).toEqual(['staff']);
    }
  });

  it('sales may share and e-mail quotes but not write them', () => {
    expect(can('sales', 'quote.share')).toBe(true);
    expect(can('sales', 'quote.write')).toBe(false);
    expect(can('sales', 'team.manage')).toBe(false);
  });

  describe('edge cases', () => {
    it('no role, or an unknown role, holds nothing', () => {
      expect(can(null, 'study.read')).toBe(false);
      expect(can(undefined, 'study.read')).toBe(false);
      expect(can('owner' as Role, 'study.read')).toBe(false);
    });
  });
});

describe('navigation follows the map', () => {
  it('installers and sales see no Team or Billing; admins see both; staff see no company nav', () => {
    expect(navFor('installer').map((i) => i.label)).not.toContain('Team');
    expect(navFor('sales').map((i) => i.label)).toEqual(['Studies', 'Quotes', 'Customers', 'Sites', 'Dishes', 'Climate', 'Services']);
    expect(navFor('admin').map((i) => i.label)).toEqual(expect.arrayContaining(['Team', 'Billing']));
    expect(navFor('staff')).toEqual([]);
    expect(settingsNavFor('sales').map((i) => i.label)).toEqual(['Your security']);
    expect(STAFF_NAV.every((i) => can('staff', i.permission))).toBe(true);
  });
});
