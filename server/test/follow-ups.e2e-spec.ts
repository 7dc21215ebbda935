import type { NestExpressApplication } from '@nestjs/platform-express';
import { randomUUID } from 'node:crypto';
import { DataSource } from 'typeorm';
import { dataSourceOptions } from '../src/database/data-source';
import { FollowUpsService } from '../src/follow-ups/follow-ups.service';
import { FollowUpQueue } from '../src/follow-ups/follow-up-queue';
import { createTestApp, http, type Session, signUpOwner } from './support/app';
import { bearer, eventually, moveTo } from './support/money';
import { ServerProcess } from './support/server-process';

/**
 * Follow-up e-mails (issue 8): a maintenance reminder N months after a job with protection
 * closes, an appointment reminder the day before a booking; scheduled once, sent once, on a
 * pg-boss queue that survives the server stopping.
 */

const DAY = 86_400_000;

interface FollowUpRow {
  id: string;
  kind: string;
  status: string;
  due_at: Date;
  window_start: Date | null;
  queued_at: Date | null;
  mail_id: string | null;
  cancel_reason: string | null;
}

/** The reminder rule, worked out here on its own: calendar months, the day clamped. */
function monthsLaterAtNine(from: Date, months: number): Date {
  const y = from.getUTCFullYear();
  const m = from.getUTCMonth() + months;
  const lastDay = new Date(Date.UTC(y, m + 1, 0)).getUTCDate();
  return new Date(Date.UTC(y, m, Math.min(from.getUTCDate(), lastDay), 9, 0, 0));
}

/** Whole minutes, so a window round-trips through JSON and the database unchanged. */
const minute = (ms: number) => new Date(Math.ceil(ms / 60_000) * 60_000);

function api(base: NestExpressApplication | string, token: string) {
  const call = async (method: string, path: string, body?: object) => {
    if (typeof base === 'string') {
      const res = await fetch(`${base}${path}`, {
        method,
        headers: { 'content-type': 'application/json', authorization: `Bearer ${token}` },
        body: body ? JSON.stringify(body) : undefined,
      });
      const text = await res.text();
      return {
        status: res.status,
        body: (text ? JSON.parse(text) : {}) as Record<string, unknown>,
      };
    }
    const res = await http(base)
      [method.toLowerCase() as 'get' | 'post' | 'patch' | 'delete'](path)
      .auth(token, bearer)
      .send(body);
    return { status: res.status, body: res.body as Record<string, unknown> };
  };
  const ok = async (method: string, path: string, body?: object) => {
    const res = await call(method, path, body);
    if (res.status >= 300)
      throw new Error(`${method} ${path}: ${res.status} ${JSON.stringify(res.body)}`);
    return res.body;
  };
  return { call, ok };
}

/** A customer (with an e-mail address unless told otherwise), their vehicle and a booked job. */
async function book(
  base: NestExpressApplication | string,
  owner: Session,
  opts: { start: Date; services?: string[]; email?: string | null; priceMinor?: number },
): Promise<{ jobId: string; customerId: string; vehicleId: string }> {
  const { ok } = api(base, owner.accessToken);
  const customerId = randomUUID();
  const vehicleId = randomUUID();
  const jobId = randomUUID();
  await ok('POST', '/api/customers', {
    id: customerId,
    name: 'Wren Calloway',
    ...(opts.email === null ? {} : { email: opts.email ?? 'wren@customers.example' }),
    address: '12 Saltmarsh Row, Heronwake',
  });
  await ok('POST', '/api/vehicles', {
    id: vehicleId,
    customerId,
    make: 'Generic',
    model: 'Hatch',
    bodyStyle: 'hatchback',
    colour: 'slate',
  });
  await ok('POST', '/api/jobs', {
    id: jobId,
    customerId,
    vehicleId,
    windowStart: opts.start.toISOString(),
    windowEnd: new Date(opts.start.getTime() + 3 * 3_600_000).toISOString(),
    priceMinor: opts.priceMinor ?? 0,
    services: opts.services ?? ['wash'],
  });
  return { jobId, customerId, vehicleId };
}

