import { createServer, type IncomingMessage, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import Stripe from 'stripe';
import { FakeStripe } from './fake-stripe';
import { TEST_CARDS } from './payment-page';

const SECRET = 'whsec_fake_stripe_spec';

/** A webhook receiver that verifies each event exactly as our server does. */
class Receiver {
  readonly events: Stripe.Event[] = [];
  readonly refused: string[] = [];
  /** Answer this status to the next N deliveries. */
  failNext: { count: number; status: number } = { count: 0, status: 500 };
  server!: Server;

  async start(): Promise<string> {
    this.server = createServer((req: IncomingMessage, res) => {
      const chunks: Buffer[] = [];
      req.on('data', (c: Buffer) => chunks.push(c));
      req.on('end', () => {
        if (this.failNext.count > 0) {
          this.failNext.count--;
          res.writeHead(this.failNext.status).end();
          return;
        }
        try {
          const event = Stripe.webhooks.constructEvent(
            Buffer.concat(chunks),
            String(req.headers['stripe-signature']),
            SECRET,
          );
          this.events.push(event);
          res.writeHead(200).end('{}');
        } catch (e) {
          this.refused.push(e instanceof Error ? e.message : String(e));
          res.writeHead(400).end();
        }
      });
    });
    await new Promise<void>((r) => this.server.listen(0, '127.0.0.1', () => r()));
    return `http://127.0.0.1:${(this.server.address() as AddressInfo).port}/hook`;
  }

  stop(): Promise<void> {
    return new Promise((r) => this.server.close(() => r()));
  }
}

function sdk(fake: FakeStripe, maxNetworkRetries = 0): Stripe {
  return new Stripe('sk_test_spec', {
    host: '127.0.0.1',
    port: fake.port,
    protocol: 'http',
    maxNetworkRetries,
    telemetry: false,
  });
}

const sessionParams = (amount = 12_345): Stripe.Checkout.SessionCreateParams => ({
  mode: 'payment',
  line_items: [
    {
      quantity: 1,
      price_data: { currency: 'usd', unit_amount: amount, product_data: { name: 'Balance' } },
    },
  ],
  success_url: 'http://127.0.0.1:1/paid?session={CHECKOUT_SESSION_ID}',
  cancel_url: 'http://127.0.0.1:1/',
  client_reference_id: 'op-1',
  metadata: { opId: 'op-1' },
  payment_intent_data: { metadata: { opId: 'op-1' } },
});

async function payOnPage(url: string, card: string): Promise<Response> {
  return fetch(url, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ card, exp: '12/40', cvc: '123', name: 'Card Holder' }).toString(),
  });
}

