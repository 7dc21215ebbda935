// Push versus raw INSERT, a phone's readings pushed, and pull of 10,000 rows. Run by
// scripts/bench/sync.
//
// The machine may be shared and noisy, so the push and the raw INSERT are measured side by
// side in alternating rounds (BENCH_ROUNDS, 3 by default) and each figure is the median of
// its rounds. One untimed push first warms the server (a fresh process compiles its code
// paths on the first requests; a server in service has long done so).
import { randomUUID } from 'node:crypto';
import { performance } from 'node:perf_hooks';
import shared from '@panelpass/shared';
import pg from 'pg';

const url = process.env.BENCH_URL;
const N = Number(process.env.BENCH_MUTATIONS ?? 2000);
const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 3);
const READINGS = Number(process.env.BENCH_READINGS ?? 1000);
const BATCH = 200;
/** What the app sends per push request (pwa/src/sync/engine.ts, pushBatch). */
const PHONE_BATCH = 100;

async function api(path, { method = 'GET', token, body } = {}) {
  const res = await fetch(url + path, {
    method,
    headers: {
      'content-type': 'application/json',
      ...(token ? { authorization: `Bearer ${token}` } : {}),
    },
    body: body ? JSON.stringify(body) : undefined,
  });
  if (!res.ok) throw new Error(`${method} ${path}: ${res.status} ${await res.text()}`);
  return res.status === 204 ? null : res.json();
}

async function signUp(businessName) {
  return api('/api/auth/sign-up', {
    method: 'POST',
    body: {
      businessName,
      name: 'Bench Owner',
      email: `bench-${randomUUID().slice(0, 8)}@bench.example`,
      password: 'bench password 123',
    },
  });
}

const median = (xs) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const seconds = (t0) => (performance.now() - t0) / 1000;

const session = await signUp('Bench Business');
const token = session.accessToken;
const businessId = session.user.businessId;
const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
await client.connect();

const clientId = randomUUID();
let nextId = 1;
/** Pushes mutations made by `make(i)`, `batch` per request; every one must be applied. */
async function push(count, batch, make) {
  for (let i = 0; i < count; i += batch) {
    const mutations = Array.from({ length: Math.min(batch, count - i) }, (_, k) => ({
      id: nextId++,
      ...make(i + k),
    }));
    const res = await api('/api/sync/push', {
      method: 'POST',
      token,
      body: { clientId, mutations },
    });
    if (res.results.some((r) => r.status !== 'applied'))
      throw new Error('a mutation was not applied');
  }
}
const customer = (i) => ({
  name: 'customer.create',
  args: { id: randomUUID(), name: `Bench customer ${i}` },
});

// 0. Warm-up, untimed.
await push(BATCH, BATCH, customer);

// 1. N customer.create mutations pushed, BATCH per request, against 2. the same number of
// rows by plain batched INSERT (100 rows per statement) into the same database; alternating.
const pushRates = [];
const rawRates = [];
for (let round = 0; round < ROUNDS; round++) {
  let t0 = performance.now();
  await push(N, BATCH, customer);
  pushRates.push(N / seconds(t0));

  const raw = Array.from({ length: N }, (_, i) => [randomUUID(), businessId, `Raw ${i}`]);
  t0 = performance.now();
  for (let i = 0; i < N; i += 100) {
    const part = raw.slice(i, i + 100);
    const values = part.map((_, k) => `($${k * 3 + 1}, $${k * 3 + 2}, $${k * 3 + 3})`).join(',');
    await client.query(
      `INSERT INTO customers (id, business_id, name) VALUES ${values}`,
      part.flat(),
    );
  }
  rawRates.push(N / seconds(t0));
}