async function rowsOf(db: DataSource, jobId: string, kind?: string): Promise<FollowUpRow[]> {
  return db.query<FollowUpRow[]>(
    `SELECT * FROM follow_ups WHERE job_id = $1 AND ($2::text IS NULL OR kind = $2)
     ORDER BY created_at, id`,
    [jobId, kind ?? null],
  );
}

async function mailsOf(db: DataSource, jobId: string, kind: string) {
  return db.query<{ id: string; to_address: string; subject: string; text: string }[]>(
    'SELECT id, to_address, subject, text FROM outbound_mail WHERE subject_id = $1 AND kind = $2',
    [jobId, kind],
  );
}

async function queueJob(db: DataSource, id: string) {
  const [row] = await db.query<{ state: string; start_after: Date; singleton_key: string }[]>(
    `SELECT state, start_after, singleton_key FROM pgboss.job WHERE name = 'follow-up' AND id = $1`,
    [id],
  );
  return row ?? null;
}

describe('follow-ups', () => {
  let app: NestExpressApplication;
  let db: DataSource;
  let owner: Session;
  let followUps: FollowUpsService;

  beforeAll(async () => {
    app = await createTestApp({ FOLLOW_UPS: 'on', FOLLOW_UPS_POLL_SECONDS: '0.5' });
    db = app.get(DataSource);
    followUps = app.get(FollowUpsService);
    owner = await signUpOwner(app, 'follow-ups');
  });
  afterAll(async () => {
    await app.close();
  });

  describe('maintenance reminder after a job with protection', () => {
    it('closing schedules exactly one, N months (the setting) later at 09:00, on the queue', async () => {
      const { ok } = api(app, owner.accessToken);
      await ok('PATCH', '/api/business', {
        settings: { waits: { keepDryHours: 24, maintenanceReminderMonths: 4 } },
      });
      const { jobId } = await book(app, owner, {
        start: minute(Date.now() + 10 * DAY),
        services: ['wash', 'protect'],
      });
      const before = new Date();
      await moveTo(app, owner, jobId, 'closed');
      const after = new Date();

      const rows = await rowsOf(db, jobId, 'maintenance');
      expect(rows).toHaveLength(1);
      const row = rows[0]!;
      expect(row.status).toBe('scheduled');
      // Worked out from the close time (either side of it, should the test straddle midnight).
      expect([monthsLaterAtNine(before, 4), monthsLaterAtNine(after, 4)].map(String)).toContain(
        String(row.due_at),
      );
      expect(row.due_at.getTime()).toBeGreaterThan(before.getTime() + 3 * 28 * DAY);

      // Its pg-boss job was written in the same transaction: its id, waiting for its time.
      expect(row.queued_at).not.toBeNull();
      const job = await queueJob(db, row.id);
      expect(job).toMatchObject({ state: 'created', singleton_key: row.id });
      expect(job!.start_after.getTime()).toBe(row.due_at.getTime());

      // The owner sees it coming.
      const list = await ok('GET', `/api/follow-ups?kind=maintenance&jobId=${jobId}`);
      expect(list).toMatchObject({ total: 1 });
      expect((list.items as unknown[])[0]).toMatchObject({
        id: row.id,
        kind: 'maintenance',
        status: 'scheduled',
        dueAt: row.due_at.toISOString(),
        customerName: 'Wren Calloway',
        customerEmail: 'wren@customers.example',
        vehicleLabel: 'slate Generic Hatch',
      });
    });

    it('knows protection by the service name a quote booking keeps, or by a keep-dry wait', async () => {
      const byName = await book(app, owner, {
        start: minute(Date.now() + 10 * DAY),
        services: ['Hand wash and dry', 'Protective coating'],
      });
      await moveTo(app, owner, byName.jobId, 'closed');
      expect(await rowsOf(db, byName.jobId, 'maintenance')).toHaveLength(1);

      const byTimer = await book(app, owner, { start: minute(Date.now() + 10 * DAY) });
      await api(app, owner.accessToken).ok('POST', '/api/timers', {
        id: randomUUID(),
        jobId: byTimer.jobId,
        kind: 'keep-dry',
        label: 'Keep dry',
        durationMs: 3_600_000,
      });
      await moveTo(app, owner, byTimer.jobId, 'closed');
      expect(await rowsOf(db, byTimer.jobId, 'maintenance')).toHaveLength(1);
    });

    it('schedules nothing for a job without protection', async () => {
      const { jobId } = await book(app, owner, {
        start: minute(Date.now() + 10 * DAY),
        services: ['wash', 'one-step'],
      });
      await moveTo(app, owner, jobId, 'closed');
      expect(await rowsOf(db, jobId, 'maintenance')).toHaveLength(0);
    });

    it('closing again, or two closes at once, never makes a second one', async () => {
      const { call } = api(app, owner.accessToken);
      const { jobId } = await book(app, owner, {
        start: minute(Date.now() + 10 * DAY),
        services: ['protect'],
      });
      await moveTo(app, owner, jobId, 'handover');
      const closes = await Promise.all(
        [1, 2, 3].map(() => call('POST', `/api/jobs/${jobId}/stage`, { stage: 'closed' })),
      );
      expect(closes.map((r) => r.status)).toEqual([200, 200, 200]);
      const retried = await call('POST', `/api/jobs/${jobId}/stage`, { stage: 'closed' });
      expect(retried.status).toBe(200);
      const rows = await rowsOf(db, jobId, 'maintenance');
      expect(rows).toHaveLength(1);
      // And the database itself refuses a second maintenance reminder for the job.
      await expect(
        db.query(
          `INSERT INTO follow_ups (id, business_id, job_id, kind, due_at, status)
           VALUES ($1, $2, $3, 'maintenance', now() + interval '1 day', 'cancelled')`,
          [randomUUID(), owner.user.businessId, jobId],
        ),
      ).rejects.toThrow(/follow_ups_maintenance_key/);
    });
  });

  describe('appointment reminder the day before a booking', () => {
    it('booking schedules one the day before; moving the window reschedules it; removing cancels', async () => {
      const { ok } = api(app, owner.accessToken);
      const start = minute(Date.now() + 3 * DAY);
      const { jobId } = await book(app, owner, { start });
      let rows = await rowsOf(db, jobId, 'appointment');
      expect(rows).toHaveLength(1);
      const first = rows[0]!;
      expect(first).toMatchObject({ status: 'scheduled' });
      expect(first.due_at.getTime()).toBe(start.getTime() - DAY);
      expect(await queueJob(db, first.id)).toMatchObject({ state: 'created' });

      // A change that leaves the window alone keeps the same reminder.
      await ok('PATCH', `/api/jobs/${jobId}`, { notes: 'Gate code 4411' });
      rows = await rowsOf(db, jobId, 'appointment');
      expect(rows.map((r) => [r.id, r.status])).toEqual([[first.id, 'scheduled']]);

      // Moved two days on: the old one is cancelled (and its queue job), a new one waits.
      const moved = minute(start.getTime() + 2 * DAY);
      await ok('PATCH', `/api/jobs/${jobId}`, {
        windowStart: moved.toISOString(),
        windowEnd: new Date(moved.getTime() + 2 * 3_600_000).toISOString(),
      });
      rows = await rowsOf(db, jobId, 'appointment');
      expect(rows).toHaveLength(2);
      expect(rows.find((r) => r.id === first.id)).toMatchObject({
        status: 'cancelled',
        cancel_reason: 'The visit was moved',
      });
      const pending = rows.filter((r) => r.status === 'scheduled');
      expect(pending).toHaveLength(1);
      expect(pending[0]!.due_at.getTime()).toBe(moved.getTime() - DAY);
      expect(pending[0]!.window_start!.getTime()).toBe(moved.getTime());
      expect(await queueJob(db, first.id)).toMatchObject({ state: 'cancelled' });
      expect(await queueJob(db, pending[0]!.id)).toMatchObject({ state: 'created' });

      // Removed: nothing pending.
      await ok('DELETE', `/api/jobs/${jobId}`);
      rows = await rowsOf(db, jobId, 'appointment');
      expect(rows.filter((r) => r.status === 'scheduled')).toHaveLength(0);
      expect(rows.find((r) => r.id === pending[0]!.id)).toMatchObject({
        status: 'cancelled',
        cancel_reason: 'The job was removed',
      });
    });

    it('a quote accepted with a window books a job with its reminder', async () => {
      const { ok } = api(app, owner.accessToken);
      const { customerId, vehicleId } = await book(app, owner, {
        start: minute(Date.now() + 20 * DAY),
      });
      const settings = (await ok('GET', '/api/business')).settings as {
        sizeClasses: { id: string }[];
        conditions: { id: string }[];
      };
      const quoteId = randomUUID();
      await ok('POST', '/api/quotes', {
        id: quoteId,
        customerId,
        vehicleId,
        inputs: {
          sizeClass: settings.sizeClasses[0]!.id,
          condition: settings.conditions[0]!.id,
          serviceIds: ['wash', 'protect'],
          chips: 0,
          addOnIds: [],
        },
      });
      const start = minute(Date.now() + 6 * DAY);
      const jobId = randomUUID();
      await ok('POST', `/api/quotes/${quoteId}/accept`, {
        jobId,
        windowStart: start.toISOString(),
        windowEnd: new Date(start.getTime() + 4 * 3_600_000).toISOString(),
      });
      const rows = await rowsOf(db, jobId, 'appointment');
      expect(rows).toHaveLength(1);
      expect(rows[0]!.due_at.getTime()).toBe(start.getTime() - DAY);
    });

    it('starting the visit early cancels its reminder at once, in the same change', async () => {
      const { ok } = api(app, owner.accessToken);
      const { jobId } = await book(app, owner, { start: minute(Date.now() + 4 * DAY) });
      const [before] = await rowsOf(db, jobId, 'appointment');
      expect(before).toMatchObject({ status: 'scheduled' });

      await ok('POST', `/api/jobs/${jobId}/stage`, { stage: 'walkaround' });
      const rows = await rowsOf(db, jobId, 'appointment');
      expect(rows).toHaveLength(1);
      expect(rows[0]).toMatchObject({
        status: 'cancelled',
        cancel_reason: 'The visit has started',
      });
      expect(await queueJob(db, before!.id)).toMatchObject({ state: 'cancelled' });
    });

    it('makes none when the day before has already passed', async () => {
      const { jobId } = await book(app, owner, { start: minute(Date.now() + 20 * 3_600_000) });
      expect(await rowsOf(db, jobId, 'appointment')).toHaveLength(0);
    });
  });

  describe('sending', () => {
    it('sends a due follow-up exactly once, however often its queue job is delivered', async () => {
      // Due in a minute: the worker leaves it; the test makes it due and delivers it itself.
      const start = minute(Date.now() + DAY + 2 * 60_000);
      const { jobId } = await book(app, owner, { start });
      const [row] = await rowsOf(db, jobId, 'appointment');
      expect(await followUps.deliver(row!.id)).toBe('not-due');
      expect(await mailsOf(db, jobId, 'appointment-reminder')).toHaveLength(0);

      await db.query(`UPDATE follow_ups SET due_at = now() - interval '1 second' WHERE id = $1`, [
        row!.id,
      ]);
      // pg-boss delivering it twice, at the same time and once more after.
      const outcomes = await Promise.all([followUps.deliver(row!.id), followUps.deliver(row!.id)]);
      outcomes.push(await followUps.deliver(row!.id));
      expect(outcomes.sort()).toEqual(['already-done', 'already-done', 'sent']);

      const mails = await mailsOf(db, jobId, 'appointment-reminder');
      expect(mails).toHaveLength(1);
      expect(mails[0]).toMatchObject({
        to_address: 'wren@customers.example',
        subject: 'See you tomorrow: slate Generic Hatch',
      });
      expect(mails[0]!.text).toContain('Hello Wren Calloway,');
      expect(mails[0]!.text).toContain('12 Saltmarsh Row, Heronwake');
      const [sent] = await rowsOf(db, jobId, 'appointment');
      expect(sent).toMatchObject({ status: 'sent', mail_id: mails[0]!.id });
    });

    it('does not send to a customer without an e-mail address (cancelled, saying why)', async () => {
      const { jobId } = await book(app, owner, {
        start: minute(Date.now() + DAY + 2 * 60_000),
        email: null,
      });
      const [row] = await rowsOf(db, jobId, 'appointment');
      await db.query(`UPDATE follow_ups SET due_at = now() WHERE id = $1`, [row!.id]);
      expect(await followUps.deliver(row!.id)).toBe('cancelled');
      expect((await rowsOf(db, jobId, 'appointment'))[0]).toMatchObject({
        status: 'cancelled',
        cancel_reason: 'The customer has no e-mail address',
      });
      expect(await mailsOf(db, jobId, 'appointment-reminder')).toHaveLength(0);
    });

    it('the worker sends one when its time comes', async () => {
      const start = new Date(Date.now() + DAY + 2_000);
      const { jobId } = await book(app, owner, { start });
      const [row] = await rowsOf(db, jobId, 'appointment');
      expect(row!.status).toBe('scheduled');
      const sent = await eventually(async () => {
        const [r] = await rowsOf(db, jobId, 'appointment');
        return r?.status === 'sent' ? r : null;
      }, 15_000);
      expect(sent.mail_id).not.toBeNull();
      expect(await mailsOf(db, jobId, 'appointment-reminder')).toHaveLength(1);
      await eventually(async () => (await queueJob(db, row!.id))?.state === 'completed', 10_000);
    });

    it('the sweeper sends one whose queue job was lost, and queues one written without a queue', async () => {
      const { jobId } = await book(app, owner, { start: minute(Date.now() + 4 * DAY) });
      const [row] = await rowsOf(db, jobId, 'appointment');
      // Its queue job gone, and long overdue.
      await db.query(`DELETE FROM pgboss.job WHERE name = 'follow-up' AND id = $1`, [row!.id]);
      await db.query(`UPDATE follow_ups SET due_at = now() - interval '1 hour' WHERE id = $1`, [
        row!.id,
      ]);
      // And another, written while no queue ran.
      const other = await book(app, owner, { start: minute(Date.now() + 5 * DAY) });
      const [unqueued] = await rowsOf(db, other.jobId, 'appointment');
      await db.query(`DELETE FROM pgboss.job WHERE name = 'follow-up' AND id = $1`, [unqueued!.id]);
      await db.query(`UPDATE follow_ups SET queued_at = NULL WHERE id = $1`, [unqueued!.id]);

      const swept = await followUps.sweep();
      expect(swept.sent).toBeGreaterThanOrEqual(1);
      expect(swept.queued).toBeGreaterThanOrEqual(1);
      expect((await rowsOf(db, jobId, 'appointment'))[0]).toMatchObject({ status: 'sent' });
      expect(await mailsOf(db, jobId, 'appointment-reminder')).toHaveLength(1);
      expect(await queueJob(db, unqueued!.id)).toMatchObject({ state: 'created' });
      expect((await rowsOf(db, other.jobId, 'appointment'))[0]!.queued_at).not.toBeNull();
    });
  });

  describe('the owner', () => {
    it('lists upcoming follow-ups soonest first, paged, and cancels one', async () => {
      const other = await signUpOwner(app, 'follow-ups-list');
      const { ok, call } = api(app, other.accessToken);
      const far = await book(app, other, { start: minute(Date.now() + 9 * DAY) });
      const near = await book(app, other, { start: minute(Date.now() + 4 * DAY) });
      const page = await ok('GET', '/api/follow-ups?limit=1');
      expect(page).toMatchObject({ total: 2, limit: 1, offset: 0 });
      const [first] = page.items as { id: string; jobId: string }[];
      expect(first!.jobId).toBe(near.jobId);
      const second = await ok('GET', '/api/follow-ups?limit=1&offset=1');
      expect((second.items as { jobId: string }[])[0]!.jobId).toBe(far.jobId);

      const cancelled = await ok('POST', `/api/follow-ups/${first!.id}/cancel`);
      expect(cancelled).toMatchObject({
        id: first!.id,
        status: 'cancelled',
        cancelReason: 'Cancelled by the owner',
      });
      expect(await queueJob(db, first!.id)).toMatchObject({ state: 'cancelled' });
      // Again: the same answer.
      expect((await call('POST', `/api/follow-ups/${first!.id}/cancel`)).status).toBe(200);
      expect(await ok('GET', '/api/follow-ups')).toMatchObject({ total: 1 });
      expect(await ok('GET', '/api/follow-ups?status=cancelled')).toMatchObject({ total: 1 });
      // A cancelled reminder is never sent, even when its time comes.
      await db.query(`UPDATE follow_ups SET due_at = now() WHERE id = $1`, [first!.id]);
      expect(await followUps.deliver(first!.id)).toBe('already-done');
      expect(await mailsOf(db, near.jobId, 'appointment-reminder')).toHaveLength(0);

      // One that has gone cannot be cancelled; another business's is not found.
      const [farRow] = await rowsOf(db, far.jobId, 'appointment');
      await db.query(`UPDATE follow_ups SET due_at = now() WHERE id = $1`, [farRow!.id]);
      expect(await followUps.deliver(farRow!.id)).toBe('sent');
      const refused = await call('POST', `/api/follow-ups/${farRow!.id}/cancel`);
      expect(refused).toMatchObject({ status: 409, body: { code: 'follow-up-sent' } });
      const foreign = await api(app, owner.accessToken).call(
        'POST',
        `/api/follow-ups/${farRow!.id}/cancel`,
      );
      expect(foreign.status).toBe(404);
    });
  });
});

