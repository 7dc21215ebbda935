import type { NestExpressApplication } from '@nestjs/platform-express';
import { bodyStyleTemplate, estimateLabour, priceQuote } from '@panelpass/shared';
import { randomUUID } from 'node:crypto';
import { DataSource } from 'typeorm';
import { signInCustomer } from './factories/customers';
import { makeJob } from './factories/records';
import { addTech, createTestApp, http, type Session, signUpOwner } from './support/app';

const bearer = { type: 'bearer' as const };

/** One field of each item of a list in an answer. */
const pluck = (list: unknown, key: string): unknown[] =>
  (list as Record<string, unknown>[]).map((item) => item[key]);
const day = 86_400_000;

/** Settings of our own for these tests (every section, so nothing comes from the defaults). */
const SETTINGS = {
  services: [
    {
      id: 'wash',
      name: 'Wash',
      priceMinor: 5_500,
      labourMinutes: 3.5,
      labourPer: 'm2',
      step: 'wash',
    },
    {
      id: 'polish',
      name: 'Polish',
      priceMinor: 31_999,
      labourMinutes: 11,
      labourPer: 'm2',
      step: 'polish',
    },
    {
      id: 'seal',
      name: 'Sealant',
      priceMinor: 12_345,
      labourMinutes: 40,
      labourPer: 'job',
      step: 'protect',
      taxable: false,
    },
  ],
  sizeClasses: [
    { id: 'compact', name: 'Compact', factor: 0.85 },
    { id: 'big', name: 'Big', factor: 1.3 },
  ],
  conditions: [
    { id: 'fair', name: 'Fair', factor: 1 },
    { id: 'rough', name: 'Rough', factor: 1.175 },
  ],
  chipPriceMinor: 1_250,
  chipLabourMinutes: 7,
  addOns: [{ id: 'glass', name: 'Glass treatment', priceMinor: 3_333, labourMinutes: 20 }],
  travel: {
    bands: [
      { upToKm: 8, feeMinor: 0 },
      { upToKm: 30, feeMinor: 1_999 },
    ],
    taxable: true,
  },
  tax: { rateBp: 725, basis: 'per-line', rounding: 'half-even' },
  deposit: { kind: 'percent', percentBp: 2_500, roundToMinor: 100 },
  units: { thickness: 'mil', temperature: 'F' },
  waits: { keepDryHours: 12, maintenanceReminderMonths: 4 },
  labourCostPerHourMinor: 4_000,
  drive: { roadFactor: 1.25, averageSpeedKmh: 50 },
};

const INPUTS = {
  sizeClass: 'big',
  condition: 'rough',
  serviceIds: ['wash', 'polish', 'seal'],
  chips: 7,
  addOnIds: ['glass'],
  distanceKm: 21.5,
  discount: { kind: 'percent', percentBp: 1_050 },
  notes: 'Sap on the roof',
};

