// Does one business's latency stay flat as the database grows? Run by scripts/bench/scale.
//
// 1. Business A (the one measured) gets a year of full records and the same "today" as in
//    scripts/bench/api; then other businesses are added around it until there are
//    SCALE_BUSINESSES/100, /10 and SCALE_BUSINESSES (1×, 10×, 100× the data). At each size A's
//    incremental pull (a few minutes of work) and jobs list (a fortnight, first page) are
//    timed, SCALE_SAMPLES requests one after another (p50, p99), with ratios to the first size.
// 2. Business B gets SCALE_HISTORY_YEARS of history and the same today as A: A versus B.
// 3. At the largest size, every query the server runs for pull, list, job, workspace and the
//    Ledger's entries, jobs and months is logged by PostgreSQL's auto_explain with ANALYZE and
//    BUFFERS; each is printed with its scans, and any Seq Scan on a big table is flagged.
import { randomUUID } from 'node:crypto';
import { readFileSync, statSync } from 'node:fs';
import { performance } from 'node:perf_hooks';
import pg from 'pg';
import { api, ms, sample } from './autocannon-lib.mjs';
import { addBusinesses, addJobs, addPools, dayFrom, tableCounts } from './datagen.mjs';

const url = process.env.BENCH_URL;
const BUSINESSES = Number(process.env.SCALE_BUSINESSES ?? 300);
const SIZES = [
  ...new Set([Math.max(1, Math.round(BUSINESSES / 100)), Math.round(BUSINESSES / 10), BUSINESSES]),
];
const OTHER_DETAIL = process.env.SCALE_OTHER_DETAIL ?? 'lean';
const HISTORY_YEARS = Number(process.env.SCALE_HISTORY_YEARS ?? 10);
const SAMPLES = Number(process.env.SCALE_SAMPLES ?? 100);
const BATCH = Number(process.env.SCALE_BATCH ?? 25);
const PG_LOG = process.env.SCALE_PG_LOG;
const BIG_TABLE_ROWS = 10_000;

const today = new Date().toISOString().slice(0, 10);
const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
await db.connect();
const lastVersion = async () =>
  (await db.query(`SELECT last_value::int AS v FROM sync_version`)).rows[0].v;
const total = (counts) => Object.values(counts).reduce((a, b) => a + b, 0);

async function signUp(name) {
  const s = await api(url, '/api/auth/sign-up', {
    method: 'POST',
    body: {
      businessName: name,
      name: 'Bench Owner',
      email: `scale-${randomUUID().slice(0, 8)}@bench.example`,
      password: 'bench password 123',
    },
  });
  return { id: s.user.businessId, email: s.user.email };
}
async function token(who) {
  const s = await api(url, '/api/auth/sign-in', {
    method: 'POST',
    body: { email: who.email, password: 'bench password 123' },
  });
  return s.accessToken;
}

/** History up to yesterday and two weeks booked ahead, then today, then a few minutes of work. */
async function measuredBusiness(name, years) {
  const who = await signUp(name);
  const customers = 450 * years;
  await addPools(db, [who.id], { customers });
  for (let y = years; y >= 1; y--) {
    await addJobs(db, [who.id], {
      fromDay: dayFrom(today, -365 * y),
      toDay: dayFrom(today, -365 * (y - 1) - 1),
      today,
      customers,
    });
  }
  await addJobs(db, [who.id], {
    fromDay: dayFrom(today, 1),
    toDay: dayFrom(today, 14),
    today,
    customers,
  });
  await addJobs(db, [who.id], { fromDay: today, toDay: today, today, customers });
  who.cursor = await lastVersion();
  const { rows } = await db.query(
    `SELECT id FROM jobs WHERE business_id = $1 AND stage = 'correction' ORDER BY window_start DESC LIMIT 1`,
    [who.id],
  );
  who.jobId = rows[0].id;
  await db.query(
    `UPDATE job_panels SET state = 'done' WHERE id IN (
       SELECT id FROM job_panels WHERE job_id = $1 ORDER BY position LIMIT 2)`,
    [who.jobId],
  );
  await db.query(`UPDATE jobs SET notes = notes || ' Hood done.' WHERE id = $1`, [who.jobId]);
  return who;
}

const paths = (who) => ({
  pull: `/api/sync/pull?cursor=${who.cursor}&scope=0&clientId=${randomUUID()}`,
  list: `/api/jobs?from=${dayFrom(today, -7)}T00:00:00Z&to=${dayFrom(today, 8)}T00:00:00Z&limit=50`,
});

