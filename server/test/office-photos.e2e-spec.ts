import type { NestExpressApplication } from '@nestjs/platform-express';
import { canonicalJson } from '@panelpass/shared';
import { createHash, randomUUID } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { signInCustomer } from './factories/customers';
import { makeJob } from './factories/records';
import { addTech, createTestApp, http, type Session, signUpOwner } from './support/app';

const bearer = { type: 'bearer' as const };

/** One field of each item of a list in an answer. */
const pluck = (list: unknown, key: string): unknown[] =>
  (list as Record<string, unknown>[]).map((item) => item[key]);
const sha = (b: Buffer | string) => createHash('sha256').update(b).digest('hex');

/** A 1×1 PNG. */
const PNG = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==',
  'base64',
);

describe('office: blobs, photos and signatures', () => {
  let app: NestExpressApplication;
  let owner: Session;
  let tech: Session;
  const blobDir = mkdtempSync(join(tmpdir(), 'panelpass-blobs-'));

  beforeAll(async () => {
    app = await createTestApp({ BLOB_DIR: blobDir });
    owner = await signUpOwner(app, 'photos');
    tech = await addTech(app, owner);
  });
  afterAll(async () => {
    await app.close();
    rmSync(blobDir, { recursive: true, force: true });
  });

  const upload = (session: Session, body: Buffer, hash = sha(body), type = 'image/png') =>
    http(app)
      .put(`/api/blobs/${hash}`)
      .auth(session.accessToken, bearer)
      .set('Content-Type', type)
      .send(body);

  it('refuses an upload whose bytes do not hash to its address (400)', async () => {
    const res = await upload(owner, PNG, sha('something else')).expect(400);
    expect(res.body.code).toBe('blob-hash-mismatch');
  });

  it('refuses a text file, whatever type it claims, with a clear message (415)', async () => {
    const text = Buffer.from('not an image, just words\n');
    const res = await upload(owner, text, sha(text), 'image/png').expect(415);
    expect(res.body).toMatchObject({
      code: 'unsupported-image',
      message: 'This file is not a JPEG, PNG or WebP image',
    });
  });

  it('refuses an image over 15 MB in the one error shape (413)', async () => {
    const big = Buffer.concat([PNG, Buffer.alloc(15 * 1024 * 1024)]);
    const res = await upload(owner, big).expect(413);
    expect(res.body).toMatchObject({ statusCode: 413, code: 'blob-too-large' });
  });

  it('stores a PNG once and serves it with its type, nosniff and inline', async () => {
    const hash = sha(PNG);
    const first = await upload(tech, PNG).expect(201);
    expect(first.body).toEqual({ sha256: hash, mime: 'image/png', bytes: PNG.length });
    await upload(owner, PNG, hash, 'application/octet-stream').expect(200);
    const res = await http(app)
      .get(`/api/blobs/${hash}`)
      .auth(owner.accessToken, bearer)
      .buffer(true)
      .parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      })
      .expect(200);
    expect(res.headers['content-type']).toBe('image/png');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-disposition']).toBe(`inline; filename="${hash}.png"`);
    expect(Buffer.compare(res.body as Buffer, PNG)).toBe(0);
    // Another business does not have it.
    const stranger = await signUpOwner(app, 'blob-stranger');
    await http(app).get(`/api/blobs/${hash}`).auth(stranger.accessToken, bearer).expect(404);
  });

  it('a photo needs its image uploaded first (409 blob-missing); then it is attached', async () => {
    const { jobId, vehicleId } = await makeJob(app, owner, { techId: tech.user.id });
    const photo = {
      id: randomUUID(),
      jobId,
      kind: 'before',
      mime: 'image/png',
      width: 1,
      height: 1,
      bytes: PNG.length,
      caption: 'Bonnet, driver side',
    };
    const missing = await http(app)
      .post('/api/photos')
      .auth(tech.accessToken, bearer)
      .send({ ...photo, sha256: sha('never uploaded') })
      .expect(409);
    expect(missing.body.code).toBe('blob-missing');
    await upload(tech, PNG);
    const res = await http(app)
      .post('/api/photos')
      .auth(tech.accessToken, bearer)
      .send({ ...photo, sha256: sha(PNG) })
      .expect(201);
    expect(res.body).toMatchObject({ jobId, vehicleId, kind: 'before', sha256: sha(PNG) });
    const list = await http(app)
      .get(`/api/photos?jobId=${jobId}`)
      .auth(owner.accessToken, bearer)
      .expect(200);
    expect(pluck(list.body.items, 'id')).toEqual([photo.id]);
  });

  it('a signature with a wrong record hash is refused; the right one is stored', async () => {
    const { jobId, customerId } = await makeJob(app, owner, { techId: tech.user.id });
    await upload(tech, PNG);
    const record = {
      job: jobId,
      shown: 'Condition at arrival',
      pins: [{ panel: 'hood', note: 'Chip, 2 mm', x: 0.42, y: 0.31 }],
      notes: 'Clear coat failing on the roof',
    };
    const body = {
      id: randomUUID(),
      jobId,
      kind: 'condition',
      signerName: 'Rowan Pellinore',
      imageSha256: sha(PNG),
      record,
    };
    // The hash of the same record with another member order must be the same.
    const reordered = {
      notes: record.notes,
      pins: [{ y: 0.31, x: 0.42, note: 'Chip, 2 mm', panel: 'hood' }],
      shown: record.shown,
      job: jobId,
    };
    const recordHash = sha(canonicalJson(reordered));
    const wrong = await http(app)
      .post('/api/signatures')
      .auth(tech.accessToken, bearer)
      .send({ ...body, recordHash: sha(JSON.stringify({ ...record, notes: 'nothing wrong' })) })
      .expect(400);
    expect(wrong.body).toMatchObject({
      code: 'record-hash-mismatch',
      details: { expected: recordHash },
    });

    const ok = await http(app)
      .post('/api/signatures')
      .auth(tech.accessToken, bearer)
      .send({ ...body, recordHash })
      .expect(201);
    expect(ok.body).toMatchObject({ kind: 'condition', recordHash, record });

    // The job's customer sees it; a customer of another job does not.
    const customer = await signInCustomer(app, owner.user.businessId, customerId);
    const seen = await http(app)
      .get(`/api/signatures?jobId=${jobId}`)
      .auth(customer.accessToken, bearer)
      .expect(200);
    expect(pluck(seen.body, 'id')).toEqual([body.id]);
    await http(app)
      .get(`/api/blobs/${sha(PNG)}`)
      .auth(customer.accessToken, bearer)
      .expect(200);
    const other = await makeJob(app, owner);
    const outsider = await signInCustomer(app, owner.user.businessId, other.customerId);
    await http(app)
      .get(`/api/signatures?jobId=${jobId}`)
      .auth(outsider.accessToken, bearer)
      .expect(404);
    await http(app)
      .get(`/api/blobs/${sha(PNG)}`)
      .auth(outsider.accessToken, bearer)
      .expect(404);
  });

  it('a customer signs acceptance on their own job, never on another', async () => {
    const mine = await makeJob(app, owner);
    const theirs = await makeJob(app, owner);
    const customer = await signInCustomer(app, owner.user.businessId, mine.customerId);
    await upload(owner, PNG);
    const record = { job: mine.jobId, accepted: ['Correction', 'Protection'], totalMinor: 45_000 };
    const sign = (jobId: string) =>
      http(app)
        .post('/api/signatures')
        .auth(customer.accessToken, bearer)
        .send({
          id: randomUUID(),
          jobId,
          kind: 'acceptance',
          signerName: 'Ada Fernhill',
          imageSha256: sha(PNG),
          record,
          recordHash: sha(canonicalJson(record)),
        });
    await sign(theirs.jobId).expect(404);
    await sign(mine.jobId).expect(201);
  });
});
