import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { PageHeader } from '@/components/ui/page-header';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { LinkButton } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { NewQuoteForm } from '@/components/quote/new-quote-form';
import { requirePermission } from '@/server/auth/guards';
import { getStudy } from '@/db/queries/studies';
import { getCustomer } from '@/db/queries/customers';
import { quoteOptionsOf } from '@/server/quotes/options-of-study';
import { addDays, utcDay } from '@/server/quotes/status';
import { parseId } from '@/server/quotes/read-quote';
import { QUOTE_VALIDITY_DAYS } from '@/server/validation/quote';

export const metadata: Metadata = { title: 'New quote' };

export default async function NewQuotePage({ searchParams }: { searchParams: Promise<{ study?: string; option?: string }> }) {
  const ctx = await requirePermission('quote.write');
  const sp = await searchParams;
  const studyId = parseId(sp.study);
  if (!studyId) {
    return (
      <>
        <PageHeader title="New quote" />
        <Notice title="Start from a study">
          A quote offers one dish of a trade-off study. Open a <Link className="font-medium text-ledger-700 underline" href="/studies">study</Link> and choose “Quote” on the dish you recommend.
        </Notice>
      </>
    );
  }
  const study = await getStudy(ctx.companyId, studyId);
  if (!study) notFound();
  const options = quoteOptionsOf(study);
  const customer = study.customerId ? await getCustomer(ctx.companyId, study.customerId) : null;
  const asked = sp.option !== undefined && /^\d{1,3}$/.test(sp.option) ? Number(sp.option) : null;
  const fallback = study.result.tradeoff.recommendation.smallestMeetingTargetIndex ?? options.find((o) => o.closes)?.index ?? 0;
  const initial = asked !== null && options.some((o) => o.index === asked && o.closes) ? asked : fallback;
  const noneClose = !options.some((o) => o.closes);
  return (
    <>
      <PageHeader
        eyebrow={`From study ${study.id}`}
        title="New quote"
        description={`${study.customerName} · ${study.siteName} · ${study.serviceName}`}
        actions={<LinkButton href={`/studies/${study.id}`} variant="quiet">Back to the study</LinkButton>}
      />
      {noneClose ? (
        <Notice tone="problem" title="No dish of this study receives the service">
          Every dish is too small for this service even in clear sky, so there is nothing to quote. Re-run the study with larger dishes.
        </Notice>
      ) : (
        <Card aria-labelledby="new-quote-title">
          <CardHeader id="new-quote-title" title="Option, customer and prices" description="The figures are copied from the study as it is now; the quote keeps them even if the study, catalogue or engine change later." />
          <CardBody>
            <NewQuoteForm
              studyId={study.id}
              options={options}
              initialOption={initial}
              defaults={{
                title: '',
                customerName: study.customerName,
                customerEmail: customer?.email ?? '',
                validUntil: addDays(utcDay(), QUOTE_VALIDITY_DAYS.default),
                extrasLabel: '',
                extrasPrice: '',
                discountAmount: '',
                taxRatePercent: '0',
                notes: '',
              }}
            />
          </CardBody>
        </Card>
      )}
    </>
  );
}
