import { randomBytes } from 'node:crypto';
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { decodeForm, type FormObject, str, strings } from './form';
import {
  approvePage,
  cardPage,
  closedPage,
  notFoundPage,
  type PageSession,
  TEST_CARDS,
} from './payment-page';
import { signatureHeader } from './signature';

/**
 * A local stand-in for the parts of Stripe's API that Panelpass uses, answering the real
 * `stripe` SDK (pointed here with its host/port/protocol options): Checkout Sessions
 * (create, retrieve, expire), Payment Intents (retrieve) and Refunds (create, retrieve), with
 * form-encoded requests, Stripe-shaped JSON answers and errors, and `Idempotency-Key`
 * replays. It serves a card page at each session's `url` and sends webhooks signed the way
 * Stripe signs them, retried with backoff when the receiver does not answer 2xx, and
 * sometimes delivered twice (as Stripe may).
 *
 * State lives in memory: restarting the stand-in forgets every session.
 */

export interface FakeStripeOptions {
  /** Default 127.0.0.1. */
  host?: string;
  /** 0 (default) takes any free port. */
  port?: number;
  /** Base of the card page links; default http://<host>:<port>. */
  publicUrl?: string;
  /** Where events are posted (our server's /api/payments/webhook); null sends none. */
  webhookUrl?: string | null;
  /** The endpoint's signing secret (`whsec_…`), shared with the receiver. */
  webhookSecret: string;
  /** Chance (0–1) that an event delivered once is delivered again. Default 0.1. */
  duplicateRate?: number;
  /** Seed of the generator that decides duplicates, so a run can be repeated. */
  seed?: number;
  /** Waits before each retry of a failed delivery; its length is the number of retries. */
  retryDelaysMs?: number[];
  /** How long an Idempotency-Key is remembered. Default 24 h, as Stripe. */
  idempotencyTtlMs?: number;
  /** The clock (for expiry); default Date.now. */
  now?: () => number;
  log?: (line: string) => void;
}

type Json = null | boolean | number | string | Json[] | { [key: string]: Json };
type Metadata = Record<string, string>;

export interface FakeSession {
  id: string;
  object: 'checkout.session';
  amount_subtotal: number;
  amount_total: number;
  cancel_url: string | null;
  client_reference_id: string | null;
  created: number;
  currency: string;
  customer_email: string | null;
  expires_at: number;
  livemode: false;
  metadata: Metadata;
  mode: 'payment';
  payment_intent: string | null;
  payment_method_types: string[];
  payment_status: 'unpaid' | 'paid';
  status: 'open' | 'complete' | 'expired';
  success_url: string;
  url: string | null;
}

export interface FakePaymentError {
  type: 'card_error';
  code: string;
  decline_code?: string;
  message: string;
}

export interface FakePaymentIntent {
  id: string;
  object: 'payment_intent';
  amount: number;
  amount_received: number;
  created: number;
  currency: string;
  description: string | null;
  last_payment_error: FakePaymentError | null;
  latest_charge: string | null;
  livemode: false;
  metadata: Metadata;
  payment_method_types: string[];
  status: 'requires_payment_method' | 'requires_action' | 'succeeded';
}

export interface FakeCharge {
  id: string;
  object: 'charge';
  amount: number;
  amount_captured: number;
  amount_refunded: number;
  created: number;
  currency: string;
  livemode: false;
  metadata: Metadata;
  paid: boolean;
  payment_intent: string;
  payment_method_details: { type: 'card'; card: { brand: string; last4: string } };
  refunded: boolean;
  status: 'succeeded';
}

export interface FakeRefund {
  id: string;
  object: 'refund';
  amount: number;
  charge: string;
  created: number;
  currency: string;
  metadata: Metadata;
  payment_intent: string;
  reason: string | null;
  status: 'succeeded';
}