describe('follow-ups survive the server stopping', () => {
  it('a Nest app closed before the time and started again sends it once', async () => {
    const env = { FOLLOW_UPS: 'on', FOLLOW_UPS_POLL_SECONDS: '0.5' };
    let app = await createTestApp(env);
    const db = new DataSource(dataSourceOptions(process.env.DATABASE_URL!));
    await db.initialize();
    try {
      const owner = await signUpOwner(app, 'restart');
      const { jobId } = await book(app, owner, { start: new Date(Date.now() + DAY + 3_000) });
      const [row] = await rowsOf(db, jobId, 'appointment');
      expect(row!.status).toBe('scheduled');
      await app.close();

      // Past its time with no server running: nothing sends it.
      await new Promise((r) => setTimeout(r, 4_000));
      expect((await rowsOf(db, jobId, 'appointment'))[0]!.status).toBe('scheduled');

      app = await createTestApp(env);
      expect(app.get(FollowUpQueue).running).toBe(true);
      await eventually(
        async () => (await rowsOf(db, jobId, 'appointment'))[0]!.status === 'sent',
        15_000,
      );
      expect(await mailsOf(db, jobId, 'appointment-reminder')).toHaveLength(1);
    } finally {
      await app.close();
      await db.destroy();
    }
  }, 40_000);

  it('a server process killed before the time, and two started again, send it once', async () => {
    const base = 18_500 + (process.pid % 500);
    const first = new ServerProcess(base);
    const again = [new ServerProcess(base + 1), new ServerProcess(base + 2)];
    const db = new DataSource(dataSourceOptions(process.env.DATABASE_URL!));
    await db.initialize();
    Object.assign(process.env, { FOLLOW_UPS: 'on', FOLLOW_UPS_POLL_SECONDS: '0.5' });
    try {
      await first.start();
      const signUp = await fetch(`${first.url}/api/auth/sign-up`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({
          businessName: 'Heronwake Mobile Finish',
          name: 'Owner',
          email: `killed-${randomUUID().slice(0, 8)}@test.example`,
          password: 'long enough password',
        }),
      });
      const owner = (await signUp.json()) as Session;
      const { jobId } = await book(first.url, owner, { start: new Date(Date.now() + DAY + 3_000) });
      await first.kill();
      const [row] = await rowsOf(db, jobId, 'appointment');
      expect(row!.status).toBe('scheduled');
      await new Promise((r) => setTimeout(r, 4_000));
      expect((await rowsOf(db, jobId, 'appointment'))[0]!.status).toBe('scheduled');

      await Promise.all(again.map((s) => s.start()));
      await eventually(
        async () => (await rowsOf(db, jobId, 'appointment'))[0]!.status === 'sent',
        15_000,
      );
      // Both servers poll the queue; a little longer, to give a second send its chance.
      await new Promise((r) => setTimeout(r, 1_500));
      expect(await mailsOf(db, jobId, 'appointment-reminder')).toHaveLength(1);
    } finally {
      await first.kill();
      await Promise.all(again.map((s) => s.kill()));
      await db.destroy();
    }
  }, 60_000);
});
