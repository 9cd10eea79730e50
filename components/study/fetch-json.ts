'use client';

/** SWR fetcher for our JSON routes: the body on 200, else an Error carrying the API's message. */
export async function fetchJson<T>(url: string): Promise<T> {
  const res = await fetch(url, { headers: { accept: 'application/json' }, credentials: 'same-origin' });
  if (!res.ok) {
    let message = `The server answered ${res.status}.`;
    try {
      message = ((await res.json()) as { error?: { message?: string } }).error?.message ?? message;
    } catch {
      // not JSON: keep the status line
    }
    throw new Error(message);
  }
  return (await res.json()) as T;
}
