import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/page-header';
import { LinkButton } from '@/components/ui/button';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { SitesList } from '@/components/sites/sites-list';
import { SiteForm } from '@/components/sites/site-form';
import { requirePermission } from '@/server/auth/guards';
import { can } from '@/server/auth/permissions';
import { listCustomerOptions } from '@/db/queries/customers';

export const metadata: Metadata = { title: 'Sites' };

export default async function SitesPage() {
  const ctx = await requirePermission('customer.read');
  const write = can(ctx.role, 'customer.write');
  const customers = write ? await listCustomerOptions(ctx.companyId) : [];
  return (
    <>
      <PageHeader
        title="Sites"
        description="Your customers' sites: where a dish goes, with coordinates and altitude."
        actions={
          <LinkButton href="/customers" variant="secondary">
            Customers
          </LinkButton>
        }
      />
      <div className="space-y-6">
        <Card>
          <CardBody>
            <SitesList canStudy={can(ctx.role, 'study.write')} canEdit={write} customers={customers} />
          </CardBody>
        </Card>
        {write && (
          <Card aria-labelledby="add-site-title">
            <CardHeader id="add-site-title" title="Add a site" description={customers.length ? undefined : 'Add the customer first, under Customers.'} />
            <CardBody>
              <SiteForm customers={customers} />
            </CardBody>
          </Card>
        )}
      </div>
    </>
  );
}
