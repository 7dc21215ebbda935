import type { NestExpressApplication } from '@nestjs/platform-express';
import { type BodyStyle, type PushResponse, priceFromSettings } from '@panelpass/shared';
import { randomUUID } from 'node:crypto';
import { DataSource } from 'typeorm';
import { createTestApp, http, type Session, signUpOwner } from './support/app';

// Issue 8, quotes and booking: the server's totals are shared's `priceFromSettings` (the
// function the phone shows live totals with) for the business's settings; sending e-mails
// the customer a link; an accepted quote books exactly one job, at the window the quote
// offers unless the acceptance names one.

const bearer = { type: 'bearer' as const };
const hour = 3_600_000;
const day = 24 * hour;

/** Invented settings of our own (every pricing section, so nothing comes from the defaults). */
const SETTINGS = {
  services: [
    {
      id: 'wash',
      name: 'Rinse and wash',
      priceMinor: 5_750,
      labourMinutes: 3,
      labourPer: 'm2',
      step: 'wash',
    },
    {
      id: 'cut',
      name: 'Cut and refine',
      priceMinor: 61_999,
      labourMinutes: 22.5,
      labourPer: 'm2',
      step: 'compound',
    },
    {
      id: 'glaze',
      name: 'Glaze coat',
      priceMinor: 14_995,
      labourMinutes: 45,
      labourPer: 'job',
      step: 'protect',
      taxable: false,
    },
  ],
  sizeClasses: [
    { id: 'compact', name: 'Compact', factor: 0.875 },
    { id: 'full', name: 'Full size', factor: 1.333 },
  ],
  conditions: [
    { id: 'kept', name: 'Well kept', factor: 1 },
    { id: 'tired', name: 'Tired', factor: 1.2125 },
  ],
  chipPriceMinor: 1_333,
  chipLabourMinutes: 8,
  addOns: [
    { id: 'wheels', name: 'Wheel faces', priceMinor: 2_999, labourMinutes: 25 },
    { id: 'cabin', name: 'Cabin wipe', priceMinor: 1_750, labourMinutes: 15, taxable: false },
  ],
  travel: {
    bands: [
      { upToKm: 6, feeMinor: 0 },
      { upToKm: 20, feeMinor: 1_750 },
      { upToKm: 45, feeMinor: 3_995 },
    ],
    taxable: false,
  },
  tax: { rateBp: 875, basis: 'per-line', rounding: 'half-up' },
  deposit: { kind: 'percent', percentBp: 3_000, roundToMinor: 500 },
  labourCostPerHourMinor: 3_800,
};

interface QuoteAnswer {
  id: string;
  status: string;
  currency: string;
  subtotalMinor: number;
  discountMinor: number;
  taxMinor: number;
  totalMinor: number;
  depositMinor: number;
  labourHours: number;
  jobId: string | null;
  lines: { kind: string; description: string; quantity: number; amountMinor: number }[];
}

