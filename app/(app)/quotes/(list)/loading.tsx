/**
 * The quotes list's shell while the page loads. It sits in the (list) route group so it wraps the
 * list only: a loading boundary above /quotes/[id] would start streaming (status 200 fixed) before
 * that page could call notFound(), and another company's id must answer a real 404.
 */
export default function QuotesLoading() {
  return (
    <div aria-busy="true" aria-live="polite">
      <div className="mb-6 h-8 w-48 animate-pulse rounded bg-stone-200" />
      <div className="rounded-md border border-stone-200 bg-white p-5">
        <p className="text-sm text-stone-600">Loading quotes…</p>
      </div>
    </div>
  );
}
