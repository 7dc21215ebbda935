import type { NestExpressApplication } from '@nestjs/platform-express';
import { canonicalJson, childId } from '@panelpass/shared';
import fc from 'fast-check';
import { randomUUID } from 'node:crypto';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Response } from 'supertest';
import { CaptureStore } from '../src/fakes/smtp/capture-store';
import { FakeStripe } from '../src/fakes/stripe/fake-stripe';
import { buildOpenApi } from '../src/setup-app';
import { signInCustomer } from './factories/customers';
import { addTech, createTestApp, http, type Session, signUpOwner } from './support/app';
import {
  ANONYMOUS_AUTH,
  describeRequest,
  type HostileRequest,
  type OpenApiDoc,
  type Pools,
  type Route,
  readCommittedOpenApi,
  requestArb,
  routesOf,
} from './support/hostile';
import { pdfText, png, sha } from './support/money';

/**
 * Hostile input: for every route of the committed OpenAPI document and every kind of caller,
 * generated path ids, query strings and bodies (see support/hostile.ts). Every answer is a 2xx
 * or a 4xx in the one error shape — never a 5xx — and no answer to a caller of one business
 * holds anything of the other business (marker words in its names and notes, its record ids).
 *
 * HOSTILE_RUNS sets the runs per route (each run is sent as all seven callers); HOSTILE_SEED
 * replays a run (the seed is printed on failure); HOSTILE_SHRINK=1 lets fast-check shrink a
 * failure (off by default: the server's state moves on between tries); HOSTILE_STATS=1 prints
 * the statuses each route answered.
 */

const RUNS = Number(process.env.HOSTILE_RUNS ?? 4);
const BASE_SEED = Number(process.env.HOSTILE_SEED ?? Math.floor(Math.random() * 2 ** 31));
const SHRINK = process.env.HOSTILE_SHRINK === '1';
/** HOSTILE_STATS=1 prints how each route answered (statuses per route), to tune the generators. */
const STATS = process.env.HOSTILE_STATS === '1';

const CALLERS = [
  'owner',
  'techAssigned',
  'techOther',
  'customer',
  'otherCustomer',
  'otherOwner',
  'anonymous',
] as const;
type Caller = (typeof CALLERS)[number];

/** Words found nowhere but in each business's own records (compared lower-cased). */
const MARKER = { A: 'qurlewalphamark', B: 'qurlewbravomark' } as const;
type BizKey = keyof typeof MARKER;

const WEBHOOK_SECRET = 'whsec_hostile_input';
const bearer = { type: 'bearer' as const };
const day = 86_400_000;

interface Business {
  marker: string;
  owner: Session;
  techAssigned: Session;
  customerId: string;
  otherCustomerId: string;
  jobId: string;
  /** Every id of the business's records and people, for the pools and the leak check. */
  ids: string[];
  /** The same ids by the path segment of their collection (`jobs`, `users`…). */
  byCollection: Record<string, string[]>;
  sha256s: string[];
  mailIds: string[];
}

const ERROR_KEYS = new Set(['statusCode', 'code', 'message', 'details']);

let blobSeed = 1_000;