describe('office: settings and quotes', () => {
  let app: NestExpressApplication;
  let owner: Session;
  let tech: Session;

  beforeAll(async () => {
    app = await createTestApp();
    owner = await signUpOwner(app, 'quotes');
    tech = await addTech(app, owner);
  });
  afterAll(async () => {
    await app.close();
  });

  const newQuote = async (customerId: string, vehicleId: string, inputs: object = INPUTS) => {
    const res = await http(app)
      .post('/api/quotes')
      .auth(owner.accessToken, bearer)
      .send({ id: randomUUID(), customerId, vehicleId, inputs })
      .expect(201);
    return res.body as { id: string; totalMinor: number; status: string };
  };

  it('a new business has complete default settings; a helper sees only the name', async () => {
    const own = await http(app).get('/api/business').auth(owner.accessToken, bearer).expect(200);
    expect(own.body.settings.sizeClasses.length).toBeGreaterThan(0);
    expect(own.body.settings.tax).toEqual(expect.objectContaining({ rateBp: expect.any(Number) }));
    const theirs = await http(app).get('/api/business').auth(tech.accessToken, bearer).expect(200);
    expect(Object.keys(theirs.body).sort()).toEqual(['id', 'name']);
  });

  it('settings are validated: a tax rate above 100 % is refused naming settings.tax.rateBp', async () => {
    const res = await http(app)
      .patch('/api/business')
      .auth(owner.accessToken, bearer)
      .send({ settings: { tax: { rateBp: 12_500, basis: 'per-line', rounding: 'half-up' } } })
      .expect(400);
    expect(res.body.code).toBe('validation-failed');
    expect(res.body.details).toEqual([expect.objectContaining({ field: 'settings.tax.rateBp' })]);
    const zone = await http(app)
      .patch('/api/business')
      .auth(owner.accessToken, bearer)
      .send({ timezone: 'Mars/Olympus_Mons', currency: 'dollars' })
      .expect(400);
    expect(pluck(zone.body.details, 'field').sort()).toEqual(['currency', 'timezone']);
    const bands = await http(app)
      .patch('/api/business')
      .auth(owner.accessToken, bearer)
      .send({
        settings: {
          travel: {
            bands: [
              { upToKm: 20, feeMinor: 0 },
              { upToKm: 10, feeMinor: 500 },
            ],
            taxable: true,
          },
        },
      })
      .expect(400);
    expect(bands.body.details[0].field).toBe('settings.travel.bands.1.upToKm');
  });

  it('a settings section sent replaces that section only', async () => {
    const res = await http(app)
      .patch('/api/business')
      .auth(owner.accessToken, bearer)
      .send({
        name: 'Saltmarsh Gloss Co',
        timezone: 'America/Chicago',
        settings: { chipPriceMinor: 1_100 },
      })
      .expect(200);
    expect(res.body).toMatchObject({ name: 'Saltmarsh Gloss Co', timezone: 'America/Chicago' });
    expect(res.body.settings.chipPriceMinor).toBe(1_100);
    expect(res.body.settings.sizeClasses.length).toBeGreaterThan(0);
  });

  it("a quote's totals, lines and labour are shared pricing's for the same inputs", async () => {
    await http(app)
      .patch('/api/business')
      .auth(owner.accessToken, bearer)
      .send({ currency: 'USD', settings: SETTINGS })
      .expect(200);
    const { customerId, vehicleId } = await makeJob(app, owner, { bodyStyle: 'suv' });
    const quote = await newQuote(customerId, vehicleId);

    // The same quote, written out by hand in the pricing's own terms.
    const expected = priceQuote({
      currency: 'USD',
      lines: [
        { kind: 'service', label: 'Wash', priceMinor: 5_500, taxable: true },
        { kind: 'service', label: 'Polish', priceMinor: 31_999, taxable: true },
        { kind: 'service', label: 'Sealant', priceMinor: 12_345, taxable: false },
        { kind: 'per-chip', label: 'Chip touch-up', unitPriceMinor: 1_250, count: 7 },
        { kind: 'add-on', label: 'Glass treatment', priceMinor: 3_333, taxable: true },
      ],
      sizeFactor: '1.3',
      conditionFactor: '1.175',
      travel: { distanceKm: 21.5, bands: SETTINGS.travel.bands, taxable: true },
      discount: { kind: 'percent', percent: '10.5' },
      tax: { ratePercent: '7.25', basis: 'per-line', rounding: 'half-even' },
      deposit: { kind: 'percent', percent: '25', roundToMinor: 100 },
    });
    const labour = estimateLabour({
      panels: bodyStyleTemplate('suv'),
      steps: [
        { step: 'wash', minutesPerM2: 3.5 },
        { step: 'polish', minutesPerM2: 11 },
        { step: 'protect', minutesPerM2: 0 },
      ],
      fixedMin: 40 + 20 + 7 * 7,
    });
    const full = await http(app)
      .get(`/api/quotes/${quote.id}`)
      .auth(owner.accessToken, bearer)
      .expect(200);
    expect(full.body).toMatchObject({
      status: 'draft',
      currency: 'USD',
      subtotalMinor: expected.subtotalMinor,
      discountMinor: expected.discountMinor,
      taxMinor: expected.taxMinor,
      totalMinor: expected.totalMinor,
      depositMinor: expected.depositMinor,
      labourHours: Math.round((labour.totalMin / 60) * 100) / 100,
    });
    const lines = full.body.lines as { kind: string; amountMinor: number; position: number }[];
    expect(lines.map((l) => l.amountMinor)).toEqual([
      ...expected.lines.map((l) => l.amountMinor),
      expected.travelMinor,
      -expected.discountMinor,
    ]);
    expect(lines.reduce((a, l) => a + l.amountMinor, 0)).toBe(expected.subtotalMinor);
    expect(expected.travelMinor).toBe(1_999);
  });

  it('an unknown service id or size class is refused naming the input', async () => {
    const { customerId, vehicleId } = await makeJob(app, owner);
    const res = await http(app)
      .post('/api/quotes')
      .auth(owner.accessToken, bearer)
      .send({
        id: randomUUID(),
        customerId,
        vehicleId,
        inputs: { ...INPUTS, serviceIds: ['wash', 'laser'] },
      })
      .expect(400);
    expect(res.body.details[0].field).toBe('inputs.serviceIds.1');
    const far = await http(app)
      .post('/api/quotes')
      .auth(owner.accessToken, bearer)
      .send({ id: randomUUID(), customerId, vehicleId, inputs: { ...INPUTS, distanceKm: 80 } })
      .expect(400);
    expect(far.body.details[0].field).toBe('inputs.distanceKm');
  });

  it('updating a quote reprices it; fewer lines leave tombstones, not stale lines', async () => {
    const { customerId, vehicleId } = await makeJob(app, owner);
    const quote = await newQuote(customerId, vehicleId);
    const res = await http(app)
      .patch(`/api/quotes/${quote.id}`)
      .auth(owner.accessToken, bearer)
      .send({
        inputs: { ...INPUTS, serviceIds: ['wash'], chips: 0, addOnIds: [], discount: undefined },
      })
      .expect(200);
    expect(pluck(res.body.lines, 'kind')).toEqual(['service', 'travel']);
    expect(res.body.totalMinor).toBeLessThan(quote.totalMinor);
    const rows: { deleted: boolean }[] = await app
      .get(DataSource)
      .query('SELECT deleted_at IS NOT NULL AS deleted FROM quote_lines WHERE quote_id = $1', [
        quote.id,
      ]);
    // Before: wash, polish, sealant, chips, glass, travel, discount; after: wash, travel.
    expect(rows.filter((r) => !r.deleted)).toHaveLength(2);
    expect(rows.filter((r) => r.deleted)).toHaveLength(5);
  });

  it('accepting creates exactly one booked job at the quote total, even when sent twice', async () => {
    const { customerId, vehicleId } = await makeJob(app, owner);
    const quote = await newQuote(customerId, vehicleId);
    const start = Date.now() + 3 * day;
    const accept = (jobId: string) =>
      http(app)
        .post(`/api/quotes/${quote.id}/accept`)
        .auth(owner.accessToken, bearer)
        .send({
          jobId,
          windowStart: new Date(start).toISOString(),
          windowEnd: new Date(start + 4 * 3_600_000).toISOString(),
        });
    const [a, b] = await Promise.all([accept(randomUUID()), accept(randomUUID())]);
    expect([a.status, b.status]).toEqual([200, 200]);
    expect(a.body.id).toBe(b.body.id);
    const again = await accept(randomUUID()).expect(200);
    expect(again.body.id).toBe(a.body.id);
    expect(a.body).toMatchObject({
      stage: 'booked',
      priceMinor: quote.totalMinor,
      quoteId: quote.id,
    });
    const ds = app.get(DataSource);
    const rows: unknown[] = await ds.query('SELECT id FROM jobs WHERE quote_id = $1', [quote.id]);
    expect(rows).toHaveLength(1);
    const after = await http(app).get(`/api/quotes/${quote.id}`).auth(owner.accessToken, bearer);
    expect(after.body).toMatchObject({ status: 'accepted', jobId: a.body.id });
    const decline = await http(app)
      .post(`/api/quotes/${quote.id}/decline`)
      .auth(owner.accessToken, bearer)
      .expect(409);
    expect(decline.body).toMatchObject({ code: 'quote-status', details: { status: 'accepted' } });
  });

  it("a customer sees their own sent quotes only: a draft or another customer's quote is 404", async () => {
    const mine = await makeJob(app, owner);
    const other = await makeJob(app, owner);
    const customer = await signInCustomer(app, owner.user.businessId, mine.customerId);
    const myQuote = await newQuote(mine.customerId, mine.vehicleId);
    const theirQuote = await newQuote(other.customerId, other.vehicleId);
    await http(app)
      .post(`/api/quotes/${theirQuote.id}/send`)
      .auth(owner.accessToken, bearer)
      .expect(200);

    await http(app).get(`/api/quotes/${myQuote.id}`).auth(customer.accessToken, bearer).expect(404);
    await http(app)
      .get(`/api/quotes/${theirQuote.id}`)
      .auth(customer.accessToken, bearer)
      .expect(404);
    await http(app)
      .post(`/api/quotes/${myQuote.id}/send`)
      .auth(owner.accessToken, bearer)
      .expect(200);
    await http(app).get(`/api/quotes/${myQuote.id}`).auth(customer.accessToken, bearer).expect(200);
    const list = await http(app).get('/api/quotes').auth(customer.accessToken, bearer).expect(200);
    expect(pluck(list.body.items, 'id')).toEqual([myQuote.id]);
    await http(app)
      .post(`/api/quotes/${theirQuote.id}/decline`)
      .auth(customer.accessToken, bearer)
      .expect(404);
    await http(app).get('/api/quotes').auth(tech.accessToken, bearer).expect(403);
  });

  it('the customer accepts their sent quote and a job is booked for them', async () => {
    const mine = await makeJob(app, owner);
    const customer = await signInCustomer(app, owner.user.businessId, mine.customerId);
    const quote = await newQuote(mine.customerId, mine.vehicleId);
    await http(app)
      .post(`/api/quotes/${quote.id}/send`)
      .auth(owner.accessToken, bearer)
      .expect(200);
    const start = Date.now() + 5 * day;
    const jobId = randomUUID();
    const res = await http(app)
      .post(`/api/quotes/${quote.id}/accept`)
      .auth(customer.accessToken, bearer)
      .send({
        jobId,
        windowStart: new Date(start).toISOString(),
        windowEnd: new Date(start + 3_600_000).toISOString(),
      })
      .expect(200);
    expect(res.body).toMatchObject({ id: jobId, customerId: mine.customerId, stage: 'booked' });
    const job = await http(app)
      .get(`/api/jobs/${jobId}`)
      .auth(customer.accessToken, bearer)
      .expect(200);
    expect(job.body.priceMinor).toBe(quote.totalMinor);
    const audit = await http(app)
      .get(`/api/audit?subjectId=${quote.id}`)
      .auth(owner.accessToken, bearer)
      .expect(200);
    expect(audit.body.items[0]).toMatchObject({
      command: 'quote.accept',
      userId: customer.user.id,
    });
  });
});