export interface FakeEvent {
  id: string;
  object: 'event';
  api_version: string;
  created: number;
  data: { object: unknown };
  livemode: false;
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
  type: string;
}

export interface Delivery {
  eventId: string;
  type: string;
  /** Whether this delivery is the extra copy of one already delivered. */
  duplicate: boolean;
  /** Each try: the receiver's status (null: no answer) and the start of its answer. */
  attempts: { at: number; status: number | null; body?: string; error?: string }[];
  delivered: boolean;
}

interface Stored {
  description: string;
  intentMetadata: Metadata;
  intentDescription: string | null;
}

interface Remembered {
  fingerprint: string;
  status: number;
  body: string;
  at: number;
}

class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly type: string,
    message: string,
    readonly extra: Record<string, string> = {},
  ) {
    super(message);
  }
}

const DEFAULT_RETRY_DELAYS = [1_000, 2_000, 4_000, 8_000, 16_000, 32_000, 60_000, 120_000];
const DAY_MS = 86_400_000;

/** mulberry32: small, seedable, good enough to decide duplicates. */
function seeded(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const ID_CHARS = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789';
function newId(prefix: string, length = 24): string {
  const bytes = randomBytes(length);
  let s = '';
  for (const b of bytes) s += ID_CHARS[b % ID_CHARS.length];
  return `${prefix}_${s}`;
}

function luhn(digits: string): boolean {
  let sum = 0;
  for (let i = 0; i < digits.length; i++) {
    let d = Number(digits[digits.length - 1 - i]);
    if (i % 2 === 1) {
      d *= 2;
      if (d > 9) d -= 9;
    }
    sum += d;
  }
  return sum % 10 === 0;
}

function readBody(req: IncomingMessage, limit = 1_000_000): Promise<string> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let size = 0;
    req.on('data', (c: Buffer) => {
      size += c.length;
      if (size > limit) {
        reject(new Error('body too large'));
        req.destroy();
        return;
      }
      chunks.push(c);
    });
    req.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
    req.on('error', reject);
  });
}

export class FakeStripe {
  readonly sessions = new Map<string, FakeSession>();
  readonly intents = new Map<string, FakePaymentIntent>();
  readonly charges = new Map<string, FakeCharge>();
  readonly refunds = new Map<string, FakeRefund>();
  readonly events: FakeEvent[] = [];
  readonly deliveries: Delivery[] = [];
  /** Requests to /v1 as they arrived (method, path, idempotency key), for tests to count. */
  readonly requests: { method: string; path: string; idempotencyKey: string | null }[] = [];

  private readonly stored = new Map<string, Stored>();
  private readonly remembered = new Map<string, Remembered>();
  private readonly inFlight = new Set<Promise<void>>();
  private readonly timers = new Set<NodeJS.Timeout>();
  private readonly random: () => number;
  private readonly now: () => number;
  private server: Server | null = null;
  private dropping = 0;
  private apiVersion = '2026-10-28.endive';
  private base = '';

  private readonly opts: FakeStripeOptions;

  constructor(opts: FakeStripeOptions) {
    this.opts = { ...opts };
    this.random = seeded(opts.seed ?? Date.now());
    this.now = opts.now ?? Date.now;
  }

  /** The API's base URL (also the card pages' unless publicUrl says otherwise). */
  get url(): string {
    return this.base;
  }

  get port(): number {
    return (this.server?.address() as AddressInfo | null)?.port ?? 0;
  }

  async start(): Promise<this> {
    const host = this.opts.host ?? '127.0.0.1';
    this.server = createServer((req, res) => {
      this.handle(req, res).catch((e: unknown) => {
        this.log(`error: ${e instanceof Error ? e.message : String(e)}`);
        if (!res.headersSent) res.writeHead(500, { 'Content-Type': 'text/plain' });
        res.end('fake stripe failed');
      });
    });
    await new Promise<void>((resolve, reject) => {
      this.server!.once('error', reject);
      this.server!.listen(this.opts.port ?? 0, host, () => resolve());
    });
    this.base = `http://${host}:${this.port}`;
    return this;
  }

