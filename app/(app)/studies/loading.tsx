/** The studies shell while the page loads. */
export default function Loading() {
  return (
    <div aria-busy="true" aria-live="polite">
      <div className="mb-6 h-8 w-40 animate-pulse rounded bg-stone-200" />
      <div className="h-64 animate-pulse rounded-md border border-stone-200 bg-white" />
      <span className="sr-only">Loading…</span>
    </div>
  );
}