async function ok(
  app: NestExpressApplication,
  s: Session,
  method: 'get' | 'post' | 'put' | 'patch',
  path: string,
  body?: object,
): Promise<Record<string, unknown>> {
  const res = await http(app)[method](path).auth(s.accessToken, bearer).send(body);
  if (res.status >= 300)
    throw new Error(`setup ${method} ${path}: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body as Record<string, unknown>;
}

/** A business with one of everything, its words carrying its marker. */
async function seedBusiness(
  app: NestExpressApplication,
  marker: string,
  mailDir: string,
): Promise<Business> {
  const owner = await signUpOwner(app, marker);
  const techAssigned = await addTech(app, owner, `${marker}-ta`);
  const techOther = await addTech(app, owner, `${marker}-to`);
  const spareTech = await addTech(app, owner, `${marker}-spare`);
  const post = (path: string, body: object) => ok(app, owner, 'post', path, body);
  const ids: string[] = [owner.user.businessId, owner.user.id, techAssigned.user.id];
  const byCollection: Record<string, string[]> = { users: [techOther.user.id, spareTech.user.id] };
  ids.push(...byCollection.users!);
  const made = (collection: string, id: string) => {
    ids.push(id);
    (byCollection[collection] ??= []).push(id);
    return id;
  };

  const customer = async (label: string) =>
    made(
      'customers',
      String(
        (
          await post('/api/customers', {
            id: randomUUID(),
            name: `Client ${label} ${marker}`,
            email: `${marker}.${label}@customers.example`,
            phone: '555-0199',
            address: `7 ${marker} Row`,
            notes: `Gate code is ${marker}`,
          })
        ).id,
      ),
    );
  const customerId = await customer('one');
  const otherCustomerId = await customer('two');
  const vehicle = async (customerId: string) =>
    made(
      'vehicles',
      String(
        (
          await post('/api/vehicles', {
            id: randomUUID(),
            customerId,
            bodyStyle: 'wagon',
            make: `Make ${marker}`,
            model: `Model ${marker}`,
            plate: marker.slice(0, 8).toUpperCase() + marker.slice(8),
            colour: `${marker} green`,
            paintNotes: `Soft clear ${marker}`,
          })
        ).id,
      ),
    );
  const job = async (customerId: string, vehicleId: string, inDays: number) => {
    const start = Date.now() + inDays * day;
    return made(
      'jobs',
      String(
        (
          await post('/api/jobs', {
            id: randomUUID(),
            customerId,
            vehicleId,
            windowStart: new Date(start).toISOString(),
            windowEnd: new Date(start + 3 * 3_600_000).toISOString(),
            assignedTechId: techAssigned.user.id,
            priceMinor: 45_000,
            notes: `Park by the ${marker} hedge`,
            address: `7 ${marker} Row`,
          })
        ).id,
      ),
    );
  };
  const vehicleId = await vehicle(customerId);
  const jobId = await job(customerId, vehicleId, 3);
  await job(otherCustomerId, await vehicle(otherCustomerId), 4);
  made('panels', childId(jobId, 'panel:roof'));
  made('checks', childId(jobId, 'check:prep.rinse-wash'));

  const pin = made('pins', randomUUID());
  await post(`/api/jobs/${jobId}/pins`, {
    id: pin,
    x: 0.4,
    y: 0.6,
    kind: 'chip',
    severity: 2,
    note: `Chip ${marker}`,
  });
  await post(`/api/jobs/${jobId}/chips`, {
    id: made('chips', randomUUID()),
    sizeMm: 2,
    layersPlanned: 3,
    note: `Stone ${marker}`,
  });
  await post(`/api/jobs/${jobId}/masks`, {
    id: made('masks', randomUUID()),
    what: `Trim ${marker}`,
  });
  const solvent = made('products', randomUUID());
  await post('/api/products', {
    id: solvent,
    name: `Tar lifter ${marker}`,
    kind: 'solvent',
    properties: { maxDwellMin: 3 },
  });
  await post(`/api/jobs/${jobId}/solvents`, {
    id: made('solvents', randomUUID()),
    productId: solvent,
    surfaceTempC: 20,
    inSun: false,
  });
  await post('/api/timers', {
    id: made('timers', randomUUID()),
    jobId,
    kind: 'cure',
    label: `Cure ${marker}`,
    durationMs: 3_600_000,
  });
  await post('/api/products', {
    id: made('products', randomUUID()),
    name: `Pad ${marker}`,
    kind: 'pad',
  });

  const settings = (await ok(app, owner, 'get', '/api/business')).settings as {
    services: { id: string }[];
    sizeClasses: { id: string }[];
    conditions: { id: string }[];
  };
  const quote = made('quotes', randomUUID());
  await post('/api/quotes', {
    id: quote,
    customerId,
    vehicleId,
    inputs: {
      sizeClass: settings.sizeClasses[0]!.id,
      condition: settings.conditions[0]!.id,
      serviceIds: [settings.services[0]!.id],
      chips: 1,
      addOnIds: [],
      notes: `Quote for ${marker}`,
    },
  });
  await post(`/api/quotes/${quote}/send`, {});
  await post('/api/invoices', { id: made('invoices', randomUUID()), jobId });
  await post(`/api/jobs/${jobId}/payments`, {
    id: made('payments', randomUUID()),
    opId: randomUUID(),
    kind: 'deposit',
    method: 'cash',
    amountMinor: 1_000,
  });

  const image = png(++blobSeed);
  const imageSha = sha(image);
  const put = await http(app)
    .put(`/api/blobs/${imageSha}`)
    .auth(owner.accessToken, bearer)
    .set('Content-Type', 'image/png')
    .send(image);
  if (put.status !== 201) throw new Error(`setup blob: ${put.status}`);
  await post('/api/photos', {
    id: made('photos', randomUUID()),
    jobId,
    kind: 'damage',
    sha256: imageSha,
    mime: 'image/png',
    width: 2,
    height: 2,
    bytes: image.length,
    caption: `Door ding ${marker}`,
  });
  const record = { jobId, note: `Swirls everywhere ${marker}` };
  await post('/api/signatures', {
    id: made('signatures', randomUUID()),
    jobId,
    kind: 'condition',
    signerName: `Signer ${marker}`,
    imageSha256: imageSha,
    record,
    recordHash: sha(canonicalJson(record)),
  });
  made(
    'invites',
    String(
      (await post('/api/invites', { email: `${marker}.invitee@test.example`, name: marker })).id,
    ),
  );
  const followUps = (await ok(app, owner, 'get', `/api/follow-ups?jobId=${jobId}`)).items as {
    id: string;
  }[];
  followUps.forEach((f) => made('follow-ups', f.id));

  // A message of this business in the dev inbox, as the capturing SMTP server keeps it.
  const raw = [
    `From: Shop <shop@${marker}.example>`,
    `To: ${marker}.one@customers.example`,
    `Subject: Receipt ${marker}`,
    `X-Panelpass-Business: ${owner.user.businessId}`,
    'MIME-Version: 1.0',
    'Content-Type: text/plain; charset=utf-8',
    '',
    `Thank you, ${marker}.`,
    '',
  ].join('\r\n');
  const mail = await new CaptureStore(mailDir).save(Buffer.from(raw), {
    from: `shop@${marker}.example`,
    to: [`${marker}.one@customers.example`],
  });

  return {
    marker,
    owner,
    techAssigned,
    customerId,
    otherCustomerId,
    jobId,
    ids,
    byCollection,
    sha256s: [imageSha],
    mailIds: [mail.id],
  };
}

/** What is wrong with an answer, if anything: its status, its error shape, a leak. */
function problemsOf(res: Response, forbidden: string[]): string[] {
  const problems: string[] = [];
  const bytes = Buffer.isBuffer(res.body) ? res.body : Buffer.alloc(0);
  const status = res.status;
  if (!((status >= 200 && status < 300) || (status >= 400 && status < 500))) {
    problems.push(`status ${status}`);
  }
  if (status >= 400) {
    let parsed: unknown;
    try {
      parsed = JSON.parse(bytes.toString('utf8'));
    } catch {
      parsed = undefined;
    }
    const o = parsed as Record<string, unknown> | undefined;
    const shaped =
      typeof o === 'object' &&
      o !== null &&
      !Array.isArray(o) &&
      Object.keys(o).every((k) => ERROR_KEYS.has(k)) &&
      o.statusCode === status &&
      typeof o.code === 'string' &&
      o.code.length > 0 &&
      typeof o.message === 'string' &&
      String(res.headers['content-type']).startsWith('application/json');
    if (!shaped) problems.push(`not the error shape: ${bytes.toString('utf8').slice(0, 300)}`);
  }
  let text = `${JSON.stringify(res.headers)}\n${bytes.toString('utf8')}`;
  if (String(res.headers['content-type']).startsWith('application/pdf')) text += pdfText(bytes);
  text = text.toLowerCase();
  const leaked = forbidden.filter((m) => text.includes(m));
  if (leaked.length) problems.push(`holds the other business's ${leaked.join(', ')}`);
  return problems;
}

/** Any route's answer kept as bytes, whatever its type. */
function asBytes(res: Response, done: (err: Error | null, body: Buffer) => void): void {
  const stream = res as unknown as NodeJS.ReadableStream;
  const chunks: Buffer[] = [];
  stream.on('data', (c: Buffer) => chunks.push(c));
  stream.on('end', () => done(null, Buffer.concat(chunks)));
  stream.on('error', (e: Error) => done(e, Buffer.alloc(0)));
}

function seedOf(route: string): number {
  let h = BASE_SEED | 0;
  for (const c of route) h = (Math.imul(h, 31) + c.charCodeAt(0)) | 0;
  return h;
}

const DOC = readCommittedOpenApi();
const ROUTES = routesOf(DOC);

describe('hostile input: every route × every caller', () => {
  let app: NestExpressApplication;
  let stripe: FakeStripe;
  let mailDir: string;
  let biz: Record<BizKey, Business>;
  let pools: Pools;
  let sessions: Record<Exclude<Caller, 'anonymous'>, Session>;
  /** The other business's marker and the ids of it this business has not named itself. */
  const secrets: Record<BizKey, Set<string>> = { A: new Set(), B: new Set() };
  const known: Record<BizKey | 'anonymous', Set<string>> = {
    A: new Set(),
    B: new Set(),
    anonymous: new Set(),
  };

  beforeAll(async () => {
    // Card payments only ever reach this local fake of the payment service.
    stripe = await new FakeStripe({ webhookSecret: WEBHOOK_SECRET, duplicateRate: 0 }).start();
    mailDir = await mkdtemp(join(tmpdir(), 'hostile-mail-'));
    app = await createTestApp({
      STRIPE_API_HOST: '127.0.0.1',
      STRIPE_API_PORT: String(stripe.port),
      STRIPE_API_PROTOCOL: 'http',
      STRIPE_WEBHOOK_SECRET: WEBHOOK_SECRET,
      STRIPE_MAX_NETWORK_RETRIES: '0',
      MAIL_CAPTURE_DIR: mailDir,
      SIGN_IN_LIMIT: '100000',
    });
    biz = {
      A: await seedBusiness(app, MARKER.A, mailDir),
      B: await seedBusiness(app, MARKER.B, mailDir),
    };
    const link = await ok(app, biz.A.owner, 'post', '/api/customer-links', {
      customerId: biz.A.customerId,
    });
    const redeemed = await http(app)
      .post(`/api/customer-links/${String(link.link).split('/c/')[1]}/redeem`)
      .expect(200);
    sessions = {
      owner: biz.A.owner,
      techAssigned: biz.A.techAssigned,
      techOther: await addTech(app, biz.A.owner, `${MARKER.A}-other`),
      customer: redeemed.body as Session,
      otherCustomer: await signInCustomer(app, biz.A.owner.user.businessId, biz.A.otherCustomerId),
      otherOwner: biz.B.owner,
    };
    // The people the callers are signed in as are not in the path pool: deleting them would
    // turn the rest of the run into 401s.
    const callers = new Set(Object.values(sessions).map((s) => s.user.id));
    const byCollection: Record<string, string[]> = {
      blobs: [...biz.A.sha256s, ...biz.B.sha256s],
      mail: [...biz.A.mailIds, ...biz.B.mailIds],
      attachments: ['0', '1', '-1', '999999999999'],
    };
    for (const b of [biz.A, biz.B]) {
      for (const [c, list] of Object.entries(b.byCollection)) {
        (byCollection[c] ??= []).push(...list.filter((id) => !callers.has(id)));
      }
    }
    pools = {
      uuids: [...biz.A.ids, ...biz.B.ids].filter((id) => !callers.has(id)),
      sha256s: [...biz.A.sha256s, ...biz.B.sha256s],
      otherIds: [...biz.A.mailIds, ...biz.B.mailIds],
      byCollection,
    };
    for (const [mine, theirs] of [
      ['A', 'B'],
      ['B', 'A'],
    ] as const) {
      const b = biz[theirs];
      for (const s of [b.marker, ...b.ids, ...b.sha256s, ...b.mailIds]) {
        secrets[mine].add(s.toLowerCase());
      }
    }
  }, 120_000);

  const statuses = new Map<string, Map<number, number>>();

  afterAll(async () => {
    if (STATS) {
      const lines = [...statuses].map(
        ([route, m]) =>
          `${route.padEnd(50)} ${[...m]
            .sort((a, b) => a[0] - b[0])
            .map(([s, n]) => `${s}×${n}`)
            .join(' ')}`,
      );
      console.log(`hostile input, answers per route:\n${lines.join('\n')}`);
    }
    await app?.close();
    await stripe?.stop();
    if (mailDir) await rm(mailDir, { recursive: true, force: true });
  });

  it('would see a leak: each business finds its own marker words and ids in its answers', async () => {
    for (const [key, s] of [
      ['A', biz.A.owner],
      ['B', biz.B.owner],
    ] as const) {
      const res = await http(app)
        .get(`/api/jobs/${biz[key].jobId}/workspace`)
        .auth(s.accessToken, bearer)
        .buffer(true)
        .parse(asBytes);
      expect(res.status).toBe(200);
      const own = [biz[key].marker, biz[key].jobId, biz[key].customerId];
      expect(problemsOf(res, own)).toEqual([`holds the other business's ${own.join(', ')}`]);
    }
  });

  /** Sends one request as one caller; the problems with its answer. */
  async function sendAs(who: Caller, r: HostileRequest, anonAuth: string | null) {
    const mine: BizKey | 'anonymous' =
      who === 'anonymous' ? 'anonymous' : who === 'otherOwner' ? 'B' : 'A';
    let t = http(app)[r.method](r.url).buffer(true).parse(asBytes);
    const auth = who === 'anonymous' ? anonAuth : `Bearer ${sessions[who].accessToken}`;
    if (auth !== null) t = t.set('Authorization', auth);
    for (const [k, v] of Object.entries(r.headers)) t = t.set(k, v);
    if (r.body !== undefined) t = t.send(r.body);
    // What a caller names in its own request is no secret to it from then on.
    const said = `${r.url}\n${Buffer.isBuffer(r.body) ? '' : (r.body ?? '')}`.toLowerCase();
    const candidates =
      mine === 'anonymous' ? [...secrets.A, ...secrets.B] : [...secrets[mine].values()];
    for (const s of candidates) if (said.includes(s)) known[mine].add(s);
    const res = await t;
    if (STATS) {
      const key = `${r.method.toUpperCase()} ${r.route}`;
      const m = statuses.get(key) ?? new Map<number, number>();
      m.set(res.status, (m.get(res.status) ?? 0) + 1);
      statuses.set(key, m);
    }
    const forbidden = candidates.filter((s) => !known[mine].has(s));
    return problemsOf(res, forbidden).map(
      (p) => `${who}: ${p}\n    request: ${describeRequest(r)}`,
    );
  }

  /** The property for one route: every caller, RUNS generated requests. */
  async function checkRoute(doc: OpenApiDoc, route: Route): Promise<void> {
    const seed = seedOf(route.key);
    const property = fc.asyncProperty(
      requestArb(doc, route, pools),
      fc.constantFrom(...ANONYMOUS_AUTH),
      async (r, anonAuth) => {
        const problems: string[] = [];
        for (const who of CALLERS) problems.push(...(await sendAs(who, r, anonAuth)));
        if (problems.length) throw new Error(problems.join('\n'));
      },
    );
    try {
      await fc.assert(property, {
        numRuns: RUNS,
        seed,
        endOnFailure: !SHRINK,
        includeErrorInReport: true,
      });
    } catch (e) {
      throw new Error(
        `${route.key} — replay with HOSTILE_SEED=${BASE_SEED} (fast-check seed ${seed})\n${
          e instanceof Error ? e.message : String(e)
        }`,
      );
    }
  }

  for (const route of ROUTES) {
    it(
      `${route.key}: 2xx or the 4xx error shape, never the other business's data`,
      () => checkRoute(DOC, route),
      300_000,
    );
  }

  it('covers as well the routes the app has that the committed document does not list yet', async () => {
    const live = buildOpenApi(app) as unknown as OpenApiDoc;
    const committed = new Set(ROUTES.map((r) => r.key));
    const missing = routesOf(live).filter((r) => !committed.has(r.key));
    for (const route of missing) await checkRoute(live, route);
    expect(routesOf(live).length).toBeGreaterThanOrEqual(ROUTES.length - 5);
  }, 600_000);
});
