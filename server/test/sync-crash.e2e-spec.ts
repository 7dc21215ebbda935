import type { PushResponse } from '@panelpass/shared';
import { randomUUID } from 'node:crypto';
import { DataSource } from 'typeorm';
import { dataSourceOptions } from '../src/database/data-source';
import { ServerProcess } from './support/server-process';

/** The server killed in the middle of a push: after a restart and a re-push, nothing is lost or doubled. */
describe('sync survives the server being killed mid-push', () => {
  const server = new ServerProcess(18_000 + (process.pid % 1000));
  let db: DataSource;

  beforeAll(async () => {
    db = await new DataSource(dataSourceOptions(process.env.DATABASE_URL!)).initialize();
    await server.start();
  }, 30_000);
  afterAll(async () => {
    await server.kill();
    await db.destroy();
  });

  it('applies every mutation exactly once', async () => {
    const email = `crash-${randomUUID().slice(0, 8)}@test.example`;
    const signUp = await fetch(`${server.url}/api/auth/sign-up`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({
        businessName: 'Crash Test',
        name: 'Owner',
        email,
        password: 'long enough password',
      }),
    });
    const { accessToken } = (await signUp.json()) as { accessToken: string };
    const clientId = randomUUID();
    const ids = Array.from({ length: 400 }, () => randomUUID());
    const mutations = ids.map((id, i) => ({
      id: i + 1,
      name: 'customer.create',
      args: { id, name: `Customer ${i + 1}` },
    }));
    const push = () =>
      fetch(`${server.url}/api/sync/push`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', authorization: `Bearer ${accessToken}` },
        body: JSON.stringify({ clientId, mutations }),
      });

    // Kill once some, but not all, mutations are in.
    const lost = push().catch(() => null);
    for (let i = 0; i < 400; i++) {
      const [row] = await db.query<
        {
          last_mutation_id: string;
        }[]
      >('SELECT last_mutation_id FROM sync_clients WHERE client_id = $1', [clientId]);
      if (row && Number(row.last_mutation_id) >= 20) break;
      await new Promise((r) => setTimeout(r, 10));
    }
    await server.kill();
    await lost;
    const [{ n: before }] = await db.query<[{ n: number }]>(
      'SELECT count(*)::int AS n FROM customers WHERE id = ANY($1)',
      [ids],
    );
    expect(before).toBeGreaterThan(0);
    expect(before).toBeLessThan(400);

    await server.start();
    const res = await push();
    expect(res.status).toBe(200);
    const body = (await res.json()) as PushResponse;
    expect(body.lastMutationId).toBe(400);
    expect(body.results.filter((r) => r.status === 'skipped')).toHaveLength(before);
    expect(body.results.filter((r) => r.status === 'applied')).toHaveLength(400 - before);

    const [{ n: after }] = await db.query<[{ n: number }]>(
      'SELECT count(*)::int AS n FROM customers WHERE id = ANY($1)',
      [ids],
    );
    expect(after).toBe(400);
    const [{ n: audits }] = await db.query<[{ n: number }]>(
      "SELECT count(*)::int AS n FROM audit_entries WHERE command = 'customer.create' AND subject_id = ANY($1)",
      [ids],
    );
    expect(audits).toBe(400);
  }, 60_000);
});
