import type { ReactNode } from 'react';
import { AppShell } from '@/components/app-shell/app-shell';
import { staffNavFor } from '@/components/app-shell/nav';
import { requireRole } from '@/server/auth/guards';

export const dynamic = 'force-dynamic';

/** The platform operator's pages: staff only (everyone else gets a 404). */
export default async function StaffLayout({ children }: { children: ReactNode }) {
  const ctx = await requireRole('staff');
  return (
    <AppShell
      homeHref="/staff"
      navItems={staffNavFor(ctx.role).map(({ label, href }) => ({ label, href }))}
      user={{ name: ctx.user.name, email: ctx.user.email, role: ctx.role, companyName: 'Platform staff', companyId: null, companies: [] }}
    >
      {children}
    </AppShell>
  );
}
