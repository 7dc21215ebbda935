import type { NestExpressApplication } from '@nestjs/platform-express';
import { randomUUID } from 'node:crypto';
import { DataSource } from 'typeorm';
import { makeJob } from './factories/records';
import { addTech, createTestApp, http, type Session, signUpOwner } from './support/app';

const bearer = { type: 'bearer' as const };

/** One field of each item of a list in an answer. */
const pluck = (list: unknown, key: string): unknown[] =>
  (list as Record<string, unknown>[]).map((item) => item[key]);

describe('office: payments, team and audit', () => {
  let app: NestExpressApplication;
  let owner: Session;
  let tech: Session;

  beforeAll(async () => {
    app = await createTestApp();
    owner = await signUpOwner(app, 'money');
    tech = await addTech(app, owner);
  });
  afterAll(async () => {
    await app.close();
  });

  const pay = (jobId: string, body: object) =>
    http(app).post(`/api/jobs/${jobId}/payments`).auth(owner.accessToken, bearer).send(body);

  it('recording cash twice with one opId gives one payment', async () => {
    const { jobId } = await makeJob(app, owner, { priceMinor: 30_000 });
    const opId = randomUUID();
    const first = await pay(jobId, {
      id: randomUUID(),
      opId,
      kind: 'deposit',
      method: 'cash',
      amountMinor: 6_000,
    }).expect(201);
    // A retry from a second device makes a new payment id but carries the same opId.
    const second = await pay(jobId, {
      id: randomUUID(),
      opId,
      kind: 'deposit',
      method: 'cash',
      amountMinor: 6_000,
    }).expect(201);
    expect(second.body.id).toBe(first.body.id);
    expect(first.body).toMatchObject({ status: 'succeeded', method: 'cash', currency: 'USD' });
    const rows: unknown[] = await app
      .get(DataSource)
      .query('SELECT id FROM payments WHERE op_id = $1', [opId]);
    expect(rows).toHaveLength(1);
    const job = await http(app).get(`/api/jobs/${jobId}`).auth(owner.accessToken, bearer);
    expect(job.body.amountDueMinor).toBe(24_000);
    const list = await http(app)
      .get(`/api/payments?jobId=${jobId}`)
      .auth(owner.accessToken, bearer)
      .expect(200);
    expect(list.body.total).toBe(1);
  });

  it('a refund may not exceed what was paid on the job', async () => {
    const { jobId } = await makeJob(app, owner, { priceMinor: 20_000 });
    await pay(jobId, {
      id: randomUUID(),
      opId: randomUUID(),
      kind: 'balance',
      method: 'cheque',
      amountMinor: 5_000,
    }).expect(201);
    const tooMuch = await pay(jobId, {
      id: randomUUID(),
      opId: randomUUID(),
      kind: 'refund',
      method: 'cash',
      amountMinor: 5_001,
    }).expect(409);
    expect(tooMuch.body).toMatchObject({
      code: 'refund-exceeds-paid',
      details: { paidMinor: 5_000 },
    });
    await pay(jobId, {
      id: randomUUID(),
      opId: randomUUID(),
      kind: 'refund',
      method: 'cash',
      amountMinor: 5_000,
    }).expect(201);
    await pay(jobId, {
      id: randomUUID(),
      opId: randomUUID(),
      kind: 'refund',
      method: 'cash',
      amountMinor: 1,
    }).expect(409);
  });

  it('cash or a cheque is never recorded above what is due, and says what is due', async () => {
    const { jobId } = await makeJob(app, owner, { priceMinor: 20_000 });
    const cash = (kind: string, amountMinor: number) =>
      pay(jobId, { id: randomUUID(), opId: randomUUID(), kind, method: 'cash', amountMinor });
    await cash('deposit', 4_000).expect(201);
    const over = await cash('balance', 16_001).expect(409);
    expect(over.body).toMatchObject({
      code: 'amount-exceeds-due',
      details: { dueMinor: 16_000, amountMinor: 16_001 },
    });
    await cash('balance', 16_000).expect(201);
    const paidUp = await cash('balance', 1).expect(409);
    expect(paidUp.body.message).toMatch(/paid in full/);
    const job = await http(app).get(`/api/jobs/${jobId}`).auth(owner.accessToken, bearer);
    expect(job.body.amountDueMinor).toBe(0);
  });

  it('a payment amount must be above zero and its kind known, each named', async () => {
    const { jobId } = await makeJob(app, owner);
    const res = await pay(jobId, {
      id: randomUUID(),
      opId: randomUUID(),
      kind: 'tip',
      method: 'cash',
      amountMinor: 0,
    }).expect(400);
    expect(pluck(res.body.details, 'field').sort()).toEqual(['amountMinor', 'kind']);
  });

  it.each([
    ['GET', '/api/users'],
    ['PATCH', '/api/business'],
    ['GET', '/api/payments'],
    ['GET', '/api/audit'],
    ['GET', '/api/invoices'],
  ])('a helper is refused %s %s (403)', async (method, path) => {
    const req =
      method === 'GET' ? http(app).get(path) : http(app).patch(path).send({ name: 'Taken Over' });
    const res = await req.auth(tech.accessToken, bearer).expect(403);
    expect(res.body.code).toBe('forbidden');
  });

  it('the team lists the owner and helpers without password hashes', async () => {
    const res = await http(app).get('/api/users').auth(owner.accessToken, bearer).expect(200);
    expect(pluck(res.body, 'role')).toEqual(['owner', 'tech']);
    expect(JSON.stringify(res.body)).not.toMatch(/password|argon/i);
  });

  it('removing a helper ends their sessions and gives their open jobs back; the owner stays', async () => {
    const helper = await addTech(app, owner, 'leaving');
    const { jobId } = await makeJob(app, owner, { techId: helper.user.id });
    await http(app)
      .delete(`/api/users/${helper.user.id}`)
      .auth(owner.accessToken, bearer)
      .expect(204);

    const ds = app.get(DataSource);
    const tokens: { revoked: boolean }[] = await ds.query(
      'SELECT revoked_at IS NOT NULL AS revoked FROM refresh_tokens WHERE user_id = $1',
      [helper.user.id],
    );
    expect(tokens.length).toBeGreaterThan(0);
    expect(tokens.every((t) => t.revoked)).toBe(true);
    await http(app)
      .post('/api/auth/refresh')
      .send({ refreshToken: helper.refreshToken })
      .expect(401);
    // The access token they still hold stops working at once, not when it expires.
    await http(app).get('/api/jobs').auth(helper.accessToken, bearer).expect(401);
    const job = await http(app).get(`/api/jobs/${jobId}`).auth(owner.accessToken, bearer);
    expect(job.body.assignedTechId).toBeNull();
    const team = await http(app).get('/api/users').auth(owner.accessToken, bearer);
    expect(pluck(team.body, 'id')).not.toContain(helper.user.id);

    const self = await http(app)
      .delete(`/api/users/${owner.user.id}`)
      .auth(owner.accessToken, bearer)
      .expect(409);
    expect(self.body.code).toBe('owner-cannot-be-removed');
    const stranger = await signUpOwner(app, 'stranger');
    await http(app)
      .delete(`/api/users/${tech.user.id}`)
      .auth(stranger.accessToken, bearer)
      .expect(404);
  });

  it('the audit log names each change, newest first, and filters by record', async () => {
    const { jobId } = await makeJob(app, owner);
    const res = await http(app)
      .get(`/api/audit?subjectId=${jobId}`)
      .auth(owner.accessToken, bearer)
      .expect(200);
    expect(res.body.items).toEqual([
      expect.objectContaining({
        command: 'job.create',
        userId: owner.user.id,
        userName: 'Test Owner',
      }),
    ]);
    const other = await signUpOwner(app, 'other-audit');
    const theirs = await http(app)
      .get(`/api/audit?subjectId=${jobId}`)
      .auth(other.accessToken, bearer)
      .expect(200);
    expect(theirs.body.total).toBe(0);
  });
});
