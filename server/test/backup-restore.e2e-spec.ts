import { execFile } from 'node:child_process';
import { chmod, mkdtemp, rm, stat } from 'node:fs/promises';
import { dirname, join } from 'node:path';
import { promisify } from 'node:util';
import { Client } from 'pg';
import { TEST_JWT_SECRET } from './support/app';

/**
 * `scripts/db backup` and `scripts/db restore` round trip: a cluster with the demo week and
 * rows of awkward values is backed up, restored into a fresh cluster, and every table of the
 * schemas we own (public, and pgboss when present) must hold the same rows, compared by count
 * and by an order-independent hash of the rows' text; every sequence must stand at the same
 * value. Two throwaway clusters of this test's own, destroyed at the end (also on failure);
 * the cluster the other e2e tests use is never touched.
 */

const run = promisify(execFile);
const ROOT = join(__dirname, '..', '..');
const DB_SCRIPT = join(ROOT, 'scripts', 'db');
/** The built server's folder: PANELPASS_SERVER_MAIN points at a private build when set. */
const DIST = process.env.PANELPASS_SERVER_MAIN
  ? dirname(process.env.PANELPASS_SERVER_MAIN)
  : join(__dirname, '..', 'dist');

interface Cluster {
  port: number;
  dir: string;
  url: string;
}

function dbEnv(c: Cluster): NodeJS.ProcessEnv {
  return {
    ...process.env,
    PANELPASS_DB_PORT: String(c.port),
    PANELPASS_DB_DIR: c.dir,
    PANELPASS_DB_NAME: 'panelpass',
    PANELPASS_DB_FSYNC: 'off',
  };
}

/** Runs scripts/db for one cluster; answers what it wrote on stderr (its log lines). */
async function db(c: Cluster, ...args: string[]): Promise<string> {
  const { stderr } = await run(DB_SCRIPT, args, { env: dbEnv(c), timeout: 60_000 });
  return stderr;
}

async function query<T>(c: Cluster, sql: string, params: unknown[] = []): Promise<T[]> {
  const client = new Client({ connectionString: c.url });
  await client.connect();
  try {
    return (await client.query(sql, params)).rows as T[];
  } finally {
    await client.end();
  }
}

/** Every table of our schemas: its row count and an md5 of its rows' text, in text order. */
async function fingerprint(c: Cluster, tables: string[]): Promise<Record<string, string>> {
  const out: Record<string, string> = {};
  for (const t of tables) {
    const [row] = await query<{ n: string; h: string | null }>(
      c,
      `SELECT count(*)::text AS n, md5(string_agg(x::text, E'\\n' ORDER BY x::text)) AS h FROM ${t} x`,
    );
    out[t] = `${row!.n} rows, ${row!.h ?? 'empty'}`;
  }
  return out;
}

async function tablesOf(c: Cluster): Promise<string[]> {
  const rows = await query<{ t: string }>(
    c,
    `SELECT format('%I.%I', n.nspname, r.relname) AS t
       FROM pg_class r JOIN pg_namespace n ON n.oid = r.relnamespace
      WHERE r.relkind IN ('r', 'p') AND n.nspname IN ('public', 'pgboss')
      ORDER BY 1`,
  );
  return rows.map((r) => r.t);
}

async function sequencesOf(c: Cluster): Promise<Record<string, string>> {
  const rows = await query<{ s: string; v: string | null }>(
    c,
    `SELECT format('%I.%I', schemaname, sequencename) AS s, last_value::text AS v
       FROM pg_sequences WHERE schemaname IN ('public', 'pgboss') ORDER BY 1`,
  );
  return Object.fromEntries(rows.map((r) => [r.s, r.v ?? 'never used']));
}