describe('the fake Stripe, through the real stripe SDK', () => {
  let receiver: Receiver;
  let fake: FakeStripe;
  let stripe: Stripe;

  beforeEach(async () => {
    receiver = new Receiver();
    const hook = await receiver.start();
    fake = await new FakeStripe({
      webhookUrl: hook,
      webhookSecret: SECRET,
      duplicateRate: 0,
      retryDelaysMs: [20, 20, 20],
    }).start();
    stripe = sdk(fake);
  });
  afterEach(async () => {
    await fake.stop();
    await receiver.stop();
  });

  it('creates and retrieves a Checkout Session shaped like Stripe’s', async () => {
    const s = await stripe.checkout.sessions.create(sessionParams());
    expect(s.id).toMatch(/^cs_test_/);
    expect(s).toMatchObject({
      object: 'checkout.session',
      amount_total: 12_345,
      currency: 'usd',
      status: 'open',
      payment_status: 'unpaid',
      metadata: { opId: 'op-1' },
    });
    expect(s.url).toBe(`${fake.url}/pay/${s.id}`);
    const again = await stripe.checkout.sessions.retrieve(s.id);
    expect(again.id).toBe(s.id);
    await expect(stripe.checkout.sessions.retrieve('cs_test_nothing')).rejects.toMatchObject({
      type: 'StripeInvalidRequestError',
      code: 'resource_missing',
      statusCode: 404,
    });
  });

  it('replays an Idempotency-Key with the same body, refuses it with another', async () => {
    const a = await stripe.checkout.sessions.create(sessionParams(), { idempotencyKey: 'k-1' });
    const b = await stripe.checkout.sessions.create(sessionParams(), { idempotencyKey: 'k-1' });
    expect(b.id).toBe(a.id);
    expect(fake.sessions.size).toBe(1);
    await expect(
      stripe.checkout.sessions.create(sessionParams(999), { idempotencyKey: 'k-1' }),
    ).rejects.toMatchObject({ type: 'StripeIdempotencyError' });
  });

  it('a lost answer is retried by the SDK with its key and makes one session', async () => {
    fake.dropResponses(1);
    const s = await sdk(fake, 2).checkout.sessions.create(sessionParams(), {
      idempotencyKey: 'k-lost',
    });
    expect(fake.sessions.size).toBe(1);
    expect(fake.requests.filter((r) => r.idempotencyKey === 'k-lost')).toHaveLength(2);
    expect([...fake.sessions.keys()]).toEqual([s.id]);
  });

  it('the card page pays with 4242…, redirects to success_url and sends signed events', async () => {
    const s = await stripe.checkout.sessions.create(sessionParams());
    const page = await fetch(s.url!);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain('Card number');
    expect(html).not.toMatch(/<script|https?:\/\/(?!127\.0\.0\.1)/);
    const res = await payOnPage(s.url!, TEST_CARDS.succeeds);
    expect(res.status).toBe(303);
    expect(res.headers.get('location')).toBe(`http://127.0.0.1:1/paid?session=${s.id}`);
    await fake.settled();
    expect(receiver.refused).toEqual([]);
    expect(receiver.events.map((e) => e.type)).toEqual([
      'checkout.session.completed',
      'payment_intent.succeeded',
    ]);
    const done = await stripe.checkout.sessions.retrieve(s.id);
    expect(done).toMatchObject({ status: 'complete', payment_status: 'paid' });
    const pi = await stripe.paymentIntents.retrieve(done.payment_intent as string);
    expect(pi).toMatchObject({ status: 'succeeded', amount_received: 12_345 });
    expect(pi.metadata).toEqual({ opId: 'op-1' });
  });

  it('4000…0002 is declined on the page and as payment_intent.payment_failed', async () => {
    const s = await stripe.checkout.sessions.create(sessionParams());
    const res = await payOnPage(s.url!, TEST_CARDS.declined);
    expect(res.status).toBe(402);
    expect(await res.text()).toContain('Your card was declined.');
    await fake.settled();
    expect(receiver.events.map((e) => e.type)).toEqual(['payment_intent.payment_failed']);
    const pi = receiver.events[0]!.data.object as Stripe.PaymentIntent;
    expect(pi.last_payment_error).toMatchObject({ code: 'card_declined' });
    expect((await stripe.checkout.sessions.retrieve(s.id)).status).toBe('open');
  });

  it('4000…3155 asks for approval first, then pays', async () => {
    const s = await stripe.checkout.sessions.create(sessionParams());
    const first = await payOnPage(s.url!, TEST_CARDS.authenticate);
    expect(first.status).toBe(303);
    expect(first.headers.get('location')).toBe(`/pay/${s.id}/approve`);
    expect(await (await fetch(`${fake.url}/pay/${s.id}/approve`)).text()).toContain('Approve');
    const approved = await fetch(`${fake.url}/pay/${s.id}/approve`, {
      method: 'POST',
      redirect: 'manual',
      headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
      body: 'decision=approve',
    });
    expect(approved.status).toBe(303);
    await fake.settled();
    expect(receiver.events.map((e) => e.type)).toContain('payment_intent.succeeded');
  });

  it('retries a delivery the receiver did not take, and can deliver an event twice', async () => {
    await fake.stop();
    fake = await new FakeStripe({
      webhookUrl: await (async () => {
        await receiver.stop();
        receiver = new Receiver();
        return receiver.start();
      })(),
      webhookSecret: SECRET,
      duplicateRate: 1,
      retryDelaysMs: [20, 20, 20],
    }).start();
    stripe = sdk(fake);
    receiver.failNext = { count: 2, status: 503 };
    const s = await stripe.checkout.sessions.create(sessionParams());
    await payOnPage(s.url!, TEST_CARDS.succeeds);
    await fake.settled();
    const completed = fake.events.find((e) => e.type === 'checkout.session.completed')!;
    const deliveries = fake.deliveriesOf(completed.id);
    expect(deliveries).toHaveLength(2);
    expect(deliveries.map((d) => [d.duplicate, d.delivered])).toEqual([
      [false, true],
      [true, true],
    ]);
    // The two refusals fell on the first tries; each refused try was tried again later.
    const statuses = fake.deliveries.flatMap((d) => d.attempts.map((a) => a.status));
    expect(statuses.filter((x) => x === 503)).toHaveLength(2);
    expect(fake.deliveries.every((d) => d.delivered)).toBe(true);
    expect(receiver.events.filter((e) => e.id === completed.id)).toHaveLength(2);
  });

  it('signs webhooks so that a wrong secret does not verify', async () => {
    const s = await stripe.checkout.sessions.create(sessionParams());
    await payOnPage(s.url!, TEST_CARDS.succeeds);
    await fake.settled();
    const event = fake.events[0]!;
    const payload = JSON.stringify(event, null, 2);
    const header = Stripe.webhooks.generateTestHeaderString({ payload, secret: SECRET });
    expect(Stripe.webhooks.constructEvent(payload, header, SECRET).id).toBe(event.id);
    expect(() => Stripe.webhooks.constructEvent(payload, header, 'whsec_other')).toThrow(
      /signature/i,
    );
  });

  it('refunds a paid intent, at most what is left, and expires only open sessions', async () => {
    const s = await stripe.checkout.sessions.create(sessionParams(10_000));
    await payOnPage(s.url!, TEST_CARDS.succeeds);
    const pi = (await stripe.checkout.sessions.retrieve(s.id)).payment_intent as string;
    const r = await stripe.refunds.create({ payment_intent: pi, amount: 4_000 });
    expect(r).toMatchObject({ object: 'refund', amount: 4_000, status: 'succeeded' });
    await expect(
      stripe.refunds.create({ payment_intent: pi, amount: 7_000 }),
    ).rejects.toMatchObject({ code: 'amount_too_large' });
    await expect(stripe.checkout.sessions.expire(s.id)).rejects.toMatchObject({
      type: 'StripeInvalidRequestError',
    });
    const open = await stripe.checkout.sessions.create(sessionParams());
    expect((await stripe.checkout.sessions.expire(open.id)).status).toBe('expired');
    expect((await fetch(`${fake.url}/pay/${open.id}`)).status).toBe(410);
    await fake.settled();
    expect(receiver.events.map((e) => e.type)).toContain('charge.refunded');
  });
});
