import { quoteCautions } from '@/server/quotes/cautions';

/** The cautions every quote carries (product.md), worded for the customer. */
export function CustomerCautions({ transmits, headingId = 'cautions-title' }: { transmits: boolean; headingId?: string }) {
  return (
    <section aria-labelledby={headingId} className="rounded-md border border-amber-300 bg-amber-50 px-4 py-4 text-sm text-amber-950 sm:px-5">
      <h2 id={headingId} className="text-base font-semibold">Please read</h2>
      <ul className="mt-2 space-y-2">
        {quoteCautions({ transmits }).map((c) => (
          <li key={c.title}>
            <span className="font-semibold">{c.title}.</span> {c.body}
          </li>
        ))}
      </ul>
    </section>
  );
}
