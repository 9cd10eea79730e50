import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { PageHeader } from '@/components/ui/page-header';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { buttonClasses } from '@/components/ui/button';
import { QuoteStatusBadge } from '@/components/quote/status-badge';
import { OptionCards } from '@/components/quote/option-cards';
import { PriceTable } from '@/components/quote/price-table';
import { QuoteTimeline } from '@/components/quote/timeline';
import { LinksPanel } from '@/components/quote/links-panel';
import { EmailQuoteForm } from '@/components/quote/email-quote-form';
import { DeleteDraftForm, EditDraftForm } from '@/components/quote/edit-draft-form';
import { RefreshWhileOpen } from '@/components/quote/refresh-while-open';
import { CustomerCautions } from '@/components/quote/customer-cautions';
import { day, dayTime } from '@/components/quote/format';
import { requirePermission } from '@/server/auth/guards';
import { can } from '@/server/auth/permissions';
import { AppError } from '@/server/errors';
import { readQuote, type QuoteWithHistory } from '@/server/quotes/read-quote';
import { isDecided, isEditable, isOpen, isPastValidity, isShareable, quoteReference } from '@/server/quotes/status';
import { siteAndServiceInWords } from '@/server/quotes/present';
import { figuresSourceInWords } from '@/server/quotes/climate-words';
import { getCompanyName } from '@/db/queries/branding';

export const metadata: Metadata = { title: 'Quote' };

