import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/page-header';
import { Notice } from '@/components/ui/notice';
import { StudyDashboard } from '@/components/dashboard/study-dashboard';
import { requireCompanyUser } from '@/server/auth/guards';
import { can, ROLE_LABELS } from '@/server/auth/permissions';

export const metadata: Metadata = { title: 'Home' };

/** Home: the company's figures and latest studies (SWR from /api/v1/dashboard), and the first-run notices. */
export default async function DashboardPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const ctx = await requireCompanyUser();
  const params = await searchParams;
  return (
    <>
      <PageHeader eyebrow={ctx.company.name} title={`Hello, ${ctx.user.name.split(' ')[0]}`} description={`You are signed in as ${ROLE_LABELS[ctx.role]}.`} />
      {params.welcome && (
        <Notice tone="success" title="Your company account is ready" className="mb-6">
          You are its admin, on a free trial. Invite your installers and sales desk from Team, and add your dishes before the first study.
        </Notice>
      )}
      {params.joined && (
        <Notice tone="success" title={`Welcome to ${ctx.company.name}`} className="mb-6">
          You have joined as {ROLE_LABELS[ctx.role]}.
        </Notice>
      )}
      <StudyDashboard canStudy={can(ctx.role, 'study.write')} />
    </>
  );
}
