import { NextResponse } from 'next/server';
import { readBodyCapped } from '@/server/http/capped-body';
import { isHandledEventType, receiveWebhookEvent, verifyWebhook, WebhookSignatureError } from '@/server/billing/webhook';

// The provider's servers call this, not a signed-in person: the signature is the authentication.
export const dynamic = 'force-dynamic';
export const runtime = 'nodejs';

/** Stripe events are far smaller; anything bigger is not one of them. */
const MAX_BODY_BYTES = 512 * 1024;

const json = (body: unknown, status: number) => NextResponse.json(body, { status, headers: { 'Cache-Control': 'no-store' } });

export async function POST(req: Request): Promise<Response> {
  // Streamed with a hard cap: a chunked body without Content-Length is cut off at the cap, not
  // buffered whole first. The signature covers the exact bytes, so the raw text is what we keep.
  // (proxy.ts leaves this path alone: a proxy in front would make Next buffer the body itself.)
  const body = await readBodyCapped(req, MAX_BODY_BYTES);
  if (!body.ok) return json({ error: { code: 'too_large', message: 'Payload too large.' } }, 413);
  const raw = body.text;

  let event;
  try {
    event = verifyWebhook(raw, req.headers.get('stripe-signature'));
  } catch (error) {
    if (error instanceof WebhookSignatureError) return json({ error: { code: error.code, message: error.message } }, 400);
    throw error;
  }
  if (!isHandledEventType(event.type)) return json({ received: true, ignored: event.type }, 200);

  try {
    const result = await receiveWebhookEvent(event);
    return json({ received: true, outcome: result.outcome }, 200);
  } catch (error) {
    // A 5xx makes the provider deliver again later; the event was not applied.
    console.error(`[webhooks/stripe] ${event.type} ${event.id} failed:`, error instanceof Error ? error.message : error);
    return json({ error: { code: 'internal', message: 'The event could not be applied; it will be retried.' } }, 500);
  }
}
