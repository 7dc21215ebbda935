import type { NestExpressApplication } from '@nestjs/platform-express';
import Decimal from 'decimal.js';
import { randomUUID } from 'node:crypto';
import { DataSource } from 'typeorm';
import { StockService } from '../src/products/stock.service';
import { makeJob } from './factories/records';
import { addTech, createTestApp, http, type Session, signUpOwner } from './support/app';

const bearer = { type: 'bearer' as const };
const MIN = 60_000;
const DAY = 86_400_000;
const ZONE = 'Pacific/Auckland';
/** An hourly cost whose minute cost is not a whole number of cents, so rounding shows. */
const RATE = 3_337;

/** A tiny RFC 4180 reader: quoted fields, doubled quotes, commas and line breaks inside quotes. */
function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let field = '';
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const c = text[i]!;
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') {
        field += '"';
        i++;
      } else if (c === '"') quoted = false;
      else field += c;
    } else if (c === '"') quoted = true;
    else if (c === ',') {
      row.push(field);
      field = '';
    } else if (c === '\r' && text[i + 1] === '\n') {
      row.push(field);
      rows.push(row);
      row = [];
      field = '';
      i++;
    } else if (c === '\n' || c === '\r') {
      throw new Error(`bare line break at ${i}: RFC 4180 lines end with CRLF`);
    } else field += c;
  }
  if (quoted) throw new Error('unterminated quoted field');
  if (field !== '' || row.length) throw new Error('the last line has no CRLF');
  return rows;
}

/** Rows of a CSV as objects keyed by the header row. */
function csvRecords(text: string): Record<string, string>[] {
  const [header, ...rows] = parseCsv(text);
  return rows.map((r) => {
    expect(r).toHaveLength(header!.length);
    return Object.fromEntries(header!.map((h, i) => [h, r[i]!]));
  });
}

/** The local calendar day of an instant in a zone, YYYY-MM-DD. */
const localDay = (at: Date | number, zone = ZONE) =>
  new Intl.DateTimeFormat('en-CA', {
    timeZone: zone,
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
  }).format(at);

/** One field of each item of a list in an answer, as text. */
const pluck = (list: unknown, key: string): string[] =>
  (list as Record<string, unknown>[]).map((item) => String(item[key]));

/** Minor units of USD as a decimal string, computed apart from the app (decimal.js). */
const usd = (minor: number) => new Decimal(minor).div(100).toFixed(2);

interface Interval {
  start: number;
  end: number;
}

/** Whole minutes covered by some interval (overlaps once): the rule the Ledger documents. */
function coveredMinutes(intervals: Interval[]): number {
  const sorted = [...intervals].sort((a, b) => a.start - b.start);
  let total = 0;
  let cur: Interval | null = null;
  for (const iv of sorted) {
    if (cur && iv.start <= cur.end) cur.end = Math.max(cur.end, iv.end);
    else {
      if (cur) total += cur.end - cur.start;
      cur = { ...iv };
    }
  }
  if (cur) total += cur.end - cur.start;
  return Math.floor(total / MIN);
}

const labourCost = (minutes: number) =>
  new Decimal(minutes).mul(RATE).div(60).toDecimalPlaces(0, Decimal.ROUND_HALF_UP).toNumber();

