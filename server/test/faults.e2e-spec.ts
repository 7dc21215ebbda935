import type { Mutation, PushResponse } from '@panelpass/shared';
import { execFile } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { DataSource } from 'typeorm';
import { dataSourceOptions } from '../src/database/data-source';
import { MIGRATE, ServerProcess } from './support/server-process';

const run = promisify(execFile);
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/**
 * Faults: PostgreSQL stopped the hard way (`pg_ctl stop -m immediate`) while three phones push,
 * and the server SIGKILLed in the middle of a REST command and a push. The API answers 503 with
 * words meanwhile, recovers by itself, and nothing is lost or applied twice.
 *
 * The test makes its own throwaway cluster (scripts/db with a port and folder of its own), so
 * the shared e2e cluster is never stopped.
 */
describe('faults: the database and the server going away', () => {
  const dbPort = 55_000 + (process.pid % 500);
  const dbEnv = {
    ...process.env,
    PANELPASS_DB_PORT: String(dbPort),
    PANELPASS_DB_DIR: `/var/tmp/panelpass-faults-${process.pid}`,
    PANELPASS_DB_FSYNC: 'off',
  };
  const dbScript = join(__dirname, '..', '..', 'scripts', 'db');
  const scriptsDb = (...args: string[]) => run(dbScript, args, { env: dbEnv, timeout: 90_000 });
  const databaseUrl = `postgres://panelpass@127.0.0.1:${dbPort}/panelpass`;
  const appPort = 19_100 + (process.pid % 400);
  const server = new ServerProcess(appPort, {
    databaseUrl,
    captureOutput: true,
    // The follow-up worker and the mail sender poll often, so they meet the outage too.
    env: {
      FOLLOW_UPS: 'on',
      FOLLOW_UPS_POLL_SECONDS: '0.5',
      FOLLOW_UPS_SWEEP_SECONDS: '1',
      MAIL_POLL_MS: '200',
    },
  });

  beforeAll(async () => {
    await scriptsDb('destroy').catch(() => undefined);
    await scriptsDb('start');
    await run(process.execPath, [MIGRATE], {
      env: { ...process.env, DATABASE_URL: databaseUrl },
    });
    await server.start();
  }, 90_000);

  afterAll(async () => {
    await server.kill();
    await scriptsDb('destroy');
  }, 60_000);

  /** A signed-up owner's token on this server. */
  async function ownerToken(): Promise<string> {
    const res = await fetch(`${server.url}/api/auth/sign-up`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({
        businessName: 'Fault Line Detailing',
        name: 'Owner',
        email: `faults-${randomUUID().slice(0, 8)}@test.example`,
        password: 'long enough password',
      }),
    });
    expect(res.status).toBe(201);
    return ((await res.json()) as { accessToken: string }).accessToken;
  }

  /** Counts in the throwaway database, on a connection of its own. */
  async function inDatabase<T>(work: (db: DataSource) => Promise<T>): Promise<T> {
    const db = await new DataSource(dataSourceOptions(databaseUrl)).initialize();
    try {
      return await work(db);
    } finally {
      await db.destroy();
    }
  }

  interface Answer {
    status: number;
    body: { code?: string; message?: string } | null;
    retryAfter: string | null;
  }
  /** Anything but an HTTP answer within the bound: a dropped connection or a hang. */
  interface NoAnswer {
    status: 'no-answer';
    error: string;
  }

  /** One request with a bound on the wait (a request hanging past it counts as no answer). */
  async function call(
    path: string,
    token: string,
    body?: unknown,
  ): Promise<(Answer & { json: unknown }) | NoAnswer> {
    try {
      const res = await fetch(`${server.url}${path}`, {
        method: body === undefined ? 'GET' : 'POST',
        headers: { 'content-type': 'application/json', authorization: `Bearer ${token}` },
        body: body === undefined ? undefined : JSON.stringify(body),
        signal: AbortSignal.timeout(15_000),
      });
      const json: unknown = await res.json().catch(() => null);
      return {
        status: res.status,
        body: json as Answer['body'],
        retryAfter: res.headers.get('retry-after'),
        json,
      };
    } catch (e) {
      return { status: 'no-answer', error: e instanceof Error ? e.message : String(e) };
    }
  }

  it('PostgreSQL stopped with -m immediate while three phones push: 503 with words meanwhile, then every mutation exactly once, same server process', async () => {
    const token = await ownerToken();
    const pid = server.pid;
    expect(pid).not.toBeNull();

    const phase = { crashed: false, restarted: false };
    const failures: (Answer | NoAnswer)[] = [];
    let firstOkAfterRestart: number | null = null;

    /**
     * A phone's sync engine, cut down: batches of five new customers and an update of each,
     * numbered 1, 2, 3…; the same batch is sent again until the server takes all of it (2xx
     * and its lastMutationId at the batch's end), as the phone's outbox does.
     */
    async function phone(clientId: string) {
      const created: string[] = [];
      let next = 1;
      let batchesAfterRestart = 0;
      let acknowledged = 0;
      while (batchesAfterRestart < 3) {
        const ids = Array.from({ length: 5 }, () => randomUUID());
        const mutations: Mutation[] = [];
        const createdAt = new Date().toISOString();
        for (const id of ids) {
          mutations.push({
            id: next++,
            name: 'customer.create',
            args: { id, name: `Client ${next}` },
            createdAt,
          });
          mutations.push({
            id: next++,
            name: 'customer.update',
            args: { id, notes: `note ${id}` },
            createdAt,
          });
        }
        const last = next - 1;
        for (;;) {
          const answer = await call('/api/sync/push', token, { clientId, mutations });
          if (answer.status === 200) {
            const result = answer.json as PushResponse;
            expect(result.results.filter((r) => r.status === 'rejected')).toEqual([]);
            if (result.lastMutationId === last) break;
          } else {
            failures.push(answer);
          }
          await sleep(100);
        }
        created.push(...ids);
        acknowledged += 1;
        if (phase.restarted) {
          batchesAfterRestart += 1;
          firstOkAfterRestart ??= Date.now();
        }
        // Before the crash, each phone keeps a steady pace so the crash finds them mid-push.
        if (!phase.crashed && acknowledged > 3) await sleep(20);
      }
      return { clientId, created, lastMutationId: next - 1, acknowledged };
    }

    const phones = Promise.all([randomUUID(), randomUUID(), randomUUID()].map(phone));

    // Let every phone get some batches in, then pull the plug on the database.
    await inDatabase(async (db) => {
      for (let i = 0; i < 600; i++) {
        const [{ n }] = await db.query<[{ n: number }]>(
          'SELECT count(*)::int AS n FROM sync_clients WHERE last_mutation_id >= 30',
        );
        if (n === 3) return;
        await sleep(25);
      }
      throw new Error('the phones did not get going');
    });
    await scriptsDb('crash');
    phase.crashed = true;
    const downAt = Date.now();

    // Meanwhile: health says so, and a signed-in read (its token's person looked up in the
    // database) answers 503 — never "sign in again".
    await sleep(500);
    const health = await fetch(`${server.url}/api/health`);
    expect(health.status).toBe(503);
    expect(health.headers.get('retry-after')).toMatch(/^\d+$/);
    expect(await health.json()).toMatchObject({ database: 'down' });
    const read = await call('/api/customers', token);
    expect(read).toMatchObject({
      status: 503,
      body: { code: 'database-unavailable' },
      retryAfter: expect.stringMatching(/^\d+$/) as unknown,
    });
    await sleep(1_500);

    const startAt = Date.now();
    await scriptsDb('start');
    const upAt = Date.now();
    phase.restarted = true;
    const done = await phones;

    // Every failed try during the outage was a 503 with words and a Retry-After — no 500,
    // no 401, no dropped connection, no hang.
    expect(failures.length).toBeGreaterThan(0);
    for (const f of failures) {
      expect(f).toMatchObject({
        status: 503,
        body: {
          code: 'database-unavailable',
          message: expect.stringContaining('kept on the phone') as unknown,
        },
        retryAfter: expect.stringMatching(/^\d+$/) as unknown,
      });
    }

    await inDatabase(async (db) => {
      for (const p of done) {
        const [client] = await db.query<{ last: number }[]>(
          'SELECT last_mutation_id::int AS last FROM sync_clients WHERE client_id = $1',
          [p.clientId],
        );
        expect(client?.last).toBe(p.lastMutationId);
        // Each mutation wrote exactly one audit entry: applied once, never twice.
        const audits = await db.query<{ command: string; n: number; subjects: number }[]>(
          `SELECT command, count(*)::int AS n, count(DISTINCT subject_id)::int AS subjects
             FROM audit_entries WHERE via = $1 GROUP BY command ORDER BY command`,
          [p.clientId],
        );
        const half = p.lastMutationId / 2;
        expect(audits).toEqual([
          { command: 'customer.create', n: half, subjects: half },
          { command: 'customer.update', n: half, subjects: half },
        ]);
        const [rows] = await db.query<[{ n: number; noted: number }]>(
          `SELECT count(*)::int AS n, count(*) FILTER (WHERE notes = 'note ' || id)::int AS noted
             FROM customers WHERE id = ANY($1)`,
          [p.created],
        );
        expect(rows).toEqual({ n: p.created.length, noted: p.created.length });
      }
      const [versions] = await db.query<[{ n: number; distinct: number }]>(
        'SELECT count(*)::int AS n, count(DISTINCT version)::int AS distinct FROM customers',
      );
      expect(versions.distinct).toBe(versions.n);
      const [{ n: refused }] = await db.query<[{ n: number }]>(
        'SELECT count(*)::int AS n FROM sync_rejections',
      );
      expect(refused).toBe(0);

      // The follow-up worker's pool found the database again by itself.
      let bossBack = false;
      for (let i = 0; i < 100 && !bossBack; i++) {
        const [{ n }] = await db.query<[{ n: number }]>(
          "SELECT count(*)::int AS n FROM pg_stat_activity WHERE application_name = 'panelpass-follow-ups'",
        );
        bossBack = n > 0;
        if (!bossBack) await sleep(200);
      }
      expect(bossBack).toBe(true);
    });

    // The same process throughout: it neither exited nor was restarted, and still answers.
    expect(server.pid).toBe(pid);
    expect((await fetch(`${server.url}/api/health`)).status).toBe(200);
    // Its log has the outage in one line per refused request, and no crash of a background job.
    expect(server.output).toMatch(/database unavailable: /);
    expect(server.output).not.toMatch(/unhandled|uncaught/i);

    console.log(
      `faults: database down ${startAt - downAt} ms, its restart took ${upAt - startAt} ms, ` +
        `first push taken ${(firstOkAfterRestart ?? upAt) - upAt} ms after; ` +
        `${failures.length} tries answered 503; ` +
        `${done.reduce((s, p) => s + p.lastMutationId, 0)} mutations from 3 phones`,
    );
  }, 90_000);

  it('the server SIGKILLed in the middle of REST creates and a push: after a restart and retries, nothing lost or doubled', async () => {
    const token = await ownerToken();

    // REST: customers created one after another, each with an id the client made, until the
    // server dies under one of them.
    const answered = new Map<string, number | 'no-answer'>();
    let restRunning = true;
    const rest = (async () => {
      while (restRunning) {
        const id = randomUUID();
        const res = await call('/api/customers', token, { id, name: `Walk-in ${id.slice(0, 4)}` });
        answered.set(id, res.status);
        if (res.status === 'no-answer') return;
      }
    })();

    const clientId = randomUUID();
    const ids = Array.from({ length: 400 }, () => randomUUID());
    const mutations = ids.map((id, i) => ({
      id: i + 1,
      name: 'customer.create',
      args: { id, name: `Customer ${i + 1}` },
    }));
    const lost = call('/api/sync/push', token, { clientId, mutations });

    await inDatabase(async (db) => {
      for (let i = 0; i < 800; i++) {
        const [row] = await db.query<{ last: number }[]>(
          'SELECT last_mutation_id::int AS last FROM sync_clients WHERE client_id = $1',
          [clientId],
        );
        if (row && row.last >= 20 && answered.size >= 3) return;
        await sleep(10);
      }
      throw new Error('the push did not get going');
    });
    await server.kill();
    restRunning = false;
    expect(await lost).toMatchObject({ status: 'no-answer' });
    await rest;

    await server.start();
    // The phone sends the same push again; the office retries every create it has no answer
    // for, with the same id.
    const again = await call('/api/sync/push', token, { clientId, mutations });
    expect(again.status).toBe(200);
    const pushed = (again as { json: unknown }).json as PushResponse;
    expect(pushed.lastMutationId).toBe(400);
    const skipped = pushed.results.filter((r) => r.status === 'skipped').length;
    expect(skipped).toBeGreaterThan(0);
    expect(skipped + pushed.results.filter((r) => r.status === 'applied').length).toBe(400);

    const unanswered = [...answered].filter(([, status]) => status !== 201).map(([id]) => id);
    expect(unanswered.length).toBeGreaterThan(0);
    for (const id of unanswered) {
      const retry = await call('/api/customers', token, { id, name: `Walk-in ${id.slice(0, 4)}` });
      expect(retry.status).toBe(201);
    }

    await inDatabase(async (db) => {
      const [{ n: viaPush }] = await db.query<[{ n: number }]>(
        'SELECT count(*)::int AS n FROM customers WHERE id = ANY($1)',
        [ids],
      );
      expect(viaPush).toBe(400);
      const [{ n: pushAudits }] = await db.query<[{ n: number }]>(
        'SELECT count(*)::int AS n FROM audit_entries WHERE via = $1',
        [clientId],
      );
      expect(pushAudits).toBe(400);
      const restIds = [...answered.keys()];
      const [{ n: viaRest }] = await db.query<[{ n: number }]>(
        'SELECT count(*)::int AS n FROM customers WHERE id = ANY($1)',
        [restIds],
      );
      expect(viaRest).toBe(restIds.length);
    });
  }, 90_000);
});
