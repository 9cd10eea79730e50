import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/page-header';
import { LinkButton } from '@/components/ui/button';
import { Card, CardBody } from '@/components/ui/card';
import { StudiesList } from '@/components/study/studies-list';
import { requirePermission } from '@/server/auth/guards';
import { can } from '@/server/auth/permissions';

export const metadata: Metadata = { title: 'Studies' };

export default async function StudiesPage() {
  const ctx = await requirePermission('study.read');
  return (
    <>
      <PageHeader
        title="Studies"
        description="Each study compares the dishes of your catalogue for one site and one satellite service: link budget, fade margin, outage minutes and price."
        actions={can(ctx.role, 'study.write') ? <LinkButton href="/studies/new">New study</LinkButton> : undefined}
      />
      <Card>
        <CardBody>
          <StudiesList />
        </CardBody>
      </Card>
    </>
  );
}
