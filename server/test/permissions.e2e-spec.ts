import type { NestExpressApplication } from '@nestjs/platform-express';
import { canonicalJson, childId } from '@panelpass/shared';
import { createHash, randomUUID } from 'node:crypto';
import { deflateSync } from 'node:zlib';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { CaptureStore } from '../src/fakes/smtp/capture-store';
import { FakeStripe } from '../src/fakes/stripe/fake-stripe';
import { TEST_CARDS } from '../src/fakes/stripe/payment-page';
import { signatureHeader } from '../src/fakes/stripe/signature';
import { buildOpenApi } from '../src/setup-app';
import { signInCustomer } from './factories/customers';
import { type JobFixture, makeJob } from './factories/records';
import {
  addTech,
  createTestApp,
  http,
  type Session,
  signUpOwner,
  uniqueEmail,
} from './support/app';

/**
 * The permissions matrix: every route × every kind of caller, with the status each must get.
 * Routes come from the OpenAPI document, so a new route without a row here fails the test.
 */

const ROLES = [
  'owner',
  'techAssigned',
  'techOther',
  'customer',
  'otherCustomer',
  'otherOwner',
] as const;
type Who = (typeof ROLES)[number];

interface Req {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  path: string;
  body?: object | Buffer;
  query?: Record<string, string>;
  contentType?: string;
}
interface Row {
  /** Builds the request, making fresh records first when the call would use them up. */
  req: (w: World, who: Who) => Promise<Req> | Req;
  /** Expected status per caller, in ROLES order. */
  expect: readonly [number, number, number, number, number, number];
}
interface PublicRow {
  req: (w: World) => Promise<Req> | Req;
  status: number;
}

interface World {
  app: NestExpressApplication;
  s: Record<Who, Session>;
  jobA: JobFixture;
  jobB: JobFixture;
  panelA: string;
  checkA: string;
  productId: string;
  solventProductId: string;
  quoteA: string;
  blobA: string;
  invoiceA: string;
  stripe: FakeStripe;
  mailA: string;
}

const WEBHOOK_SECRET = 'whsec_permissions_matrix';

const bearer = { type: 'bearer' as const };
const day = 86_400_000;

/** A valid, tiny PNG whose bytes differ by `seed` (so each upload is a new blob). */
function png(seed: number): Buffer {
  const crcTable = Array.from({ length: 256 }, (_, n) => {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    return c >>> 0;
  });
  const crc = (buf: Buffer) => {
    let c = 0xffffffff;
    for (const b of buf) c = crcTable[(c ^ b) & 0xff]! ^ (c >>> 8);
    return (c ^ 0xffffffff) >>> 0;
  };
  const chunk = (type: string, data: Buffer) => {
    const len = Buffer.alloc(4);
    len.writeUInt32BE(data.length);
    const td = Buffer.concat([Buffer.from(type), data]);
    const c = Buffer.alloc(4);
    c.writeUInt32BE(crc(td));
    return Buffer.concat([len, td, c]);
  };
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(1, 0);
  ihdr.writeUInt32BE(1, 4);
  ihdr[8] = 8;
  ihdr[9] = 2;
  const raw = Buffer.from([0, seed & 0xff, (seed >> 8) & 0xff, (seed >> 16) & 0xff]);
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', ihdr),
    chunk('IDAT', deflateSync(raw)),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}
const sha = (b: Buffer | string) => createHash('sha256').update(b).digest('hex');
let seed = 1;

