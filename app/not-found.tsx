import Link from 'next/link';

export default function NotFound() {
  return (
    <main className="mx-auto max-w-xl px-6 py-24">
      <p className="font-mono text-sm text-ledger-700">404</p>
      <h1 className="mt-2 text-2xl font-semibold">We could not find that page</h1>
      <p className="mt-3 text-stone-600">It may have moved, or the link may have expired or been withdrawn.</p>
      <Link href="/" className="mt-6 inline-block text-ledger-700 underline">Back to FadeLedger</Link>
    </main>
  );
}
