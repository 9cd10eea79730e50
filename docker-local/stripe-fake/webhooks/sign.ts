// Stripe's webhook signature scheme: header `t=<unix seconds>,v1=<hex HMAC-SHA256>` where the
// HMAC key is the whole endpoint secret (including `whsec_`) and the message is `${t}.${payload}`.
// This is what stripe.webhooks.constructEvent verifies.
import { createHmac } from 'node:crypto';

export function signatureHeader(payload: string, secret: string, timestamp: number): string {
  const v1 = createHmac('sha256', secret).update(`${timestamp}.${payload}`, 'utf8').digest('hex');
  return `t=${timestamp},v1=${v1}`;
}
