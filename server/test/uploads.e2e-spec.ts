import type { NestExpressApplication } from '@nestjs/platform-express';
import { createHash, randomUUID } from 'node:crypto';
import { mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Response } from 'supertest';
import { makeJob } from './factories/records';
import { createTestApp, http, type Session, signUpOwner } from './support/app';
import { JPEG_3X2, pngOfSize, WEBP_3X2 } from './support/images';

const bearer = { type: 'bearer' as const };
const MB = 1024 * 1024;
const sha = (b: Buffer) => createHash('sha256').update(b).digest('hex');

/** The raw bytes of an answer (supertest only buffers text by itself). */
const asBytes = (r: Response, done: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  r.on('data', (c: Buffer) => chunks.push(c));
  r.on('end', () => done(null, Buffer.concat(chunks)));
};

describe('uploads: checked by content, size and pixel limits, server-made names, safe types', () => {
  let app: NestExpressApplication;
  let owner: Session;
  const blobDir = mkdtempSync(join(tmpdir(), 'panelpass-uploads-'));

  beforeAll(async () => {
    app = await createTestApp({ BLOB_DIR: blobDir });
    owner = await signUpOwner(app, 'uploads');
  });
  afterAll(async () => {
    await app.close();
    rmSync(blobDir, { recursive: true, force: true });
  });

  const put = (body: Buffer, type: string, hash = sha(body)) =>
    http(app)
      .put(`/api/blobs/${hash}`)
      .auth(owner.accessToken, bearer)
      .set('Content-Type', type)
      .send(body);

  it('refuses a 30 MB photo with 413 from its declared length, saying both sizes', async () => {
    // A JPEG start, then 30 MB: refused on Content-Length before the body is read.
    const big = Buffer.concat([JPEG_3X2, Buffer.alloc(30 * MB - JPEG_3X2.length)]);
    const res = await put(big, 'image/jpeg');
    expect(res.status).toBe(413);
    expect(res.body).toEqual({
      statusCode: 413,
      code: 'blob-too-large',
      message: 'A photo may be at most 15 MB; this one is 30.0 MB',
      details: { maxBytes: 15 * MB, bytes: 30 * MB },
    });
  });

  it('refuses a text file named photo.jpg and declared image/jpeg with 415, in words', async () => {
    const text = Buffer.from('Wax on Tuesday, polish on Thursday.\n');
    const res = await http(app)
      .put(`/api/blobs/${sha(text)}`)
      .auth(owner.accessToken, bearer)
      .set('Content-Type', 'image/jpeg')
      .set('Content-Disposition', 'attachment; filename="photo.jpg"')
      .send(text)
      .expect(415);
    expect(res.body).toEqual({
      statusCode: 415,
      code: 'unsupported-image',
      message: 'This file is not a JPEG, PNG or WebP image',
    });
  });

  it('refuses HTML and SVG (script carriers), whatever type they claim', async () => {
    const html = Buffer.from('<!doctype html><html><body><script>alert(1)</script></body></html>');
    const svg = Buffer.from(
      '<svg xmlns="http://www.w3.org/2000/svg" onload="alert(1)"><rect width="1" height="1"/></svg>',
    );
    for (const [body, type] of [
      [html, 'text/html'],
      [html, 'image/png'],
      [svg, 'image/svg+xml'],
      [svg, 'image/webp'],
    ] as const) {
      const res = await put(body, type).expect(415);
      expect(res.body.code).toBe('unsupported-image');
    }
    // Nothing of them was kept.
    const kept = readdirSync(blobDir, { recursive: true }).map(String);
    for (const hash of [sha(html), sha(svg)]) {
      expect(kept.some((name) => name.includes(hash))).toBe(false);
    }
  });

  it('refuses a PNG whose header claims 100,000 × 100,000 px (a decompression bomb) with 422', async () => {
    const bomb = pngOfSize(100_000, 100_000);
    expect(bomb.length).toBeLessThan(200);
    const res = await put(bomb, 'image/png').expect(422);
    expect(res.body).toMatchObject({
      statusCode: 422,
      code: 'image-too-large',
      message:
        'An image may be at most 12,000 px on a side and 50 megapixels; this one is 100,000 × 100,000 px',
    });
  });

  it('refuses a PNG cut short inside its header with 422', async () => {
    const cut = pngOfSize(3, 2).subarray(0, 22);
    const res = await put(Buffer.from(cut), 'image/png').expect(422);
    expect(res.body).toMatchObject({ code: 'image-unreadable' });
  });

  it.each([
    ['JPEG', JPEG_3X2, 'image/jpeg', 'jpg'],
    ['PNG', pngOfSize(3, 2, 7), 'image/png', 'png'],
    ['WebP', WEBP_3X2, 'image/webp', 'webp'],
  ])(
    'takes a real small %s and serves it back as its own type, nosniff, inline under a server-made name',
    async (_, image, mime, ext) => {
      const hash = sha(image);
      // Declared as something else: the type kept is the one found in the bytes.
      const stored = await put(image, 'application/octet-stream').expect(201);
      expect(stored.body).toEqual({ sha256: hash, mime, bytes: image.length });
      const res = await http(app)
        .get(`/api/blobs/${hash}`)
        .auth(owner.accessToken, bearer)
        .buffer(true)
        .parse(asBytes)
        .expect(200);
      expect(res.headers['content-type']).toBe(mime);
      expect(res.headers['x-content-type-options']).toBe('nosniff');
      expect(res.headers['content-disposition']).toBe(`inline; filename="${hash}.${ext}"`);
      expect(Buffer.compare(res.body as Buffer, image)).toBe(0);
      // On disk under the server's name: the SHA-256, nothing of the client's.
      expect(readdirSync(join(blobDir, owner.user.businessId))).toContain(hash);
    },
  );

  it('takes only a PNG as a quote signature image (415 for a JPEG), with its own size words', async () => {
    const job = await makeJob(app, owner);
    const settings = (
      await http(app).get('/api/business').auth(owner.accessToken, bearer).expect(200)
    ).body.settings as {
      services: { id: string }[];
      sizeClasses: { id: string }[];
      conditions: { id: string }[];
    };
    const quoteId = randomUUID();
    await http(app)
      .post('/api/quotes')
      .auth(owner.accessToken, bearer)
      .send({
        id: quoteId,
        customerId: job.customerId,
        vehicleId: job.vehicleId,
        inputs: {
          sizeClass: settings.sizeClasses[0]!.id,
          condition: settings.conditions[0]!.id,
          serviceIds: [settings.services[0]!.id],
          chips: 0,
          addOnIds: [],
        },
      })
      .expect(201);
    const sign = (body: Buffer, type = 'image/png') =>
      http(app)
        .put(`/api/quotes/${quoteId}/signature-image`)
        .auth(owner.accessToken, bearer)
        .set('Content-Type', type)
        .send(body);
    const jpeg = await sign(JPEG_3X2).expect(415);
    expect(jpeg.body).toMatchObject({
      code: 'unsupported-image',
      message: 'This file is not a PNG image (it is image/jpeg)',
    });
    const big = await sign(Buffer.concat([pngOfSize(3, 2), Buffer.alloc(MB)])).expect(413);
    expect(big.body.message).toMatch(
      /^A signature image may be at most 512 KB; this one is 1\.0 MB$/,
    );
    const ok = await sign(pngOfSize(300, 100, 3)).expect(201);
    expect(ok.body).toMatchObject({ mime: 'image/png' });
  });

  it('never echoes or keeps a file name the client sent', async () => {
    const image = pngOfSize(4, 4, 11);
    const res = await http(app)
      .put(`/api/blobs/${sha(image)}?filename=evil.html`)
      .auth(owner.accessToken, bearer)
      .set('Content-Type', 'image/png')
      .set('Content-Disposition', 'attachment; filename="../../evil.html"')
      .send(image)
      .expect(201);
    expect(JSON.stringify(res.body)).not.toContain('evil');
    const got = await http(app)
      .get(`/api/blobs/${sha(image)}`)
      .auth(owner.accessToken, bearer)
      .buffer(true)
      .parse(asBytes)
      .expect(200);
    expect(String(got.headers['content-disposition'])).not.toContain('evil');
    const names = readdirSync(blobDir, { recursive: true }).map(String);
    expect(names.some((n) => n.includes('evil'))).toBe(false);
  });
});
