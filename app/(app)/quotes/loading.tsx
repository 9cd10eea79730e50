/** The quotes pages' shell while the server answers. */
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
