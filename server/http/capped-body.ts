/**
 * A request body read as a stream with a hard cap. `req.text()` buffers everything the client
 * sends before anyone can look at its size, so a chunked upload (no Content-Length) of 50 MB
 * costs 50 MB of memory and the time to receive it. Here reading stops at the first chunk past
 * the cap and the stream is cancelled, so the rest is never pulled.
 *
 * @example
 *   const body = await readBodyCapped(req, 512 * 1024);
 *   if (!body.ok) return new Response(null, { status: 413 });
 *   body.text // the exact bytes as UTF-8, for signature checks
 */
export type CappedBody = { ok: true; bytes: Uint8Array; text: string } | { ok: false; reason: 'too_large'; readBytes: number };

export async function readBodyCapped(req: Request, maxBytes: number): Promise<CappedBody> {
  // A declared length over the cap is refused before a single byte is read.
  const declared = Number(req.headers.get('content-length') ?? NaN);
  if (Number.isFinite(declared) && declared > maxBytes) return { ok: false, reason: 'too_large', readBytes: 0 };
  if (!req.body) return { ok: true, bytes: new Uint8Array(0), text: '' };

  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      // Tell the source to stop; whatever the client still sends is never pulled into memory.
      await reader.cancel('request body over the cap').catch(() => undefined);
      return { ok: false, reason: 'too_large', readBytes: total };
    }
    chunks.push(value);
  }
  const bytes = new Uint8Array(total);
  let at = 0;
  for (const c of chunks) {
    bytes.set(c, at);
    at += c.byteLength;
  }
  return { ok: true, bytes, text: new TextDecoder('utf-8').decode(bytes) };
}
