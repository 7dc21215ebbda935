import { createHmac } from 'node:crypto';

/**
 * The `Stripe-Signature` header Stripe sends with a webhook: `t=<unix seconds>,v1=<hex
 * HMAC-SHA256 of "<t>.<payload>" keyed with the endpoint's signing secret>`. The receiver
 * recomputes it over the raw body (stripe.webhooks.constructEvent does exactly this).
 */
export function signatureHeader(payload: string, secret: string, timestamp: number): string {
  const v1 = createHmac('sha256', secret).update(`${timestamp}.${payload}`, 'utf8').digest('hex');
  return `t=${timestamp},v1=${v1}`;
}
