import type { NestExpressApplication } from '@nestjs/platform-express';
import { Test } from '@nestjs/testing';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Response } from 'supertest';
import { http, useTestEnv } from './support/app';

const ALLOWED = 'https://office.panelpass.test';
const OTHER = 'https://elsewhere.panelpass.test';

/** The directives of a Content-Security-Policy header, by name (CSP Level 3, §2.2). */
function directives(res: Response): Map<string, string[]> {
  const header = String(res.headers['content-security-policy'] ?? '');
  return new Map(
    header
      .split(';')
      .map((d) => d.trim().split(/\s+/))
      .filter((parts) => parts[0])
      .map(([name, ...values]) => [name!.toLowerCase(), values]),
  );
}

describe('response headers: CSP, HSTS, nosniff, Referrer-Policy, CORS allow-list', () => {
  let app: NestExpressApplication;
  const pwaDist = mkdtempSync(join(tmpdir(), 'panelpass-pwa-'));

  beforeAll(async () => {
    writeFileSync(join(pwaDist, 'index.html'), '<!doctype html><title>Panelpass</title>');
    useTestEnv({ CORS_ORIGINS: ALLOWED });
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

  const page = () => http(app).get('/jobs/today').expect(200);
  const api = () => http(app).get('/api/health').expect(200);

  it('serves the app page and an API answer (the responses checked below)', async () => {
    const res = await page();
    expect(res.headers['content-type']).toMatch(/^text\/html/);
    expect(res.text).toContain('<title>Panelpass</title>');
    expect((await api()).headers['content-type']).toMatch(/^application\/json/);
  });

  it('API answers are not stored and carry no ETag; the app page is revalidated', async () => {
    const res = await api();
    expect(res.headers['cache-control']).toBe('no-store');
    expect(res.headers.etag).toBeUndefined();
    expect((await page()).headers['cache-control']).toBe('no-cache');
  });

  it.each([
    ['page', page],
    ['API', api],
  ])(
    '%s: a CSP naming each directive (CSP Level 3), nothing inline for scripts',
    async (_, get) => {
      const csp = directives(await get());
      expect(csp.get('default-src')).toEqual(["'self'"]);
      expect(csp.get('script-src')).toEqual(["'self'"]);
      expect(csp.get('object-src')).toEqual(["'none'"]);
      expect(csp.get('base-uri')).toEqual(["'none'"]);
      expect(csp.get('frame-ancestors')).toEqual(["'none'"]);
      expect(csp.get('form-action')).toEqual(["'self'"]);
      expect(csp.get('connect-src')).toEqual(["'self'"]);
      expect(csp.get('worker-src')).toEqual(["'self'"]);
      expect(csp.get('manifest-src')).toEqual(["'self'"]);
      expect(csp.get('img-src')).toEqual(["'self'", 'data:', 'blob:']);
      for (const values of csp.values()) {
        expect(values).not.toContain('*');
      }
      expect(csp.get('script-src')).not.toContain("'unsafe-inline'");
      expect(csp.get('script-src')).not.toContain("'unsafe-eval'");
    },
  );

  it.each([
    ['page', page],
    ['API', api],
  ])(
    '%s: HSTS for a year with sub-domains (RFC 6797), nosniff, no-referrer, no X-Powered-By',
    async (_, get) => {
      const res = await get();
      const hsts = String(res.headers['strict-transport-security']);
      const maxAge = Number(/max-age=(\d+)/.exec(hsts)?.[1]);
      expect(maxAge).toBeGreaterThanOrEqual(31_536_000);
      expect(hsts).toMatch(/(^|;)\s*includeSubDomains\s*(;|$)/i);
      expect(res.headers['x-content-type-options']).toBe('nosniff');
      expect(res.headers['referrer-policy']).toBe('no-referrer');
      expect(res.headers['x-powered-by']).toBeUndefined();
    },
  );

  describe('CORS (the Fetch standard, CORS protocol)', () => {
    it('reflects an origin on the list, with Vary: Origin and never *', async () => {
      const res = await http(app).get('/api/health').set('Origin', ALLOWED).expect(200);
      expect(res.headers['access-control-allow-origin']).toBe(ALLOWED);
      expect(String(res.headers.vary)).toMatch(/\bOrigin\b/);
      expect(res.headers['access-control-allow-credentials']).toBeUndefined();
    });

    it('gives an origin not on the list no CORS headers (the browser then withholds the answer)', async () => {
      const res = await http(app).get('/api/health').set('Origin', OTHER).expect(200);
      expect(res.headers['access-control-allow-origin']).toBeUndefined();
      expect(String(res.headers.vary)).toMatch(/\bOrigin\b/);
    });

    it('answers the preflight of a listed origin with the methods and headers the app uses', async () => {
      const res = await http(app)
        .options('/api/jobs')
        .set('Origin', ALLOWED)
        .set('Access-Control-Request-Method', 'POST')
        .set('Access-Control-Request-Headers', 'authorization, content-type');
      expect(res.status).toBe(204);
      expect(res.headers['access-control-allow-origin']).toBe(ALLOWED);
      expect(String(res.headers['access-control-allow-methods'])).toContain('POST');
      const allowed = String(res.headers['access-control-allow-headers']).toLowerCase();
      expect(allowed).toContain('authorization');
      expect(allowed).toContain('content-type');
    });

    it('refuses the preflight of any other origin (403, no CORS headers, the one error shape)', async () => {
      for (const origin of [
        OTHER,
        `${ALLOWED}.evil.test`,
        'null',
        ALLOWED.replace('https', 'http'),
      ]) {
        const res = await http(app)
          .options('/api/jobs')
          .set('Origin', origin)
          .set('Access-Control-Request-Method', 'DELETE')
          .expect(403);
        expect(res.headers['access-control-allow-origin']).toBeUndefined();
        expect(res.headers['access-control-allow-methods']).toBeUndefined();
        expect(res.body).toEqual({
          statusCode: 403,
          code: 'cors-origin-refused',
          message: expect.stringContaining('CORS_ORIGINS') as unknown,
        });
      }
    });

    it('leaves same-origin requests (no Origin header) as they are', async () => {
      const res = await http(app).get('/api/health').expect(200);
      expect(res.headers['access-control-allow-origin']).toBeUndefined();
    });
  });
});
