import type { NestExpressApplication } from '@nestjs/platform-express';
import type { PullResponse } from '@panelpass/shared';
import { randomUUID } from 'node:crypto';
import { request as httpRequest } from 'node:http';
import type { AddressInfo } from 'node:net';
import { brotliDecompressSync, gunzipSync } from 'node:zlib';
import { createTestApp, http, type Session, signUpOwner } from './support/app';

/** One answer as it crossed the wire: status, headers and the bytes before any decoding. */
interface Raw {
  status: number;
  headers: Record<string, string | string[] | undefined>;
  body: Buffer;
}

describe('API answers compressed for a poor line (common/compress-api.ts)', () => {
  let app: NestExpressApplication;
  let owner: Session;
  let base: string;
  const clientId = randomUUID();

  /** A request through a plain socket, so the test sees the coded bytes themselves. */
  const send = (
    method: string,
    path: string,
    headers: Record<string, string>,
    body?: unknown,
  ): Promise<Raw> =>
    new Promise((resolve, reject) => {
      const data = body === undefined ? undefined : Buffer.from(JSON.stringify(body));
      const req = httpRequest(
        base + path,
        {
          method,
          headers: {
            authorization: `Bearer ${owner.accessToken}`,
            ...(data ? { 'content-type': 'application/json' } : {}),
            ...headers,
          },
        },
        (res) => {
          const chunks: Buffer[] = [];
          res.on('data', (c: Buffer) => chunks.push(c));
          res.on('end', () =>
            resolve({
              status: res.statusCode ?? 0,
              headers: res.headers,
              body: Buffer.concat(chunks),
            }),
          );
          res.on('error', reject);
        },
      );
      req.on('error', reject);
      req.end(data);
    });

  const pullPath = `/api/sync/pull?cursor=0&scope=0&clientId=${clientId}`;

  beforeAll(async () => {
    app = await createTestApp();
    await app.listen(0, '127.0.0.1');
    base = `http://127.0.0.1:${(app.getHttpServer().address() as AddressInfo).port}`;
    owner = await signUpOwner(app, 'compress');
    // Enough customers that the pull is several kilobytes of repetitive JSON.
    const mutations = Array.from({ length: 40 }, (_, i) => ({
      id: i + 1,
      name: 'customer.create',
      args: {
        id: randomUUID(),
        name: `Customer number ${i + 1}`,
        notes: 'Gate code at the side door.',
      },
    }));
    await http(app)
      .post('/api/sync/push')
      .auth(owner.accessToken, { type: 'bearer' })
      .send({ clientId, mutations })
      .expect(200);
  });
  afterAll(() => app.close());

  it('a read is sent as brotli when the client takes it, a fraction of its size, the same JSON', async () => {
    const plain = await send('GET', pullPath, {});
    expect(plain.status).toBe(200);
    expect(plain.headers['content-encoding']).toBeUndefined();
    const pulled = JSON.parse(plain.body.toString('utf8')) as PullResponse;
    expect(pulled.changes.customers).toHaveLength(40);

    const br = await send('GET', pullPath, { 'accept-encoding': 'gzip, deflate, br, zstd' });
    expect(br.status).toBe(200);
    expect(br.headers['content-encoding']).toBe('br');
    expect(String(br.headers.vary)).toMatch(/accept-encoding/i);
    expect(br.body.length).toBeLessThan(plain.body.length / 3);
    const decoded = JSON.parse(brotliDecompressSync(br.body).toString('utf8')) as PullResponse;
    expect({ ...decoded, serverTime: 0 }).toEqual({ ...pulled, serverTime: 0 });
  });

  it('gzip for a client that takes only gzip', async () => {
    const gz = await send('GET', pullPath, { 'accept-encoding': 'gzip' });
    expect(gz.headers['content-encoding']).toBe('gzip');
    const decoded = JSON.parse(gunzipSync(gz.body).toString('utf8')) as PullResponse;
    expect(decoded.changes.customers).toHaveLength(40);
  });

  it('writes go plain, whatever their size (a token minted beside chosen input must not leak by length)', async () => {
    const mutations = Array.from({ length: 60 }, (_, i) => ({
      id: 100 + i,
      name: 'customer.create',
      args: { id: randomUUID(), name: `Later customer ${i}` },
    }));
    const push = await send(
      'POST',
      '/api/sync/push',
      { 'accept-encoding': 'br, gzip' },
      { clientId, mutations },
    );
    expect(push.status).toBe(200);
    expect(push.body.length).toBeGreaterThan(1024);
    expect(push.headers['content-encoding']).toBeUndefined();
    JSON.parse(push.body.toString('utf8'));
  });

  it('small answers go plain: compressing them saves nothing', async () => {
    const live = await send('GET', '/api/health/live', { 'accept-encoding': 'br, gzip' });
    expect(live.status).toBe(200);
    expect(live.body.length).toBeLessThan(1024);
    expect(live.headers['content-encoding']).toBeUndefined();
  });
});
