import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/page-header';
import { LinkButton } from '@/components/ui/button';
import { Card, CardBody } from '@/components/ui/card';
import { QuotesList } from '@/components/quote/quotes-list';
import { requirePermission } from '@/server/auth/guards';
import { can } from '@/server/auth/permissions';

export const metadata: Metadata = { title: 'Quotes' };

export default async function QuotesPage() {
  const ctx = await requirePermission('quote.read');
  return (
    <>
      <PageHeader
        title="Quotes"
        description="Each quote offers one dish from a study, with your prices, to one customer. Share it as a comparison link or by e-mail; the customer accepts or declines on their page."
        actions={can(ctx.role, 'quote.write') ? <LinkButton href="/studies" variant="secondary">Quote from a study</LinkButton> : undefined}
      />
      <Card>
        <CardBody>
          <QuotesList canCreate={can(ctx.role, 'quote.write')} />
        </CardBody>
      </Card>
    </>
  );
}
