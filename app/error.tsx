'use client';

import { useEffect } from 'react';

export default function RootError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  useEffect(() => {
    console.error(error);
  }, [error]);
  return (
    <main className="mx-auto max-w-xl px-6 py-24">
      <h1 className="text-2xl font-semibold">Something went wrong on our side</h1>
      <p className="mt-3 text-stone-600">
        Nothing you entered has been lost. Try again; if it keeps happening, tell us the reference below.
      </p>
      {error.digest && <p className="mt-2 font-mono text-sm text-stone-500">Reference: {error.digest}</p>}
      <button onClick={reset} className="mt-6 rounded bg-ledger-700 px-4 py-2 text-white hover:bg-ledger-800">
        Try again
      </button>
    </main>
  );
}
