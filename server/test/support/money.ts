import type { NestExpressApplication } from '@nestjs/platform-express';
import { canonicalJson } from '@panelpass/shared';
import { createHash, randomUUID } from 'node:crypto';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { inflateSync, deflateSync } from 'node:zlib';
import { type CapturedMessage } from '../../src/fakes/smtp/capture-store';
import { CaptureSmtp } from '../../src/fakes/smtp/capture-smtp';
import { FakeStripe } from '../../src/fakes/stripe/fake-stripe';
import { createTestApp, http, type Session } from './app';

/** The webhook signing secret shared by the fake and the app in tests. */
export const WEBHOOK_SECRET = 'whsec_e2e_money_secret';

export interface MoneyWorld {
  app: NestExpressApplication;
  stripe: FakeStripe;
  /** May be replaced by a test that stops and restarts it (same port, same folder). */
  smtp: CaptureSmtp;
  close(): Promise<void>;
}

/**
 * The app listening on a port of its own, with the fake Stripe and the capturing SMTP server
 * started for it on ports of their own (never the development ones), wired together.
 */
export async function startMoneyWorld(overrides: Record<string, string> = {}): Promise<MoneyWorld> {
  const dir = await mkdtemp(join(tmpdir(), 'panelpass-mail-'));
  const stripe = await new FakeStripe({
    webhookSecret: WEBHOOK_SECRET,
    duplicateRate: 0,
    retryDelaysMs: [50, 100, 200, 400],
  }).start();
  const smtp = await new CaptureSmtp({ dir }).start();
  const app = await createTestApp({
    STRIPE_API_HOST: '127.0.0.1',
    STRIPE_API_PORT: String(stripe.port),
    STRIPE_API_PROTOCOL: 'http',
    STRIPE_WEBHOOK_SECRET: WEBHOOK_SECRET,
    STRIPE_MAX_NETWORK_RETRIES: '1',
    MAIL_SENDER: '1',
    MAIL_HOST: '127.0.0.1',
    MAIL_PORT: String(smtp.port),
    MAIL_CAPTURE_DIR: dir,
    MAIL_POLL_MS: '150',
    MAIL_RETRY_BASE_MS: '200',
    PUBLIC_URL: 'http://127.0.0.1:5999',
    ...overrides,
  });
  await app.listen(0, '127.0.0.1');
  const port = (app.getHttpServer().address() as { port: number }).port;
  stripe.setWebhook(`http://127.0.0.1:${port}/api/payments/webhook`);
  const world: MoneyWorld = {
    app,
    stripe,
    smtp,
    async close() {
      await stripe.stop();
      await app.close();
      await world.smtp.stop();
      await rm(dir, { recursive: true, force: true });
    },
  };
  return world;
}

export const bearer = { type: 'bearer' as const };

/** Moves a job forward stage by stage to `to`. */
export async function moveTo(
  app: NestExpressApplication,
  s: Session,
  jobId: string,
  to: string,
): Promise<void> {
  const order = ['booked', 'walkaround', 'prep', 'correction', 'finish', 'handover', 'closed'];
  const job = await http(app).get(`/api/jobs/${jobId}`).auth(s.accessToken, bearer).expect(200);
  for (let i = order.indexOf(job.body.stage as string) + 1; i <= order.indexOf(to); i++) {
    await http(app)
      .post(`/api/jobs/${jobId}/stage`)
      .auth(s.accessToken, bearer)
      .send({ stage: order[i] })
      .expect(200);
  }
}

/** Posts the card form of the fake's payment page; 303 when it paid (or asks for approval). */
export function payOnPage(url: string, card: string): Promise<Response> {
  return fetch(url, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ card, exp: '11/39', cvc: '321', name: 'Ada Fernhill' }).toString(),
  });
}

/** Waits until `check` answers something, or fails after `ms`. */
export async function eventually<T>(
  check: () => Promise<T | null | undefined | false>,
  ms = 10_000,
  what = 'the condition',
): Promise<T> {
  const until = Date.now() + ms;
  for (;;) {
    const v = await check();
    if (v) return v;
    if (Date.now() > until) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

/** Captured messages of one business. */
export async function mailOf(smtp: CaptureSmtp, businessId: string): Promise<CapturedMessage[]> {
  return (await smtp.store.list()).filter((m) => m.businessId === businessId);
}

/** A valid 2×2 PNG whose pixels depend on `seed` (so each is a new blob). */
export function png(seed: number): Buffer {
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
  ihdr.writeUInt32BE(2, 0);
  ihdr.writeUInt32BE(2, 4);
  ihdr[8] = 8;
  ihdr[9] = 2;
  const row = (v: number) => [0, v & 0xff, (v >> 8) & 0xff, 90, 200, 30, 60];
  const raw = Buffer.from([...row(seed), ...row(seed + 7)]);
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', ihdr),
    chunk('IDAT', deflateSync(raw)),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

export const sha = (b: Buffer | string) => createHash('sha256').update(b).digest('hex');

/** Uploads an image as the owner; answers its SHA-256. */
export async function upload(
  app: NestExpressApplication,
  s: Session,
  seed: number,
): Promise<string> {
  const bytes = png(seed);
  const hash = sha(bytes);
  const res = await http(app)
    .put(`/api/blobs/${hash}`)
    .auth(s.accessToken, bearer)
    .set('Content-Type', 'image/png')
    .send(bytes);
  if (res.status !== 201 && res.status !== 200) throw new Error(`upload: ${res.status}`);
  return hash;
}

/** The customer's acceptance signature over a summary of the work. */
export async function acceptanceSignature(
  app: NestExpressApplication,
  s: Session,
  jobId: string,
  imageSha256: string,
): Promise<{ id: string; recordHash: string }> {
  const record = { jobId, summary: 'Two-step correction, six chips filled, ceramic coating' };
  const recordHash = sha(canonicalJson(record));
  const id = randomUUID();
  await http(app)
    .post('/api/signatures')
    .auth(s.accessToken, bearer)
    .send({
      id,
      jobId,
      kind: 'acceptance',
      signerName: 'Ada Fernhill',
      imageSha256,
      record,
      recordHash,
    })
    .expect(201);
  return { id, recordHash };
}

/**
 * The text drawn in a PDF made by pdfkit with its built-in fonts: the content streams
 * inflated, and the hex strings of the text operators decoded and joined.
 */
export function pdfText(pdf: Buffer): string {
  const raw = pdf.toString('latin1');
  const re = /stream\r?\n/g;
  let out = '';
  let m: RegExpExecArray | null;
  while ((m = re.exec(raw)) !== null) {
    const start = m.index + m[0].length;
    const end = raw.indexOf('endstream', start);
    if (end < 0) break;
    try {
      const text = inflateSync(Buffer.from(raw.slice(start, end), 'latin1')).toString('latin1');
      for (const block of text.match(/\[[^\]]*\]\s*TJ/g) ?? []) {
        for (const hex of block.match(/<([0-9a-fA-F]*)>/g) ?? []) {
          out += Buffer.from(hex.slice(1, -1), 'hex').toString('latin1');
        }
        out += '\n';
      }
    } catch {
      // not a deflated stream (an image, say)
    }
    re.lastIndex = end + 'endstream'.length;
  }
  return out;
}