async function measure(who) {
  const t = await token(who);
  const p = paths(who);
  const pulled = await api(url, p.pull, { token: t });
  const n = Object.values(pulled.changes).reduce((k, l) => k + l.length, 0);
  if (n !== 3) throw new Error(`the incremental pull gave ${n} rows, not the 3 written`);
  const listed = await api(url, p.list, { token: t });
  if (listed.items.length === 0) throw new Error('the list is empty');
  await sample(url, p.pull, { token: t, count: 10 });
  await sample(url, p.list, { token: t, count: 10 });
  return {
    pull: await sample(url, p.pull, { token: t, count: SAMPLES }),
    list: await sample(url, p.list, { token: t, count: SAMPLES }),
  };
}

// 1. A, then the crowd around it.
let t0 = performance.now();
const A = await measuredBusiness('Measured Detailing', 1);
console.log(
  `A:         a year of full records, ${total(await tableCounts(db))} rows, in ${((performance.now() - t0) / 1000).toFixed(1)} s`,
);
const results = [];
let have = 1;
for (const size of SIZES) {
  t0 = performance.now();
  // Others are written with triggers off (the trigger's work is the column default here:
  // version from the same sequence); their keys are made to hold, as in datagen.mjs.
  await db.query(`SET session_replication_role = replica`);
  while (have < size) {
    const n = Math.min(BATCH, size - have);
    const ids = await addBusinesses(db, n, 'Neighbour Detailing');
    await addPools(db, ids, { customers: 450 });
    await addJobs(db, ids, {
      fromDay: dayFrom(today, -365),
      toDay: dayFrom(today, 14),
      today,
      customers: 450,
      detail: OTHER_DETAIL,
    });
    have += n;
  }
  await db.query(`SET session_replication_role = origin`);
  const genSeconds = (performance.now() - t0) / 1000;
  await db.query('VACUUM ANALYZE'); // as autovacuum would have by then
  const counts = await tableCounts(db);
  const r = await measure(A);
  results.push({ size, rows: total(counts), jobs: counts.jobs, genSeconds, ...r });
  console.log(
    `${String(size).padStart(5)} businesses: ${total(counts)} rows (${counts.jobs} jobs), added in ${genSeconds.toFixed(0)} s; ` +
      `A pull p50 ${ms(r.pull.p50)} p99 ${ms(r.pull.p99)} ms, list p50 ${ms(r.list.p50)} p99 ${ms(r.list.p99)} ms`,
  );
}

// 2. Ten years of history against one.
t0 = performance.now();
const B = await measuredBusiness('Long-standing Detailing', HISTORY_YEARS);
await db.query('VACUUM ANALYZE'); // as autovacuum would have by then
const { rows: bJobs } = await db.query(
  `SELECT count(*)::int AS n FROM jobs WHERE business_id = $1`,
  [B.id],
);
console.log(
  `B:         ${HISTORY_YEARS} years of full records (${bJobs[0].n} jobs), in ${((performance.now() - t0) / 1000).toFixed(0)} s`,
);
const a1 = await measure(A);
const b10 = await measure(B);

