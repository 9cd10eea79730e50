import type { ReactNode } from 'react';
import { AppShell } from '@/components/app-shell/app-shell';
import { requireCompanyUser } from '@/server/auth/guards';
import { listMembershipsOfUser } from '@/db/queries/team';
import { BillingBanner } from '@/components/billing/billing-banner';
import { can } from '@/server/auth/permissions';

export const dynamic = 'force-dynamic';

/** Every company page: signed in (else sign-in), a member of a company (staff go to /staff). */
export default async function AppLayout({ children }: { children: ReactNode }) {
  const ctx = await requireCompanyUser();
  const companies = await listMembershipsOfUser(ctx.user.id);
  return (
    <AppShell user={{ name: ctx.user.name, email: ctx.user.email, role: ctx.role, companyName: ctx.company.name, companyId: ctx.companyId, companies }}>
      <BillingBanner companyId={ctx.companyId} canManage={can(ctx.role, 'billing.manage')} />
      {children}
    </AppShell>
  );
}
