import type { NestExpressApplication } from '@nestjs/platform-express';
import type { PullResponse, PushResponse, SyncRow } from '@panelpass/shared';
import { randomUUID } from 'node:crypto';
import { DataSource } from 'typeorm';
import { addTech, createTestApp, http, type Session, signUpOwner } from './support/app';

const bearer = { type: 'bearer' as const };

function jobMutations(startId: number, opts: { techId?: string } = {}) {
  const customerId = randomUUID();
  const vehicleId = randomUUID();
  const jobId = randomUUID();
  const start = Date.now() + 86_400_000;
  return {
    customerId,
    vehicleId,
    jobId,
    mutations: [
      { id: startId, name: 'customer.create', args: { id: customerId, name: 'Juniper Hale' } },
      {
        id: startId + 1,
        name: 'vehicle.create',
        args: { id: vehicleId, customerId, bodyStyle: 'sedan', colour: 'silver' },
      },
      {
        id: startId + 2,
        name: 'job.create',
        args: {
          id: jobId,
          customerId,
          vehicleId,
          windowStart: new Date(start).toISOString(),
          windowEnd: new Date(start + 7_200_000).toISOString(),
          priceMinor: 30_000,
          ...(opts.techId ? { assignedTechId: opts.techId } : {}),
        },
      },
    ],
  };
}

async function pullAll(
  app: NestExpressApplication,
  s: Session,
  clientId: string,
  from = 0,
  scope = 0,
  limit?: number,
) {
  let cursor = from;
  const rows: Record<string, SyncRow[]> = {};
  let last: PullResponse;
  let pages = 0;
  do {
    const res = await http(app)
      .get('/api/sync/pull')
      .query({ cursor, scope, clientId, ...(limit ? { limit } : {}) })
      .auth(s.accessToken, bearer)
      .expect(200);
    last = res.body as PullResponse;
    for (const [table, list] of Object.entries(last.changes))
      (rows[table] ??= []).push(...(list ?? []));
    cursor = last.cursor;
    scope = last.scope;
    pages++;
  } while (last.more && pages < 100);
  return { rows, last, pages };
}