// 3. The plans, at the largest size.
const plans = [];
if (PG_LOG) {
  const { rows: sizes } = await db.query(
    `SELECT relname AS t, reltuples::bigint AS n FROM pg_class WHERE relkind = 'r' AND relnamespace = 'public'::regnamespace`,
  );
  const rowsOf = new Map(sizes.map((r) => [r.t, Number(r.n)]));
  const tA = await token(A);
  const from30 = dayFrom(today, -30);
  const calls = [
    ['pull', paths(A).pull],
    ['list', paths(A).list],
    ['job', `/api/jobs/${A.jobId}`],
    ['workspace', `/api/jobs/${A.jobId}/workspace`],
    ['ledger entries', `/api/ledger/entries?from=${from30}&to=${today}`],
    ['ledger jobs', `/api/ledger/jobs?from=${from30}&to=${today}`],
    ['ledger months', `/api/ledger/months?from=${dayFrom(today, -364)}&to=${today}`],
  ];
  for (const [, path] of calls) await api(url, path, { token: tA }); // warm
  await db.query(`ALTER SYSTEM SET auto_explain.log_min_duration = 0`);
  await db.query(`SELECT pg_reload_conf()`);
  await new Promise((r) => setTimeout(r, 500));
  const offset = statSync(PG_LOG).size;
  for (const [name, path] of calls) {
    await db.query(`SELECT 'bench-call:${name}' AS mark`);
    await api(url, path, { token: tA });
  }
  await db.query(`SELECT 'bench-call:end' AS mark`);
  await db.query(`ALTER SYSTEM SET auto_explain.log_min_duration = -1`);
  await db.query(`SELECT pg_reload_conf()`);
  const log = readFileSync(PG_LOG, 'utf8').slice(offset);
  // auto_explain: "… LOG:  duration: 0.1 ms  plan:\n\tQuery Text: …\n\t<plan lines>"
  const entries = log.split(/\n(?=\d{4}-\d\d-\d\d )/).filter((e) => e.includes('plan:'));
  let call = null;
  for (const e of entries) {
    const mark = e.match(/'bench-call:([^']+)'/);
    if (mark) {
      call = mark[1] === 'end' ? null : { name: mark[1], queries: [] };
      if (call) plans.push(call);
      continue;
    }
    if (!call) continue;
    const text = (e.match(/Query Text: ([^\n]*)/) ?? [])[1] ?? '';
    if (/^(START|COMMIT|SET|ROLLBACK)/i.test(text.trim())) continue;
    const scans = [
      ...e.matchAll(
        /(Seq Scan|Index Only Scan|Index Scan|Bitmap Heap Scan|Bitmap Index Scan)(?: Backward)?(?: using (\S+))? on (\w+)/g,
      ),
    ].map((m) => ({ kind: m[1], index: m[2] ?? null, table: m[3] }));
    const dur = Number((e.match(/duration: ([\d.]+) ms/) ?? [])[1] ?? 0);
    call.queries.push({ text, scans, dur });
  }
  console.log(
    `\nplans at ${BUSINESSES} businesses (auto_explain, ANALYZE, BUFFERS; big = over ${BIG_TABLE_ROWS} rows):`,
  );
  let flagged = 0;
  for (const c of plans) {
    console.log(
      `  ${c.name}: ${c.queries.length} queries, ${c.queries.reduce((s, q) => s + q.dur, 0).toFixed(1)} ms in the database`,
    );
    for (const q of c.queries) {
      const seen = new Map();
      for (const s of q.scans) {
        const big = s.kind === 'Seq Scan' && (rowsOf.get(s.table) ?? 0) > BIG_TABLE_ROWS;
        if (big) flagged++;
        seen.set(
          `${s.table}:${s.kind}:${s.index}`,
          `${s.kind}${s.index ? ` (${s.index})` : ''} on ${s.table}${big ? ` — SEQ SCAN ON A BIG TABLE (${rowsOf.get(s.table)} rows)` : ''}`,
        );
      }
      if (seen.size === 0) continue;
      const what = q.text.replace(/\s+/g, ' ').slice(0, 70);
      console.log(
        `    ${q.dur.toFixed(2).padStart(7)} ms  ${[...seen.values()].join('; ')}\n               ${what}…`,
      );
    }
  }
  console.log(`  Seq Scans on big tables: ${flagged}`);
  plans.flagged = flagged;
}
await db.end();

const first = results[0];
console.log(
  '\nA at each size (requests one after another; 2 shared cores, other work on the machine):',
);
console.log(
  'businesses        rows   pull p50  p99 ms   list p50  p99 ms   pull p99 ÷ 1×   list p99 ÷ 1×',
);
for (const r of results) {
  console.log(
    `${String(r.size).padStart(10)} ${String(r.rows).padStart(11)} ${ms(r.pull.p50).padStart(10)} ${ms(r.pull.p99).padStart(7)} ${ms(r.list.p50).padStart(10)} ${ms(r.list.p99).padStart(7)} ${(r.pull.p99 / first.pull.p99).toFixed(2).padStart(15)} ${(r.list.p99 / first.list.p99).toFixed(2).padStart(15)}`,
  );
}
console.log(
  `history: 1 year p50/p99 pull ${ms(a1.pull.p50)}/${ms(a1.pull.p99)} ms, list ${ms(a1.list.p50)}/${ms(a1.list.p99)} ms; ` +
    `${HISTORY_YEARS} years pull ${ms(b10.pull.p50)}/${ms(b10.pull.p99)} ms, list ${ms(b10.list.p50)}/${ms(b10.list.p99)} ms ` +
    `(p50 ratios pull ${(b10.pull.p50 / a1.pull.p50).toFixed(2)}, list ${(b10.list.p50 / a1.list.p50).toFixed(2)})`,
);
const last = results[results.length - 1];
const ratios = [
  last.pull.p50 / first.pull.p50,
  last.list.p50 / first.list.p50,
  b10.pull.p50 / a1.pull.p50,
  b10.list.p50 / a1.list.p50,
];
const flat = ratios.every((x) => x < 1.5);
console.log(
  `scale: p50 ratio ${last.size}÷${first.size} businesses pull ${ratios[0].toFixed(2)}, list ${ratios[1].toFixed(2)}; ` +
    `${HISTORY_YEARS}÷1 years pull ${ratios[2].toFixed(2)}, list ${ratios[3].toFixed(2)} (goal ≈ 1, < 1.5)` +
    `${PG_LOG ? `; ${plans.flagged} Seq Scans on big tables` : ''} ${flat && !plans.flagged ? 'ok' : 'MISSED'}`,
);
