import type { NestExpressApplication } from '@nestjs/platform-express';
import { bodyStyleTemplate, childId } from '@panelpass/shared';
import { randomUUID } from 'node:crypto';
import { DataSource } from 'typeorm';
import { signInCustomer } from './factories/customers';
import { makeJob } from './factories/records';
import { addTech, createTestApp, http, type Session, signUpOwner } from './support/app';

const bearer = { type: 'bearer' as const };

describe('customers, vehicles and jobs', () => {
  let app: NestExpressApplication;
  let owner: Session;
  let tech: Session;

  beforeAll(async () => {
    app = await createTestApp();
    owner = await signUpOwner(app, 'jobs');
    tech = await addTech(app, owner);
  });
  afterAll(async () => {
    await app.close();
  });

  it("a new job gets its vehicle's panels top-down, with ids both sides can compute", async () => {
    const { jobId } = await makeJob(app, owner, { bodyStyle: 'pickup' });
    const ds = app.get(DataSource);
    const panels: { id: string; panel_key: string; position: number }[] = await ds.query(
      'SELECT id, panel_key, position FROM job_panels WHERE job_id = $1 ORDER BY position',
      [jobId],
    );
    const template = bodyStyleTemplate('pickup');
    expect(panels.map((p) => p.panel_key)).toEqual(template.map((t) => t.id));
    expect(panels[0]!.id).toBe(childId(jobId, `panel:${template[0]!.id}`));
  });

  it('retrying a create with the same id returns the same record, not a second one', async () => {
    const id = randomUUID();
    const body = { id, name: 'Twice Sent' };
    const a = await http(app)
      .post('/api/customers')
      .auth(owner.accessToken, bearer)
      .send(body)
      .expect(201);
    const b = await http(app)
      .post('/api/customers')
      .auth(owner.accessToken, bearer)
      .send(body)
      .expect(201);
    expect(b.body.version).toBe(a.body.version);
  });

  it('moves stages one at a time; a skip is a 409 naming the allowed stages', async () => {
    const { jobId } = await makeJob(app, owner);
    const skip = await http(app)
      .post(`/api/jobs/${jobId}/stage`)
      .auth(owner.accessToken, bearer)
      .send({ stage: 'correction' })
      .expect(409);
    expect(skip.body).toMatchObject({
      code: 'stage-not-allowed',
      details: { from: 'booked', allowed: ['walkaround'] },
    });
    const ok = await http(app)
      .post(`/api/jobs/${jobId}/stage`)
      .auth(owner.accessToken, bearer)
      .send({ stage: 'walkaround' })
      .expect(200);
    expect(ok.body.stage).toBe('walkaround');
    const bad = await http(app)
      .post(`/api/jobs/${jobId}/stage`)
      .auth(owner.accessToken, bearer)
      .send({ stage: 'polishing' })
      .expect(400);
    expect(bad.body.details[0].field).toBe('stage');
  });

  it('detects a stale write through If-Match and lets a fresh one through', async () => {
    const { customerId } = await makeJob(app, owner);
    const current = await http(app)
      .get(`/api/customers/${customerId}`)
      .auth(owner.accessToken, bearer)
      .expect(200);
    const v = current.body.version as number;
    await http(app)
      .patch(`/api/customers/${customerId}`)
      .auth(owner.accessToken, bearer)
      .set('If-Match', `"${v}"`)
      .send({ phone: '555-0100' })
      .expect(200);
    const stale = await http(app)
      .patch(`/api/customers/${customerId}`)
      .auth(owner.accessToken, bearer)
      .set('If-Match', `"${v}"`)
      .send({ phone: '555-0199' })
      .expect(409);
    expect(stale.body.code).toBe('stale-write');
    expect(stale.body.details.currentVersion).toBeGreaterThan(v);
  });

  it('of two concurrent writes made against the same version, exactly one wins', async () => {
    const { jobId } = await makeJob(app, owner);
    const current = await http(app)
      .get(`/api/jobs/${jobId}`)
      .auth(owner.accessToken, bearer)
      .expect(200);
    const v = String(current.body.version);
    const attempts = await Promise.all(
      ['first note', 'second note', 'third note'].map((notes) =>
        http(app)
          .patch(`/api/jobs/${jobId}`)
          .auth(owner.accessToken, bearer)
          .set('If-Match', `"${v}"`)
          .send({ notes }),
      ),
    );
    const statuses = attempts.map((r) => r.status).sort();
    expect(statuses).toEqual([200, 409, 409]);
    const winner = attempts.find((r) => r.status === 200)!;
    const after = await http(app)
      .get(`/api/jobs/${jobId}`)
      .auth(owner.accessToken, bearer)
      .expect(200);
    expect(after.body.notes).toBe(winner.body.notes);
  });

  it('every write bumps the version from one sequence', async () => {
    const { jobId } = await makeJob(app, owner);
    const before = await http(app)
      .get(`/api/jobs/${jobId}`)
      .auth(owner.accessToken, bearer)
      .expect(200);
    const after = await http(app)
      .patch(`/api/jobs/${jobId}`)
      .auth(owner.accessToken, bearer)
      .send({ notes: 'gate code 4411' })
      .expect(200);
    expect(Number(after.body.version)).toBeGreaterThan(Number(before.body.version));
  });

  it('a helper sees only jobs assigned to them, without the price', async () => {
    const mine = await makeJob(app, owner, { techId: tech.user.id });
    const other = await makeJob(app, owner);
    const list = await http(app).get('/api/jobs').auth(tech.accessToken, bearer).expect(200);
    const ids = (list.body.items as { id: string }[]).map((j) => j.id);
    expect(ids).toContain(mine.jobId);
    expect(ids).not.toContain(other.jobId);
    expect(list.body.items[0]).not.toHaveProperty('priceMinor');
    expect(list.body.items[0].amountDueMinor).toBe(45_000);
    await http(app).get(`/api/jobs/${other.jobId}`).auth(tech.accessToken, bearer).expect(404);
    await http(app)
      .patch(`/api/jobs/${mine.jobId}`)
      .auth(tech.accessToken, bearer)
      .send({ priceMinor: 1 })
      .expect(403);
    await http(app)
      .patch(`/api/jobs/${mine.jobId}`)
      .auth(tech.accessToken, bearer)
      .send({ conditionNotes: 'swirls all over' })
      .expect(200);
  });

  it("another business's records are answered as not found", async () => {
    const { jobId, customerId } = await makeJob(app, owner);
    const stranger = await signUpOwner(app, 'stranger');
    await http(app).get(`/api/jobs/${jobId}`).auth(stranger.accessToken, bearer).expect(404);
    await http(app)
      .get(`/api/customers/${customerId}`)
      .auth(stranger.accessToken, bearer)
      .expect(404);
    await http(app)
      .patch(`/api/customers/${customerId}`)
      .auth(stranger.accessToken, bearer)
      .send({ name: 'x' })
      .expect(404);
  });

  it('refuses a window that ends before it starts, naming the field', async () => {
    const { customerId, vehicleId } = await makeJob(app, owner);
    const res = await http(app)
      .post('/api/jobs')
      .auth(owner.accessToken, bearer)
      .send({
        id: randomUUID(),
        customerId,
        vehicleId,
        windowStart: '2026-12-02T10:00:00Z',
        windowEnd: '2026-12-02T09:00:00Z',
      })
      .expect(400);
    expect(res.body.details[0].field).toBe('windowEnd');
  });

  it('refuses a window longer than 14 days (our own limit), saying so', async () => {
    const { customerId, vehicleId } = await makeJob(app, owner);
    const res = await http(app)
      .post('/api/jobs')
      .auth(owner.accessToken, bearer)
      .send({
        id: randomUUID(),
        customerId,
        vehicleId,
        windowStart: '2026-12-02T08:00:00Z',
        windowEnd: '2026-12-16T08:00:01Z',
      })
      .expect(400);
    expect(res.body.message).toMatch(/at most 14 days/);
    expect(res.body.details[0].field).toBe('windowEnd');
  });

  it('lists the visits overlapping a range: one begun before it, none ended before it', async () => {
    const other = await signUpOwner(app, 'jobs-range');
    const { customerId, vehicleId } = await makeJob(app, other);
    const book = async (start: string, end: string) => {
      const id = randomUUID();
      await http(app)
        .post('/api/jobs')
        .auth(other.accessToken, bearer)
        .send({ id, customerId, vehicleId, windowStart: start, windowEnd: end })
        .expect(201);
      return id;
    };
    // The range is 2027-03-10 .. 2027-03-17.
    const longBefore = await book('2027-03-01T08:00:00Z', '2027-03-12T17:00:00Z'); // 11 days, overlaps
    const endedBefore = await book('2027-03-08T08:00:00Z', '2027-03-09T17:00:00Z');
    const inside = await book('2027-03-11T08:00:00Z', '2027-03-11T12:00:00Z');
    const after = await book('2027-03-17T08:00:00Z', '2027-03-17T12:00:00Z');
    const res = await http(app)
      .get('/api/jobs?from=2027-03-10T00:00:00Z&to=2027-03-17T00:00:00Z&limit=10')
      .auth(other.accessToken, bearer)
      .expect(200);
    const ids = (res.body.items as { id: string }[]).map((j) => j.id);
    expect(ids).toEqual([longBefore, inside]);
    expect(res.body.total).toBe(2);
    expect(ids).not.toContain(endedBefore);
    expect(ids).not.toContain(after);
  });

  it('writes an audit entry for each change, naming who made it', async () => {
    const { jobId } = await makeJob(app, owner);
    const ds = app.get(DataSource);
    const rows: { command: string; user_id: string }[] = await ds.query(
      'SELECT command, user_id FROM audit_entries WHERE subject_id = $1',
      [jobId],
    );
    expect(rows).toEqual([{ command: 'job.create', user_id: owner.user.id }]);
  });

  it("a job's internal notes (a gate code, a remark) are the staff's: its customer never reads them", async () => {
    const { jobId, customerId } = await makeJob(app, owner);
    await http(app)
      .patch(`/api/jobs/${jobId}`)
      .auth(owner.accessToken, bearer)
      .send({ notes: 'Gate code 4471; dog in the yard' })
      .expect(200);
    const customer = await signInCustomer(app, owner.user.businessId, customerId);

    const own = await http(app).get(`/api/jobs/${jobId}`).auth(customer.accessToken, bearer);
    expect(own.status).toBe(200);
    expect(own.body).not.toHaveProperty('notes');
    const list = await http(app).get('/api/jobs').auth(customer.accessToken, bearer).expect(200);
    const items = list.body.items as { id: string }[];
    expect(items.map((j) => j.id)).toEqual([jobId]);
    expect(items[0]).not.toHaveProperty('notes');

    const staff = await http(app).get(`/api/jobs/${jobId}`).auth(owner.accessToken, bearer);
    expect(staff.body.notes).toBe('Gate code 4471; dog in the yard');
  });
});
