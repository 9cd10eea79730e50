import type { Metadata } from 'next';
import { headers } from 'next/headers';
import { notFound } from 'next/navigation';
import { OptionCards } from '@/components/quote/option-cards';
import { PriceTable } from '@/components/quote/price-table';
import { CustomerCautions } from '@/components/quote/customer-cautions';
import { CustomerDecisionForm } from '@/components/quote/customer-decision-form';
import { DecisionConfirmation } from '@/components/quote/decision-confirmation';
import { SellerContactCard } from '@/components/quote/seller-contact-card';
import { day, dayTime } from '@/components/quote/format';
import { formatMoney } from '@/server/money-format';
import { Notice } from '@/components/ui/notice';
import { openSharedPage } from '@/server/quotes/shared-quote';
import { requestMetaFrom } from '@/server/auth/request-meta';
import { validateRequest } from '@/server/auth/session';
import { siteAndServiceInWords } from '@/server/quotes/present';
import { figuresSourceInWords } from '@/server/quotes/climate-words';
import { diameterLabel } from '@/server/study-option';
import { effectiveStatus, isDecided, quoteReference } from '@/server/quotes/status';

export const dynamic = 'force-dynamic';

// Personal pages: never in a search index, and the token never leaves in a Referer header.
export const metadata: Metadata = {
  title: { absolute: 'Your quote' },
  robots: { index: false, follow: false, nocache: true, googleBot: { index: false, follow: false } },
  referrer: 'no-referrer',
};

/**
 * The customer's comparison page (no account). The token is the only key: looked up by its
 * sha256; unknown, expired and revoked links all answer 404 (not-found.tsx beside this page names
 * the company of an expired or revoked link, and nothing for an unknown one).
 */
