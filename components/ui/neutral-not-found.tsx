/**
 * The plain "not found" answer: no product or company name, no links. People reach a 404 from a
 * customer link they were sent (they may never have heard of us) as well as from inside the app.
 */
export function NeutralNotFound() {
  return (
    <main className="mx-auto max-w-xl px-6 py-24">
      <p className="font-mono text-sm text-stone-600">404</p>
      <h1 className="mt-2 text-2xl font-semibold text-stone-900">We could not find that page</h1>
      <p className="mt-3 text-stone-700">Check the address for typing mistakes. If someone sent you this link, ask them for a new one.</p>
    </main>
  );
}
