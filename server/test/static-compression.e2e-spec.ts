import type { NestExpressApplication } from '@nestjs/platform-express';
import { Test } from '@nestjs/testing';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { brotliCompressSync, gzipSync } from 'node:zlib';
import type { Response } from 'supertest';
import { http, useTestEnv } from './support/app';

// Each copy holds different words, so the body (decoded by the client per Content-Encoding)
// tells which file went out, and that its coding header matches its bytes.
const SCRIPT = {
  plain: "console.log('plain');",
  br: "console.log('brotli');",
  gz: "console.log('gzip');",
};
const PAGE = {
  plain: '<!doctype html><title>Panelpass plain</title>',
  br: '<!doctype html><title>Panelpass brotli</title>',
  gz: '<!doctype html><title>Panelpass gzip</title>',
};

/** The body as bytes after content decoding, whatever the type. */
const bytes = (res: Response) => (res.body as Buffer).toString('utf8');
/** Keeps the (decoded) body as bytes: a parser is handed the response stream itself. */
const rawParser = (res: Response, done: (error: Error | null, body: Buffer) => void) => {
  const stream = res as unknown as NodeJS.ReadableStream;
  const chunks: Buffer[] = [];
  stream.on('data', (chunk: Buffer) => chunks.push(chunk));
  stream.on('end', () => done(null, Buffer.concat(chunks)));
};