  async stop(): Promise<void> {
    for (const t of this.timers) clearTimeout(t);
    this.timers.clear();
    const server = this.server;
    this.server = null;
    if (!server) return;
    server.closeAllConnections();
    await new Promise<void>((resolve) => server.close(() => resolve()));
  }

  /** Where events go from now on (null: nowhere). */
  setWebhook(url: string | null): void {
    this.opts.webhookUrl = url;
  }

  /** The chance of a second delivery from now on. */
  setDuplicateRate(rate: number): void {
    this.opts.duplicateRate = rate;
  }

  /** The next `count` API calls are carried out but their answers never arrive (the socket is cut). */
  dropResponses(count: number): void {
    this.dropping = count;
  }

  /** Resolves when no webhook delivery or retry is waiting. */
  async settled(): Promise<void> {
    while (this.inFlight.size) await Promise.all([...this.inFlight]);
  }

  /** Deliveries made of one event, including duplicates. */
  deliveriesOf(eventId: string): Delivery[] {
    return this.deliveries.filter((d) => d.eventId === eventId);
  }

  private log(line: string): void {
    this.opts.log?.(`[fake-stripe] ${line}`);
  }

  private get pageBase(): string {
    return (this.opts.publicUrl ?? this.base).replace(/\/$/, '');
  }

  // ---------------------------------------------------------------- HTTP

  private async handle(req: IncomingMessage, res: ServerResponse): Promise<void> {
    const url = new URL(req.url ?? '/', 'http://fake.local');
    const path = url.pathname;
    const method = req.method ?? 'GET';
    if (path.startsWith('/v1/')) return this.api(req, res, method, path, url);
    if (path.startsWith('/pay/')) return this.page(req, res, method, path);
    if (path.startsWith('/_fake/')) return this.inspect(req, res, method, path, url);
    res.writeHead(404, { 'Content-Type': 'text/plain' });
    res.end('not found');
  }

  private async api(
    req: IncomingMessage,
    res: ServerResponse,
    method: string,
    path: string,
    url: URL,
  ): Promise<void> {
    const body = method === 'POST' ? await readBody(req) : url.search.slice(1);
    const idempotencyKey = (req.headers['idempotency-key'] as string | undefined) ?? null;
    this.requests.push({ method, path, idempotencyKey });
    const version = req.headers['stripe-version'];
    if (typeof version === 'string' && version) this.apiVersion = version;
    const send = (status: number, text: string, replayed = false) => {
      if (this.dropping > 0) {
        this.dropping--;
        this.log(`cut the answer to ${method} ${path}`);
        req.socket.destroy();
        return;
      }
      res.writeHead(status, {
        'Content-Type': 'application/json',
        'Request-Id': newId('req', 14),
        'Stripe-Version': this.apiVersion,
        ...(idempotencyKey ? { 'Idempotency-Key': idempotencyKey } : {}),
        ...(replayed ? { 'Idempotent-Replayed': 'true' } : {}),
      });
      res.end(text);
    };
    const auth = req.headers.authorization ?? '';
    if (!/^Bearer sk_[A-Za-z0-9_]+$/.test(auth)) {
      const err = {
        error: {
          type: 'invalid_request_error',
          message: 'Invalid API Key provided: give a secret key starting with sk_',
        },
      };
      return send(401, JSON.stringify(err));
    }

    const fingerprint = `${method} ${path} ${body}`;
    if (method === 'POST' && idempotencyKey) {
      this.forgetOldKeys();
      const seen = this.remembered.get(idempotencyKey);
      if (seen) {
        if (seen.fingerprint === fingerprint) return send(seen.status, seen.body, true);
        const err = new ApiError(
          400,
          'idempotency_error',
          `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${idempotencyKey}' if you meant to execute a different request.`,
        );
        return send(err.status, JSON.stringify(this.errorBody(err)));
      }
    }

    let status = 200;
    let answer: unknown;
    try {
      answer = this.route(method, path, decodeForm(body));
    } catch (e) {
      if (!(e instanceof ApiError)) throw e;
      status = e.status;
      answer = this.errorBody(e);
    }
    const text = JSON.stringify(answer);
    // Stripe keeps the result of a request that ran (not of one refused as malformed).
    if (method === 'POST' && idempotencyKey && status !== 400 && status !== 401) {
      this.remembered.set(idempotencyKey, { fingerprint, status, body: text, at: this.now() });
    }
    send(status, text);
  }