describe('scripts/db backup and restore', () => {
  let parent: string;
  let a: Cluster;
  let b: Cluster;
  let dump: string;

  beforeAll(async () => {
    parent = await mkdtemp('/var/tmp/pp-backup-test-');
    // As root the clusters run as `postgres`, which must be able to reach their folders.
    await chmod(parent, 0o755);
    const port = 56000 + (process.pid % 250) * 2;
    a = { port, dir: join(parent, 'a'), url: `postgres://panelpass@127.0.0.1:${port}/panelpass` };
    b = {
      port: port + 1,
      dir: join(parent, 'b'),
      url: `postgres://panelpass@127.0.0.1:${port + 1}/panelpass`,
    };
    dump = join(parent, 'panelpass.dump');
  });

  afterAll(async () => {
    for (const c of [a, b]) await db(c, 'destroy').catch(() => undefined);
    await rm(parent, { recursive: true, force: true });
  });

  it('restores every row of every table and every sequence into a fresh cluster', async () => {
    await db(a, 'start');
    const serverEnv = {
      ...process.env,
      DATABASE_URL: a.url,
      JWT_SECRET: TEST_JWT_SECRET,
      MAIL_SENDER: '0',
      NODE_ENV: 'test',
    };
    await run(process.execPath, [join(DIST, 'database', 'migrate.js')], { env: serverEnv });
    // The demo week, through the app's own commands (pg-boss creates its schema on the way).
    await run(process.execPath, [join(DIST, 'database', 'seeds', 'run-seed.js')], {
      env: serverEnv,
      timeout: 60_000,
    });
    // Awkward values a dump must carry exactly: text beyond the BMP, quotes, tabs and new
    // lines in a real table; and a table of our own for types the schema has few of (bytea
    // with zero bytes, the largest bigint, a 40-digit numeric, NaN and infinities, NULLs).
    await query(
      a,
      `UPDATE customers SET name = $1, notes = ''
        WHERE id = (SELECT id FROM customers ORDER BY id LIMIT 1)`,
      ['Zoë “Ōkami” 🚗 O\'Hara,\t"quoted"\r\nsecond line'],
    );
    await query(
      a,
      `CREATE TABLE public.backup_probe (
         id bigserial PRIMARY KEY, label text, blob bytea, big bigint, exact numeric,
         ratio double precision, at timestamptz, doc jsonb, tags text[])`,
    );
    await query(
      a,
      `INSERT INTO public.backup_probe (label, blob, big, exact, ratio, at, doc, tags) VALUES
        ('ünïcödé ✓ 漆', '\\x00ff00deadbeef00'::bytea, 9223372036854775807,
         1234567890123456789012345678901234.567890, 'NaN', '2031-02-03 04:05:06.789012+00',
         '{"a": [1, 2.5, null], "emoji": "🧽"}', ARRAY['a,b', NULL, '"c"']),
        (NULL, NULL, -9223372036854775808, -0.000000000000000001, '-Infinity', NULL, 'null', '{}'),
        ('', '\\x'::bytea, 0, 0, 'Infinity', '-infinity', '[]', NULL)`,
    );
    await query(a, `SELECT setval('public.backup_probe_id_seq', 9007199254740993)`);

    const tables = await tablesOf(a);
    // The comparison below is only worth something if there is data in both our schemas.
    expect(tables).toEqual(
      expect.arrayContaining(['public.businesses', 'public.jobs', 'public.backup_probe']),
    );
    expect(tables.some((t) => t.startsWith('pgboss.'))).toBe(true);
    const before = await fingerprint(a, tables);
    expect(before['public.jobs']).not.toMatch(/^0 rows/);
    expect(before['public.backup_probe']).toMatch(/^3 rows/);
    const sequencesBefore = await sequencesOf(a);
    expect(sequencesBefore['public.backup_probe_id_seq']).toBe('9007199254740993');

    const backupLog = await db(a, 'backup', dump);
    expect(backupLog).toMatch(
      new RegExp(`backed up panelpass to .*: \\S+, ${tables.length} tables`),
    );
    expect((await stat(dump)).size).toBeGreaterThan(0);

    await db(b, 'start');
    const restoreLog = await db(b, 'restore', dump);
    expect(restoreLog).toContain(`${tables.length} tables`);

    expect(await tablesOf(b)).toEqual(tables);
    expect(await fingerprint(b, tables)).toEqual(before);
    expect(await sequencesOf(b)).toEqual(sequencesBefore);

    // Restoring again over the tables now there is refused and changes nothing…
    await expect(db(b, 'restore', dump)).rejects.toMatchObject({
      stderr: expect.stringContaining('already has') as unknown,
    });
    // …unless --force, which drops the database first (a row added since is gone again).
    await query(b, `INSERT INTO public.backup_probe (label) VALUES ('added after the restore')`);
    await db(b, 'restore', dump, '--force');
    expect(await fingerprint(b, tables)).toEqual(before);
  }, 120_000);
});