describe('static app files: precompressed brotli and gzip copies (pwa/scripts/compress.mjs)', () => {
  let app: NestExpressApplication;
  const pwaDist = mkdtempSync(join(tmpdir(), 'panelpass-pwa-compressed-'));

  beforeAll(async () => {
    mkdirSync(join(pwaDist, 'assets'));
    const write = (name: string, copies: { plain: string; br?: string; gz?: string }) => {
      writeFileSync(join(pwaDist, name), copies.plain);
      if (copies.br) writeFileSync(join(pwaDist, `${name}.br`), brotliCompressSync(copies.br));
      if (copies.gz) writeFileSync(join(pwaDist, `${name}.gz`), gzipSync(copies.gz));
    };
    write('index.html', PAGE);
    write('assets/app-1a2b3c.js', SCRIPT);
    write('sw.js', SCRIPT);
    write('manifest.webmanifest', { plain: '{"name":"plain"}', br: '{"name":"brotli"}' });
    write('assets/only-plain-9z8y.css', { plain: 'body{margin:0}' });
    useTestEnv();
    const { AppModule } = await import('../src/app.module');
    const { setupApp } = await import('../src/setup-app');
    const moduleRef = await Test.createTestingModule({ imports: [AppModule] }).compile();
    app = moduleRef.createNestApplication<NestExpressApplication>({ logger: ['error'] });
    setupApp(app, pwaDist);
    await app.init();
  });
  afterAll(async () => {
    await app.close();
    rmSync(pwaDist, { recursive: true, force: true });
  });

  const get = (path: string, acceptEncoding: string) =>
    http(app).get(path).set('Accept-Encoding', acceptEncoding).buffer(true).parse(rawParser);

  it('brotli when the browser takes it (and gzip too): the .br copy, its coding, the script type', async () => {
    const res = await get('/assets/app-1a2b3c.js', 'gzip, deflate, br, zstd').expect(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(bytes(res)).toBe(SCRIPT.br);
    expect(res.headers['content-type']).toBe('text/javascript; charset=utf-8');
    expect(res.headers['vary']).toMatch(/accept-encoding/i);
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
  });

  it('gzip when only gzip is taken, or brotli is refused with q=0', async () => {
    for (const accept of ['gzip', 'br;q=0, gzip;q=0.8', 'deflate, gzip']) {
      const res = await get('/assets/app-1a2b3c.js', accept).expect(200);
      expect(res.headers['content-encoding']).toBe('gzip');
      expect(bytes(res)).toBe(SCRIPT.gz);
      expect(res.headers['content-type']).toBe('text/javascript; charset=utf-8');
      expect(res.headers['vary']).toMatch(/accept-encoding/i);
      expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    }
  });

  it('the file as it is for identity only (Vary still set, so no cache mixes them up)', async () => {
    for (const accept of ['identity', 'br;q=0, gzip;q=0', '*;q=0']) {
      const res = await get('/assets/app-1a2b3c.js', accept).expect(200);
      expect(res.headers['content-encoding']).toBeUndefined();
      expect(bytes(res)).toBe(SCRIPT.plain);
      expect(res.headers['content-type']).toBe('text/javascript; charset=utf-8');
      expect(res.headers['vary']).toMatch(/accept-encoding/i);
      expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    }
  });

  it('a file with no copies goes as it is, whatever is accepted', async () => {
    const res = await get('/assets/only-plain-9z8y.css', 'gzip, br').expect(200);
    expect(res.headers['content-encoding']).toBeUndefined();
    expect(bytes(res)).toBe('body{margin:0}');
    expect(res.headers['content-type']).toBe('text/css; charset=utf-8');
  });

  it('only the copies that exist: brotli for the manifest, but no gzip to fall back on', async () => {
    const br = await get('/manifest.webmanifest', 'br').expect(200);
    expect(br.headers['content-encoding']).toBe('br');
    expect(bytes(br)).toBe('{"name":"brotli"}');
    expect(br.headers['content-type']).toBe('application/manifest+json; charset=utf-8');
    expect(br.headers['cache-control']).toBe('no-cache');
    const gz = await get('/manifest.webmanifest', 'gzip').expect(200);
    expect(gz.headers['content-encoding']).toBeUndefined();
    expect(bytes(gz)).toBe('{"name":"plain"}');
  });

  it('the service worker and index.html outside /assets/: compressed, revalidated each time', async () => {
    const sw = await get('/sw.js', 'gzip, br').expect(200);
    expect(sw.headers['content-encoding']).toBe('br');
    expect(bytes(sw)).toBe(SCRIPT.br);
    expect(sw.headers['cache-control']).toBe('no-cache');
    // The service worker's precache asks for index.html with a revision in the query string.
    const index = await get('/index.html?__WB_REVISION__=abc123', 'gzip').expect(200);
    expect(index.headers['content-encoding']).toBe('gzip');
    expect(bytes(index)).toBe(PAGE.gz);
    expect(index.headers['content-type']).toBe('text/html; charset=utf-8');
    expect(index.headers['cache-control']).toBe('no-cache');
  });

  it('the index.html fallback of app routes is compressed too, with the same headers', async () => {
    for (const [accept, coding, body] of [
      ['gzip, deflate, br', 'br', PAGE.br],
      ['gzip', 'gzip', PAGE.gz],
      ['identity', undefined, PAGE.plain],
    ] as const) {
      const res = await get('/today', accept).expect(200);
      expect(res.headers['content-encoding']).toBe(coding);
      expect(bytes(res)).toBe(body);
      expect(res.headers['content-type']).toBe('text/html; charset=utf-8');
      expect(res.headers['vary']).toMatch(/accept-encoding/i);
      expect(res.headers['cache-control']).toBe('no-cache');
    }
  });

  it('HEAD answers the headers of the copy a GET would send, with no body', async () => {
    const res = await http(app)
      .head('/assets/app-1a2b3c.js')
      .set('Accept-Encoding', 'br')
      .expect(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers['content-type']).toBe('text/javascript; charset=utf-8');
    expect(Number(res.headers['content-length'])).toBe(brotliCompressSync(SCRIPT.br).length);
  });

  it('each representation has its own ETag; revalidating the brotli copy answers 304', async () => {
    const br = await get('/assets/app-1a2b3c.js', 'br').expect(200);
    const plain = await get('/assets/app-1a2b3c.js', 'identity').expect(200);
    const etag = String(br.headers['etag']);
    expect(etag).toBeTruthy();
    expect(etag).not.toBe(String(plain.headers['etag']));
    await get('/assets/app-1a2b3c.js', 'br').set('If-None-Match', etag).expect(304);
  });

  it('API answers are untouched', async () => {
    const res = await http(app).get('/api/health').set('Accept-Encoding', 'br').expect(200);
    expect(res.headers['content-encoding']).toBeUndefined();
    expect(res.headers['content-type']).toMatch(/^application\/json/);
  });
});
