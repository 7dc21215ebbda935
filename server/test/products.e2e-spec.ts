import type { NestExpressApplication } from '@nestjs/platform-express';
import { childId } from '@panelpass/shared';
import { randomUUID } from 'node:crypto';
import { DataSource } from 'typeorm';
import { StockService } from '../src/products/stock.service';
import { addTech, createTestApp, http, type Session, signUpOwner } from './support/app';

const bearer = { type: 'bearer' as const };

describe('products on the Shelf and their stock', () => {
  let app: NestExpressApplication;
  let owner: Session;
  let tech: Session;

  const post = (who: Session, url: string, body: object = {}) =>
    http(app).post(url).auth(who.accessToken, bearer).send(body);
  const get = (who: Session, url: string) => http(app).get(url).auth(who.accessToken, bearer);

  const solvent = (over: object = {}) => ({
    id: randomUUID(),
    name: 'Sap lifter',
    kind: 'solvent',
    properties: { maxDwellMin: 4 },
    unit: 'mL',
    stockQty: 250,
    amountPerUse: 5,
    unitCostMinor: 2.5,
    lowStockAt: 50,
    sdsUrl: 'https://sds.example/sap-lifter.pdf',
    ...over,
  });

  beforeAll(async () => {
    app = await createTestApp();
    owner = await signUpOwner(app, 'shelf');
    tech = await addTech(app, owner, 'shelf-tech');
  });
  afterAll(async () => {
    await app.close();
  });

  it('creates a product with typed properties and records its opening stock as a movement', async () => {
    const body = solvent();
    const res = await post(owner, '/api/products', body).expect(201);
    expect(res.body).toMatchObject({
      kind: 'solvent',
      properties: { maxDwellMin: 4 },
      stockQty: 250,
    });
    const moves = await get(owner, `/api/products/${body.id}/movements`).expect(200);
    expect(moves.body.items).toEqual([
      expect.objectContaining({
        id: childId(body.id, 'opening-stock'),
        qty: 250,
        reason: 'adjust',
      }),
    ]);
  });

  it('checks properties against the kind, naming the field', async () => {
    const missing = await post(
      owner,
      '/api/products',
      solvent({ properties: { maxSurfaceC: 30 } }),
    ).expect(400);
    expect(missing.body.code).toBe('validation-failed');
    expect((missing.body.details as { field: string }[]).map((d) => d.field)).toContain(
      'properties.maxDwellMin',
    );
    const foreign = await post(
      owner,
      '/api/products',
      solvent({ properties: { maxDwellMin: 4, cleanRemovalDays: 7 } }),
    ).expect(400);
    expect(foreign.body.details[0].field).toBe('properties.cleanRemovalDays');
    const cure = await post(owner, '/api/products', {
      id: randomUUID(),
      name: 'Touch-up bottle',
      kind: 'touch-up',
      properties: { refC: 20, flashMinAtRef: 20, cureMinAtRef: 600, minC: 30, maxC: 10 },
    }).expect(400);
    expect(cure.body.details[0].field).toBe('properties.minC');
    const scale = await post(owner, '/api/products', {
      id: randomUUID(),
      name: 'Finishing polish',
      kind: 'finishing-polish',
      properties: { cutLevel: 11, finishLevel: 9 },
    }).expect(400);
    expect(scale.body.details[0].field).toBe('properties.cutLevel');
  });

  it('re-checks the stored properties when the kind changes', async () => {
    const body = solvent();
    await post(owner, '/api/products', body).expect(201);
    const res = await http(app)
      .patch(`/api/products/${body.id}`)
      .auth(owner.accessToken, bearer)
      .send({ kind: 'tape' })
      .expect(400);
    expect(res.body.details[0].field).toBe('properties.maxDwellMin');
    const ok = await http(app)
      .patch(`/api/products/${body.id}`)
      .auth(owner.accessToken, bearer)
      .send({ kind: 'tape', properties: { cleanRemovalDays: 5 } })
      .expect(200);
    expect(ok.body).toMatchObject({ kind: 'tape', properties: { cleanRemovalDays: 5 } });
    await http(app)
      .patch(`/api/products/${body.id}`)
      .auth(owner.accessToken, bearer)
      .send({ name: null })
      .expect(400);
  });

  it('a helper may look products up without their unit cost, and may not change the Shelf', async () => {
    const body = solvent();
    await post(owner, '/api/products', body).expect(201);
    const list = await get(tech, '/api/products?kind=solvent').expect(200);
    expect(list.body.items.length).toBeGreaterThan(0);
    for (const p of list.body.items) expect(p).not.toHaveProperty('unitCostMinor');
    const one = await get(tech, `/api/products/${body.id}`).expect(200);
    expect(one.body).not.toHaveProperty('unitCostMinor');
    expect(one.body.name).toBe('Sap lifter');
    const own = await get(owner, `/api/products/${body.id}`).expect(200);
    expect(own.body.unitCostMinor).toBe(2.5);
    await post(tech, '/api/products', solvent()).expect(403);
    await get(tech, `/api/products/${body.id}/movements`).expect(403);
    await post(tech, `/api/products/${body.id}/stock`, {
      id: randomUUID(),
      qty: 10,
      reason: 'restock',
    }).expect(403);
  });

  it('lists only products at or below their low-stock mark with lowStock=true', async () => {
    const low = solvent({ name: 'Almost out', stockQty: 10, lowStockAt: 20 });
    const plenty = solvent({ name: 'Plenty', stockQty: 500, lowStockAt: 20 });
    await post(owner, '/api/products', low).expect(201);
    await post(owner, '/api/products', plenty).expect(201);
    const res = await get(owner, '/api/products?lowStock=true&limit=200').expect(200);
    const ids = (res.body.items as { id: string }[]).map((p) => p.id);
    expect(ids).toContain(low.id);
    expect(ids).not.toContain(plenty.id);
    await get(owner, '/api/products?lowStock=maybe').expect(400);
  });

  it('a restock adds once per movement id and sets the unit cost; stock never goes below zero', async () => {
    const body = solvent({ stockQty: 20, unitCostMinor: 2 });
    await post(owner, '/api/products', body).expect(201);
    const restock = { id: randomUUID(), qty: 500, reason: 'restock', unitCostMinor: 1.8 };
    const a = await post(owner, `/api/products/${body.id}/stock`, restock).expect(201);
    expect(a.body.product).toMatchObject({ stockQty: 520, unitCostMinor: 1.8 });
    const b = await post(owner, `/api/products/${body.id}/stock`, restock).expect(201);
    expect(b.body.product.stockQty).toBe(520);
    const below = await post(owner, `/api/products/${body.id}/stock`, {
      id: randomUUID(),
      qty: -600,
      reason: 'adjust',
    }).expect(409);
    expect(below.body).toMatchObject({ code: 'stock-below-zero', details: { stockQty: 520 } });
    const zero = await post(owner, `/api/products/${body.id}/stock`, {
      id: randomUUID(),
      qty: 0,
      reason: 'adjust',
    }).expect(400);
    expect(zero.body.details[0].field).toBe('qty');
    const count = await post(owner, `/api/products/${body.id}/stock`, {
      id: randomUUID(),
      qty: -20.5,
      reason: 'adjust',
    }).expect(201);
    expect(count.body.product.stockQty).toBe(499.5);
  });

  it('a use is taken from stock once per source record, however often it is recorded', async () => {
    const body = solvent({ stockQty: 100, amountPerUse: 7.5 });
    await post(owner, '/api/products', body).expect(201);
    const stock = app.get(StockService);
    const actor = {
      userId: owner.user.id,
      businessId: owner.user.businessId,
      role: 'owner' as const,
    };
    const use = {
      productId: body.id,
      jobId: null,
      sourceType: 'solvent' as const,
      sourceId: randomUUID(),
    };
    for (let i = 0; i < 3; i += 1) {
      await app.get(DataSource).transaction((m) => stock.recordUse({ actor, m, via: 'test' }, use));
    }
    const res = await get(owner, `/api/products/${body.id}`).expect(200);
    expect(res.body.stockQty).toBe(92.5);
  });

  it('a removed product is gone from the list; customers and other businesses see nothing', async () => {
    const body = solvent();
    await post(owner, '/api/products', body).expect(201);
    await http(app).delete(`/api/products/${body.id}`).auth(owner.accessToken, bearer).expect(204);
    await get(owner, `/api/products/${body.id}`).expect(404);
    const stranger = await signUpOwner(app, 'shelf-stranger');
    const other = solvent();
    await post(owner, '/api/products', other).expect(201);
    await get(stranger, `/api/products/${other.id}`).expect(404);
    const theirs = await get(stranger, '/api/products').expect(200);
    expect(theirs.body.items).toEqual([]);
  });
});