describe('quotes and booking (issue 8)', () => {
  let app: NestExpressApplication;
  let owner: Session;
  let currency: string;

  const as = (s: Session) => ({
    get: (path: string) => http(app).get(path).auth(s.accessToken, bearer),
    post: (path: string, body: object = {}) =>
      http(app).post(path).auth(s.accessToken, bearer).send(body),
    patch: (path: string, body: object) =>
      http(app).patch(path).auth(s.accessToken, bearer).send(body),
  });

  /** A customer (with or without an e-mail address) and their vehicle, as the owner adds them. */
  async function customerWithVehicle(
    bodyStyle: BodyStyle,
    email: string | null = 'pell.oakum@customers.example',
  ): Promise<{ customerId: string; vehicleId: string }> {
    const customerId = randomUUID();
    const vehicleId = randomUUID();
    await as(owner)
      .post('/api/customers', {
        id: customerId,
        name: 'Pell Oakum',
        email,
        address: '12 Saltmarsh Lane, Larkspur Bay',
        lat: 44.6301,
        lng: -124.049,
      })
      .expect(201);
    await as(owner)
      .post('/api/vehicles', {
        id: vehicleId,
        customerId,
        make: 'Orrin',
        model: 'Drift',
        bodyStyle,
      })
      .expect(201);
    return { customerId, vehicleId };
  }

  const linkIn = (text: string): { token: string; quote: string } => {
    const m = /\/c\/([A-Za-z0-9_-]{16,})\?quote=([0-9a-f-]{36})/.exec(text);
    if (!m) throw new Error(`no customer link in: ${text}`);
    return { token: m[1]!, quote: m[2]! };
  };

  beforeAll(async () => {
    app = await createTestApp();
    owner = await signUpOwner(app, 'quotes-booking');
    const business = await as(owner).patch('/api/business', { settings: SETTINGS }).expect(200);
    currency = (business.body as { currency: string }).currency;
  });
  afterAll(async () => {
    await app.close();
  });

  const CASES: { name: string; bodyStyle: BodyStyle; inputs: Record<string, unknown> }[] = [
    {
      name: 'full size, tired, every service, chips, both add-ons, a distance, a percent discount',
      bodyStyle: 'suv',
      inputs: {
        sizeClass: 'full',
        condition: 'tired',
        serviceIds: ['wash', 'cut', 'glaze'],
        chips: 11,
        addOnIds: ['wheels', 'cabin'],
        distanceKm: 19.9,
        discount: { kind: 'percent', percentBp: 1_275 },
      },
    },
    {
      name: 'compact, kept, wash only, a chosen band, a fixed discount',
      bodyStyle: 'hatchback',
      inputs: {
        sizeClass: 'compact',
        condition: 'kept',
        serviceIds: ['wash'],
        chips: 0,
        addOnIds: [],
        travelBand: 45,
        discount: { kind: 'fixed', amountMinor: 777 },
      },
    },
    {
      name: 'chips and an untaxed add-on only, no travel',
      bodyStyle: 'van',
      inputs: {
        sizeClass: 'full',
        condition: 'kept',
        serviceIds: [],
        chips: 4,
        addOnIds: ['cabin'],
      },
    },
  ];

  it.each(CASES)(
    "stores shared's totals, lines and hours: $name",
    async ({ bodyStyle, inputs }) => {
      const { customerId, vehicleId } = await customerWithVehicle(bodyStyle);
      const id = randomUUID();
      const res = await as(owner)
        .post('/api/quotes', { id, customerId, vehicleId, inputs })
        .expect(201);
      const quote = res.body as QuoteAnswer;
      const shared = priceFromSettings(
        SETTINGS as Parameters<typeof priceFromSettings>[0],
        currency,
        inputs as unknown as Parameters<typeof priceFromSettings>[2],
        bodyStyle,
      );
      expect(quote).toMatchObject({
        status: 'draft',
        subtotalMinor: shared.result.subtotalMinor,
        discountMinor: shared.result.discountMinor,
        taxMinor: shared.result.taxMinor,
        totalMinor: shared.result.totalMinor,
        depositMinor: shared.result.depositMinor,
        labourHours: shared.labourHours,
      });
      expect(quote.lines.map((l) => [l.kind, l.description, l.amountMinor])).toEqual(
        shared.lines.map((l) => [l.kind, l.description, l.amountMinor]),
      );
      // The figures add up: the lines are the subtotal, the total is subtotal plus tax.
      expect(quote.lines.reduce((a, l) => a + l.amountMinor, 0)).toBe(quote.subtotalMinor);
      expect(quote.totalMinor).toBe(quote.subtotalMinor + quote.taxMinor);
    },
  );

  it('a quote built on a phone and pushed through sync is priced the same as shared prices it', async () => {
    const { customerId, vehicleId } = await customerWithVehicle('sedan');
    const id = randomUUID();
    const first = CASES[0]!.inputs;
    const second = { ...CASES[1]!.inputs, notes: 'Sap on the roof' };
    const res = await as(owner)
      .post('/api/sync/push', {
        clientId: randomUUID(),
        mutations: [
          { id: 1, name: 'quote.create', args: { id, customerId, vehicleId, inputs: first } },
          { id: 2, name: 'quote.update', args: { id, inputs: second } },
          { id: 3, name: 'quote.send', args: { id } },
        ],
      })
      .expect(200);
    expect((res.body as PushResponse).results.map((r) => r.status)).toEqual([
      'applied',
      'applied',
      'applied',
    ]);
    const quote = (await as(owner).get(`/api/quotes/${id}`).expect(200)).body as QuoteAnswer;
    const shared = priceFromSettings(
      SETTINGS as Parameters<typeof priceFromSettings>[0],
      currency,
      second as unknown as Parameters<typeof priceFromSettings>[2],
      'sedan',
    );
    expect(quote.status).toBe('sent');
    expect(quote.totalMinor).toBe(shared.result.totalMinor);
    expect(quote.depositMinor).toBe(shared.result.depositMinor);
  });

  it('sending e-mails the customer a link to the quote; without an address it is refused', async () => {
    const { customerId, vehicleId } = await customerWithVehicle('wagon');
    const id = randomUUID();
    const quote = (
      await as(owner)
        .post('/api/quotes', { id, customerId, vehicleId, inputs: CASES[1]!.inputs })
        .expect(201)
    ).body as QuoteAnswer;
    await as(owner).post(`/api/quotes/${id}/send`).expect(200);
    const ds = app.get(DataSource);
    const mails = await ds.query<{ to: string; subject: string; text: string; kind: string }[]>(
      'SELECT to_address AS "to", subject, text, kind FROM outbound_mail WHERE subject_id = $1',
      [id],
    );
    expect(mails).toHaveLength(1);
    expect(mails[0]!.to).toBe('pell.oakum@customers.example');
    expect(mails[0]!.kind).toBe('customer-link');
    expect(linkIn(mails[0]!.text).quote).toBe(id);
    const total = (quote.totalMinor / 100).toFixed(2);
    expect(mails[0]!.subject).toContain(total);

    const silent = await customerWithVehicle('sedan', null);
    const draftId = randomUUID();
    await as(owner)
      .post('/api/quotes', { id: draftId, ...silent, inputs: CASES[1]!.inputs })
      .expect(201);
    const refused = await as(owner).post(`/api/quotes/${draftId}/send`).expect(409);
    expect(refused.body.code).toBe('no-email');
    expect((await as(owner).get(`/api/quotes/${draftId}`).expect(200)).body.status).toBe('draft');
  });

  it('accepted through the e-mailed link, the quote books exactly one job, at the window it offers', async () => {
    const { customerId, vehicleId } = await customerWithVehicle('pickup');
    const id = randomUUID();
    const start = new Date(Math.ceil((Date.now() + 5 * day) / hour) * hour);
    const end = new Date(start.getTime() + 4 * hour);
    const inputs = {
      ...CASES[0]!.inputs,
      windowStart: start.toISOString(),
      windowEnd: end.toISOString(),
    };
    const quote = (
      await as(owner).post('/api/quotes', { id, customerId, vehicleId, inputs }).expect(201)
    ).body as QuoteAnswer;
    await as(owner).post(`/api/quotes/${id}/send`).expect(200);
    const ds = app.get(DataSource);
    const [mail] = await ds.query<{ text: string }[]>(
      'SELECT text FROM outbound_mail WHERE subject_id = $1',
      [id],
    );
    const { token } = linkIn(mail!.text);
    const session = (await http(app).post(`/api/customer-links/${token}/redeem`).expect(200))
      .body as Session;
    expect(session.user.role).toBe('customer');

    // Two acceptances at once (a double tap), then the owner's: one job, the same each time.
    const [a, b] = await Promise.all([
      as(session).post(`/api/quotes/${id}/accept`, { jobId: randomUUID() }),
      as(session).post(`/api/quotes/${id}/accept`, { jobId: randomUUID() }),
    ]);
    expect([a.status, b.status]).toEqual([200, 200]);
    expect(a.body.id).toBe(b.body.id);
    const again = await as(owner)
      .post(`/api/quotes/${id}/accept`, { jobId: randomUUID() })
      .expect(200);
    expect(again.body.id).toBe(a.body.id);
    const jobs = await ds.query<{ n: number }[]>(
      'SELECT count(*)::int AS n FROM jobs WHERE quote_id = $1',
      [id],
    );
    expect(jobs[0]!.n).toBe(1);
    const job = (
      await as(owner)
        .get(`/api/jobs/${a.body.id as string}`)
        .expect(200)
    ).body as {
      stage: string;
      priceMinor: number;
      windowStart: string;
      windowEnd: string;
      lat: number | null;
    };
    expect(job).toMatchObject({ stage: 'booked', priceMinor: quote.totalMinor, lat: 44.6301 });
    expect(new Date(job.windowStart).toISOString()).toBe(start.toISOString());
    expect(new Date(job.windowEnd).toISOString()).toBe(end.toISOString());
    const after = (await as(owner).get(`/api/quotes/${id}`).expect(200)).body as QuoteAnswer;
    expect(after).toMatchObject({ status: 'accepted', jobId: a.body.id });
  });

  it('a quote that offers no visit needs a window to be accepted; an offered window must end after it starts', async () => {
    const { customerId, vehicleId } = await customerWithVehicle('coupe');
    const id = randomUUID();
    await as(owner)
      .post('/api/quotes', { id, customerId, vehicleId, inputs: CASES[2]!.inputs })
      .expect(201);
    const refused = await as(owner)
      .post(`/api/quotes/${id}/accept`, { jobId: randomUUID() })
      .expect(400);
    expect(refused.body.code).toBe('window-needed');
    const start = Date.now() + 2 * day;
    const booked = await as(owner)
      .post(`/api/quotes/${id}/accept`, {
        jobId: randomUUID(),
        windowStart: new Date(start).toISOString(),
        windowEnd: new Date(start + 2 * hour).toISOString(),
      })
      .expect(200);
    expect(booked.body.quoteId).toBe(id);

    const backwards = await as(owner)
      .post('/api/quotes', {
        id: randomUUID(),
        customerId,
        vehicleId,
        inputs: {
          ...CASES[2]!.inputs,
          windowStart: new Date(start).toISOString(),
          windowEnd: new Date(start - hour).toISOString(),
        },
      })
      .expect(400);
    expect(backwards.body.details).toEqual([
      expect.objectContaining({ field: 'inputs.windowEnd' }),
    ]);
  });
});