async function ok(
  w: World,
  method: Req['method'],
  path: string,
  body?: object,
): Promise<{ [k: string]: unknown }> {
  const res = await http(w.app)[method](path).auth(w.s.owner.accessToken, bearer).send(body);
  if (res.status >= 300)
    throw new Error(`setup ${method} ${path}: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body as { [k: string]: unknown };
}

/** Fresh records of business A, for calls that use them up. */
const fresh = {
  async customer(w: World) {
    const id = randomUUID();
    await ok(w, 'post', '/api/customers', { id, name: 'Fresh Customer' });
    return id;
  },
  async vehicle(w: World) {
    const id = randomUUID();
    await ok(w, 'post', '/api/vehicles', { id, customerId: w.jobA.customerId, bodyStyle: 'coupe' });
    return id;
  },
  async job(w: World) {
    return (await makeJob(w.app, w.s.owner, { techId: w.s.techAssigned.user.id })).jobId;
  },
  async pin(w: World) {
    const id = randomUUID();
    await ok(w, 'post', `/api/jobs/${w.jobA.jobId}/pins`, {
      id,
      x: 0.5,
      y: 0.5,
      kind: 'chip',
      severity: 1,
    });
    return id;
  },
  async solvent(w: World) {
    const id = randomUUID();
    await ok(w, 'post', `/api/jobs/${w.jobA.jobId}/solvents`, {
      id,
      productId: w.solventProductId,
      surfaceTempC: 20,
      inSun: false,
    });
    return id;
  },
  async mask(w: World) {
    const id = randomUUID();
    await ok(w, 'post', `/api/jobs/${w.jobA.jobId}/masks`, { id, what: 'Rear badge' });
    return id;
  },
  async timer(w: World, paused = false) {
    const id = randomUUID();
    await ok(w, 'post', '/api/timers', {
      id,
      jobId: w.jobA.jobId,
      kind: 'custom',
      label: 'Wait',
      durationMs: 600_000,
    });
    if (paused) await ok(w, 'post', `/api/timers/${id}/pause`, {});
    return id;
  },
  async product(w: World) {
    const id = randomUUID();
    await ok(w, 'post', '/api/products', { id, name: 'Spare pad', kind: 'pad' });
    return id;
  },
  async quote(w: World, send: boolean) {
    const id = randomUUID();
    const settings = (await ok(w, 'get', '/api/business')).settings as {
      services: { id: string }[];
      sizeClasses: { id: string }[];
      conditions: { id: string }[];
    };
    await ok(w, 'post', '/api/quotes', {
      id,
      customerId: w.jobA.customerId,
      vehicleId: w.jobA.vehicleId,
      inputs: {
        sizeClass: settings.sizeClasses[0]!.id,
        condition: settings.conditions[0]!.id,
        serviceIds: [settings.services[0]!.id],
        chips: 0,
        addOnIds: [],
      },
    });
    if (send) await ok(w, 'post', `/api/quotes/${id}/send`, {});
    return id;
  },
  async invite(w: World) {
    return String(
      (await ok(w, 'post', '/api/invites', { email: uniqueEmail('inv'), name: 'Invitee' })).id,
    );
  },
  async tech(w: World) {
    return (await addTech(w.app, w.s.owner, 'gone')).user.id;
  },
  /** A card payment of business A that went through (paid on the fake's page, webhook sent). */
  async cardPayment(w: World) {
    const jobId = await fresh.job(w);
    const asked = await ok(w, 'post', `/api/jobs/${jobId}/payment-requests`, {
      id: randomUUID(),
      opId: randomUUID(),
      kind: 'deposit',
      amountMinor: 2_000,
    });
    const seen = w.stripe.events.length;
    const paid = await fetch(String(asked.checkoutUrl), {
      method: 'POST',
      redirect: 'manual',
      headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ card: TEST_CARDS.succeeds, exp: '10/38', cvc: '123' }).toString(),
    });
    if (paid.status !== 303) throw new Error(`setup: card page answered ${paid.status}`);
    for (const event of w.stripe.events.slice(seen)) {
      const body = JSON.stringify(event);
      const sig = signatureHeader(body, WEBHOOK_SECRET, Math.floor(Date.now() / 1000));
      await http(w.app)
        .post('/api/payments/webhook')
        .set('Content-Type', 'application/json')
        .set('Stripe-Signature', sig)
        .send(body)
        .expect(200);
    }
    return String((asked.payment as { id: string }).id);
  },
  async customerLinkToken(w: World) {
    const link = await ok(w, 'post', '/api/customer-links', { customerId: w.jobA.customerId });
    return String(link.link).split('/c/')[1]!;
  },
};

const e = (...s: Row['expect']) => s;

/** The Ledger's routes all take a range of days. */
const LEDGER_RANGE = { from: '2026-01-01', to: '2026-12-31' };

/** The same request for everyone: "body of a new X" rows use fresh ids per call. */
const MATRIX: Record<string, Row> = {
  'GET /api/auth/me': {
    req: () => ({ method: 'get', path: '/api/auth/me' }),
    expect: e(200, 200, 200, 200, 200, 200),
  },
  'GET /api/audit': {
    req: () => ({ method: 'get', path: '/api/audit' }),
    expect: e(200, 403, 403, 403, 403, 200),
  },
  'GET /api/blobs/{sha256}': {
    req: (w) => ({ method: 'get', path: `/api/blobs/${w.blobA}` }),
    expect: e(200, 200, 404, 200, 404, 404),
  },
  'PUT /api/blobs/{sha256}': {
    req: () => {
      const body = png(++seed);
      return { method: 'put', path: `/api/blobs/${sha(body)}`, body, contentType: 'image/png' };
    },
    expect: e(201, 201, 201, 403, 403, 201),
  },
  'GET /api/business': {
    req: () => ({ method: 'get', path: '/api/business' }),
    expect: e(200, 200, 200, 200, 200, 200),
  },
  'PATCH /api/business': {
    req: () => ({ method: 'patch', path: '/api/business', body: { timezone: 'UTC' } }),
    expect: e(200, 403, 403, 403, 403, 200),
  },
  'GET /api/business/export': {
    req: () => ({ method: 'get', path: '/api/business/export', query: { format: 'json' } }),
    expect: e(200, 403, 403, 403, 403, 200),
  },
  // A wrong name: an owner gets as far as the check (400) and nothing is deleted here;
  // business-data.e2e-spec.ts deletes a business of its own.
  'DELETE /api/business': {
    req: () => ({ method: 'delete', path: '/api/business', body: { confirmName: 'Not its name' } }),
    expect: e(400, 403, 403, 403, 403, 400),
  },
  'POST /api/checks/{id}/toggle': {
    req: (w) => ({ method: 'post', path: `/api/checks/${w.checkA}/toggle`, body: { done: true } }),
    expect: e(200, 200, 404, 403, 403, 404),
  },
  'POST /api/chips/{id}/layers': {
    req: async (w) => {
      const chip = randomUUID();
      await ok(w, 'post', `/api/jobs/${w.jobA.jobId}/chips`, {
        id: chip,
        sizeMm: 2,
        layersPlanned: 3,
      });
      return { method: 'post', path: `/api/chips/${chip}/layers`, body: { id: randomUUID() } };
    },
    expect: e(201, 201, 404, 403, 403, 404),
  },
  'POST /api/climate': {
    req: (w) => ({
      method: 'post',
      path: '/api/climate',
      body: { id: randomUUID(), jobId: w.jobA.jobId, airC: 18, rhPct: 60 },
    }),
    expect: e(201, 201, 404, 403, 403, 404),
  },
  'GET /api/customers': {
    req: () => ({ method: 'get', path: '/api/customers' }),
    expect: e(200, 403, 403, 403, 403, 200),
  },
  'POST /api/customers': {
    req: () => ({
      method: 'post',
      path: '/api/customers',
      body: { id: randomUUID(), name: 'New Person' },
    }),
    expect: e(201, 403, 403, 403, 403, 201),
  },
  'DELETE /api/customers/{id}': {
    req: async (w) => ({ method: 'delete', path: `/api/customers/${await fresh.customer(w)}` }),
    expect: e(204, 403, 403, 403, 403, 404),
  },
  'POST /api/customer-links': {
    req: (w) => ({
      method: 'post',
      path: '/api/customer-links',
      body: { customerId: w.jobA.customerId },
    }),
    expect: e(201, 403, 403, 403, 403, 404),
  },
  'GET /api/customer-area': {
    req: () => ({ method: 'get', path: '/api/customer-area' }),
    expect: e(403, 403, 403, 200, 200, 403),
  },
  'GET /api/dev/mail': {
    req: () => ({ method: 'get', path: '/api/dev/mail' }),
    expect: e(200, 403, 403, 403, 403, 200),
  },
  'GET /api/dev/mail/{id}': {
    req: (w) => ({ method: 'get', path: `/api/dev/mail/${w.mailA}` }),
    expect: e(200, 403, 403, 403, 403, 404),
  },
  'GET /api/dev/mail/{id}/attachments/{index}': {
    req: (w) => ({ method: 'get', path: `/api/dev/mail/${w.mailA}/attachments/0` }),
    expect: e(200, 403, 403, 403, 403, 404),
  },
  'GET /api/customers/{id}': {
    req: (w) => ({ method: 'get', path: `/api/customers/${w.jobA.customerId}` }),
    expect: e(200, 403, 403, 403, 403, 404),
  },
  'PATCH /api/customers/{id}': {
    req: (w) => ({
      method: 'patch',
      path: `/api/customers/${w.jobA.customerId}`,
      body: { phone: '555-0101' },
    }),
    expect: e(200, 403, 403, 403, 403, 404),
  },
  'GET /api/follow-ups': {
    req: () => ({ method: 'get', path: '/api/follow-ups' }),
    expect: e(200, 403, 403, 403, 403, 200),
  },
  'POST /api/follow-ups/{id}/cancel': {
    req: async (w) => {
      // A booking three days ahead has its appointment reminder scheduled.
      const { jobId } = await makeJob(w.app, w.s.owner, { startInDays: 3 });
      const list = await ok(w, 'get', `/api/follow-ups?jobId=${jobId}`);
      const [followUp] = list.items as { id: string }[];
      return { method: 'post', path: `/api/follow-ups/${followUp!.id}/cancel` };
    },
    expect: e(200, 403, 403, 403, 403, 404),
  },
  'GET /api/invites': {
    req: () => ({ method: 'get', path: '/api/invites' }),
    expect: e(200, 403, 403, 403, 403, 200),
  },
  'POST /api/invites': {
    req: () => ({
      method: 'post',
      path: '/api/invites',
      body: { email: uniqueEmail('helper'), name: 'New Helper' },
    }),
    expect: e(201, 403, 403, 403, 403, 201),
  },
  'DELETE /api/invites/{id}': {
    req: async (w) => ({ method: 'delete', path: `/api/invites/${await fresh.invite(w)}` }),
    expect: e(204, 403, 403, 403, 403, 404),
  },
  'GET /api/invoices': {
    req: () => ({ method: 'get', path: '/api/invoices' }),
    expect: e(200, 403, 403, 403, 403, 200),
  },
  'GET /api/invoices/{id}': {
    req: (w) => ({ method: 'get', path: `/api/invoices/${w.invoiceA}` }),
    expect: e(200, 403, 403, 403, 403, 404),
  },
  'POST /api/invoices': {
    req: async (w) => ({
      method: 'post',
      path: '/api/invoices',
      body: { id: randomUUID(), jobId: await fresh.job(w) },
    }),
    expect: e(201, 403, 403, 403, 403, 404),
  },
  'GET /api/invoices/{id}/pdf': {
    req: (w) => ({ method: 'get', path: `/api/invoices/${w.invoiceA}/pdf` }),
    expect: e(200, 403, 403, 200, 404, 404),
  },
  'GET /api/jobs': {
    req: () => ({ method: 'get', path: '/api/jobs' }),
    expect: e(200, 200, 200, 200, 200, 200),
  },
  'POST /api/jobs': {
    req: (w) => ({
      method: 'post',
      path: '/api/jobs',
      body: {
        id: randomUUID(),
        customerId: w.jobA.customerId,
        vehicleId: w.jobA.vehicleId,
        windowStart: new Date(Date.now() + 2 * day).toISOString(),
        windowEnd: new Date(Date.now() + 2 * day + 3_600_000).toISOString(),
      },
    }),
    expect: e(201, 403, 403, 403, 403, 404),
  },
  'DELETE /api/jobs/{id}': {
    req: async (w) => ({ method: 'delete', path: `/api/jobs/${await fresh.job(w)}` }),
    expect: e(204, 403, 403, 403, 403, 404),
  },
  'GET /api/jobs/{id}': {
    req: (w) => ({ method: 'get', path: `/api/jobs/${w.jobA.jobId}` }),
    expect: e(200, 200, 404, 200, 404, 404),
  },
  'PATCH /api/jobs/{id}': {
    req: (w) => ({
      method: 'patch',
      path: `/api/jobs/${w.jobA.jobId}`,
      body: { notes: 'side gate' },
    }),
    expect: e(200, 200, 404, 403, 403, 404),
  },
  'POST /api/jobs/{id}/assign': {
    req: async (w) => ({
      method: 'post',
      path: `/api/jobs/${await fresh.job(w)}/assign`,
      body: { techId: null },
    }),
    expect: e(200, 403, 403, 403, 403, 404),
  },
  'POST /api/jobs/{id}/stage': {
    req: async (w) => ({
      method: 'post',
      path: `/api/jobs/${await fresh.job(w)}/stage`,
      body: { stage: 'walkaround' },
    }),
    expect: e(200, 200, 404, 403, 403, 404),
  },
  'GET /api/jobs/{id}/condition-record': {
    req: (w) => ({ method: 'get', path: `/api/jobs/${w.jobA.jobId}/condition-record` }),
    expect: e(200, 200, 404, 200, 404, 404),
  },
  'GET /api/jobs/{id}/documents': {
    req: (w) => ({ method: 'get', path: `/api/jobs/${w.jobA.jobId}/documents` }),
    expect: e(200, 200, 404, 200, 404, 404),
  },
  'GET /api/jobs/{id}/report.pdf': {
    req: (w) => ({ method: 'get', path: `/api/jobs/${w.jobA.jobId}/report.pdf` }),
    expect: e(200, 200, 404, 200, 404, 404),
  },
  'POST /api/jobs/{id}/send-report': {
    req: (w) => ({ method: 'post', path: `/api/jobs/${w.jobA.jobId}/send-report`, body: {} }),
    expect: e(202, 403, 403, 403, 403, 404),
  },
  'POST /api/jobs/{jobId}/payment-requests': {
    req: (w) => ({
      method: 'post',
      path: `/api/jobs/${w.jobA.jobId}/payment-requests`,
      body: { id: randomUUID(), opId: randomUUID(), kind: 'deposit', amountMinor: 100 },
    }),
    expect: e(201, 201, 404, 201, 404, 404),
  },
  'POST /api/payments/{id}/refunds': {
    req: async (w, who) => ({
      method: 'post',
      path: `/api/payments/${who === 'owner' ? await fresh.cardPayment(w) : randomUUID()}/refunds`,
      body: { id: randomUUID(), amountMinor: 500 },
    }),
    expect: e(201, 403, 403, 403, 403, 404),
  },
  'GET /api/jobs/{id}/workspace': {
    req: (w) => ({ method: 'get', path: `/api/jobs/${w.jobA.jobId}/workspace` }),
    expect: e(200, 200, 404, 200, 404, 404),
  },
  'POST /api/jobs/{jobId}/chips': {
    req: (w) => ({
      method: 'post',
      path: `/api/jobs/${w.jobA.jobId}/chips`,
      body: { id: randomUUID(), sizeMm: 1.5, layersPlanned: 2 },
    }),
    expect: e(201, 201, 404, 403, 403, 404),
  },
  'POST /api/jobs/{jobId}/masks': {
    req: (w) => ({
      method: 'post',
      path: `/api/jobs/${w.jobA.jobId}/masks`,
      body: { id: randomUUID(), what: 'Window rubber' },
    }),
    expect: e(201, 201, 404, 403, 403, 404),
  },
  'POST /api/jobs/{jobId}/passes': {
    req: (w) => ({
      method: 'post',
      path: `/api/jobs/${w.jobA.jobId}/passes`,
      body: {
        id: randomUUID(),
        panelId: w.panelA,
        step: 'polish',
        machine: 'dual-action',
        pad: 'foam',
        speedSetting: '4',
        passes: 2,
        result: 'another-pass',
      },
    }),
    expect: e(201, 201, 404, 403, 403, 404),
  },
  'POST /api/jobs/{jobId}/payments': {
    req: (w) => ({
      method: 'post',
      path: `/api/jobs/${w.jobA.jobId}/payments`,
      body: {
        id: randomUUID(),
        opId: randomUUID(),
        kind: 'deposit',
        method: 'cash',
        amountMinor: 100,
      },
    }),
    expect: e(201, 403, 403, 403, 403, 404),
  },
  'POST /api/jobs/{jobId}/pins': {
    req: (w) => ({
      method: 'post',
      path: `/api/jobs/${w.jobA.jobId}/pins`,
      body: { id: randomUUID(), x: 0.2, y: 0.3, kind: 'scratch', severity: 2 },
    }),
    expect: e(201, 201, 404, 403, 403, 404),
  },
  'POST /api/jobs/{jobId}/readings': {
    req: (w) => ({
      method: 'post',
      path: `/api/jobs/${w.jobA.jobId}/readings`,
      body: {
        id: randomUUID(),
        panelId: w.panelA,
        phase: 'before',
        readings: [110, 112, 108],
        unit: 'um',
        gaugeType: 'magnetic-eddy',
      },
    }),
    expect: e(201, 201, 404, 403, 403, 404),
  },
  'POST /api/jobs/{jobId}/solvents': {
    req: (w) => ({
      method: 'post',
      path: `/api/jobs/${w.jobA.jobId}/solvents`,
      body: { id: randomUUID(), productId: w.solventProductId, surfaceTempC: 22, inSun: true },
    }),
    expect: e(201, 201, 404, 403, 403, 404),
  },
  'GET /api/ledger/entries': {
    req: () => ({ method: 'get', path: '/api/ledger/entries', query: LEDGER_RANGE }),
    expect: e(200, 403, 403, 403, 403, 200),
  },
  'GET /api/ledger/jobs': {
    req: () => ({ method: 'get', path: '/api/ledger/jobs', query: LEDGER_RANGE }),
    expect: e(200, 403, 403, 403, 403, 200),
  },
  'GET /api/ledger/months': {
    req: () => ({ method: 'get', path: '/api/ledger/months', query: LEDGER_RANGE }),
    expect: e(200, 403, 403, 403, 403, 200),
  },
  'GET /api/ledger/export/invoices.csv': {
    req: () => ({ method: 'get', path: '/api/ledger/export/invoices.csv', query: LEDGER_RANGE }),
    expect: e(200, 403, 403, 403, 403, 200),
  },
  'GET /api/ledger/export/payments.csv': {
    req: () => ({ method: 'get', path: '/api/ledger/export/payments.csv', query: LEDGER_RANGE }),
    expect: e(200, 403, 403, 403, 403, 200),
  },
  'POST /api/masks/{id}/remove': {
    req: async (w) => ({
      method: 'post',
      path: `/api/masks/${await fresh.mask(w)}/remove`,
      body: {},
    }),
    expect: e(200, 200, 404, 403, 403, 404),
  },
  'PATCH /api/panels/{id}': {
    req: (w) => ({
      method: 'patch',
      path: `/api/panels/${w.panelA}`,
      body: { hardness: 'medium' },
    }),
    expect: e(200, 200, 404, 403, 403, 404),
  },
  'GET /api/payments': {
    req: () => ({ method: 'get', path: '/api/payments' }),
    expect: e(200, 403, 403, 403, 403, 200),
  },
  'GET /api/photos': {
    req: (w) => ({ method: 'get', path: '/api/photos', query: { jobId: w.jobA.jobId } }),
    expect: e(200, 200, 404, 200, 404, 404),
  },
  'POST /api/photos': {
    req: (w) => ({
      method: 'post',
      path: '/api/photos',
      body: {
        id: randomUUID(),
        jobId: w.jobA.jobId,
        kind: 'before',
        sha256: w.blobA,
        mime: 'image/png',
        width: 1,
        height: 1,
        bytes: 1,
      },
    }),
    expect: e(201, 201, 404, 403, 403, 404),
  },
  'DELETE /api/pins/{id}': {
    req: async (w) => ({ method: 'delete', path: `/api/pins/${await fresh.pin(w)}` }),
    expect: e(204, 204, 404, 403, 403, 404),
  },
  'PATCH /api/pins/{id}': {
    req: async (w) => ({
      method: 'patch',
      path: `/api/pins/${await fresh.pin(w)}`,
      body: { note: 'deep' },
    }),
    expect: e(200, 200, 404, 403, 403, 404),
  },
  'GET /api/products': {
    req: () => ({ method: 'get', path: '/api/products' }),
    expect: e(200, 200, 200, 403, 403, 200),
  },
  'POST /api/products': {
    req: () => ({
      method: 'post',
      path: '/api/products',
      body: { id: randomUUID(), name: 'Wool pad', kind: 'pad' },
    }),
    expect: e(201, 403, 403, 403, 403, 201),
  },
  'DELETE /api/products/{id}': {
    req: async (w) => ({ method: 'delete', path: `/api/products/${await fresh.product(w)}` }),
    expect: e(204, 403, 403, 403, 403, 404),
  },
  'GET /api/products/{id}': {
    req: (w) => ({ method: 'get', path: `/api/products/${w.productId}` }),
    expect: e(200, 200, 200, 403, 403, 404),
  },
  'PATCH /api/products/{id}': {
    req: (w) => ({
      method: 'patch',
      path: `/api/products/${w.productId}`,
      body: { lowStockAt: 50 },
    }),
    expect: e(200, 403, 403, 403, 403, 404),
  },
  'GET /api/products/{id}/movements': {
    req: (w) => ({ method: 'get', path: `/api/products/${w.productId}/movements` }),
    expect: e(200, 403, 403, 403, 403, 404),
  },
  'POST /api/products/{id}/stock': {
    req: (w) => ({
      method: 'post',
      path: `/api/products/${w.productId}/stock`,
      body: { id: randomUUID(), qty: 100, reason: 'restock' },
    }),
    expect: e(201, 403, 403, 403, 403, 404),
  },
  'GET /api/quotes': {
    req: () => ({ method: 'get', path: '/api/quotes' }),
    expect: e(200, 403, 403, 200, 200, 200),
  },
  'GET /api/quotes/{id}': {
    req: (w) => ({ method: 'get', path: `/api/quotes/${w.quoteA}` }),
    expect: e(200, 403, 403, 200, 404, 404),
  },
  'PATCH /api/quotes/{id}': {
    req: async (w) => ({
      method: 'patch',
      path: `/api/quotes/${await fresh.quote(w, false)}`,
      body: { validUntil: new Date(Date.now() + 20 * day).toISOString() },
    }),
    expect: e(200, 403, 403, 403, 403, 404),
  },
  'POST /api/quotes/{id}/accept': {
    req: async (w) => ({
      method: 'post',
      path: `/api/quotes/${await fresh.quote(w, true)}/accept`,
      body: {
        jobId: randomUUID(),
        windowStart: new Date(Date.now() + 5 * day).toISOString(),
        windowEnd: new Date(Date.now() + 5 * day + 7_200_000).toISOString(),
      },
    }),
    expect: e(200, 403, 403, 200, 404, 404),
  },
  'POST /api/quotes/{id}/decline': {
    req: async (w) => ({
      method: 'post',
      path: `/api/quotes/${await fresh.quote(w, true)}/decline`,
      body: {},
    }),
    expect: e(200, 403, 403, 200, 404, 404),
  },
  'PUT /api/quotes/{id}/signature-image': {
    req: (w) => ({
      method: 'put',
      path: `/api/quotes/${w.quoteA}/signature-image`,
      body: png(++seed),
      contentType: 'image/png',
    }),
    expect: e(201, 403, 403, 201, 404, 404),
  },
  'POST /api/quotes/{id}/send': {
    req: async (w) => ({
      method: 'post',
      path: `/api/quotes/${await fresh.quote(w, false)}/send`,
      body: {},
    }),
    expect: e(200, 403, 403, 403, 403, 404),
  },
  'GET /api/signatures': {
    req: (w) => ({ method: 'get', path: '/api/signatures', query: { jobId: w.jobA.jobId } }),
    expect: e(200, 200, 404, 200, 404, 404),
  },
  'POST /api/signatures': {
    req: (w) => {
      const record = { jobId: w.jobA.jobId, note: 'Two chips on the hood, swirls everywhere' };
      return {
        method: 'post',
        path: '/api/signatures',
        body: {
          id: randomUUID(),
          jobId: w.jobA.jobId,
          kind: 'condition',
          signerName: 'Signer',
          imageSha256: w.blobA,
          record,
          recordHash: sha(canonicalJson(record)),
        },
      };
    },
    expect: e(201, 201, 404, 201, 404, 404),
  },
  'POST /api/solvents/{id}/flush': {
    req: async (w) => ({
      method: 'post',
      path: `/api/solvents/${await fresh.solvent(w)}/flush`,
      body: {},
    }),
    expect: e(200, 200, 404, 403, 403, 404),
  },
  'GET /api/sync/pull': {
    req: () => ({
      method: 'get',
      path: '/api/sync/pull',
      query: { cursor: '0', scope: '0', clientId: randomUUID() },
    }),
    expect: e(200, 200, 200, 403, 403, 200),
  },
  'POST /api/sync/push': {
    req: () => ({
      method: 'post',
      path: '/api/sync/push',
      body: { clientId: randomUUID(), mutations: [] },
    }),
    expect: e(200, 200, 200, 403, 403, 200),
  },
  'GET /api/timers': {
    req: () => ({ method: 'get', path: '/api/timers' }),
    expect: e(200, 200, 200, 403, 403, 200),
  },
  'POST /api/timers': {
    req: (w) => ({
      method: 'post',
      path: '/api/timers',
      body: {
        id: randomUUID(),
        jobId: w.jobA.jobId,
        kind: 'cure',
        label: 'Layer 1',
        durationMs: 900_000,
      },
    }),
    expect: e(201, 201, 404, 403, 403, 404),
  },
  'POST /api/timers/{id}/ack': {
    req: async (w) => ({
      method: 'post',
      path: `/api/timers/${await fresh.timer(w)}/ack`,
      body: {},
    }),
    expect: e(200, 200, 404, 403, 403, 404),
  },
  'POST /api/timers/{id}/cancel': {
    req: async (w) => ({
      method: 'post',
      path: `/api/timers/${await fresh.timer(w)}/cancel`,
      body: {},
    }),
    expect: e(200, 200, 404, 403, 403, 404),
  },
  'POST /api/timers/{id}/pause': {
    req: async (w) => ({
      method: 'post',
      path: `/api/timers/${await fresh.timer(w)}/pause`,
      body: {},
    }),
    expect: e(200, 200, 404, 403, 403, 404),
  },
  'POST /api/timers/{id}/resume': {
    req: async (w) => ({
      method: 'post',
      path: `/api/timers/${await fresh.timer(w, true)}/resume`,
      body: {},
    }),
    expect: e(200, 200, 404, 403, 403, 404),
  },
  'GET /api/users': {
    req: () => ({ method: 'get', path: '/api/users' }),
    expect: e(200, 403, 403, 403, 403, 200),
  },
  'DELETE /api/users/{id}': {
    req: async (w) => ({ method: 'delete', path: `/api/users/${await fresh.tech(w)}` }),
    expect: e(204, 403, 403, 403, 403, 404),
  },
  'GET /api/vehicles': {
    req: () => ({ method: 'get', path: '/api/vehicles' }),
    expect: e(200, 403, 403, 200, 200, 200),
  },
  'POST /api/vehicles': {
    req: (w) => ({
      method: 'post',
      path: '/api/vehicles',
      body: { id: randomUUID(), customerId: w.jobA.customerId, bodyStyle: 'van' },
    }),
    expect: e(201, 403, 403, 403, 403, 404),
  },
  'DELETE /api/vehicles/{id}': {
    req: async (w) => ({ method: 'delete', path: `/api/vehicles/${await fresh.vehicle(w)}` }),
    expect: e(204, 403, 403, 403, 403, 404),
  },
  'GET /api/vehicles/{id}': {
    req: (w) => ({ method: 'get', path: `/api/vehicles/${w.jobA.vehicleId}` }),
    expect: e(200, 403, 403, 200, 404, 404),
  },
  'PATCH /api/vehicles/{id}': {
    req: (w) => ({
      method: 'patch',
      path: `/api/vehicles/${w.jobA.vehicleId}`,
      body: { colour: 'pearl white' },
    }),
    expect: e(200, 403, 403, 403, 403, 404),
  },
};

/** Routes that need no sign-in: one anonymous call each. */
const PUBLIC: Record<string, PublicRow> = {
  'GET /api/health': { req: () => ({ method: 'get', path: '/api/health' }), status: 200 },
  'GET /api/health/live': {
    req: () => ({ method: 'get', path: '/api/health/live' }),
    status: 200,
  },
  'POST /api/auth/sign-up': {
    req: () => ({
      method: 'post',
      path: '/api/auth/sign-up',
      body: {
        businessName: 'Another Shop',
        name: 'Owner',
        email: uniqueEmail('new'),
        password: 'long enough pw',
      },
    }),
    status: 201,
  },
  'POST /api/auth/sign-in': {
    req: (w) => ({
      method: 'post',
      path: '/api/auth/sign-in',
      body: { email: w.s.owner.user.email, password: 'correct horse battery' },
    }),
    status: 200,
  },
  'POST /api/auth/refresh': {
    req: async (w) => {
      const s = await signUpOwner(w.app, 'refresh');
      return { method: 'post', path: '/api/auth/refresh', body: { refreshToken: s.refreshToken } };
    },
    status: 200,
  },
  'POST /api/auth/sign-out': {
    req: async (w) => {
      const s = await signUpOwner(w.app, 'signout');
      return { method: 'post', path: '/api/auth/sign-out', body: { refreshToken: s.refreshToken } };
    },
    status: 204,
  },
  'POST /api/payments/webhook': {
    req: () => ({
      method: 'post',
      path: '/api/payments/webhook',
      body: { id: 'evt_unsigned', type: 'payment_intent.succeeded' },
    }),
    status: 400,
  },
  'POST /api/customer-links/{token}/redeem': {
    req: async (w) => ({
      method: 'post',
      path: `/api/customer-links/${await fresh.customerLinkToken(w)}/redeem`,
    }),
    status: 200,
  },
  'POST /api/invites/{token}/accept': {
    req: async (w) => {
      const invite = await ok(w, 'post', '/api/invites', {
        email: uniqueEmail('accept'),
        name: 'Helper',
      });
      const token = String(invite.link).split('/invite/')[1];
      return {
        method: 'post',
        path: `/api/invites/${token}/accept`,
        body: { name: 'Helper', password: 'helper password 1' },
      };
    },
    status: 201,
  },
};

// Creating a quote needs the business's own service ids, read from its settings.
MATRIX['POST /api/quotes'] = {
  req: async (w) => {
    const settings = (await ok(w, 'get', '/api/business')).settings as {
      services: { id: string }[];
      sizeClasses: { id: string }[];
      conditions: { id: string }[];
    };
    return {
      method: 'post',
      path: '/api/quotes',
      body: {
        id: randomUUID(),
        customerId: w.jobA.customerId,
        vehicleId: w.jobA.vehicleId,
        inputs: {
          sizeClass: settings.sizeClasses[0]!.id,
          condition: settings.conditions[0]!.id,
          serviceIds: [settings.services[0]!.id],
          chips: 2,
          addOnIds: [],
        },
      },
    };
  },
  expect: e(201, 403, 403, 403, 403, 404),
};

async function send(w: World, r: Req, token?: string) {
  let t = http(w.app)[r.method](r.path);
  if (token) t = t.auth(token, bearer);
  if (r.query) t = t.query(r.query);
  if (r.contentType) t = t.set('Content-Type', r.contentType);
  if (r.body !== undefined) t = t.send(r.body);
  return t;
}

describe('permissions matrix', () => {
  const w = {} as World;
  let routes: string[];
  let mailDir: string;

  beforeAll(async () => {
    w.stripe = await new FakeStripe({ webhookSecret: WEBHOOK_SECRET, duplicateRate: 0 }).start();
    mailDir = await mkdtemp(join(tmpdir(), 'matrix-mail-'));
    w.app = await createTestApp({
      STRIPE_API_HOST: '127.0.0.1',
      STRIPE_API_PORT: String(w.stripe.port),
      STRIPE_API_PROTOCOL: 'http',
      STRIPE_WEBHOOK_SECRET: WEBHOOK_SECRET,
      MAIL_CAPTURE_DIR: mailDir,
    });
    const owner = await signUpOwner(w.app, 'matrix');
    const otherOwner = await signUpOwner(w.app, 'matrix-other');
    const techAssigned = await addTech(w.app, owner, 'matrix-ta');
    const techOther = await addTech(w.app, owner, 'matrix-to');
    w.jobA = await makeJob(w.app, owner, { techId: techAssigned.user.id, bodyStyle: 'sedan' });
    w.jobB = await makeJob(w.app, owner);
    w.s = {
      owner,
      techAssigned,
      techOther,
      customer: await signInCustomer(w.app, owner.user.businessId, w.jobA.customerId),
      otherCustomer: await signInCustomer(w.app, owner.user.businessId, w.jobB.customerId),
      otherOwner,
    };
    w.panelA = childId(w.jobA.jobId, 'panel:roof');
    w.checkA = childId(w.jobA.jobId, 'check:prep.rinse-wash');
    w.productId = await fresh.product(w);
    w.solventProductId = randomUUID();
    await ok(w, 'post', '/api/products', {
      id: w.solventProductId,
      name: 'Tar remover',
      kind: 'solvent',
      properties: { maxDwellMin: 3 },
    });
    w.quoteA = await fresh.quote(w, true);
    const blob = png(0);
    w.blobA = sha(blob);
    await http(w.app)
      .put(`/api/blobs/${w.blobA}`)
      .auth(owner.accessToken, bearer)
      .set('Content-Type', 'image/png')
      .send(blob)
      .expect(201);
    await ok(w, 'post', '/api/photos', {
      id: randomUUID(),
      jobId: w.jobA.jobId,
      kind: 'damage',
      sha256: w.blobA,
      mime: 'image/png',
      width: 1,
      height: 1,
      bytes: blob.length,
    });
    w.invoiceA = randomUUID();
    await ok(w, 'post', '/api/invoices', { id: w.invoiceA, jobId: w.jobA.jobId });
    // A message of business A in the dev inbox, as the capturing SMTP server keeps it.
    const boundary = 'matrix-boundary';
    const raw = [
      'From: Shop <shop@matrix.example>',
      'To: ada@customers.example',
      'Subject: Receipt',
      `X-Panelpass-Business: ${owner.user.businessId}`,
      'MIME-Version: 1.0',
      `Content-Type: multipart/mixed; boundary="${boundary}"`,
      '',
      `--${boundary}`,
      'Content-Type: text/plain; charset=utf-8',
      '',
      'Thank you.',
      `--${boundary}`,
      'Content-Type: application/pdf; name="receipt.pdf"',
      'Content-Disposition: attachment; filename="receipt.pdf"',
      'Content-Transfer-Encoding: base64',
      '',
      Buffer.from('%PDF-1.3 matrix').toString('base64'),
      `--${boundary}--`,
      '',
    ].join('\r\n');
    w.mailA = (
      await new CaptureStore(mailDir).save(Buffer.from(raw), {
        from: 'shop@matrix.example',
        to: ['ada@customers.example'],
      })
    ).id;
    const doc = buildOpenApi(w.app);
    routes = Object.entries(doc.paths).flatMap(([p, ops]) =>
      Object.keys(ops as object)
        .filter((m) => ['get', 'post', 'put', 'patch', 'delete'].includes(m))
        .map((m) => `${m.toUpperCase()} ${p}`),
    );
  });
  afterAll(async () => {
    await w.app.close();
    await w.stripe.stop();
    await rm(mailDir, { recursive: true, force: true });
  });

  it('has a row for every route of the API, and no row for a route that does not exist', () => {
    const covered = [...Object.keys(MATRIX), ...Object.keys(PUBLIC)].sort();
    expect(covered).toEqual([...routes].sort());
  });

  it('answers every signed-in caller as the table says', async () => {
    const mismatches: string[] = [];
    for (const [route, row] of Object.entries(MATRIX)) {
      for (const [i, who] of ROLES.entries()) {
        const r = await row.req(w, who);
        const res = await send(w, r, w.s[who].accessToken);
        if (res.status !== row.expect[i]) {
          mismatches.push(
            `${route} as ${who}: expected ${row.expect[i]}, got ${res.status} ${JSON.stringify(res.body).slice(0, 160)}`,
          );
        }
      }
    }
    expect(mismatches).toEqual([]);
  }, 120_000);

  it('answers the public routes without a sign-in, and every other route 401 without one', async () => {
    for (const [route, row] of Object.entries(PUBLIC)) {
      const res = await send(w, await row.req(w));
      expect({ route, status: res.status }).toEqual({ route, status: row.status });
    }
    for (const [route, row] of Object.entries(MATRIX)) {
      const res = await send(w, await row.req(w, 'owner'));
      expect({ route, status: res.status }).toEqual({ route, status: 401 });
    }
  }, 60_000);
});