// 3. A phone back after hours offline: READINGS gauge readings on one job's panels, in
// requests of PHONE_BATCH, each reading.add checking the job, the panel and the gauge.
const customerId = randomUUID();
const vehicleId = randomUUID();
const jobId = randomUUID();
const start = Date.now() + 86_400_000;
await push(
  3,
  3,
  (i) =>
    [
      { name: 'customer.create', args: { id: customerId, name: 'Bench car owner' } },
      {
        name: 'vehicle.create',
        args: { id: vehicleId, customerId, bodyStyle: 'sedan', colour: 'silver' },
      },
      {
        name: 'job.create',
        args: {
          id: jobId,
          customerId,
          vehicleId,
          windowStart: new Date(start).toISOString(),
          windowEnd: new Date(start + 7_200_000).toISOString(),
          priceMinor: 30_000,
        },
      },
    ][i],
);
const { rows: panels } = await client.query(
  `SELECT id FROM job_panels WHERE job_id = $1 AND substrate = 'steel' ORDER BY id`,
  [jobId],
);
if (!panels.length) throw new Error('the bench job has no steel panels');
let t0 = performance.now();
await push(READINGS, PHONE_BATCH, (i) => ({
  name: 'reading.add',
  args: {
    id: randomUUID(),
    jobId,
    panelId: panels[i % panels.length].id,
    phase: 'before',
    readings: [112 + (i % 7), 118, 121],
    unit: 'um',
    gaugeType: 'magnetic',
  },
}));
const readingsSeconds = seconds(t0);

// 4. Pull 10,000 rows from cursor 0: a business of its own holding exactly that many.
const puller = await signUp('Bench Pull Business');
for (let i = 0; i < 10_000; i += 1000) {
  const part = Array.from({ length: 1000 }, (_, k) => [
    randomUUID(),
    puller.user.businessId,
    `Pulled ${i + k}`,
  ]);
  const values = part.map((_, k) => `($${k * 3 + 1}, $${k * 3 + 2}, $${k * 3 + 3})`).join(',');
  await client.query(`INSERT INTO customers (id, business_id, name) VALUES ${values}`, part.flat());
}
await client.end();
t0 = performance.now();
let cursor = 0;
let pulled = 0;
let pages = 0;
for (;;) {
  // In pages of the app's size.
  const res = await api(
    `/api/sync/pull?cursor=${cursor}&scope=0&clientId=${randomUUID()}&limit=${shared.PULL_PAGE_ROWS}`,
    { token: puller.accessToken },
  );
  for (const list of Object.values(res.changes)) pulled += list.length;
  cursor = res.cursor;
  pages++;
  if (!res.more) break;
}
const pullSeconds = seconds(t0);

const pushRate = median(pushRates);
const rawRate = median(rawRates);
const ratio = (100 * pushRate) / rawRate;
const list = (xs) => xs.map((x) => x.toFixed(0)).join(', ');
console.log(
  `push:      ${N} mutations per round: median ${pushRate.toFixed(0)} mutations/s (${BATCH} per request; rounds ${list(pushRates)})`,
);
console.log(
  `raw:       ${N} rows per round: median ${rawRate.toFixed(0)} rows/s (100 per INSERT; rounds ${list(rawRates)})`,
);
console.log(
  `ratio:     push is ${ratio.toFixed(1)} % of raw insert throughput (medians of ${ROUNDS} alternating rounds; goal ≥ 25 %)`,
);
console.log(
  `readings:  ${READINGS} reading.add on one job in ${readingsSeconds.toFixed(2)} s = ${(READINGS / readingsSeconds).toFixed(0)} mutations/s (${PHONE_BATCH} per request)`,
);
console.log(
  `pull:      ${pulled} rows in ${pages} pages in ${pullSeconds.toFixed(2)} s (server side, goal for pull+apply < 3 s)`,
);
console.log(
  `sync: push ${ratio.toFixed(1)} % of raw insert (goal ≥ 25 %) ${pushRate >= rawRate / 4 ? 'ok' : 'missed'}; ${pushRate.toFixed(0)} mutations/s, readings ${(READINGS / readingsSeconds).toFixed(0)}/s; pull ${pulled} rows ${pullSeconds.toFixed(2)} s`,
);