describe('sync push and pull', () => {
  let app: NestExpressApplication;
  let owner: Session;

  beforeAll(async () => {
    app = await createTestApp();
    owner = await signUpOwner(app, 'sync');
  });
  afterAll(async () => {
    await app.close();
  });

  it('applies pushed mutations once, in order; a retried push skips them', async () => {
    const clientId = randomUUID();
    const { mutations, jobId } = jobMutations(1);
    const first = await http(app)
      .post('/api/sync/push')
      .auth(owner.accessToken, bearer)
      .send({ clientId, mutations })
      .expect(200);
    expect((first.body as PushResponse).results.map((r) => r.status)).toEqual([
      'applied',
      'applied',
      'applied',
    ]);
    expect(first.body.lastMutationId).toBe(3);

    const again = await http(app)
      .post('/api/sync/push')
      .auth(owner.accessToken, bearer)
      .send({ clientId, mutations })
      .expect(200);
    expect((again.body as PushResponse).results.map((r) => r.status)).toEqual([
      'skipped',
      'skipped',
      'skipped',
    ]);
    const ds = app.get(DataSource);
    const jobs: unknown[] = await ds.query('SELECT id FROM jobs WHERE id = $1', [jobId]);
    expect(jobs).toHaveLength(1);
  });

  it('records a refused mutation with its reason and goes on with the next', async () => {
    const clientId = randomUUID();
    const { mutations, jobId } = jobMutations(1);
    const bad = { id: 4, name: 'job.setStage', args: { id: jobId, stage: 'handover' } };
    const good = { id: 5, name: 'job.setStage', args: { id: jobId, stage: 'walkaround' } };
    const res = await http(app)
      .post('/api/sync/push')
      .auth(owner.accessToken, bearer)
      .send({ clientId, mutations: [...mutations, bad, good] })
      .expect(200);
    const body = res.body as PushResponse;
    expect(body.results[3]).toMatchObject({ id: 4, status: 'rejected', code: 'stage-not-allowed' });
    expect(body.results[4]).toEqual({ id: 5, status: 'applied' });
    expect(body.lastMutationId).toBe(5);
    const unknown = await http(app)
      .post('/api/sync/push')
      .auth(owner.accessToken, bearer)
      .send({ clientId, mutations: [{ id: 6, name: 'job.teleport', args: {} }] })
      .expect(200);
    expect(unknown.body.results[0]).toMatchObject({ status: 'rejected', code: 'unknown-command' });
    expect(unknown.body.lastMutationId).toBe(6);

    // The answer to that push was lost: the retry gets the same refusal, not a bare "skipped".
    const retried = await http(app)
      .post('/api/sync/push')
      .auth(owner.accessToken, bearer)
      .send({ clientId, mutations: [bad, good] })
      .expect(200);
    expect(retried.body.results).toEqual([
      expect.objectContaining({ id: 4, status: 'rejected', code: 'stage-not-allowed' }),
      { id: 5, status: 'skipped' },
    ]);
  });

  it('pulls new rows with tombstones, by version cursor, and pages without losing any', async () => {
    const clientId = randomUUID();
    const base = await pullAll(app, owner, clientId);
    const { mutations, customerId, jobId } = jobMutations(1);
    await http(app)
      .post('/api/sync/push')
      .auth(owner.accessToken, bearer)
      .send({ clientId, mutations })
      .expect(200);
    await http(app)
      .post('/api/sync/push')
      .auth(owner.accessToken, bearer)
      .send({ clientId, mutations: [{ id: 4, name: 'customer.remove', args: { id: customerId } }] })
      .expect(200);

    const whole = await pullAll(app, owner, clientId, base.last.cursor);
    expect(whole.rows.jobs?.map((j) => j.id)).toEqual([jobId]);
    expect(whole.rows.customers?.find((c) => c.id === customerId)?.deletedAt).not.toBeNull();
    expect(whole.rows.job_panels?.length).toBeGreaterThan(5);
    expect(whole.last.lastMutationId).toBe(4);

    const paged = await pullAll(app, owner, clientId, base.last.cursor, 0, 3);
    expect(paged.pages).toBeGreaterThan(2);
    for (const [table, rows] of Object.entries(whole.rows)) {
      const ids = (paged.rows[table] ?? []).map((r) => r.id);
      expect({ table, ids: [...new Set(ids)].sort() }).toEqual({
        table,
        ids: rows.map((r) => r.id).sort(),
      });
    }
  });

  it("a helper pulls only their jobs' rows, without prices, and starts afresh when assignments change", async () => {
    const tech = await addTech(app, owner, 'sync-tech');
    const ownerClient = randomUUID();
    const techClient = randomUUID();
    const mine = jobMutations(1, { techId: tech.user.id });
    const other = jobMutations(4);
    await http(app)
      .post('/api/sync/push')
      .auth(owner.accessToken, bearer)
      .send({ clientId: ownerClient, mutations: [...mine.mutations, ...other.mutations] })
      .expect(200);

    const first = await pullAll(app, tech, techClient);
    expect(first.rows.jobs?.map((j) => j.id)).toEqual([mine.jobId]);
    expect(first.rows.jobs?.[0]).not.toHaveProperty('priceMinor');
    expect(first.rows.customers?.map((c) => c.id)).toEqual([mine.customerId]);
    expect(first.rows.job_panels?.every((p) => p.jobId === mine.jobId)).toBe(true);
    expect(first.rows.quotes).toBeUndefined();

    await http(app)
      .post(`/api/jobs/${other.jobId}/assign`)
      .auth(owner.accessToken, bearer)
      .send({ techId: tech.user.id })
      .expect(200);
    const next = await http(app)
      .get('/api/sync/pull')
      .query({ cursor: first.last.cursor, scope: first.last.scope, clientId: techClient })
      .auth(tech.accessToken, bearer)
      .expect(200);
    expect(next.body.reset).toBe(true);
    expect((next.body.changes.jobs as SyncRow[]).map((j) => j.id).sort()).toEqual(
      [mine.jobId, other.jobId].sort(),
    );
  });

  it('refuses sync to a customer and a device id used by another person', async () => {
    const clientId = randomUUID();
    await http(app)
      .post('/api/sync/push')
      .auth(owner.accessToken, bearer)
      .send({ clientId, mutations: [] })
      .expect(200);
    const other = await signUpOwner(app, 'sync-other');
    const res = await http(app)
      .post('/api/sync/push')
      .auth(other.accessToken, bearer)
      .send({ clientId, mutations: [] })
      .expect(409);
    expect(res.body.code).toBe('client-id-taken');
  });
});
