import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/page-header';
import { LinkButton } from '@/components/ui/button';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { CustomersList } from '@/components/sites/customers-list';
import { CustomerForm } from '@/components/sites/customer-form';
import { requirePermission } from '@/server/auth/guards';
import { can } from '@/server/auth/permissions';

export const metadata: Metadata = { title: 'Customers' };

export default async function CustomersPage() {
  const ctx = await requirePermission('customer.read');
  const write = can(ctx.role, 'customer.write');
  return (
    <>
      <PageHeader
        title="Customers"
        description="The people and businesses you install for. Their sites are under Sites."
        actions={
          <LinkButton href="/sites" variant="secondary">
            Sites
          </LinkButton>
        }
      />
      <div className="space-y-6">
        <Card>
          <CardBody>
            <CustomersList canEdit={write} />
          </CardBody>
        </Card>
        {write && (
          <Card aria-labelledby="add-customer-title">
            <CardHeader id="add-customer-title" title="Add a customer" />
            <CardBody>
              <CustomerForm />
            </CardBody>
          </Card>
        )}
      </div>
    </>
  );
}