  private errorBody(e: ApiError): { error: Record<string, string> } {
    return { error: { type: e.type, message: e.message, ...e.extra } };
  }

  private forgetOldKeys(): void {
    const ttl = this.opts.idempotencyTtlMs ?? DAY_MS;
    const now = this.now();
    for (const [k, v] of this.remembered) if (now - v.at > ttl) this.remembered.delete(k);
  }

  private route(method: string, path: string, form: FormObject): unknown {
    const parts = path.split('/').filter(Boolean); // ['v1', ...]
    const [, a, b, c, d] = parts;
    if (a === 'checkout' && b === 'sessions') {
      if (method === 'POST' && !c) return this.createSession(form);
      if (method === 'GET' && c && !d) return this.session(c);
      if (method === 'POST' && c && d === 'expire') return this.expire(c);
    }
    if (a === 'payment_intents' && method === 'GET' && b && !c) return this.intent(b);
    if (a === 'refunds') {
      if (method === 'POST' && !b) return this.createRefund(form);
      if (method === 'GET' && b && !c) {
        const r = this.refunds.get(b);
        if (!r) throw missing('refund', b);
        return r;
      }
    }
    throw new ApiError(
      404,
      'invalid_request_error',
      `Unrecognized request URL (${method}: ${path}).`,
    );
  }

  // ---------------------------------------------------------------- API objects

  private createSession(form: FormObject): FakeSession {
    const mode = str(form, 'mode');
    if (mode !== 'payment') throw invalid('mode', 'This stand-in only takes mode=payment.');
    const successUrl = str(form, 'success_url');
    if (!successUrl) throw invalid('success_url', 'Missing required param: success_url.');
    const items = form.line_items;
    if (!Array.isArray(items) || !items.length) {
      throw invalid('line_items', 'Missing required param: line_items.');
    }
    let currency = '';
    let total = 0;
    const names: string[] = [];
    items.forEach((item, i) => {
      const cur = str(item, 'price_data', 'currency')?.toLowerCase();
      const unit = Number(str(item, 'price_data', 'unit_amount'));
      const qty = Number(str(item, 'quantity') ?? '1');
      const name = str(item, 'price_data', 'product_data', 'name');
      if (!cur) throw invalid(`line_items[${i}][price_data][currency]`, 'Missing currency.');
      if (!Number.isInteger(unit) || unit < 0) {
        throw invalid(`line_items[${i}][price_data][unit_amount]`, 'Invalid integer.');
      }
      if (!Number.isInteger(qty) || qty < 1) {
        throw invalid(`line_items[${i}][quantity]`, 'Invalid integer.');
      }
      if (!name) throw invalid(`line_items[${i}][price_data][product_data][name]`, 'Missing name.');
      if (currency && cur !== currency) {
        throw invalid(
          `line_items[${i}][price_data][currency]`,
          'All line items must share one currency.',
        );
      }
      currency = cur;
      total += unit * qty;
      names.push(qty > 1 ? `${name} × ${qty}` : name);
    });
    const created = Math.floor(this.now() / 1000);
    let expiresAt = created + DAY_MS / 1000;
    const asked = str(form, 'expires_at');
    if (asked !== undefined) {
      const t = Number(asked);
      if (!Number.isInteger(t) || t < created + 1800 || t > created + DAY_MS / 1000) {
        throw invalid(
          'expires_at',
          'The `expires_at` timestamp must be between 30 minutes and 24 hours from now.',
        );
      }
      expiresAt = t;
    }
    const id = newId('cs_test', 58);
    const session: FakeSession = {
      id,
      object: 'checkout.session',
      amount_subtotal: total,
      amount_total: total,
      cancel_url: str(form, 'cancel_url') ?? null,
      client_reference_id: str(form, 'client_reference_id') ?? null,
      created,
      currency,
      customer_email: str(form, 'customer_email') ?? null,
      expires_at: expiresAt,
      livemode: false,
      metadata: strings(form.metadata),
      mode: 'payment',
      payment_intent: null,
      payment_method_types: ['card'],
      payment_status: 'unpaid',
      status: 'open',
      success_url: successUrl,
      url: `${this.pageBase}/pay/${id}`,
    };
    this.sessions.set(id, session);
    this.stored.set(id, {
      description: names.join(', '),
      intentMetadata: strings((form.payment_intent_data as FormObject | undefined)?.metadata),
      intentDescription: str(form, 'payment_intent_data', 'description') ?? null,
    });
    this.log(`session ${id} for ${total} ${currency}`);
    return session;
  }

