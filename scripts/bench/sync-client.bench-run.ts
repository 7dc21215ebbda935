import 'fake-indexeddb/auto';
import { IDBFactory, IDBKeyRange } from 'fake-indexeddb';
import { chromium } from 'playwright-core';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import pg from 'pg';
import { afterAll, expect, it } from 'vitest';
import { LocalDb } from '../../pwa/src/db/localDb';
import { mutate } from '../../pwa/src/db/mutate';

const url = process.env.BENCH_URL!;
const ROWS = 10_000;

/** The one-line summary (the last line, which scripts/bench/all collects). */
const summary: string[] = [];
afterAll(() => {
  if (summary.length) console.log(`sync-client: ${summary.join('; ')}`);
});

async function post<T>(path: string, body: unknown, token?: string): Promise<T> {
  const res = await fetch(url + path, {
    method: 'POST',
    headers: {
      'content-type': 'application/json',
      ...(token ? { authorization: `Bearer ${token}` } : {}),
    },
    body: JSON.stringify(body),
  });
  if (!res.ok) throw new Error(`${path}: ${res.status} ${await res.text()}`);
  return (await res.json()) as T;
}

interface PullRun {
  seconds: number;
  firstPull: number;
  lastPullDone: number;
}

/** One fresh phone: a new business of ROWS customers, signed in on a new browser profile. */
async function pullOnce(tapAtOnce: boolean): Promise<PullRun> {
  const email = `bench-${crypto.randomUUID().slice(0, 8)}@bench.example`;
  const password = 'bench password 123';
  const session = await post<{ user: { id: string; businessId: string } }>('/api/auth/sign-up', {
    businessName: 'Bench Pull',
    name: 'Owner',
    email,
    password,
  });
  const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await client.connect();
  for (let i = 0; i < ROWS; i += 1000) {
    const values: string[] = [];
    const params: unknown[] = [];
    for (let k = 0; k < 1000; k++) {
      params.push(
        crypto.randomUUID(),
        session.user.businessId,
        `Customer ${i + k}`,
        `${i + k} Bench Street`,
      );
      const n = params.length;
      values.push(`($${n - 3}, $${n - 2}, $${n - 1}, $${n})`);
    }
    await client.query(
      `INSERT INTO customers (id, business_id, name, address) VALUES ${values.join(',')}`,
      params,
    );
  }
  await client.end();

  const profile = mkdtempSync(join(tmpdir(), 'panelpass-bench-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: process.env.CHROME_PATH ?? '/usr/bin/chromium',
    headless: true,
    viewport: { width: 390, height: 844 },
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  try {
    const page = await context.newPage();
    await page.goto(`${url}/sign-in`);
    // A person takes a few seconds to type their e-mail and password; the service worker has
    // stored the app by then (on a fresh profile, storing it competes with IndexedDB's writes).
    // The second series taps as soon as the form is filled.
    if (!tapAtOnce) {
      await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
    }
    const form = page.getByRole('form', { name: 'Sign in' });
    await form.getByLabel('E-mail').fill(email);
    await form.getByLabel('Password', { exact: true }).fill(password);
    const t0 = Date.now();
    // What the phone asked for, when (ms after the tap): the phases printed below, and each
    // request with BENCH_SHOW_REQUESTS=1.
    const seen: string[] = [];
    let firstPull = 0;
    let lastPullDone = 0;
    page.on('request', (r) => {
      if (!r.url().includes('/api/')) return;
      if (!firstPull && r.url().includes('/api/sync/pull')) firstPull = Date.now() - t0;
      seen.push(`${Date.now() - t0} > ${r.method()} ${r.url().replace(url, '')}`);
    });
    page.on('requestfinished', (r) => {
      if (!r.url().includes('/api/')) return;
      if (r.url().includes('/api/sync/pull')) lastPullDone = Date.now() - t0;
      seen.push(`${Date.now() - t0} < ${r.url().replace(url, '')}`);
    });
    await form.getByRole('button', { name: 'Sign in' }).click();
    const dbName = `panelpass-${session.user.id}`;
    // Looked at only once the app has made its database: opening it first would create an
    // empty one and get in the app's way.
    const count = (name: string) =>
      page.evaluate(async (dbName) => {
        const known = await indexedDB.databases();
        if (!known.some((d) => d.name === dbName && (d.version ?? 0) > 1)) return -1;
        return new Promise<number>((resolve) => {
          const open = indexedDB.open(dbName);
          open.onerror = () => resolve(-1);
          open.onsuccess = () => {
            const db = open.result;
            const req = db.transaction('customers').objectStore('customers').count();
            req.onsuccess = () => {
              db.close();
              resolve(req.result);
            };
            req.onerror = () => resolve(-1);
          };
        });
      }, name);
    const deadline = Date.now() + 120_000;
    while ((await count(dbName)) < ROWS) {
      if (Date.now() > deadline) throw new Error('the rows did not arrive within 2 minutes');
      await page.waitForTimeout(50);
    }
    const seconds = (Date.now() - t0) / 1000;
    const stored = await page.evaluate(
      (name) =>
        new Promise<number>((resolve) => {
          const open = indexedDB.open(name);
          open.onsuccess = () => {
            const count = open.result.transaction('customers').objectStore('customers').count();
            count.onsuccess = () => resolve(count.result);
          };
        }),
      dbName,
    );
    expect(stored).toBe(ROWS);
    if (process.env.BENCH_SHOW_REQUESTS)
      console.log(seen.map((l) => 'pull:       ' + l).join('\n'));
    return { seconds, firstPull, lastPullDone };
  } finally {
    await context.close();
    rmSync(profile, { recursive: true, force: true });
  }
}

it('pull and apply 10,000 rows into a fresh phone (Chromium)', async () => {
  const s = (ms: number) => (ms / 1000).toFixed(2);
  const phases = ({ seconds, firstPull, lastPullDone }: PullRun) =>
    `sign-in to first pull ${s(firstPull)} s, pages ${s(lastPullDone - firstPull)} s, ` +
    `applied ${s(seconds * 1000 - lastPullDone)} s later`;
  const count = Number(process.env.BENCH_RUNS ?? 5);
  const series = async (tapAtOnce: boolean, label: string): Promise<PullRun> => {
    const runs: PullRun[] = [];
    for (let i = 0; i < count; i++) {
      const run = await pullOnce(tapAtOnce);
      runs.push(run);
      console.log(`pull:       ${label} ${i + 1}: ${run.seconds.toFixed(2)} s (${phases(run)})`);
    }
    return [...runs].sort((a, b) => a.seconds - b.seconds)[Math.floor(runs.length / 2)]!;
  };
  const typed = await series(false, 'run');
  const hurried = await series(true, 'tapped at once');
  console.log(
    `pull:     ${ROWS} rows signed in, pulled and applied in ${typed.seconds.toFixed(2)} s, ` +
      `median of ${count} fresh phones (goal < 3 s; includes sign-in): ${phases(typed)}`,
  );
  console.log(
    `pull:     tapped before the service worker had stored the app: ${hurried.seconds.toFixed(2)} s ` +
      `(${phases(hurried)})`,
  );
  expect(typed.seconds).toBeGreaterThan(0);
  summary.push(
    `pull+apply ${ROWS} rows median ${typed.seconds.toFixed(2)} s (goal < 3 s) ${typed.seconds < 3 ? 'ok' : 'missed'}, ` +
      `${hurried.seconds.toFixed(2)} s tapped before the app was stored`,
  );
});

it('Dexie write cost per mutation (Node, fake-indexeddb)', async () => {
  const db = new LocalDb(
    { userId: 'bench-user', businessId: 'bench-business', role: 'owner' },
    { indexedDB: new IDBFactory(), IDBKeyRange, onVersionChange: () => undefined },
  );
  const times: number[] = [];
  for (let i = 0; i < 500; i++) {
    const t = performance.now();
    await mutate(db, 'customer.create', { id: crypto.randomUUID(), name: `Customer ${i}` });
    times.push(performance.now() - t);
  }
  times.sort((a, b) => a - b);
  const median = times[Math.floor(times.length / 2)]!;
  const p95 = times[Math.floor(times.length * 0.95)]!;
  console.log(
    `mutate:   median ${median.toFixed(2)} ms, p95 ${p95.toFixed(2)} ms per mutation over 500 (goal median < 2 ms)`,
  );
  expect(await db.outbox.count()).toBe(500);
  summary.push(
    `mutate median ${median.toFixed(2)} ms (goal < 2 ms) ${median < 2 ? 'ok' : 'missed'}`,
  );
  db.close();
});