export default async function SharedQuotePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const h = await headers();
  const session = await validateRequest();
  const viewer = session ? { userId: session.user.id, isStaff: session.user.isStaff } : null;
  const shared = await openSharedPage(token, h, requestMetaFrom(h), viewer);
  if (!shared) notFound();
  const { quote, companyName, showLogo, contact, teamView } = shared;
  const ref = quoteReference(quote.number);
  const words = siteAndServiceInWords(quote.studySnapshot);
  const sources = figuresSourceInWords(quote.studySnapshot, companyName);
  const decided = isDecided(quote.status);
  const expired = effectiveStatus(quote.status, quote.validUntil) === 'expired';
  const chosen = quote.chosenOption;
  const total = formatMoney(quote.total, quote.currency);
  return (
    <div className="min-h-screen bg-stone-50">
      <header className="border-b border-stone-200 bg-white">
        <div className="mx-auto flex max-w-5xl flex-wrap items-center justify-between gap-4 px-5 py-4">
          <div className="flex items-center gap-3">
            {showLogo && (
              // A small stored image served from our own route; next/image would add nothing here.
              <img src={`/share/${token}/logo`} alt={`${companyName} logo`} className="h-10 w-auto max-w-[160px] object-contain" />
            )}
            <p className="text-lg font-semibold text-stone-900">{companyName}</p>
          </div>
          <p className="text-sm text-stone-600">
            Quote <span className="font-mono">{ref}</span> · valid until {day(quote.validUntil)}
          </p>
        </div>
      </header>

      <main className="mx-auto max-w-5xl space-y-8 px-5 py-8">
        {teamView && (
          <Notice tone="caution" title="You are viewing as your team">
            You are signed in to {companyName}: this visit is not counted as a customer view, and the quote&apos;s status stays as it is. This is what the customer sees.
          </Notice>
        )}
        <section aria-labelledby="intro-title">
          <h1 id="intro-title" className="text-2xl font-semibold tracking-tight text-stone-900">
            Hello {quote.customerName}, here is your quote
          </h1>
          <p className="mt-2 max-w-3xl text-stone-700">
            We compared {quote.options.length === 1 ? 'one dish size' : `${quote.options.length} dish sizes`} for your site. Rain weakens satellite signals; a bigger dish keeps the signal through heavier rain but costs more. Below is what each size would mean for you in an average year.
          </p>
          <dl className="mt-4 grid max-w-3xl gap-x-6 gap-y-2 text-sm sm:grid-cols-[8rem_1fr]">
            <dt className="font-medium text-stone-600">Site</dt>
            <dd className="text-stone-900">{words.site}</dd>
            <dt className="font-medium text-stone-600">Service</dt>
            <dd className="text-stone-900">{words.service}</dd>
            <dt className="font-medium text-stone-600">Dish direction</dt>
            <dd className="text-stone-900">{words.pointing}</dd>
            <dt className="font-medium text-stone-600">Weather data</dt>
            <dd className="text-stone-900">
              {sources.rainClimate} {sources.attenuation}
            </dd>
          </dl>
        </section>

        {expired && (
          <Notice tone="caution" title="This quote has expired">
            It was valid until {day(quote.validUntil)} and can no longer be accepted. Please ask {companyName} for a new one.
          </Notice>
        )}

        <section aria-labelledby="options-title" className="space-y-3">
          <h2 id="options-title" className="text-lg font-semibold text-stone-900">The options</h2>
          <p className="max-w-3xl text-sm text-stone-700">
            We recommend the {chosen.dishName} ({diameterLabel(chosen.diameterM).words}). “Without signal” means the picture or connection drops out while rain is heaviest; it comes back by itself when the rain eases.
          </p>
          <OptionCards options={quote.options} chosenIndex={quote.chosenOptionIndex} currency={quote.currency} />
        </section>

        <section aria-labelledby="price-title" className="rounded-md border border-stone-200 bg-white px-4 py-4 sm:px-5">
          <h2 id="price-title" className="mb-3 text-lg font-semibold text-stone-900">Price of the recommended option</h2>
          <PriceTable quote={quote} />
          {quote.notes && (
            <div className="mt-4">
              <h3 className="text-sm font-semibold text-stone-900">Notes from {companyName}</h3>
              <p className="mt-1 whitespace-pre-line text-sm text-stone-800">{quote.notes}</p>
            </div>
          )}
          <p className="mt-4 text-sm">
            <a href={`/share/${token}/pdf`} className="font-medium text-ledger-700 underline underline-offset-2" rel="noreferrer">Download this quote as a PDF</a>
          </p>
        </section>

        {decided ? (
          // The answer's confirmation sits where the form was, so a customer on a phone sees it where they tapped.
          <section aria-labelledby="decision-title" className="rounded-md border border-ledger-200 bg-white px-4 py-4 sm:px-5">
            <DecisionConfirmation labelledBy="decision-title">
              {quote.status === 'accepted' ? (
                <Notice tone="success" title={<span id="decision-title">{`You accepted this quote${quote.decidedByName ? `, ${quote.decidedByName}` : ''}`}</span>}>
                  Recorded {quote.decidedAt ? dayTime(quote.decidedAt) : ''}. {companyName} has been told and will be in touch to book the installation.
                </Notice>
              ) : (
                <Notice title={<span id="decision-title">You declined this quote</span>}>
                  Recorded {quote.decidedAt ? dayTime(quote.decidedAt) : ''}{quote.decidedByName ? ` by ${quote.decidedByName}` : ''}. If you change your mind, ask {companyName} for a new quote.
                </Notice>
              )}
            </DecisionConfirmation>
            <SellerContactCard contact={contact} className="mt-4" />
          </section>
        ) : (
          !expired && (
            <section aria-labelledby="decide-title" className="rounded-md border border-ledger-200 bg-white px-4 py-4 sm:px-5">
              <h2 id="decide-title" className="text-lg font-semibold text-stone-900">Your decision</h2>
              <p className="mb-4 mt-1 text-sm text-stone-700">
                Accept to go ahead with the {chosen.dishName} for {total}, or decline. Your answer goes to {companyName} straight away and can be given once.
              </p>
              <CustomerDecisionForm token={token} total={total} companyName={companyName} />
            </section>
          )
        )}

        {!decided && <SellerContactCard contact={contact} />}

        <CustomerCautions transmits={quote.studySnapshot.service.transmits} />
      </main>
      <footer className="border-t border-stone-200 bg-white">
        <p className="mx-auto max-w-5xl px-5 py-4 text-xs text-stone-600">
          Prepared by {companyName} with FadeLedger. Outage figures use the ITU-R propagation methods with the weather data named above. {sources.caution}
        </p>
      </footer>
    </div>
  );
}