  private session(id: string): FakeSession {
    const s = this.sessions.get(id);
    if (!s) throw missing('checkout.session', id);
    this.expireIfDue(s);
    return s;
  }

  private expire(id: string): FakeSession {
    const s = this.session(id);
    if (s.status !== 'open') {
      throw new ApiError(
        400,
        'invalid_request_error',
        'Only Checkout Sessions with a status in ["open"] can be expired.',
        { code: 'checkout_session_not_open' },
      );
    }
    this.markExpired(s);
    return s;
  }

  private expireIfDue(s: FakeSession): void {
    if (s.status === 'open' && this.now() >= s.expires_at * 1000) this.markExpired(s);
  }

  private markExpired(s: FakeSession): void {
    s.status = 'expired';
    s.url = null;
    this.emit('checkout.session.expired', s);
  }

  private intent(id: string): FakePaymentIntent {
    const pi = this.intents.get(id);
    if (!pi) throw missing('payment_intent', id);
    return pi;
  }

  private createRefund(form: FormObject): FakeRefund {
    let piId = str(form, 'payment_intent');
    const chargeId = str(form, 'charge');
    if (!piId && chargeId) piId = this.charges.get(chargeId)?.payment_intent;
    if (!piId) throw invalid('payment_intent', 'Give a payment_intent or a charge to refund.');
    const pi = this.intents.get(piId);
    if (!pi) throw missing('payment_intent', piId);
    const charge = pi.latest_charge ? this.charges.get(pi.latest_charge) : undefined;
    if (pi.status !== 'succeeded' || !charge) {
      throw new ApiError(
        400,
        'invalid_request_error',
        `This PaymentIntent (${pi.id}) does not have a successful charge to refund.`,
        { code: 'charge_not_refundable' },
      );
    }
    const left = charge.amount - charge.amount_refunded;
    if (left <= 0) {
      throw new ApiError(
        400,
        'invalid_request_error',
        `Charge ${charge.id} has already been refunded.`,
        {
          code: 'charge_already_refunded',
        },
      );
    }
    const asked = str(form, 'amount');
    const amount = asked === undefined ? left : Number(asked);
    if (!Number.isInteger(amount) || amount < 1)
      throw invalid('amount', 'Invalid positive integer.');
    if (amount > left) {
      throw new ApiError(
        400,
        'invalid_request_error',
        `Refund amount (${amount}) is greater than unrefunded amount on charge (${left}).`,
        { param: 'amount', code: 'amount_too_large' },
      );
    }
    const refund: FakeRefund = {
      id: newId('re'),
      object: 'refund',
      amount,
      charge: charge.id,
      created: Math.floor(this.now() / 1000),
      currency: charge.currency,
      metadata: strings(form.metadata),
      payment_intent: pi.id,
      reason: str(form, 'reason') ?? null,
      status: 'succeeded',
    };
    this.refunds.set(refund.id, refund);
    charge.amount_refunded += amount;
    charge.refunded = charge.amount_refunded >= charge.amount;
    this.emit('refund.created', refund);
    this.emit('charge.refunded', charge);
    return refund;
  }

