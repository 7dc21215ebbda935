import type { NestExpressApplication } from '@nestjs/platform-express';
import { canonicalJson, childId } from '@panelpass/shared';
import { createHash, randomUUID } from 'node:crypto';
import { deflateSync } from 'node:zlib';
import { DataSource } from 'typeorm';
import { signInCustomer } from './factories/customers';
import { type JobFixture, makeJob } from './factories/records';
import { addTech, createTestApp, http, type Session, signUpOwner } from './support/app';

/**
 * The customer's own phone (issue 7): their business's name and currency, their quotes only,
 * a signature over exactly the quote shown and then acceptance (one job, however often it is
 * sent), and the condition record of their job, read-only and scoped.
 */

const bearer = { type: 'bearer' as const };
const day = 86_400_000;
const sha = (b: Buffer | string) => createHash('sha256').update(b).digest('hex');

/** A valid 1×1 PNG whose single pixel comes from `seed` (so each is a new image). */
function png(seed: number): Buffer {
  const table = Array.from({ length: 256 }, (_, n) => {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    return c >>> 0;
  });
  const crc = (buf: Buffer) => {
    let c = 0xffffffff;
    for (const b of buf) c = table[(c ^ b) & 0xff]! ^ (c >>> 8);
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
  const raw = Buffer.from([0, seed & 0xff, (seed >> 8) & 0xff, 7]);
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', ihdr),
    chunk('IDAT', deflateSync(raw)),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

interface QuoteAnswer {
  id: string;
  status: string;
  currency: string;
  totalMinor: number;
  subtotalMinor: number;
  taxMinor: number;
  depositMinor: number;
  lines: { description: string; amountMinor: number }[];
}

describe('the customer area', () => {
  let app: NestExpressApplication;
  let owner: Session;
  let otherOwner: Session;
  let helper: Session;
  let otherHelper: Session;
  let mine: JobFixture;
  let theirs: JobFixture;
  let customer: Session;
  let otherCustomer: Session;
  let seed = 1;

  const as = (s: Session) => ({
    get: (path: string) => http(app).get(path).auth(s.accessToken, bearer),
    post: (path: string, body: object = {}) =>
      http(app).post(path).auth(s.accessToken, bearer).send(body),
    putPng: (path: string, body: Buffer) =>
      http(app).put(path).auth(s.accessToken, bearer).set('Content-Type', 'image/png').send(body),
  });

  async function quoteFor(job: JobFixture, send = true): Promise<QuoteAnswer> {
    const settings = (await as(owner).get('/api/business').expect(200)).body.settings as {
      services: { id: string }[];
      sizeClasses: { id: string }[];
      conditions: { id: string }[];
    };
    const id = randomUUID();
    await as(owner)
      .post('/api/quotes', {
        id,
        customerId: job.customerId,
        vehicleId: job.vehicleId,
        inputs: {
          sizeClass: settings.sizeClasses[0]!.id,
          condition: settings.conditions[0]!.id,
          serviceIds: [settings.services[0]!.id],
          chips: 3,
          addOnIds: [],
        },
      })
      .expect(201);
    if (send) await as(owner).post(`/api/quotes/${id}/send`).expect(200);
    return (await as(owner).get(`/api/quotes/${id}`).expect(200)).body as QuoteAnswer;
  }

  /** What the customer's screen shows and signs: the quote's own figures and the visit chosen. */
  const shownRecord = (q: QuoteAnswer, windowStart: string, windowEnd: string) => ({
    kind: 'quote',
    quoteId: q.id,
    currency: q.currency,
    lines: q.lines.map((l) => ({ description: l.description, amountMinor: l.amountMinor })),
    subtotalMinor: q.subtotalMinor,
    taxMinor: q.taxMinor,
    totalMinor: q.totalMinor,
    depositMinor: q.depositMinor,
    visit: { windowStart, windowEnd },
  });

  beforeAll(async () => {
    app = await createTestApp();
    owner = await signUpOwner(app, 'cust-area');
    otherOwner = await signUpOwner(app, 'cust-area-other');
    helper = await addTech(app, owner, 'cust-area-helper');
    otherHelper = await addTech(app, owner, 'cust-area-other-helper');
    // A business that works in euros: the customer's answers must say so.
    await http(app)
      .patch('/api/business')
      .auth(owner.accessToken, bearer)
      .send({ currency: 'EUR' })
      .expect(200);
    mine = await makeJob(app, owner, { techId: helper.user.id, bodyStyle: 'sedan' });
    theirs = await makeJob(app, owner);
    customer = await signInCustomer(app, owner.user.businessId, mine.customerId, 'mine');
    otherCustomer = await signInCustomer(app, owner.user.businessId, theirs.customerId, 'theirs');
  });
  afterAll(async () => {
    await app.close();
  });

  it("tells the customer their business's name and currency; no one else has this route", async () => {
    const area = await as(customer).get('/api/customer-area').expect(200);
    expect(area.body).toEqual({
      customer: { id: mine.customerId, name: 'Ada Fernhill' },
      business: { name: expect.any(String), currency: 'EUR', timezone: expect.any(String) },
    });
    const business = await as(owner).get('/api/business').expect(200);
    expect(area.body.business.name).toBe(business.body.name);
    expect((await as(otherCustomer).get('/api/customer-area').expect(200)).body.customer.id).toBe(
      theirs.customerId,
    );
    await as(owner).get('/api/customer-area').expect(403);
    await as(helper).get('/api/customer-area').expect(403);
  });

  it('shows a customer their own sent quotes only, in the business currency; another customer gets 404', async () => {
    const sent = await quoteFor(mine);
    const draft = await quoteFor(mine, false);
    const other = await quoteFor(theirs);
    expect(sent.currency).toBe('EUR');

    const list = await as(customer).get('/api/quotes').expect(200);
    const ids = (list.body.items as { id: string }[]).map((q) => q.id);
    expect(ids).toContain(sent.id);
    expect(ids).not.toContain(draft.id);
    expect(ids).not.toContain(other.id);

    const one = await as(customer).get(`/api/quotes/${sent.id}`).expect(200);
    expect(one.body).toMatchObject({ currency: 'EUR', totalMinor: sent.totalMinor });
    expect(one.body.lines.length).toBeGreaterThan(0);
    expect(one.body.subtotalMinor + one.body.taxMinor).toBeGreaterThanOrEqual(
      one.body.totalMinor - 1,
    );

    // Someone else's quote is not found, whatever is tried with it.
    await as(otherCustomer).get(`/api/quotes/${sent.id}`).expect(404);
    await as(customer).get(`/api/quotes/${draft.id}`).expect(404);
    await as(otherCustomer)
      .putPng(`/api/quotes/${sent.id}/signature-image`, png(++seed))
      .expect(404);
    const image = png(++seed);
    await as(customer).putPng(`/api/quotes/${sent.id}/signature-image`, image).expect(201);
    const record = shownRecord(sent, new Date().toISOString(), new Date().toISOString());
    await as(otherCustomer)
      .post('/api/signatures', {
        id: randomUUID(),
        quoteId: sent.id,
        kind: 'quote',
        signerName: 'Not Them',
        imageSha256: sha(image),
        record,
        recordHash: sha(canonicalJson(record)),
      })
      .expect(404);
    await as(otherCustomer)
      .post(`/api/quotes/${sent.id}/accept`, {
        jobId: randomUUID(),
        windowStart: new Date(Date.now() + 3 * day).toISOString(),
        windowEnd: new Date(Date.now() + 3 * day + 4 * 3_600_000).toISOString(),
      })
      .expect(404);
    await as(otherCustomer).post(`/api/quotes/${sent.id}/decline`).expect(404);
    expect((await as(owner).get(`/api/quotes/${sent.id}`).expect(200)).body.status).toBe('sent');
  });

  it('a signature over the quote shown, then acceptance, books exactly one job at its total', async () => {
    const quote = await quoteFor(mine);
    const windowStart = new Date(Date.now() + 6 * day).toISOString();
    const windowEnd = new Date(Date.now() + 6 * day + 5 * 3_600_000).toISOString();
    const record = shownRecord(quote, windowStart, windowEnd);

    const image = png(++seed);
    const stored = await as(customer)
      .putPng(`/api/quotes/${quote.id}/signature-image`, image)
      .expect(201);
    expect(stored.body).toEqual({ sha256: sha(image), mime: 'image/png', bytes: image.length });
    // Sending the same image again changes nothing.
    await as(customer).putPng(`/api/quotes/${quote.id}/signature-image`, image).expect(200);

    // A record that is not what its hash says is refused: what was signed is what was sent.
    await as(customer)
      .post('/api/signatures', {
        id: randomUUID(),
        quoteId: quote.id,
        kind: 'quote',
        signerName: 'Ada Fernhill',
        imageSha256: sha(image),
        record: { ...record, totalMinor: record.totalMinor - 100 },
        recordHash: sha(canonicalJson(record)),
      })
      .expect(400);

    const signatureId = randomUUID();
    const signature = await as(customer)
      .post('/api/signatures', {
        id: signatureId,
        quoteId: quote.id,
        kind: 'quote',
        signerName: 'Ada Fernhill',
        imageSha256: sha(image),
        record,
        recordHash: sha(canonicalJson(record)),
      })
      .expect(201);
    expect(signature.body).toMatchObject({
      quoteId: quote.id,
      kind: 'quote',
      recordHash: sha(canonicalJson(record)),
    });

    const jobId = randomUUID();
    const accept = { jobId, windowStart, windowEnd };
    const [first, second] = await Promise.all([
      as(customer).post(`/api/quotes/${quote.id}/accept`, accept),
      as(customer).post(`/api/quotes/${quote.id}/accept`, { ...accept, jobId: randomUUID() }),
    ]);
    expect([first.status, second.status]).toEqual([200, 200]);
    expect(first.body.id).toBe(second.body.id);
    expect(first.body).toMatchObject({
      quoteId: quote.id,
      customerId: mine.customerId,
      stage: 'booked',
      priceMinor: quote.totalMinor,
    });
    expect(new Date(first.body.windowStart as string).toISOString()).toBe(windowStart);

    const ds = app.get(DataSource);
    const jobs = await ds.query<{ n: number }[]>(
      'SELECT count(*)::int AS n FROM jobs WHERE quote_id = $1',
      [quote.id],
    );
    expect(jobs[0]!.n).toBe(1);
    const after = await as(customer).get(`/api/quotes/${quote.id}`).expect(200);
    expect(after.body).toMatchObject({ status: 'accepted', jobId: first.body.id });
    // The booked visit is in the customer's own list, with its time window.
    const list = await as(customer).get('/api/jobs').expect(200);
    const booked = (list.body.items as { id: string; windowEnd: string }[]).find(
      (j) => j.id === first.body.id,
    );
    expect(booked && new Date(booked.windowEnd).toISOString()).toBe(windowEnd);

    // The signature is kept with the quote, its image readable by its customer only.
    const sigs = await as(customer).get(`/api/signatures?quoteId=${quote.id}`).expect(200);
    expect((sigs.body as { id: string }[]).map((s) => s.id)).toEqual([signatureId]);
    await as(customer)
      .get(`/api/blobs/${sha(image)}`)
      .expect(200);
    await as(otherCustomer)
      .get(`/api/blobs/${sha(image)}`)
      .expect(404);
    // Accepted is final for the customer: declining now is refused.
    await as(customer).post(`/api/quotes/${quote.id}/decline`).expect(409);
  });

  it('lets the customer decline their quote, after which it cannot be accepted', async () => {
    const quote = await quoteFor(mine);
    const declined = await as(customer).post(`/api/quotes/${quote.id}/decline`).expect(200);
    expect(declined.body.status).toBe('declined');
    const refused = await as(customer)
      .post(`/api/quotes/${quote.id}/accept`, {
        jobId: randomUUID(),
        windowStart: new Date(Date.now() + 2 * day).toISOString(),
        windowEnd: new Date(Date.now() + 2 * day + 3_600_000).toISOString(),
      })
      .expect(409);
    expect(refused.body.code).toBe('quote-status');
  });

  it('refuses a signature image that is too large or not an image, in words', async () => {
    const quote = await quoteFor(mine);
    const big = Buffer.concat([png(++seed), Buffer.alloc(600 * 1024)]);
    const tooBig = await as(customer)
      .putPng(`/api/quotes/${quote.id}/signature-image`, big)
      .expect(413);
    expect(tooBig.body).toMatchObject({ code: 'blob-too-large' });
    const notImage = await as(customer)
      .putPng(`/api/quotes/${quote.id}/signature-image`, Buffer.from('not a picture'))
      .expect(415);
    expect(notImage.body.code).toBe('unsupported-image');
    await as(helper).putPng(`/api/quotes/${quote.id}/signature-image`, png(++seed)).expect(403);
  });

  it('gives the condition record to the owner, the job’s helper and the job’s customer only', async () => {
    const jobId = mine.jobId;
    await as(owner).post(`/api/jobs/${jobId}/stage`, { stage: 'walkaround' }).expect(200);
    await http(app)
      .patch(`/api/jobs/${jobId}`)
      .auth(owner.accessToken, bearer)
      .send({ conditionNotes: 'Stone chips on the bonnet edge.', notes: 'Gate code 4411' })
      .expect(200);
    const pinId = randomUUID();
    await as(owner)
      .post(`/api/jobs/${jobId}/pins`, {
        id: pinId,
        x: 0.4,
        y: 0.2,
        panelKey: 'hood',
        kind: 'chip',
        severity: 2,
        note: 'Three chips',
      })
      .expect(201);
    const roof = childId(jobId, 'panel:roof');
    for (const [phase, readings] of [
      ['before', [120, 122, 118]],
      ['after', [112, 114, 110]],
    ] as const) {
      await as(helper)
        .post(`/api/jobs/${jobId}/readings`, {
          id: randomUUID(),
          panelId: roof,
          phase,
          readings,
          unit: 'um',
          gaugeType: 'magnetic-eddy',
        })
        .expect(201);
    }
    const photo = png(++seed);
    await http(app)
      .put(`/api/blobs/${sha(photo)}`)
      .auth(owner.accessToken, bearer)
      .set('Content-Type', 'image/png')
      .send(photo)
      .expect(201);
    await as(owner)
      .post('/api/photos', {
        id: randomUUID(),
        jobId,
        kind: 'damage',
        sha256: sha(photo),
        mime: 'image/png',
        width: 1,
        height: 1,
        bytes: photo.length,
      })
      .expect(201);
    const signed = { kind: 'condition', jobId, conditionNotes: 'Stone chips on the bonnet edge.' };
    await as(owner)
      .post('/api/signatures', {
        id: randomUUID(),
        jobId,
        kind: 'condition',
        signerName: 'Ada Fernhill',
        imageSha256: sha(photo),
        record: signed,
        recordHash: sha(canonicalJson(signed)),
      })
      .expect(201);

    const seen = await as(customer).get(`/api/jobs/${jobId}/condition-record`).expect(200);
    const r = seen.body;
    expect(r.job).toMatchObject({ id: jobId, conditionNotes: 'Stone chips on the bonnet edge.' });
    expect(JSON.stringify(r)).not.toContain('Gate code 4411');
    expect(r.vehicle).toMatchObject({ bodyStyle: 'sedan' });
    expect(r.thicknessUnit).toBe('um');
    expect(r.pins).toEqual([
      expect.objectContaining({
        id: pinId,
        number: 1,
        x: 0.4,
        y: 0.2,
        panelKey: 'hood',
        panelLabel: 'Hood',
        kind: 'chip',
        note: 'Three chips',
      }),
    ]);
    const roofRow = (r.panels as { panelKey: string }[]).find((p) => p.panelKey === 'roof');
    expect(roofRow).toMatchObject({ beforeUm: 120, afterUm: 112, removedUm: 8 });
    expect(r.photos).toEqual([
      expect.objectContaining({
        kind: 'damage',
        sha256: sha(photo),
        url: `/api/blobs/${sha(photo)}`,
      }),
    ]);
    expect(r.signatures).toEqual([
      expect.objectContaining({
        signerName: 'Ada Fernhill',
        recordHash: sha(canonicalJson(signed)),
        record: signed,
      }),
    ]);
    await as(customer)
      .get(r.photos[0].url as string)
      .expect(200);

    await as(owner).get(`/api/jobs/${jobId}/condition-record`).expect(200);
    await as(helper).get(`/api/jobs/${jobId}/condition-record`).expect(200);
    await as(otherHelper).get(`/api/jobs/${jobId}/condition-record`).expect(404);
    await as(otherCustomer).get(`/api/jobs/${jobId}/condition-record`).expect(404);
    await as(otherOwner).get(`/api/jobs/${jobId}/condition-record`).expect(404);
    // A job with nothing recorded yet answers an empty record, not an error.
    const empty = await as(otherCustomer).get(`/api/jobs/${theirs.jobId}/condition-record`);
    expect(empty.status).toBe(200);
    expect(empty.body).toMatchObject({ pins: [], photos: [], signatures: [], panels: [] });
  });
});
