import type { SellerContact } from '@/server/quotes/seller-contact';

/** How the customer reaches the seller: on the quote page and on a link that no longer opens. */
export function SellerContactCard({ contact, className = '', title = 'Questions about this quote?' }: { contact: SellerContact; className?: string; title?: string }) {
  const { companyName, personName, email, phone } = contact;
  return (
    <section aria-labelledby="seller-contact-title" className={`rounded-md border border-stone-200 bg-white px-4 py-4 sm:px-5 ${className}`}>
      <h2 id="seller-contact-title" className="text-base font-semibold text-stone-900">{title}</h2>
      <p className="mt-1 text-sm text-stone-700">
        {email || phone ? <>Get in touch with {personName ? `${personName} at ${companyName}` : companyName}:</> : <>Please contact {companyName} directly.</>}
      </p>
      {(email || phone) && (
        <dl className="mt-2 grid gap-x-4 gap-y-1 text-sm sm:grid-cols-[6rem_1fr]">
          {email && (
            <>
              <dt className="font-medium text-stone-600">E-mail</dt>
              <dd>
                <a className="break-all font-medium text-ledger-700 underline underline-offset-2" href={`mailto:${email}`}>{email}</a>
              </dd>
            </>
          )}
          {phone && (
            <>
              <dt className="font-medium text-stone-600">Phone</dt>
              <dd>
                <a className="font-medium text-ledger-700 underline underline-offset-2" href={`tel:${phone.replace(/[^\d+]/g, '')}`}>{phone}</a>
              </dd>
            </>
          )}
        </dl>
      )}
    </section>
  );
}