  // ---------------------------------------------------------------- the card page

  private async page(
    req: IncomingMessage,
    res: ServerResponse,
    method: string,
    path: string,
  ): Promise<void> {
    const [, , id, step] = path.split('/'); // '', 'pay', id, step?
    const s = id ? this.sessions.get(id) : undefined;
    const html = (status: number, text: string) => {
      // A browser holds form-action to the redirect after the post too: the app's return
      // page (success_url, another origin) must be allowed, or paying leaves the card page.
      const back = s ? originOf(s.success_url) : null;
      res.writeHead(status, {
        'Content-Type': 'text/html; charset=utf-8',
        'Cache-Control': 'no-store',
        'Content-Security-Policy': `default-src 'none'; style-src 'unsafe-inline'; form-action 'self'${back ? ` ${back}` : ''}`,
      });
      res.end(text);
    };
    const redirect = (to: string) => {
      res.writeHead(303, { Location: to, 'Cache-Control': 'no-store' });
      res.end();
    };
    if (!s) return html(404, notFoundPage());
    this.expireIfDue(s);
    const shown: PageSession = {
      id: s.id,
      description: this.stored.get(s.id)?.description ?? 'Payment',
      amountMinor: s.amount_total,
      currency: s.currency,
    };
    if (s.status !== 'open')
      return html(s.status === 'complete' ? 200 : 410, closedPage(shown, s.status));
    const pi = s.payment_intent ? this.intents.get(s.payment_intent) : undefined;

    if (step === 'approve') {
      if (pi?.status !== 'requires_action') return redirect(`/pay/${s.id}`);
      if (method !== 'POST') return html(200, approvePage(shown));
      const form = decodeForm(await readBody(req));
      if (str(form, 'decision') === 'approve') {
        this.succeed(s, pi, TEST_CARDS.authenticate.slice(-4));
        return redirect(this.successUrl(s));
      }
      this.fail(s, pi, {
        type: 'card_error',
        code: 'payment_intent_authentication_failure',
        message: 'The card holder did not approve this payment. Try again, or use another card.',
      });
      return html(402, cardPage(shown, pi.last_payment_error!.message));
    }
    if (step) return html(404, notFoundPage());
    if (method !== 'POST') return html(200, cardPage(shown));

    const form = decodeForm(await readBody(req));
    const card = (str(form, 'card') ?? '').replace(/[\s-]/g, '');
    const name = str(form, 'name') ?? '';
    const problem = checkCard(card, str(form, 'exp') ?? '', str(form, 'cvc') ?? '', this.now());
    if (problem) return html(400, cardPage(shown, problem, name));
    const intent = this.ensureIntent(s);
    if (card === TEST_CARDS.succeeds) {
      this.succeed(s, intent, card.slice(-4));
      return redirect(this.successUrl(s));
    }
    if (card === TEST_CARDS.authenticate) {
      intent.status = 'requires_action';
      return redirect(`/pay/${s.id}/approve`);
    }
    this.fail(s, intent, {
      type: 'card_error',
      code: 'card_declined',
      decline_code: 'generic_decline',
      message:
        card === TEST_CARDS.declined
          ? 'Your card was declined.'
          : 'Your card was declined. This test page takes only the test card numbers listed below.',
    });
    return html(402, cardPage(shown, intent.last_payment_error!.message, name));
  }