describe('the Ledger: money, materials, labour and profit; CSV for an accountant', () => {
  let app: NestExpressApplication;
  let owner: Session;
  let tech: Session;
  let stranger: Session;

  const post = (who: Session, url: string, body: object) =>
    http(app).post(url).auth(who.accessToken, bearer).send(body);
  const get = (who: Session, url: string) => http(app).get(url).auth(who.accessToken, bearer);

  const today = () => localDay(Date.now());

  /** What the test built, with the figures it expects, computed here and never by the app. */
  const built = {
    jobId: '',
    oldJobId: '',
    invoiceId: '',
    invoiceNumber: 0,
    quoteId: '',
    paymentIds: [] as string[],
    refundId: '',
    oldPaymentId: '',
    strangerIds: [] as string[],
    revenue: 0,
    collected: 0,
    refunded: 0,
    materials: 0,
    minutes: 0,
  };

  async function pay(
    who: Session,
    jobId: string,
    kind: 'deposit' | 'balance' | 'refund',
    method: 'cash' | 'cheque',
    amountMinor: number,
  ): Promise<string> {
    const res = await post(who, `/api/jobs/${jobId}/payments`, {
      id: randomUUID(),
      opId: randomUUID(),
      kind,
      method,
      amountMinor,
    }).expect(201);
    return String(res.body.id);
  }

  async function productAt(unitCostMinor: number, amountPerUse: number): Promise<string> {
    const id = randomUUID();
    await post(owner, '/api/products', {
      id,
      name: `Sap lifter ${unitCostMinor}`,
      kind: 'solvent',
      properties: { maxDwellMin: 4 },
      unit: 'mL',
      stockQty: 1_000,
      amountPerUse,
      unitCostMinor,
    }).expect(201);
    return id;
  }

  beforeAll(async () => {
    app = await createTestApp();
    owner = await signUpOwner(app, 'ledger');
    tech = await addTech(app, owner, 'ledger-tech');
    stranger = await signUpOwner(app, 'ledger-stranger');
    await http(app)
      .patch('/api/business')
      .auth(owner.accessToken, bearer)
      .send({ timezone: ZONE, settings: { labourCostPerHourMinor: RATE } })
      .expect(200);

    // The job of today: three payments in, one refund out, an invoice, products used, timers.
    const { jobId, customerId, vehicleId } = await makeJob(app, owner, {
      startInDays: 0,
      priceMinor: 48_750,
    });
    built.jobId = jobId;
    const moneyIn: [kind: 'deposit' | 'balance', method: 'cash' | 'cheque', minor: number][] = [
      ['deposit', 'cash', 9_750],
      ['balance', 'cheque', 30_001],
      ['balance', 'cash', 8_999],
    ];
    for (const [kind, method, minor] of moneyIn) {
      built.paymentIds.push(await pay(owner, jobId, kind, method, minor));
      built.collected += minor;
    }
    built.refundId = await pay(owner, jobId, 'refund', 'cash', 1_234);
    built.refunded = 1_234;
    built.revenue = built.collected - built.refunded;

    const invoiceId = randomUUID();
    const invoice = await post(owner, '/api/invoices', { id: invoiceId, jobId }).expect(201);
    built.invoiceId = invoiceId;
    built.invoiceNumber = Number(invoice.body.number);

    // A quote, dated today; written straight to the table: the Ledger only reads quotes.
    built.quoteId = randomUUID();
    await app.get(DataSource).query(
      `INSERT INTO quotes (id, business_id, customer_id, vehicle_id, status, total_minor, currency)
       VALUES ($1, $2, $3, $4, 'sent', 61250, 'USD')`,
      [built.quoteId, owner.user.businessId, customerId, vehicleId],
    );

    // Products used on the job, at unit costs with fractions of a cent.
    const uses: [unitCost: number, perUse: number, times: number][] = [
      [2.5, 7.5, 3],
      [0.1234, 33, 2],
      [14.3, 1, 1],
    ];
    const stock = app.get(StockService);
    const actor = {
      userId: owner.user.id,
      businessId: owner.user.businessId,
      role: 'owner' as const,
    };
    let materials = new Decimal(0);
    for (const [unitCost, perUse, times] of uses) {
      const productId = await productAt(unitCost, perUse);
      for (let n = 0; n < times; n++) {
        await app
          .get(DataSource)
          .transaction((m) =>
            stock.recordUse(
              { actor, m, via: 'test' },
              { productId, jobId, sourceType: 'solvent', sourceId: randomUUID() },
            ),
          );
        materials = materials.plus(new Decimal(unitCost).mul(perUse));
      }
    }
    built.materials = materials.toDecimalPlaces(0, Decimal.ROUND_HALF_UP).toNumber();
    // The sum ends in more than half a cent: rounding down would be caught.
    expect(materials.mod(1).toNumber()).toBeGreaterThanOrEqual(0.5);

    // Timers: two overlapping waits, one apart, one still paused, and a keep-dry that is not work.
    const base = Date.now() - 5 * 60 * MIN;
    const waits: { kind: string; start: number; ms: number }[] = [
      { kind: 'cure', start: base, ms: 30 * MIN },
      { kind: 'dwell', start: base + 20 * MIN, ms: 17 * MIN + 30_000 },
      { kind: 'flush', start: base + 90 * MIN, ms: 11 * MIN + 45_000 },
    ];
    const intervals: Interval[] = [];
    for (const w of waits) {
      await post(owner, '/api/timers', {
        id: randomUUID(),
        jobId,
        kind: w.kind,
        label: `A ${w.kind} wait`,
        startedAt: new Date(w.start).toISOString(),
        durationMs: w.ms,
      }).expect(201);
      intervals.push({ start: w.start, end: w.start + w.ms });
    }
    const custom = randomUUID();
    const customStart = Date.now() - 40 * MIN;
    await post(owner, '/api/timers', {
      id: custom,
      jobId,
      kind: 'custom',
      label: 'Working on the hood',
      startedAt: new Date(customStart).toISOString(),
      durationMs: 120 * MIN,
    }).expect(201);
    const pausedAt = customStart + 25 * MIN + 10_000;
    await post(owner, `/api/timers/${custom}/pause`, {
      at: new Date(pausedAt).toISOString(),
    }).expect(200);
    intervals.push({ start: customStart, end: pausedAt });
    await post(owner, '/api/timers', {
      id: randomUUID(),
      jobId,
      kind: 'keep-dry',
      label: 'Keep dry',
      startedAt: new Date(base).toISOString(),
      durationMs: 12 * 60 * MIN,
    }).expect(201);
    built.minutes = coveredMinutes(intervals);
    // The labour cost ends in more than half a cent too.
    expect(new Decimal(built.minutes).mul(RATE).div(60).mod(1).toNumber()).toBeGreaterThan(0.5);

    // A job visited 40 days ago, paid today: its money is in today's entries, not today's jobs.
    const old = await makeJob(app, owner, { startInDays: -40, priceMinor: 20_000 });
    built.oldJobId = old.jobId;
    built.oldPaymentId = await pay(owner, old.jobId, 'balance', 'cash', 20_000);

    // Another business's money and invoice on the same day, which must never show.
    const theirs = await makeJob(app, stranger, { startInDays: 0, priceMinor: 77_700 });
    built.strangerIds.push(theirs.jobId);
    built.strangerIds.push(await pay(stranger, theirs.jobId, 'deposit', 'cash', 7_770));
    const theirInvoice = randomUUID();
    await post(stranger, '/api/invoices', { id: theirInvoice, jobId: theirs.jobId }).expect(201);
    built.strangerIds.push(theirInvoice);
  });
  afterAll(async () => {
    await app.close();
  });

  it('per job: revenue, materials, labour and profit equal the sums computed apart', async () => {
    const res = await get(owner, `/api/ledger/jobs?from=${today()}&to=${today()}`).expect(200);
    expect(pluck(res.body.items, 'jobId')).toEqual([built.jobId]);
    const labour = labourCost(built.minutes);
    expect(res.body).toMatchObject({ currency: 'USD', labourCostPerHourMinor: RATE, total: 1 });
    expect(res.body.items[0]).toMatchObject({
      jobId: built.jobId,
      priceMinor: 48_750,
      collectedMinor: built.collected,
      refundedMinor: built.refunded,
      revenueMinor: built.revenue,
      materialsMinor: built.materials,
      labourMinutes: built.minutes,
      labourMinor: labour,
      profitMinor: built.revenue - built.materials - labour,
      customerName: 'Ada Fernhill',
      vehicleLabel: 'Generic Estate',
    });
  });

  it('labour counts the work timers once where they overlap, never keep-dry', () => {
    // cure 30 min ∪ dwell (from 20 to 37.5) = 37.5; flush 11.75; custom paused after 25 min 10 s.
    expect(built.minutes).toBe(Math.floor(37.5 + 11.75 + 25 + 10 / 60));
  });

  it('per month: each month the range touches, a job counted in the month of its visit', async () => {
    const from = localDay(Date.now() - 45 * DAY);
    const res = await get(owner, `/api/ledger/months?from=${from}&to=${today()}`).expect(200);
    const months: { month: string; jobs: number }[] = res.body.months;
    // Every month from the first to the last, in order, none missing.
    const expected: string[] = [];
    for (let m = from.slice(0, 7); m <= today().slice(0, 7);) {
      expected.push(m);
      const [y, mo] = m.split('-').map(Number) as [number, number];
      m = mo === 12 ? `${y + 1}-01` : `${y}-${String(mo + 1).padStart(2, '0')}`;
    }
    expect(months.map((m) => m.month)).toEqual(expected);
    const oldMonth = localDay(Date.now() - 40 * DAY).slice(0, 7);
    const thisMonth = today().slice(0, 7);
    const labour = labourCost(built.minutes);
    const thisJob = {
      jobs: 1,
      revenueMinor: built.revenue,
      materialsMinor: built.materials,
      labourMinutes: built.minutes,
      labourMinor: labour,
      profitMinor: built.revenue - built.materials - labour,
    };
    const oldJob = {
      jobs: 1,
      revenueMinor: 20_000,
      materialsMinor: 0,
      labourMinutes: 0,
      labourMinor: 0,
      profitMinor: 20_000,
    };
    for (const m of res.body.months as Record<string, number | string>[]) {
      if (m.month === thisMonth && m.month === oldMonth) {
        expect(m).toMatchObject({
          jobs: 2,
          revenueMinor: thisJob.revenueMinor + oldJob.revenueMinor,
          profitMinor: thisJob.profitMinor + oldJob.profitMinor,
        });
      } else if (m.month === thisMonth) expect(m).toMatchObject(thisJob);
      else if (m.month === oldMonth) expect(m).toMatchObject(oldJob);
      else expect(m).toMatchObject({ jobs: 0, revenueMinor: 0, profitMinor: 0 });
    }
    expect(res.body.totals).toEqual({
      jobs: 2,
      revenueMinor: thisJob.revenueMinor + oldJob.revenueMinor,
      materialsMinor: thisJob.materialsMinor,
      labourMinutes: thisJob.labourMinutes,
      labourMinor: thisJob.labourMinor,
      profitMinor: thisJob.profitMinor + oldJob.profitMinor,
    });
  });

  it('entries list the quote, the invoice and the money of the range, refunds negative', async () => {
    const res = await get(owner, `/api/ledger/entries?from=${today()}&to=${today()}`).expect(200);
    const items: { id: string; kind: string; amountMinor: number; invoiceNumber: number | null }[] =
      res.body.items;
    const byId = new Map(items.map((i) => [i.id, i]));
    expect(byId.get(built.quoteId)).toMatchObject({ kind: 'quote', amountMinor: 61_250 });
    expect(byId.get(built.invoiceId)).toMatchObject({
      kind: 'invoice',
      invoiceNumber: built.invoiceNumber,
    });
    expect(byId.get(built.paymentIds[0]!)).toMatchObject({ kind: 'deposit', amountMinor: 9_750 });
    expect(byId.get(built.paymentIds[1]!)).toMatchObject({ kind: 'payment', amountMinor: 30_001 });
    expect(byId.get(built.refundId)).toMatchObject({ kind: 'refund', amountMinor: -1_234 });
    // Paid today for a visit 40 days ago: money is dated when it moved.
    expect(byId.get(built.oldPaymentId)).toMatchObject({ kind: 'payment', amountMinor: 20_000 });
    expect(res.body.total).toBe(1 + 1 + 4 + 1);
    expect(res.body.sums).toEqual({
      quote: { count: 1, amountMinor: 61_250 },
      invoice: { count: 1, amountMinor: 48_750 },
      deposit: { count: 1, amountMinor: 9_750 },
      payment: { count: 3, amountMinor: 30_001 + 8_999 + 20_000 },
      refund: { count: 1, amountMinor: -1_234 },
    });
    // Newest first.
    const times = items.map((i) => (i as unknown as { at: string }).at);
    expect([...times].sort().reverse()).toEqual(times);
  });

  it('entries filter by kind and page without losing or repeating one', async () => {
    const q = `from=${today()}&to=${today()}`;
    const some = await get(owner, `/api/ledger/entries?${q}&kind=deposit,refund`).expect(200);
    expect(pluck(some.body.items, 'kind').sort()).toEqual(['deposit', 'refund']);
    expect(some.body.total).toBe(2);
    const seen: string[] = [];
    for (let offset = 0; offset < 7; offset += 3) {
      const page = await get(owner, `/api/ledger/entries?${q}&limit=3&offset=${offset}`).expect(
        200,
      );
      expect(page.body.total).toBe(7);
      seen.push(...pluck(page.body.items, 'id'));
    }
    expect(new Set(seen).size).toBe(7);
    await get(owner, `/api/ledger/entries?${q}&kind=tips`).expect(400);
  });

  it('the payments CSV parses back (RFC 4180) with a row per payment, amounts exact', async () => {
    const res = await get(
      owner,
      `/api/ledger/export/payments.csv?from=${today()}&to=${today()}`,
    ).expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv; charset=utf-8/);
    expect(res.headers['content-disposition']).toBe(
      `attachment; filename="payments-${today()}-to-${today()}.csv"`,
    );
    const text = res.text;
    expect(text.split('\r\n')[0]).toBe(
      'Paid on,Kind,Method,Amount,Currency,Customer,Vehicle,Invoice number,Payment id,Refund of,Job',
    );
    const records = csvRecords(text);
    const byId = new Map(records.map((r) => [r['Payment id'], r]));
    expect(records).toHaveLength(5);
    expect(byId.get(built.paymentIds[0])).toMatchObject({
      'Paid on': today(),
      Kind: 'deposit',
      Method: 'cash',
      Amount: usd(9_750),
      Currency: 'USD',
      Customer: 'Ada Fernhill',
      'Invoice number': String(built.invoiceNumber),
      Job: built.jobId,
    });
    expect(byId.get(built.paymentIds[1])).toMatchObject({ Method: 'cheque', Amount: usd(30_001) });
    expect(byId.get(built.refundId)).toMatchObject({
      Kind: 'refund',
      Amount: usd(-1_234),
      'Refund of': '',
    });
    expect(byId.get(built.oldPaymentId)).toMatchObject({
      Amount: usd(20_000),
      Job: built.oldJobId,
    });
    const sum = records.reduce((s, r) => s.plus(r.Amount!), new Decimal(0));
    expect(sum.toFixed(2)).toBe(usd(built.revenue + 20_000));
  });

  it('the invoices CSV parses back with the invoice, its tax and total exact', async () => {
    const res = await get(
      owner,
      `/api/ledger/export/invoices.csv?from=${today()}&to=${today()}`,
    ).expect(200);
    const records = csvRecords(res.text);
    expect(records).toHaveLength(1);
    const invoice = await get(owner, `/api/invoices/${built.invoiceId}`).expect(200);
    expect(records[0]).toMatchObject({
      'Invoice number': String(built.invoiceNumber),
      'Issued on': today(),
      Customer: 'Ada Fernhill',
      Subtotal: usd(invoice.body.subtotalMinor),
      Tax: usd(invoice.body.taxMinor),
      Total: usd(48_750),
      Currency: 'USD',
      'Tax rule': invoice.body.taxLabel,
      'Invoice id': built.invoiceId,
    });
    expect(new Decimal(records[0]!.Subtotal!).plus(records[0]!.Tax!).toFixed(2)).toBe(
      records[0]!.Total,
    );
  });

  it('text with commas, quotes and line breaks survives the CSV; a formula never runs', async () => {
    const { jobId, customerId } = await makeJob(app, owner, { startInDays: 0 });
    const name = '=Fernhill, "Ada"\r\nand co';
    await http(app)
      .patch(`/api/customers/${customerId}`)
      .auth(owner.accessToken, bearer)
      .send({ name })
      .expect(200);
    const paymentId = await pay(owner, jobId, 'deposit', 'cash', 1);
    const res = await get(
      owner,
      `/api/ledger/export/payments.csv?from=${today()}&to=${today()}`,
    ).expect(200);
    const row = csvRecords(res.text).find((r) => r['Payment id'] === paymentId);
    expect(row).toMatchObject({ Customer: `'${name}`, Amount: '0.01' });
  });

  it('another business never appears, in any answer or file', async () => {
    const q = `from=${localDay(Date.now() - 60 * DAY)}&to=${today()}`;
    for (const path of [
      `/api/ledger/entries?${q}&limit=200`,
      `/api/ledger/jobs?${q}&limit=200`,
      `/api/ledger/export/payments.csv?${q}`,
      `/api/ledger/export/invoices.csv?${q}`,
    ]) {
      const res = await get(owner, path).expect(200);
      for (const id of built.strangerIds) expect(res.text).not.toContain(id);
    }
    // And the stranger sees only their own.
    const theirs = await get(stranger, `/api/ledger/months?${q}`).expect(200);
    expect(theirs.body.totals).toMatchObject({ jobs: 1, revenueMinor: 7_770 });
  });

  it.each([
    '/api/ledger/entries',
    '/api/ledger/jobs',
    '/api/ledger/months',
    '/api/ledger/export/invoices.csv',
    '/api/ledger/export/payments.csv',
  ])('a helper is refused %s (403)', async (path) => {
    const res = await get(tech, `${path}?from=${today()}&to=${today()}`).expect(403);
    expect(res.body.code).toBe('forbidden');
  });

  it('a range must be real days, in order, at most ten years', async () => {
    const bad = await get(owner, '/api/ledger/months?from=2026-02-30&to=2026-03-01').expect(400);
    expect(bad.body.details[0].field).toBe('from');
    const backwards = await get(owner, '/api/ledger/jobs?from=2026-03-02&to=2026-03-01').expect(
      400,
    );
    expect(backwards.body.details[0].field).toBe('to');
    await get(owner, '/api/ledger/months?from=2000-01-01&to=2020-01-01').expect(400);
    const missing = await get(owner, '/api/ledger/entries').expect(400);
    expect(pluck(missing.body.details, 'field').sort()).toEqual(['from', 'to']);
  });
});
