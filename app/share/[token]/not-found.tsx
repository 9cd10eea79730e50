import type { Metadata } from 'next';
import { headers } from 'next/headers';
import { SellerContactCard } from '@/components/quote/seller-contact-card';
import { closedLinkSeller } from '@/server/quotes/shared-quote';
import { SHARE_TOKEN_HEADER } from '@/server/http/share-token-header';
import { NeutralNotFound } from '@/components/ui/neutral-not-found';

// An absolute title: the customer's browser tab names no product they have never heard of.
export const metadata: Metadata = { title: { absolute: 'Link not available' }, robots: { index: false, follow: false } };

/**
 * A customer's link that does not open (still a 404). A link that existed but was revoked or ran
 * out names the company behind it and how to reach it; a token that never existed gets the
 * neutral page, so guessing tells nobody anything about any company.
 */
export default async function SharedLinkNotFound() {
  const token = (await headers()).get(SHARE_TOKEN_HEADER);
  const seller = token ? await closedLinkSeller(token) : null;
  if (!seller) return <NeutralNotFound />;
  return (
    <div className="min-h-screen bg-stone-50">
      <header className="border-b border-stone-200 bg-white">
        <p className="mx-auto max-w-3xl px-5 py-4 text-lg font-semibold text-stone-900">{seller.companyName}</p>
      </header>
      <main className="mx-auto max-w-3xl space-y-6 px-5 py-10">
        <div>
          <h1 className="text-2xl font-semibold tracking-tight text-stone-900">This quote link no longer opens</h1>
          <p className="mt-2 text-stone-700">
            {seller.companyName} has withdrawn this link, or its time ran out. Your quote is not lost: ask {seller.companyName} for a new link.
          </p>
        </div>
        <SellerContactCard contact={seller} title={`Contact ${seller.companyName}`} />
      </main>
    </div>
  );
}