  private successUrl(s: FakeSession): string {
    return s.success_url.split('{CHECKOUT_SESSION_ID}').join(s.id);
  }

  private ensureIntent(s: FakeSession): FakePaymentIntent {
    const existing = s.payment_intent ? this.intents.get(s.payment_intent) : undefined;
    if (existing) return existing;
    const stored = this.stored.get(s.id);
    const pi: FakePaymentIntent = {
      id: newId('pi'),
      object: 'payment_intent',
      amount: s.amount_total,
      amount_received: 0,
      created: Math.floor(this.now() / 1000),
      currency: s.currency,
      description: stored?.intentDescription ?? null,
      last_payment_error: null,
      latest_charge: null,
      livemode: false,
      metadata: stored?.intentMetadata ?? {},
      payment_method_types: ['card'],
      status: 'requires_payment_method',
    };
    this.intents.set(pi.id, pi);
    s.payment_intent = pi.id;
    return pi;
  }

  private succeed(s: FakeSession, pi: FakePaymentIntent, last4: string): void {
    const charge: FakeCharge = {
      id: newId('ch'),
      object: 'charge',
      amount: pi.amount,
      amount_captured: pi.amount,
      amount_refunded: 0,
      created: Math.floor(this.now() / 1000),
      currency: pi.currency,
      livemode: false,
      metadata: { ...pi.metadata },
      paid: true,
      payment_intent: pi.id,
      payment_method_details: { type: 'card', card: { brand: 'visa', last4 } },
      refunded: false,
      status: 'succeeded',
    };
    this.charges.set(charge.id, charge);
    pi.status = 'succeeded';
    pi.amount_received = pi.amount;
    pi.latest_charge = charge.id;
    pi.last_payment_error = null;
    s.status = 'complete';
    s.payment_status = 'paid';
    s.url = null;
    this.log(`session ${s.id} paid`);
    this.emit('checkout.session.completed', s);
    this.emit('payment_intent.succeeded', pi);
  }

  private fail(_s: FakeSession, pi: FakePaymentIntent, error: FakePaymentError): void {
    pi.status = 'requires_payment_method';
    pi.last_payment_error = error;
    this.log(`payment ${pi.id} failed: ${error.code}`);
    this.emit('payment_intent.payment_failed', pi);
  }

  // ---------------------------------------------------------------- webhooks

  private emit(type: string, object: unknown): void {
    const event: FakeEvent = {
      id: newId('evt'),
      object: 'event',
      api_version: this.apiVersion,
      created: Math.floor(this.now() / 1000),
      // A snapshot: later changes to the object do not rewrite an event already made.
      data: { object: JSON.parse(JSON.stringify(object)) as Json },
      livemode: false,
      pending_webhooks: this.opts.webhookUrl ? 1 : 0,
      request: { id: null, idempotency_key: null },
      type,
    };
    this.events.push(event);
    if (this.opts.webhookUrl) this.track(this.deliver(event, false));
  }

  private track(p: Promise<void>): void {
    this.inFlight.add(p);
    void p.finally(() => this.inFlight.delete(p));
  }

  private sleep(ms: number): Promise<void> {
    return new Promise((resolve) => {
      const t = setTimeout(() => {
        this.timers.delete(t);
        resolve();
      }, ms);
      this.timers.add(t);
    });
  }

