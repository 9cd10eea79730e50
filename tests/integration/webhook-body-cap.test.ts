import { afterAll, describe, expect, it } from 'vitest';
import { closeSequelize } from '@/db/sequelize';
import { POST } from '@/app/api/webhooks/stripe/route';
import { rand, webhookRequest } from './billing-fixtures';

/**
 * The payment webhook reads its body as a stream with a 512 KB cap. A chunked body (no
 * Content-Length) far over the cap must be answered 413 after about the cap has been pulled,
 * not after all of it has been buffered.
 */
afterAll(closeSequelize);

const CAP = 512 * 1024;
const CHUNK = 64 * 1024;
const url = `${process.env.APP_URL ?? 'http://localhost:3100'}/api/webhooks/stripe`;

/** A body of `total` bytes produced chunk by chunk on demand, counting what the reader pulled. */
function lazyBody(total: number): { stream: ReadableStream<Uint8Array>; pulled: () => number } {
  let sent = 0;
  const chunk = new Uint8Array(CHUNK).fill(0x61);
  const stream = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (sent >= total) return controller.close();
      sent += CHUNK;
      controller.enqueue(chunk);
    },
  });
  return { stream, pulled: () => sent };
}

const streamed = (body: ReadableStream<Uint8Array>, headers: Record<string, string> = {}) =>
  new Request(url, { method: 'POST', headers: { 'content-type': 'application/json', 'stripe-signature': 't=1,v1=00', ...headers }, body, duplex: 'half' } as RequestInit);

describe('webhook body cap', () => {
  it('answers 413 to a chunked 50 MB body after pulling little more than the cap', async () => {
    const body = lazyBody(50 * 1024 * 1024);
    const started = Date.now();
    const res = await POST(streamed(body.stream));
    expect(res.status).toBe(413);
    expect(((await res.json()) as { error: { code: string } }).error.code).toBe('too_large');
    // The stream's own read-ahead may have one or two chunks queued beyond the one that crossed the cap.
    expect(body.pulled()).toBeLessThanOrEqual(CAP + 3 * CHUNK);
    expect(Date.now() - started).toBeLessThan(2000);
  });

  it('refuses a declared Content-Length over the cap without reading a byte', async () => {
    const body = lazyBody(CAP + CHUNK);
    const res = await POST(streamed(body.stream, { 'content-length': String(CAP + 1) }));
    expect(res.status).toBe(413);
    expect(body.pulled()).toBeLessThanOrEqual(CHUNK); // a stream may prime one chunk on construction
  });

  it('still takes a signed event just under the cap, sent chunked, byte for byte', async () => {
    // An event type the app does not handle: verified, then acknowledged as ignored (nothing stored).
    const event = { id: `evt_${rand()}`, object: 'event', type: 'customer.created', created: Math.floor(Date.now() / 1000), data: { object: { id: `cus_${rand()}`, description: 'é'.repeat(200_000) } } };
    const signed = webhookRequest(event);
    const bytes = new Uint8Array(await signed.arrayBuffer());
    expect(bytes.byteLength).toBeGreaterThan(CAP - 200_000);
    expect(bytes.byteLength).toBeLessThanOrEqual(CAP);
    // Chunk boundaries that split the two-byte é: the route must join bytes before decoding.
    let at = 0;
    const stream = new ReadableStream<Uint8Array>({
      pull(controller) {
        if (at >= bytes.byteLength) return controller.close();
        controller.enqueue(bytes.slice(at, at + 9_999));
        at += 9_999;
      },
    });
    const res = await POST(streamed(stream, { 'stripe-signature': signed.headers.get('stripe-signature')! }));
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ received: true, ignored: 'customer.created' });
  });
});
