// Push versus raw INSERT, and pull of 10,000 rows. Run by scripts/bench/sync.
import { randomUUID } from 'node:crypto';
import { performance } from 'node:perf_hooks';
import pg from 'pg';

const url = process.env.BENCH_URL;
const N = Number(process.env.BENCH_MUTATIONS ?? 2000);
const BATCH = 200;

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

const email = `bench-${randomUUID().slice(0, 8)}@bench.example`;
const session = await api('/api/auth/sign-up', {
  method: 'POST',
  body: {
    businessName: 'Bench Business',
    name: 'Bench Owner',
    email,
    password: 'bench password 123',
  },
});
const token = session.accessToken;
const businessId = session.user.businessId;

// 1. Push N customer.create mutations, BATCH per request.
const clientId = randomUUID();
const rows = Array.from({ length: N }, (_, i) => ({
  id: randomUUID(),
  name: `Bench customer ${i}`,
}));
let t0 = performance.now();
for (let i = 0; i < N; i += BATCH) {
  const mutations = rows
    .slice(i, i + BATCH)
    .map((args, j) => ({ id: i + j + 1, name: 'customer.create', args }));
  const res = await api('/api/sync/push', { method: 'POST', token, body: { clientId, mutations } });
  if (res.results.some((r) => r.status !== 'applied'))
    throw new Error('a mutation was not applied');
}
const pushSeconds = (performance.now() - t0) / 1000;

// 2. The same rows, plain batched INSERT (100 rows per statement) into the same database.
const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
await client.connect();
const raw = rows.map((r) => ({ ...r, id: randomUUID() }));
t0 = performance.now();
for (let i = 0; i < N; i += 100) {
  const part = raw.slice(i, i + 100);
  const values = part.map((_, k) => `($${k * 3 + 1}, $${k * 3 + 2}, $${k * 3 + 3})`).join(',');
  await client.query(
    `INSERT INTO customers (id, business_id, name) VALUES ${values}`,
    part.flatMap((r) => [r.id, businessId, r.name]),
  );
}
const rawSeconds = (performance.now() - t0) / 1000;

// 3. Pull 10,000 rows from cursor 0 (rows of this business: the pushed and the raw ones, plus more).
const extra = Math.max(0, 10_000 - 2 * N);
for (let i = 0; i < extra; i += 1000) {
  const part = Array.from({ length: Math.min(1000, extra - i) }, (_, k) => [
    randomUUID(),
    businessId,
    `Extra ${i + k}`,
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
  const res = await api(`/api/sync/pull?cursor=${cursor}&scope=0&clientId=${clientId}`, { token });
  for (const list of Object.values(res.changes)) pulled += list.length;
  cursor = res.cursor;
  pages++;
  if (!res.more) break;
}
const pullSeconds = (performance.now() - t0) / 1000;

const pushRate = N / pushSeconds;
const rawRate = N / rawSeconds;
console.log(
  `push:      ${N} mutations in ${pushSeconds.toFixed(2)} s = ${pushRate.toFixed(0)} mutations/s (${BATCH} per request)`,
);
console.log(
  `raw:       ${N} rows in ${rawSeconds.toFixed(2)} s = ${rawRate.toFixed(0)} rows/s (100 per INSERT)`,
);
console.log(
  `ratio:     push is ${((100 * pushRate) / rawRate).toFixed(1)} % of raw insert throughput (goal ≥ 25 %)`,
);
console.log(
  `pull:      ${pulled} rows in ${pages} pages in ${pullSeconds.toFixed(2)} s (server side, goal for pull+apply < 3 s)`,
);
console.log(
  `sync: push ${((100 * pushRate) / rawRate).toFixed(1)} % of raw insert (goal ≥ 25 %) ${pushRate >= rawRate / 4 ? 'ok' : 'missed'}; pull ${pulled} rows ${pullSeconds.toFixed(2)} s`,
);
