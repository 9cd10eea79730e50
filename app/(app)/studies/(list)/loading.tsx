/**
 * The studies list's shell while the page loads. It sits in the (list) route group so it wraps the
 * list only: a loading boundary above /studies/[id] would start streaming (status 200 fixed) before
 * that page could call notFound(), and another company's id must answer a real 404.
 */
export default function Loading() {
  return (
    <div aria-busy="true" aria-live="polite">
      <div className="mb-6 h-8 w-40 animate-pulse rounded bg-stone-200" />
      <div className="h-64 animate-pulse rounded-md border border-stone-200 bg-white" />
      <span className="sr-only">Loading…</span>
    </div>
  );
}