export default async function QuotePage({ params }: { params: Promise<{ id: string }> }) {
  const ctx = await requirePermission('quote.read');
  const { id } = await params;
  let data: QuoteWithHistory;
  try {
    data = await readQuote(ctx.companyId, id);
  } catch (error) {
    if (error instanceof AppError && error.status === 404) notFound();
    throw error;
  }
  const { quote, links, events } = data;
  const ref = quoteReference(quote.number);
  const canWrite = can(ctx.role, 'quote.write');
  const canShare = can(ctx.role, 'quote.share');
  const shareable = isShareable(quote.status) && !isPastValidity(quote.validUntil);
  const words = siteAndServiceInWords(quote.studySnapshot);
  // The customer's page names the company that chose any override climate; this card shows the same words.
  const sources = figuresSourceInWords(quote.studySnapshot, (await getCompanyName(ctx.companyId)) ?? 'your company');
  const waiting = isOpen(quote.status);
  return (
    <>
      <PageHeader
        eyebrow={`Quote ${ref}`}
        title={quote.title}
        description={
          <>
            {quote.customerName}
            {quote.customerEmail ? ` <${quote.customerEmail}>` : ''} · valid until {day(quote.validUntil)}
            {quote.studyId && (
              <>
                {' · from '}
                <Link className="text-ledger-700 underline" href={`/studies/${quote.studyId}`}>study {quote.studyId}</Link>
              </>
            )}
          </>
        }
        actions={
          <>
            <Link href="/quotes" className={buttonClasses('quiet')}>All quotes</Link>
            <a href={`/api/v1/quotes/${quote.id}/pdf`} className={buttonClasses('secondary')} download>Download PDF</a>
          </>
        }
      />
      {waiting && <RefreshWhileOpen />}
      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="min-w-0 space-y-6">
          <Card aria-labelledby="status-title">
            <CardHeader id="status-title" title={<span className="flex items-center gap-2">Status <QuoteStatusBadge status={quote.status} /></span>} />
            <CardBody className="space-y-2 text-sm text-stone-800">
              {quote.status === 'draft' && <p>Not shared yet. Make a link or e-mail it; either sends it to the customer. A draft can still be changed.</p>}
              {quote.status === 'sent' && <p>Sent {quote.sentAt ? dayTime(quote.sentAt) : ''}; the customer has not opened it yet.</p>}
              {quote.status === 'viewed' && <p>The customer first opened it {quote.firstViewedAt ? dayTime(quote.firstViewedAt) : ''} and has not decided yet.</p>}
              {quote.status === 'accepted' && (
                <Notice tone="success" title={`Accepted by ${quote.decidedByName}`}>
                  {quote.decidedAt ? dayTime(quote.decidedAt) : ''}. Time to book the installation.
                </Notice>
              )}
              {quote.status === 'declined' && (
                <Notice title={`Declined by ${quote.decidedByName}`}>
                  {quote.decidedAt ? dayTime(quote.decidedAt) : ''}
                  {quote.decisionComment ? ` — “${quote.decisionComment}”` : ''}
                </Notice>
              )}
              {quote.status === 'expired' && <p>Its validity ended on {day(quote.validUntil)} before the customer decided. Make a new quote from the study if they are still interested.</p>}
            </CardBody>
          </Card>

          <Card aria-labelledby="offer-title">
            <CardHeader id="offer-title" title="What the customer sees" description={`${words.site} ${words.service}`} />
            <CardBody className="space-y-5">
              <p className="text-sm text-stone-700">
                {sources.rainClimate} {sources.attenuation}
              </p>
              <OptionCards options={quote.options} chosenIndex={quote.chosenOptionIndex} currency={quote.currency} />
              <div>
                <h3 className="mb-2 text-sm font-semibold text-stone-900">Price of {quote.chosenOption.dishName}</h3>
                <PriceTable quote={quote} />
              </div>
              {quote.notes && (
                <div>
                  <h3 className="text-sm font-semibold text-stone-900">Notes</h3>
                  <p className="mt-1 whitespace-pre-line text-sm text-stone-800">{quote.notes}</p>
                </div>
              )}
              <CustomerCautions transmits={quote.studySnapshot.service.transmits} />
            </CardBody>
          </Card>

          {canWrite && isEditable(quote.status) && (
            <Card aria-labelledby="edit-title">
              <CardHeader id="edit-title" title="Edit the draft" actions={<DeleteDraftForm quoteId={quote.id} />} />
              <CardBody>
                <EditDraftForm
                  quoteId={quote.id}
                  defaults={{
                    title: quote.title,
                    customerName: quote.customerName,
                    customerEmail: quote.customerEmail ?? '',
                    validUntil: quote.validUntil,
                    hardwarePrice: quote.hardwarePrice,
                    labourPrice: quote.labourPrice,
                    extrasLabel: quote.extrasLabel ?? '',
                    extrasPrice: quote.extrasPrice,
                    discountAmount: quote.discountAmount,
                    taxRatePercent: String(Number(quote.taxRatePercent)),
                    notes: quote.notes ?? '',
                  }}
                />
              </CardBody>
            </Card>
          )}
        </div>

        <div className="min-w-0 space-y-6">
          <Card aria-labelledby="links-title">
            <CardHeader id="links-title" title="Comparison links" description="Each link opens this quote for the customer, without an account. Only your team sees the view counts." />
            <CardBody>
              {!shareable && !isDecided(quote.status) && (
                <p className="mb-3 text-sm text-stone-700">{quote.status === 'draft' ? 'Set a valid-until date from today on to share this draft.' : 'This quote can no longer be shared.'}</p>
              )}
              <LinksPanel quoteId={quote.id} links={links} canShare={canShare} shareable={shareable} />
            </CardBody>
          </Card>

          {canShare && shareable && (
            <Card aria-labelledby="email-title">
              <CardHeader id="email-title" title="E-mail to the customer" description="Sends the quote with a new link of its own." />
              <CardBody>
                <EmailQuoteForm quoteId={quote.id} customerEmail={quote.customerEmail} />
              </CardBody>
            </Card>
          )}

          <Card aria-labelledby="timeline-title">
            <CardHeader id="timeline-title" title="Timeline" />
            <CardBody>
              <QuoteTimeline events={events} />
            </CardBody>
          </Card>
        </div>
      </div>
    </>
  );
}
