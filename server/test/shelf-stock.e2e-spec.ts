import type { NestExpressApplication } from '@nestjs/platform-express';
import { childId, PRODUCT_KINDS, type PushResponse, type SyncRow } from '@panelpass/shared';
import type { AddressInfo } from 'node:net';
import { randomUUID } from 'node:crypto';
import { DataSource } from 'typeorm';
import { PRODUCT_KINDS as SERVER_PRODUCT_KINDS } from '../src/products/dto/product.dto';
import { makeJob } from './factories/records';
import { addTech, createTestApp, http, type Session, signUpOwner } from './support/app';

/*
 * The Shelf through sync (issue 8): the owner's phone keeps the Shelf offline and pushes
 * product.create / product.update / stock.adjust; stock goes down exactly once per use logged
 * in the field (pass, solvent, touch-up layer, tape) however often a device sends it — the
 * same push again, a push whose answer was lost, the same record from another device — and
 * the low-stock list follows.
 */

const bearer = { type: 'bearer' as const };
const MIN = 60_000;

interface Mutation {
  id: number;
  name: string;
  args: Record<string, unknown>;
}

describe('the Shelf through sync, and stock taken once per use', () => {
  let app: NestExpressApplication;
  let db: DataSource;
  let owner: Session;
  let tech: Session;
  let baseUrl: string;

  const push = (who: Session, clientId: string, mutations: Mutation[]) =>
    http(app).post('/api/sync/push').auth(who.accessToken, bearer).send({ clientId, mutations });
  const get = (who: Session, url: string) => http(app).get(url).auth(who.accessToken, bearer);
  const statuses = (body: PushResponse) => body.results.map((r) => r.status);
  const stockOf = async (id: string) =>
    Number((await get(owner, `/api/products/${id}`).expect(200)).body.stockQty);
  const usesOf = async (sourceId: string): Promise<number> => {
    const rows = await db.query<{ n: number }[]>(
      "SELECT count(*)::int AS n FROM stock_movements WHERE source_id = $1 AND reason = 'use'",
      [sourceId],
    );
    return rows[0]?.n ?? 0;
  };

  /** A product put on the Shelf from the owner's phone (through sync). */
  async function shelve(clientId: string, id: number, fields: Record<string, unknown>) {
    const productId = randomUUID();
    const res = await push(owner, clientId, [
      { id, name: 'product.create', args: { id: productId, ...fields } },
    ]).expect(200);
    expect(statuses(res.body as PushResponse)).toEqual(['applied']);
    return productId;
  }

  beforeAll(async () => {
    app = await createTestApp();
    await app.listen(0, '127.0.0.1');
    baseUrl = `http://127.0.0.1:${(app.getHttpServer().address() as AddressInfo).port}`;
    db = app.get(DataSource);
    owner = await signUpOwner(app, 'shelf-sync');
    tech = await addTech(app, owner, 'shelf-sync-tech');
  });
  afterAll(async () => {
    await app.close();
  });

  it('knows the same product kinds on the phone as on the server', () => {
    expect([...PRODUCT_KINDS]).toEqual([...SERVER_PRODUCT_KINDS]);
  });

  it('takes product.create, product.update and stock.adjust from a phone, once each', async () => {
    const clientId = randomUUID();
    const productId = randomUUID();
    const deliveryId = randomUUID();
    const mutations: Mutation[] = [
      {
        id: 1,
        name: 'product.create',
        args: {
          id: productId,
          name: 'Ceramic spray sealant',
          kind: 'protection',
          properties: { refC: 20, flashMinAtRef: 2, cureMinAtRef: 120, minC: 5, maxC: 35 },
          unit: 'mL',
          stockQty: 100,
          amountPerUse: 25,
          unitCostMinor: 6,
          lowStockAt: 30,
          sdsUrl: 'https://sds.example/ceramic-spray.pdf',
        },
      },
      { id: 2, name: 'product.update', args: { id: productId, lowStockAt: 40 } },
      {
        id: 3,
        name: 'stock.adjust',
        args: { id: deliveryId, productId, qty: 50, reason: 'restock', unitCostMinor: 5.5 },
      },
    ];
    const first = await push(owner, clientId, mutations).expect(200);
    expect(statuses(first.body as PushResponse)).toEqual(['applied', 'applied', 'applied']);
    // The same push again (its answer never came back): nothing is counted twice.
    const again = await push(owner, clientId, mutations).expect(200);
    expect(statuses(again.body as PushResponse)).toEqual(['skipped', 'skipped', 'skipped']);

    const product = await get(owner, `/api/products/${productId}`).expect(200);
    expect(product.body).toMatchObject({ stockQty: 150, lowStockAt: 40, unitCostMinor: 5.5 });
    const moves = await get(owner, `/api/products/${productId}/movements`).expect(200);
    expect(
      (moves.body.items as { id: string; qty: number }[]).map((m) => [m.id, m.qty]).sort(),
    ).toEqual(
      [
        [childId(productId, 'opening-stock'), 100],
        [deliveryId, 50],
      ].sort(),
    );
  });

  it('refuses the Shelf’s commands from a helper’s phone, and a count below zero, in words', async () => {
    const ownerClient = randomUUID();
    const productId = await shelve(ownerClient, 1, {
      name: 'Wax-free panel wipe',
      kind: 'cleaner',
      properties: { dilution: { concentrateParts: 1, waterParts: 3 } },
      stockQty: 10,
    });
    const helperPush = await push(tech, randomUUID(), [
      { id: 1, name: 'product.update', args: { id: productId, lowStockAt: 5 } },
      {
        id: 2,
        name: 'stock.adjust',
        args: { id: randomUUID(), productId, qty: 5, reason: 'restock' },
      },
    ]).expect(200);
    expect((helperPush.body as PushResponse).results).toEqual([
      expect.objectContaining({ status: 'rejected', code: 'forbidden' }),
      expect.objectContaining({ status: 'rejected', code: 'forbidden' }),
    ]);
    const below = await push(owner, ownerClient, [
      {
        id: 2,
        name: 'stock.adjust',
        args: { id: randomUUID(), productId, qty: -11, reason: 'adjust' },
      },
    ]).expect(200);
    expect((below.body as PushResponse).results[0]).toMatchObject({
      status: 'rejected',
      code: 'stock-below-zero',
    });
    expect(await stockOf(productId)).toBe(10);
  });

  it('takes stock exactly once per use: pushed twice, retried after a lost answer, or sent by a second phone', async () => {
    const { jobId } = await makeJob(app, owner, { techId: tech.user.id, bodyStyle: 'sedan' });
    const panel = (key: string) => childId(jobId, `panel:${key}`);
    const shelf = randomUUID();
    const polish = await shelve(shelf, 1, {
      name: 'Medium cut polish',
      kind: 'polish',
      properties: { cutLevel: 5, finishLevel: 6 },
      stockQty: 200,
      amountPerUse: 8,
      lowStockAt: 50,
    });
    const solvent = await shelve(shelf, 2, {
      name: 'Bug and tar remover',
      kind: 'solvent',
      properties: { maxDwellMin: 4 },
      stockQty: 100,
      amountPerUse: 10,
    });
    const paint = await shelve(shelf, 3, {
      name: 'Touch-up paint, mid grey',
      kind: 'touch-up',
      properties: { refC: 20, flashMinAtRef: 10, cureMinAtRef: 240, minC: 5, maxC: 35 },
      stockQty: 20,
      amountPerUse: 0.2,
    });
    const tape = await shelve(shelf, 4, {
      name: 'Trim masking tape 24 mm',
      kind: 'tape',
      properties: { cleanRemovalDays: 5 },
      unit: 'm',
      stockQty: 50,
      amountPerUse: 1.5,
    });

    const chipId = randomUUID();
    const ids = {
      pass: randomUUID(),
      solvent: randomUUID(),
      layer: randomUUID(),
      mask: randomUUID(),
    };
    const at = (minutesAgo: number) => new Date(Date.now() - minutesAgo * MIN).toISOString();
    const phone = randomUUID();
    const field: Mutation[] = [
      {
        id: 1,
        name: 'climate.record',
        args: { id: randomUUID(), jobId, airC: 19, rhPct: 55, surfaceC: 21, takenAt: at(30) },
      },
      {
        id: 2,
        name: 'pass.log',
        args: {
          id: ids.pass,
          jobId,
          panelId: panel('hood'),
          step: 'polish',
          machine: 'dual-action',
          pad: 'Foam polishing pad',
          productId: polish,
          speedSetting: '4',
          passes: 2,
          result: 'another-pass',
          loggedAt: at(20),
        },
      },
      {
        id: 3,
        name: 'solvent.apply',
        args: {
          id: ids.solvent,
          jobId,
          panelId: panel('roof'),
          productId: solvent,
          surfaceTempC: 21,
          inSun: false,
          appliedAt: at(15),
        },
      },
      {
        id: 4,
        name: 'chip.add',
        args: {
          id: chipId,
          jobId,
          panelId: panel('hood'),
          sizeMm: 1.5,
          productId: paint,
          layersPlanned: 3,
        },
      },
      {
        id: 5,
        name: 'chip.addLayer',
        args: { id: ids.layer, chipId, appliedAt: at(10) },
      },
      {
        id: 6,
        name: 'mask.add',
        args: { id: ids.mask, jobId, what: 'Mirror caps', productId: tape, appliedAt: at(5) },
      },
    ];

    // The helper's phone pushes; the answer is lost on the way back (the phone gives up
    // waiting), and it pushes the same mutations again at once.
    const lost = new AbortController();
    const firstTry = fetch(`${baseUrl}/api/sync/push`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', authorization: `Bearer ${tech.accessToken}` },
      body: JSON.stringify({ clientId: phone, mutations: field }),
      signal: lost.signal,
    }).catch(() => null);
    setTimeout(() => lost.abort(), 5);
    await firstTry;
    const retry = await push(tech, phone, field).expect(200);
    const retried = retry.body as PushResponse;
    expect(retried.lastMutationId).toBe(6);
    expect(retried.results.every((r) => r.status === 'applied' || r.status === 'skipped')).toBe(
      true,
    );
    // …and once more, the whole outbox again (a third sync run before the pull).
    const third = await push(tech, phone, field).expect(200);
    expect(statuses(third.body as PushResponse)).toEqual(field.map(() => 'skipped'));

    // A second phone of the helper sends the same records as new mutations of its own.
    const second = await push(
      tech,
      randomUUID(),
      field.map((m) => ({ ...m })),
    ).expect(200);
    expect((second.body as PushResponse).results.every((r) => r.status !== 'rejected')).toBe(true);

    for (const id of Object.values(ids)) expect(await usesOf(id)).toBe(1);
    expect(await stockOf(polish)).toBe(192);
    expect(await stockOf(solvent)).toBe(90);
    expect(await stockOf(paint)).toBe(19.8);
    expect(await stockOf(tape)).toBe(48.5);

    // What the phones pull: the helper sees the stock left but no cost; the owner sees the
    // use movements, one per record.
    const helperPull = await get(tech, `/api/sync/pull?cursor=0&clientId=${phone}`).expect(200);
    const helperPolish = (helperPull.body.changes.products as SyncRow[]).find(
      (p) => p.id === polish,
    ) as unknown as Record<string, unknown>;
    expect(helperPolish).toMatchObject({ stockQty: 192 });
    expect(helperPolish).not.toHaveProperty('unitCostMinor');
    expect(helperPull.body.changes.stock_movements).toBeUndefined();
    const ownerPull = await get(owner, `/api/sync/pull?cursor=0&clientId=${shelf}`).expect(200);
    const uses = (ownerPull.body.changes.stock_movements as Record<string, unknown>[]).filter(
      (m) => m.reason === 'use' && m.jobId === jobId,
    );
    expect(uses.map((m) => m.sourceId).sort()).toEqual(Object.values(ids).sort());
  });

  it('lists products at or below their low-stock mark, as uses bring them there', async () => {
    const { jobId } = await makeJob(app, owner, { techId: tech.user.id, bodyStyle: 'hatchback' });
    const shelf = randomUUID();
    const compound = await shelve(shelf, 1, {
      name: 'Heavy cut compound (low test)',
      kind: 'compound',
      properties: { cutLevel: 9, finishLevel: 2 },
      stockQty: 116,
      amountPerUse: 8,
      lowStockAt: 100,
    });
    const plenty = await shelve(shelf, 2, {
      name: 'Finishing polish (low test)',
      kind: 'finishing-polish',
      properties: { cutLevel: 2, finishLevel: 9 },
      stockQty: 900,
      amountPerUse: 8,
      lowStockAt: 100,
    });
    const lowIds = async () =>
      (
        (await get(owner, '/api/products?lowStock=true&limit=200').expect(200)).body.items as {
          id: string;
        }[]
      ).map((p) => p.id);
    expect(await lowIds()).not.toContain(compound);

    const pass = (id: number) => ({
      id,
      name: 'pass.log',
      args: {
        id: randomUUID(),
        jobId,
        panelId: childId(jobId, 'panel:hood'),
        step: 'heavy-compound',
        machine: 'rotary',
        pad: 'Wool cutting pad',
        productId: compound,
        speedSetting: '1200 rpm',
        passes: 1,
        result: 'another-pass',
      },
    });
    const phone = randomUUID();
    await push(tech, phone, [pass(1)]).expect(200);
    expect(await stockOf(compound)).toBe(108);
    expect(await lowIds()).not.toContain(compound);
    await push(tech, phone, [pass(2)]).expect(200);
    // 100 left, the mark itself: low.
    expect(await stockOf(compound)).toBe(100);
    const low = await lowIds();
    expect(low).toContain(compound);
    expect(low).not.toContain(plenty);
    const notLow = (
      (await get(owner, '/api/products?lowStock=false&limit=200').expect(200)).body.items as {
        id: string;
      }[]
    ).map((p) => p.id);
    expect(notLow).toContain(plenty);
    expect(notLow).not.toContain(compound);
  });
});
