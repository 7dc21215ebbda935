import type { NestExpressApplication } from '@nestjs/platform-express';
import {
  childId,
  dewPointC,
  flushBy,
  maskRemoveBy,
  planChip,
  toMicrometres,
} from '@panelpass/shared';
import { randomUUID } from 'node:crypto';
import { DataSource } from 'typeorm';
import { makeJob } from './factories/records';
import { addTech, createTestApp, http, type Session, signUpOwner } from './support/app';

const bearer = { type: 'bearer' as const };
const MIN = 60_000;

/** The stages a job walks through to close. */
const TO_CLOSED = ['walkaround', 'prep', 'correction', 'finish', 'handover', 'closed'];

describe('field records of a job', () => {
  let app: NestExpressApplication;
  let db: DataSource;
  let owner: Session;
  let tech: Session;
  let otherTech: Session;

  const post = (who: Session, url: string, body: object = {}) =>
    http(app).post(url).auth(who.accessToken, bearer).send(body);
  const get = (who: Session, url: string) => http(app).get(url).auth(who.accessToken, bearer);
  const panel = (jobId: string, key: string) => childId(jobId, `panel:${key}`);

  /** A job assigned to the helper, with a sedan's panels. */
  const techJob = async () =>
    (await makeJob(app, owner, { bodyStyle: 'sedan', techId: tech.user.id })).jobId;

  const product = async (body: object) => {
    const id = randomUUID();
    await post(owner, '/api/products', { id, ...body }).expect(201);
    return id;
  };
  const stockOf = async (productId: string) =>
    Number((await get(owner, `/api/products/${productId}`).expect(200)).body.stockQty);

  const close = async (jobId: string) => {
    for (const stage of TO_CLOSED) {
      await post(owner, `/api/jobs/${jobId}/stage`, { stage }).expect(200);
    }
  };

  beforeAll(async () => {
    app = await createTestApp();
    db = app.get(DataSource);
    owner = await signUpOwner(app, 'field');
    tech = await addTech(app, owner, 'field-tech');
    otherTech = await addTech(app, owner, 'field-other');
  });
  afterAll(async () => {
    await app.close();
  });

  describe('damage pins', () => {
    it('numbers pins in order, changes only the fields sent, and removes with a tombstone', async () => {
      const jobId = await techJob();
      const a = randomUUID();
      const first = await post(tech, `/api/jobs/${jobId}/pins`, {
        id: a,
        x: 0.2,
        y: 0.3,
        panelKey: 'hood',
        kind: 'chip',
        severity: 2,
        note: 'deep, to primer',
      }).expect(201);
      expect(first.body).toMatchObject({ number: 1, panelKey: 'hood', kind: 'chip' });
      const second = await post(tech, `/api/jobs/${jobId}/pins`, {
        id: randomUUID(),
        x: 0.7,
        y: 0.9,
        kind: 'scratch',
        severity: 1,
      }).expect(201);
      expect(second.body.number).toBe(2);

      const moved = await http(app)
        .patch(`/api/pins/${a}`)
        .auth(tech.accessToken, bearer)
        .send({ x: 0.25 })
        .expect(200);
      expect(moved.body).toMatchObject({ x: 0.25, y: 0.3, note: 'deep, to primer', severity: 2 });

      await http(app).delete(`/api/pins/${a}`).auth(tech.accessToken, bearer).expect(204);
      const [row] = await db.query('SELECT deleted_at FROM damage_pins WHERE id = $1', [a]);
      expect(row.deleted_at).not.toBeNull();
      const ws = await get(tech, `/api/jobs/${jobId}/workspace`).expect(200);
      expect((ws.body.pins as { number: number }[]).map((p) => p.number)).toEqual([2]);
    });

    it('refuses a pin off the outline or on a panel the job does not have, naming the field', async () => {
      const jobId = await techJob();
      const off = await post(tech, `/api/jobs/${jobId}/pins`, {
        id: randomUUID(),
        x: 1.2,
        y: 0.5,
        kind: 'dent',
        severity: 1,
      }).expect(400);
      expect(off.body.code).toBe('validation-failed');
      expect(off.body.details[0].field).toBe('x');
      const notPanel = await post(tech, `/api/jobs/${jobId}/pins`, {
        id: randomUUID(),
        x: 0.5,
        y: 0.5,
        panelKey: 'bed-side',
        kind: 'dent',
        severity: 1,
      }).expect(400);
      expect(notPanel.body.details[0].field).toBe('panelKey');
      const nulled = await http(app)
        .patch(`/api/pins/${randomUUID()}`)
        .auth(tech.accessToken, bearer)
        .send({ x: null })
        .expect(400);
      expect(nulled.body.details[0].field).toBe('x');
    });
  });

  describe('film readings', () => {
    it('refuses a magnetic reading on a plastic bumper with the reason, and takes an ultrasonic one', async () => {
      const jobId = await techJob();
      const bumper = panel(jobId, 'front-bumper');
      const refused = await post(tech, `/api/jobs/${jobId}/readings`, {
        id: randomUUID(),
        panelId: bumper,
        phase: 'before',
        readings: [110, 112, 108],
        unit: 'um',
        gaugeType: 'magnetic',
      }).expect(400);
      expect(refused.body.code).toBe('gauge-not-valid-on-substrate');
      expect(refused.body.message).toMatch(/plastic/);
      expect(refused.body.details.reasons[0].code).toBe('metal-gauge-on-non-metal');
      const [{ n }] = await db.query(
        'SELECT count(*)::int AS n FROM film_readings WHERE job_id = $1',
        [jobId],
      );
      expect(n).toBe(0);
      await post(tech, `/api/jobs/${jobId}/readings`, {
        id: randomUUID(),
        panelId: bumper,
        phase: 'before',
        readings: [110, 112, 108],
        unit: 'um',
        gaugeType: 'ultrasonic',
      }).expect(201);
    });

    it('stores readings in mil as µm exactly (1 mil = 25.4 µm)', async () => {
      const jobId = await techJob();
      const id = randomUUID();
      const res = await post(tech, `/api/jobs/${jobId}/readings`, {
        id,
        panelId: panel(jobId, 'hood'),
        phase: 'before',
        readings: [4.4, 5, 4.7],
        unit: 'mil',
        gaugeType: 'magnetic',
      }).expect(201);
      const expected = [4.4, 5, 4.7].map((v) => toMicrometres(v, 'mil'));
      expect(res.body.readingsUm).toEqual(expected);
      expect(res.body.readingsUm[1]).toBe(127);
      const [row] = await db.query('SELECT readings_um, unit FROM film_readings WHERE id = $1', [
        id,
      ]);
      expect(row).toEqual({ readings_um: expected, unit: 'mil' });
    });

    it('refuses a reading on a panel of another job (404)', async () => {
      const jobId = await techJob();
      const other = await techJob();
      await post(tech, `/api/jobs/${jobId}/readings`, {
        id: randomUUID(),
        panelId: panel(other, 'hood'),
        phase: 'before',
        readings: [100],
        unit: 'um',
        gaugeType: 'magnetic',
      }).expect(404);
    });
  });

  describe('passes and the panel board', () => {
    it('answers the clear-coat budget after the pass and warns before the reserve is reached', async () => {
      const jobId = await techJob();
      const hood = panel(jobId, 'hood');
      // Default clear 35 µm, 25 % allowance = 8.75 µm; one heavy pass counts 5 µm, leaving 3.75.
      const res = await post(tech, `/api/jobs/${jobId}/passes`, {
        id: randomUUID(),
        panelId: hood,
        step: 'heavy-compound',
        machine: 'rotary',
        pad: 'wool 6 in',
        speedSetting: '3',
        passes: 1,
        result: 'another-pass',
      }).expect(201);
      expect(res.body.budget).toMatchObject({
        status: 'next-pass-crosses-reserve',
        allowanceUm: 8.75,
        allowanceLeftUm: 3.75,
        removedUm: { lowUm: 3, highUm: 5 },
      });
      expect((res.body.warnings as { code: string }[]).map((w) => w.code)).toEqual([
        'next-pass-crosses-reserve',
      ]);
      expect(res.body.panel.state).toBe('in-progress');

      const done = await post(tech, `/api/jobs/${jobId}/passes`, {
        id: randomUUID(),
        panelId: hood,
        step: 'finishing',
        machine: 'dual-action',
        pad: 'soft foam',
        speedSetting: '4',
        passes: 2,
        result: 'done',
      }).expect(201);
      expect(done.body.panel.state).toBe('done');
      expect(done.body.budget.removedUm.highUm).toBe(7);
    });

    it('counts the panel clear estimate and the thinnest before spot', async () => {
      const jobId = await techJob();
      const roof = panel(jobId, 'roof');
      await http(app)
        .patch(`/api/panels/${roof}`)
        .auth(tech.accessToken, bearer)
        .send({ clearEstimateUm: 50, hardness: 'soft' })
        .expect(200);
      for (const readings of [
        [120, 118, 122],
        [78, 76, 77],
      ]) {
        await post(tech, `/api/jobs/${jobId}/readings`, {
          id: randomUUID(),
          panelId: roof,
          phase: 'before',
          readings,
          unit: 'um',
          gaugeType: 'magnetic',
        }).expect(201);
      }
      const res = await post(tech, `/api/jobs/${jobId}/passes`, {
        id: randomUUID(),
        panelId: roof,
        step: 'polish',
        machine: 'dual-action',
        pad: 'orange foam',
        speedSetting: '5',
        passes: 1,
        result: 'another-pass',
      }).expect(201);
      expect(res.body.budget.estimatedClearUm).toBe(50);
      expect((res.body.warnings as { code: string }[]).map((w) => w.code)).toContain(
        'total-film-under-floor',
      );
    });

    it('takes stock once when the same pass.log is sent twice (same id)', async () => {
      const jobId = await techJob();
      const polish = await product({
        name: 'Mid-cut polish',
        kind: 'polish',
        properties: { cutLevel: 5, finishLevel: 7 },
        unit: 'mL',
        stockQty: 500,
        amountPerUse: 15,
        unitCostMinor: 4,
      });
      const body = {
        id: randomUUID(),
        panelId: panel(jobId, 'trunk-lid'),
        step: 'polish',
        machine: 'dual-action',
        pad: 'orange foam',
        productId: polish,
        speedSetting: '5',
        passes: 2,
        result: 'another-pass',
      };
      const a = await post(tech, `/api/jobs/${jobId}/passes`, body).expect(201);
      const b = await post(tech, `/api/jobs/${jobId}/passes`, body).expect(201);
      expect(b.body.version).toBe(a.body.version);
      expect(await stockOf(polish)).toBe(485);
      const [{ n }] = await db.query(
        "SELECT count(*)::int AS n FROM stock_movements WHERE source_id = $1 AND reason = 'use'",
        [body.id],
      );
      expect(n).toBe(1);
    });

    it('refuses a product of the wrong kind on a pass, naming the field', async () => {
      const jobId = await techJob();
      const tape = await product({ name: 'Trim tape', kind: 'tape' });
      const res = await post(tech, `/api/jobs/${jobId}/passes`, {
        id: randomUUID(),
        panelId: panel(jobId, 'hood'),
        step: 'polish',
        machine: 'dual-action',
        pad: 'orange foam',
        productId: tape,
        speedSetting: '5',
        passes: 1,
        result: 'done',
      }).expect(400);
      expect(res.body.details[0].field).toBe('productId');
    });

    it('refuses an unknown step with the known ones', async () => {
      const jobId = await techJob();
      const res = await post(tech, `/api/jobs/${jobId}/passes`, {
        id: randomUUID(),
        panelId: panel(jobId, 'hood'),
        step: 'medium-cut',
        machine: 'dual-action',
        pad: 'orange foam',
        speedSetting: '5',
        passes: 1,
        result: 'done',
      }).expect(400);
      expect(res.body.details[0]).toMatchObject({ field: 'step' });
      expect(res.body.message).toMatch(/heavy-compound, polish, finishing/);
    });

    it('detects a stale panel write through If-Match', async () => {
      const jobId = await techJob();
      const hood = panel(jobId, 'hood');
      const first = await http(app)
        .patch(`/api/panels/${hood}`)
        .auth(tech.accessToken, bearer)
        .send({ substrate: 'aluminium' })
        .expect(200);
      const v = first.body.version as number;
      await http(app)
        .patch(`/api/panels/${hood}`)
        .auth(owner.accessToken, bearer)
        .set('If-Match', `"${v}"`)
        .send({ finish: 'single-stage' })
        .expect(200);
      const stale = await http(app)
        .patch(`/api/panels/${hood}`)
        .auth(tech.accessToken, bearer)
        .set('If-Match', `"${v}"`)
        .send({ state: 'skipped' })
        .expect(409);
      expect(stale.body.code).toBe('stale-write');
    });
  });

  describe('solvents and masking', () => {
    it('makes a flush timer whose end is shared flushBy for the product, panel heat and sun', async () => {
      const jobId = await techJob();
      const tar = await product({
        name: 'Spot tar dissolver',
        kind: 'solvent',
        properties: { maxDwellMin: 5, maxSurfaceC: 35 },
        sdsUrl: 'https://sds.example/tar-dissolver.pdf',
        stockQty: 1000,
        amountPerUse: 10,
      });
      const appliedAt = new Date(Date.now() - 60_000);
      const id = randomUUID();
      const res = await post(tech, `/api/jobs/${jobId}/solvents`, {
        id,
        panelId: panel(jobId, 'left-front-door'),
        productId: tar,
        surfaceTempC: 30,
        inSun: true,
        appliedAt: appliedAt.toISOString(),
      }).expect(201);
      const expected = flushBy({
        appliedAtMs: appliedAt.getTime(),
        product: { maxDwellMin: 5, maxSurfaceC: 35 },
        surfaceC: 30,
        inSun: true,
      });
      expect(new Date(res.body.flushBy).getTime()).toBe(expected.flushByMs);
      expect(res.body.timer).toMatchObject({
        id: childId(id, 'timer'),
        kind: 'flush',
        subjectType: 'solvent',
        subjectId: id,
        jobId,
      });
      expect(new Date(res.body.timer.endsAt).getTime()).toBe(expected.flushByMs);
      expect((res.body.reasons as { code: string }[]).map((r) => r.code)).toEqual(
        expected.reasons.map((r) => r.code),
      );
      const sds = (res.body.cautions as { code: string; message: string }[]).find(
        (c) => c.code === 'solvent-sds',
      )!;
      expect(sds).toMatchObject({ sdsUrl: 'https://sds.example/tar-dissolver.pdf' });
      expect(sds.message).toMatch(/safety data sheet/);
      expect(await stockOf(tar)).toBe(990);
    });

    it('uses the documented default dwell for a solvent without one, and says so', async () => {
      const jobId = await techJob();
      const appliedAt = new Date(Date.now() - 1000);
      const res = await post(tech, `/api/jobs/${jobId}/solvents`, {
        id: randomUUID(),
        surfaceTempC: 20,
        inSun: false,
        appliedAt: appliedAt.toISOString(),
      }).expect(201);
      expect(new Date(res.body.flushBy).getTime()).toBe(appliedAt.getTime() + 3 * MIN);
      expect(res.body.reasons[0]).toMatchObject({
        code: 'solvent-dwell-default',
        severity: 'warn',
      });
    });

    it('a second flush changes nothing; the first silences the flush timer', async () => {
      const jobId = await techJob();
      const id = randomUUID();
      await post(tech, `/api/jobs/${jobId}/solvents`, {
        id,
        surfaceTempC: 18,
        inSun: false,
      }).expect(201);
      const first = await post(tech, `/api/solvents/${id}/flush`).expect(200);
      expect(first.body.flushedAt).not.toBeNull();
      expect(first.body.status.state).toBe('done-in-time');
      expect(first.body.timer.acknowledgedAt).not.toBeNull();
      const second = await post(tech, `/api/solvents/${id}/flush`, {
        at: new Date().toISOString(),
      }).expect(200);
      expect(second.body.flushedAt).toBe(first.body.flushedAt);
      expect(second.body.version).toBe(first.body.version);
    });

    it("sets masking's remove-by from the tape's window (shared maskRemoveBy); a second remove is a no-op", async () => {
      const jobId = await techJob();
      const tape = await product({
        name: 'Fine-line trim tape',
        kind: 'tape',
        properties: { cleanRemovalDays: 7 },
      });
      const appliedAt = new Date(Date.now() - 5 * MIN);
      const id = randomUUID();
      const res = await post(tech, `/api/jobs/${jobId}/masks`, {
        id,
        what: 'Rear window rubber',
        productId: tape,
        appliedAt: appliedAt.toISOString(),
      }).expect(201);
      const expected = maskRemoveBy({
        appliedAtMs: appliedAt.getTime(),
        tape: { cleanRemovalDays: 7 },
      });
      expect(new Date(res.body.removeBy).getTime()).toBe(expected.removeByMs);
      expect(res.body.status.state).toBe('running');
      const first = await post(tech, `/api/masks/${id}/remove`).expect(200);
      expect(first.body.removedAt).not.toBeNull();
      const second = await post(tech, `/api/masks/${id}/remove`).expect(200);
      expect(second.body.removedAt).toBe(first.body.removedAt);
      expect(second.body.version).toBe(first.body.version);
    });

    it('masking without a tape window uses the documented one-day default and says so', async () => {
      const jobId = await techJob();
      const appliedAt = new Date(Date.now() - MIN);
      const res = await post(tech, `/api/jobs/${jobId}/masks`, {
        id: randomUUID(),
        what: 'Badge',
        appliedAt: appliedAt.toISOString(),
      }).expect(201);
      expect(new Date(res.body.removeBy).getTime()).toBe(appliedAt.getTime() + 86_400_000);
      expect(res.body.reasons[0].code).toBe('tape-window-default');
    });
  });

  describe('chips', () => {
    it('plans layers from the climate readings and the paint, takes stock once per layer, and carries cautions', async () => {
      const jobId = await techJob();
      const cure = { refC: 20, flashMinAtRef: 30, cureMinAtRef: 1440, minC: 10, maxC: 35 };
      const paint = await product({
        name: 'Touch-up pen, green',
        kind: 'touch-up',
        properties: cure,
        unit: 'mL',
        stockQty: 10,
        amountPerUse: 0.5,
      });
      const takenAt = new Date(Date.now() - 30 * MIN);
      await post(tech, '/api/climate', {
        id: randomUUID(),
        jobId,
        airC: 18,
        rhPct: 55,
        surfaceC: 22,
        takenAt: takenAt.toISOString(),
      }).expect(201);
      const chipId = randomUUID();
      const chip = await post(tech, `/api/jobs/${jobId}/chips`, {
        id: chipId,
        panelId: panel(jobId, 'hood'),
        sizeMm: 1.5,
        productId: paint,
        layersPlanned: 3,
      }).expect(201);
      expect(chip.body.number).toBe(1);
      expect((chip.body.cautions as { message: string }[]).map((c) => c.message).join(' ')).toMatch(
        /isocyanates/,
      );
      const appliedAt = new Date(Date.now() - 10 * MIN);
      const layerId = randomUUID();
      const layer = await post(tech, `/api/chips/${chipId}/layers`, {
        id: layerId,
        appliedAt: appliedAt.toISOString(),
      }).expect(201);
      expect(layer.body.productId).toBe(paint);
      const plan = layer.body.chip.schedule.plan;
      const expected = planChip({
        product: cure,
        layersAppliedAtMs: [appliedAt.getTime()],
        layersPlanned: 3,
        readings: [{ atMs: takenAt.getTime(), tempC: 22, rhPercent: 55 }],
        nowMs: Date.now(),
      });
      expect(plan.nextLayerAtMs).toBe(expected.nextLayerAtMs);
      expect(plan.layersDone).toBe(1);
      await post(tech, `/api/chips/${chipId}/layers`, {
        id: layerId,
        appliedAt: appliedAt.toISOString(),
      }).expect(201);
      expect(await stockOf(paint)).toBe(9.5);
    });

    it('gives no invented times for a chip without a paint', async () => {
      const jobId = await techJob();
      const res = await post(tech, `/api/jobs/${jobId}/chips`, {
        id: randomUUID(),
        sizeMm: 2,
        layersPlanned: 2,
      }).expect(201);
      expect(res.body.schedule.plan).toBeNull();
      expect(res.body.schedule.reasons[0].code).toBe('no-cure-properties');
    });
  });

  describe('timers', () => {
    it('resume pushes endsAt later by exactly the paused time', async () => {
      const jobId = await techJob();
      const id = randomUUID();
      const startedAt = new Date(Date.now() - 10 * MIN);
      const started = await post(tech, '/api/timers', {
        id,
        jobId,
        kind: 'cure',
        label: 'Chip 1 layer 2',
        startedAt: startedAt.toISOString(),
        durationMs: 60 * MIN,
      }).expect(201);
      expect(new Date(started.body.endsAt).getTime()).toBe(startedAt.getTime() + 60 * MIN);
      const pauseAt = new Date(startedAt.getTime() + 2 * MIN);
      const paused = await post(tech, `/api/timers/${id}/pause`, {
        at: pauseAt.toISOString(),
      }).expect(200);
      expect(paused.body.state).toBe('paused');
      const resumed = await post(tech, `/api/timers/${id}/resume`, {
        at: new Date(pauseAt.getTime() + 90_000).toISOString(),
      }).expect(200);
      expect(resumed.body.pausedMs).toBe(90_000);
      expect(new Date(resumed.body.endsAt).getTime()).toBe(startedAt.getTime() + 60 * MIN + 90_000);
      expect(resumed.body.state).toBe('running');
      // Resuming a running timer changes nothing.
      const again = await post(tech, `/api/timers/${id}/resume`).expect(200);
      expect(again.body.version).toBe(resumed.body.version);
    });

    it('lists open timers of the jobs in scope; ack takes one off; an acknowledged timer cannot be cancelled', async () => {
      const mine = await techJob();
      const notMine = (await makeJob(app, owner, { techId: otherTech.user.id })).jobId;
      const a = randomUUID();
      const b = randomUUID();
      await post(tech, '/api/timers', {
        id: a,
        jobId: mine,
        kind: 'keep-dry',
        label: 'Keep dry',
        endsAt: new Date(Date.now() + 2 * 3_600_000).toISOString(),
      }).expect(201);
      await post(owner, '/api/timers', {
        id: b,
        jobId: notMine,
        kind: 'dwell',
        label: 'Iron remover dwell',
        durationMs: 5 * MIN,
      }).expect(201);
      const ids = (who: Session) =>
        get(who, '/api/timers')
          .expect(200)
          .then((r) => (r.body.items as { id: string }[]).map((t) => t.id));
      expect(await ids(tech)).toContain(a);
      expect(await ids(tech)).not.toContain(b);
      expect(await ids(owner)).toEqual(expect.arrayContaining([a, b]));
      await post(tech, `/api/timers/${b}/ack`).expect(404);
      await post(tech, `/api/timers/${a}/ack`).expect(200);
      expect(await ids(tech)).not.toContain(a);
      const cancel = await post(tech, `/api/timers/${a}/cancel`).expect(409);
      expect(cancel.body).toMatchObject({
        code: 'timer-action-not-allowed',
        details: { state: 'acknowledged', allowed: [] },
      });
    });

    it('a timer without a job is the owner’s own; it needs durationMs or endsAt', async () => {
      const body = {
        id: randomUUID(),
        kind: 'custom',
        label: 'Call the supplier',
        durationMs: MIN,
      };
      await post(tech, '/api/timers', body).expect(403);
      await post(owner, '/api/timers', body).expect(201);
      await post(tech, `/api/timers/${body.id}/pause`).expect(404);
      const neither = await post(owner, '/api/timers', {
        id: randomUUID(),
        kind: 'custom',
        label: 'x',
      }).expect(400);
      expect((neither.body.details as { field: string }[]).map((d) => d.field)).toEqual(
        expect.arrayContaining(['durationMs', 'endsAt']),
      );
    });
  });

  describe('checklist and climate', () => {
    it('ticks a checklist item with who and when, and unticks it', async () => {
      const jobId = await techJob();
      const item = childId(jobId, 'check:prep.rinse-wash');
      const on = await post(tech, `/api/checks/${item}/toggle`, { done: true }).expect(200);
      expect(on.body).toMatchObject({ done: true, doneBy: tech.user.id });
      expect(on.body.doneAt).not.toBeNull();
      const off = await post(owner, `/api/checks/${item}/toggle`, { done: false }).expect(200);
      expect(off.body).toMatchObject({ done: false, doneBy: null, doneAt: null });
    });

    it('records climate in °C with its dew point; refuses humidity over 100 %', async () => {
      const jobId = await techJob();
      const res = await post(tech, '/api/climate', {
        id: randomUUID(),
        jobId,
        airC: 21,
        rhPct: 60,
        surfaceC: 19,
      }).expect(201);
      expect(res.body.dewPointC).toBeCloseTo(dewPointC(21, 60), 10);
      expect(res.body.gate.ok).toBe(true);
      const bad = await post(tech, '/api/climate', {
        id: randomUUID(),
        jobId,
        airC: 21,
        rhPct: 120,
      }).expect(400);
      expect(bad.body.details[0].field).toBe('rhPct');
      await post(tech, '/api/climate', { id: randomUUID(), airC: 21, rhPct: 50 }).expect(403);
    });
  });

  describe('permissions and closed jobs', () => {
    it('a helper cannot log on a job not assigned to them (404)', async () => {
      const jobId = (await makeJob(app, owner, { techId: otherTech.user.id })).jobId;
      await post(tech, `/api/jobs/${jobId}/passes`, {
        id: randomUUID(),
        panelId: panel(jobId, 'hood'),
        step: 'polish',
        machine: 'dual-action',
        pad: 'orange foam',
        speedSetting: '5',
        passes: 1,
        result: 'done',
      }).expect(404);
      await post(tech, `/api/jobs/${jobId}/pins`, {
        id: randomUUID(),
        x: 0.1,
        y: 0.1,
        kind: 'chip',
        severity: 1,
      }).expect(404);
      await post(tech, `/api/checks/${childId(jobId, 'check:prep.dry')}/toggle`, {
        done: true,
      }).expect(404);
      await get(tech, `/api/jobs/${jobId}/workspace`).expect(404);
    });

    it("another business's job is not found", async () => {
      const jobId = await techJob();
      const stranger = await signUpOwner(app, 'field-stranger');
      await post(stranger, `/api/jobs/${jobId}/readings`, {
        id: randomUUID(),
        panelId: panel(jobId, 'hood'),
        phase: 'before',
        readings: [100],
        unit: 'um',
        gaugeType: 'magnetic',
      }).expect(404);
      await get(stranger, `/api/jobs/${jobId}/workspace`).expect(404);
    });

    it('a closed job refuses new records (409 job-closed), but a retried create answers its record', async () => {
      const jobId = await techJob();
      const pinId = randomUUID();
      const pin = { id: pinId, x: 0.4, y: 0.4, kind: 'etching', severity: 2 };
      await post(tech, `/api/jobs/${jobId}/pins`, pin).expect(201);
      await close(jobId);
      const refused = await post(tech, `/api/jobs/${jobId}/pins`, {
        ...pin,
        id: randomUUID(),
      }).expect(409);
      expect(refused.body.code).toBe('job-closed');
      await post(tech, `/api/jobs/${jobId}/pins`, pin).expect(201);
      const pass = await post(tech, `/api/jobs/${jobId}/passes`, {
        id: randomUUID(),
        panelId: panel(jobId, 'hood'),
        step: 'polish',
        machine: 'dual-action',
        pad: 'orange foam',
        speedSetting: '5',
        passes: 1,
        result: 'done',
      }).expect(409);
      expect(pass.body.code).toBe('job-closed');
      await post(tech, `/api/jobs/${jobId}/solvents`, {
        id: randomUUID(),
        surfaceTempC: 20,
        inSun: false,
      }).expect(409);
      await http(app)
        .patch(`/api/pins/${pinId}`)
        .auth(tech.accessToken, bearer)
        .send({ note: 'late edit' })
        .expect(409);
    });

    it('writes one audit entry per field change, naming the command and who made it', async () => {
      const jobId = await techJob();
      const id = randomUUID();
      await post(tech, '/api/climate', { id, jobId, airC: 15, rhPct: 70 }).expect(201);
      const rows = await db.query(
        'SELECT command, user_id FROM audit_entries WHERE subject_id = $1',
        [id],
      );
      expect(rows).toEqual([{ command: 'climate.record', user_id: tech.user.id }]);
    });
  });
});