  private async deliver(event: FakeEvent, duplicate: boolean): Promise<void> {
    const delivery: Delivery = {
      eventId: event.id,
      type: event.type,
      duplicate,
      attempts: [],
      delivered: false,
    };
    this.deliveries.push(delivery);
    const delays = this.opts.retryDelaysMs ?? DEFAULT_RETRY_DELAYS;
    const payload = JSON.stringify(event, null, 2);
    for (let attempt = 0; attempt <= delays.length; attempt++) {
      if (attempt > 0) await this.sleep(delays[attempt - 1]!);
      if (!this.server) return;
      const at = this.now();
      try {
        const res = await fetch(this.opts.webhookUrl!, {
          method: 'POST',
          headers: {
            'Content-Type': 'application/json; charset=utf-8',
            'User-Agent': 'Panelpass-FakeStripe/1.0',
            'Stripe-Signature': signatureHeader(
              payload,
              this.opts.webhookSecret,
              Math.floor(Date.now() / 1000),
            ),
          },
          body: payload,
          signal: AbortSignal.timeout(10_000),
        });
        const answer = (await res.text()).slice(0, 500);
        delivery.attempts.push({ at, status: res.status, body: answer });
        if (res.ok) {
          delivery.delivered = true;
          break;
        }
        this.log(`${event.type} ${event.id}: receiver answered ${res.status}`);
      } catch (e) {
        const why = e instanceof Error ? e.message : 'failed';
        delivery.attempts.push({ at, status: null, error: why });
        this.log(`${event.type} ${event.id}: not delivered (${why})`);
      }
    }
    if (delivery.delivered && !duplicate && this.random() < (this.opts.duplicateRate ?? 0.1)) {
      this.log(`${event.type} ${event.id}: sending it again`);
      await this.deliver(event, true);
    }
  }

  // ---------------------------------------------------------------- inspection (not Stripe's)

  private async inspect(
    req: IncomingMessage,
    res: ServerResponse,
    method: string,
    path: string,
    url: URL,
  ): Promise<void> {
    const json = (status: number, body: unknown) => {
      res.writeHead(status, { 'Content-Type': 'application/json' });
      res.end(JSON.stringify(body));
    };
    if (method === 'GET' && path === '/_fake/sessions') {
      return json(200, { data: [...this.sessions.values()] });
    }
    if (method === 'GET' && path === '/_fake/events') {
      return json(200, {
        data: this.events.map((e) => ({ ...e, deliveries: this.deliveriesOf(e.id) })),
      });
    }
    if (method === 'POST' && path === '/_fake/drop-responses') {
      await readBody(req);
      this.dropResponses(Number(url.searchParams.get('count') ?? '1'));
      return json(200, { dropping: this.dropping });
    }
    json(404, { error: 'not found' });
  }
}

function invalid(param: string, message: string): ApiError {
  return new ApiError(400, 'invalid_request_error', message, { param });
}

function missing(what: string, id: string): ApiError {
  return new ApiError(404, 'invalid_request_error', `No such ${what}: '${id}'`, {
    code: 'resource_missing',
    param: 'id',
  });
}

/** What the page says before trying the card (Stripe's form checks these as you type). */
function checkCard(card: string, exp: string, cvc: string, now: number): string | null {
  if (!/^\d{12,19}$/.test(card)) return 'Your card number is incomplete.';
  if (!luhn(card)) return 'Your card number is invalid.';
  const m = /^\s*(\d{1,2})\s*\/\s*(\d{2}|\d{4})\s*$/.exec(exp);
  if (!m) return "Your card's expiry date is incomplete (MM/YY).";
  const month = Number(m[1]);
  const year = m[2]!.length === 2 ? 2000 + Number(m[2]) : Number(m[2]);
  if (month < 1 || month > 12) return "Your card's expiry month is not valid.";
  const today = new Date(now);
  if (
    year < today.getUTCFullYear() ||
    (year === today.getUTCFullYear() && month < today.getUTCMonth() + 1)
  ) {
    return "Your card's expiry date is in the past.";
  }
  if (!/^\d{3,4}$/.test(cvc.trim())) return "Your card's security code is incomplete.";
  return null;
}

/** The origin of a URL (`http://127.0.0.1:8080`), or null when it is not one. */
function originOf(url: string): string | null {
  try {
    const { origin } = new URL(url);
    return origin === 'null' ? null : origin;
  } catch {
    return null;
  }
}
