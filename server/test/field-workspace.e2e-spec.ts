import type { NestExpressApplication } from '@nestjs/platform-express';
import { bodyStyleTemplate, childId, clearCoatBudget } from '@panelpass/shared';
import { randomUUID } from 'node:crypto';
import { signInCustomer } from './factories/customers';
import { makeJob } from './factories/records';
import { addTech, createTestApp, http, type Session, signUpOwner } from './support/app';

const bearer = { type: 'bearer' as const };

/** The parts of a workspace panel these tests read. */
interface WsPanel {
  panelKey: string;
  state: string;
  budget: unknown;
  stats: { before: unknown };
  flags: { flags: string[] };
  passes: Record<string, unknown>[];
}

/** Every key of a JSON answer, at any depth. */
function keysOf(value: unknown, into = new Set<string>()): Set<string> {
  if (Array.isArray(value)) value.forEach((v) => keysOf(v, into));
  else if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      into.add(k);
      keysOf(v, into);
    }
  }
  return into;
}

describe('the job workspace', () => {
  let app: NestExpressApplication;
  let owner: Session;
  let tech: Session;
  let jobId: string;
  let customerId: string;
  let customerToken: string;

  const post = (who: Session, url: string, body: object = {}) =>
    http(app).post(url).auth(who.accessToken, bearer).send(body);
  const workspace = (token: string, id = jobId) =>
    http(app).get(`/api/jobs/${id}/workspace`).auth(token, bearer);
  const panel = (key: string) => childId(jobId, `panel:${key}`);

  /** A customer's access token as the e-mailed sign-in link would give it. */
  const customerSession = async (businessId: string, cid: string) =>
    (await signInCustomer(app, businessId, cid)).accessToken;

  beforeAll(async () => {
    app = await createTestApp();
    owner = await signUpOwner(app, 'workspace');
    tech = await addTech(app, owner, 'workspace-tech');
    ({ jobId, customerId } = await makeJob(app, owner, {
      bodyStyle: 'suv',
      techId: tech.user.id,
      priceMinor: 62_000,
    }));
    customerToken = await customerSession(owner.user.businessId, customerId);
    await http(app)
      .patch(`/api/jobs/${jobId}`)
      .auth(owner.accessToken, bearer)
      .send({ notes: 'gate code 1234, dog in yard', conditionNotes: 'door repainted' })
      .expect(200);
    const polish = randomUUID();
    await post(owner, '/api/products', {
      id: polish,
      name: 'Heavy cut compound',
      kind: 'compound',
      properties: { cutLevel: 9, finishLevel: 3 },
      unitCostMinor: 3,
      amountPerUse: 10,
      stockQty: 100,
    }).expect(201);
    // Before readings: most panels near 120 µm, the left front door repainted (~250 µm).
    for (const [key, values] of [
      ['roof', [118, 121, 119]],
      ['hood', [122, 125, 120]],
      ['left-front-fender', [117, 119, 118]],
      ['left-front-door', [250, 255, 248]],
      ['right-front-door', [120, 118, 121]],
    ] as const) {
      await post(tech, `/api/jobs/${jobId}/readings`, {
        id: randomUUID(),
        panelId: panel(key),
        phase: 'before',
        readings: values,
        unit: 'um',
        gaugeType: 'magnetic',
      }).expect(201);
    }
    await post(tech, `/api/jobs/${jobId}/passes`, {
      id: randomUUID(),
      panelId: panel('hood'),
      step: 'heavy-compound',
      machine: 'rotary',
      pad: 'wool',
      productId: polish,
      speedSetting: '2',
      passes: 1,
      result: 'another-pass',
      note: 'holograms at the edge',
    }).expect(201);
    await post(tech, `/api/jobs/${jobId}/pins`, {
      id: randomUUID(),
      x: 0.3,
      y: 0.5,
      panelKey: 'left-front-door',
      kind: 'repaint',
      severity: 2,
      note: 'colour mismatch in sun',
    }).expect(201);
    await post(tech, `/api/jobs/${jobId}/solvents`, {
      id: randomUUID(),
      surfaceTempC: 24,
      inSun: false,
    }).expect(201);
    await post(tech, '/api/climate', { id: randomUUID(), jobId, airC: 17, rhPct: 65 }).expect(201);
  });
  afterAll(async () => {
    await app.close();
  });

  it('lists the panels top-down in the template order, each with its clear-coat budget', async () => {
    const res = await workspace(owner.accessToken).expect(200);
    const keys = (res.body.panels as { panelKey: string }[]).map((p) => p.panelKey);
    expect(keys).toEqual(bodyStyleTemplate('suv').map((p) => p.id));
    for (const p of res.body.panels) expect(p.budget).toHaveProperty('status');
    const hood = (res.body.panels as WsPanel[]).find((p) => p.panelKey === 'hood')!;
    expect(hood.budget).toEqual(
      clearCoatBudget({ passes: [{ step: 'heavy-compound', count: 1 }], totalFilmUm: 122 + 1 / 3 }),
    );
    expect(hood.passes).toHaveLength(1);
    expect(hood.stats.before).toMatchObject({ count: 3, minUm: 120, maxUm: 125 });
    expect(hood.state).toBe('in-progress');
  });

  it('flags the repainted door against the vehicle baseline', async () => {
    const res = await workspace(owner.accessToken).expect(200);
    const door = (res.body.panels as WsPanel[]).find((p) => p.panelKey === 'left-front-door')!;
    expect(door.flags.flags).toEqual(['probably-repainted']);
    expect(res.body.film.baselineUm).toBeCloseTo(119.67, 1);
    const roof = (res.body.panels as WsPanel[]).find((p) => p.panelKey === 'roof')!;
    expect(roof.flags.flags).toEqual([]);
  });

  it('carries the records of the job and the cautions of solvent and touch-up work', async () => {
    const res = await workspace(tech.accessToken).expect(200);
    expect(res.body.pins).toHaveLength(1);
    expect(res.body.solvents).toHaveLength(1);
    expect(res.body.solvents[0].status.state).toMatch(/running|due-soon|overdue/);
    expect((res.body.timers as { kind: string }[]).map((t) => t.kind)).toEqual(['flush']);
    expect(res.body.checklist.length).toBeGreaterThan(0);
    expect(res.body.climate[0].dewPointC).toBeCloseTo(10.4, 0);
    expect(res.body.progress.total).toBe(bodyStyleTemplate('suv').length);
    const codes = (res.body.cautions as { code: string; message: string }[]).map((c) => c.code);
    expect(codes).toEqual(expect.arrayContaining(['solvent-sds', 'touch-up-sds']));
    expect(
      (res.body.cautions as { message: string }[]).some((c) => /safety data sheet/.test(c.message)),
    ).toBe(true);
  });

  it('a helper sees no money: no price and no unit cost anywhere', async () => {
    const res = await workspace(tech.accessToken).expect(200);
    const keys = keysOf(res.body);
    expect(keys.has('priceMinor')).toBe(false);
    expect(keys.has('unitCostMinor')).toBe(false);
    expect(res.body.job.amountDueMinor).toBe(62_000);
    const own = await workspace(owner.accessToken).expect(200);
    expect(own.body.job.priceMinor).toBe(62_000);
  });

  it("the job's customer reads the condition record without the internal notes", async () => {
    const res = await workspace(customerToken).expect(200);
    expect(res.body.job).not.toHaveProperty('notes');
    expect(res.body.job.conditionNotes).toBe('door repainted');
    expect(res.body.customer).not.toHaveProperty('notes');
    expect(res.body.pins[0]).toMatchObject({ kind: 'repaint', note: 'colour mismatch in sun' });
    const hood = (res.body.panels as WsPanel[]).find((p) => p.panelKey === 'hood')!;
    expect(hood.passes[0]).not.toHaveProperty('note');
    expect(hood).not.toHaveProperty('testSpotNote');
    const owners = await workspace(owner.accessToken).expect(200);
    expect(owners.body.job.notes).toBe('gate code 1234, dog in yard');
  });

  it('a customer may only read: field records are refused (403)', async () => {
    await http(app)
      .post(`/api/jobs/${jobId}/pins`)
      .auth(customerToken, bearer)
      .send({ id: randomUUID(), x: 0.1, y: 0.1, kind: 'chip', severity: 1 })
      .expect(403);
  });

  it('a customer of another job, and a helper not assigned, get 404', async () => {
    const other = await makeJob(app, owner);
    const stranger = await customerSession(owner.user.businessId, other.customerId);
    await workspace(stranger).expect(404);
    const otherTech = await addTech(app, owner, 'workspace-other');
    await workspace(otherTech.accessToken).expect(404);
    await workspace(customerToken, other.jobId).expect(404);
  });
});
