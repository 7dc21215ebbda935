import type { NestExpressApplication } from '@nestjs/platform-express';
import { DataSource } from 'typeorm';
import { CommandBus } from '../src/commands/command-bus.service';
import { dataSourceOptions } from '../src/database/data-source';
import { seedDemo } from '../src/database/seeds/run-seed';
import { DEMO_PASSWORD, demoPeople, demoVisits } from '../src/database/seeds/demo';
import { createTestApp, http } from './support/app';

/** The demo business, loaded into an empty database of its own. */
const baseUrl = process.env.DATABASE_URL!;
const scratchName = `seed_check_${process.pid}`;
const scratchUrl = baseUrl.replace(/\/[^/]+$/, `/${scratchName}`);

describe('demo data', () => {
  let admin: DataSource;
  let app: NestExpressApplication;

  beforeAll(async () => {
    admin = await new DataSource({ type: 'postgres', url: baseUrl }).initialize();
    await admin.query(`DROP DATABASE IF EXISTS "${scratchName}"`);
    await admin.query(`CREATE DATABASE "${scratchName}"`);
    const ds = await new DataSource(dataSourceOptions(scratchUrl)).initialize();
    await ds.runMigrations({ transaction: 'each' });
    await ds.destroy();
    app = await createTestApp({ DATABASE_URL: scratchUrl });
  });
  afterAll(async () => {
    await app.close();
    await admin.query(`DROP DATABASE IF EXISTS "${scratchName}" WITH (FORCE)`);
    await admin.destroy();
  });

  it('loads a week of visits in different stages into an empty database, once', async () => {
    const ds = app.get(DataSource);
    expect(await seedDemo(ds, app.get(CommandBus))).toBe(true);
    expect(await seedDemo(ds, app.get(CommandBus))).toBe(false);

    const stages: { stage: string; n: number }[] = await ds.query(
      'SELECT stage, count(*)::int AS n FROM jobs GROUP BY stage ORDER BY stage',
    );
    expect(stages.map((s) => s.stage)).toEqual([
      'booked',
      'closed',
      'correction',
      'handover',
      'prep',
      'walkaround',
    ]);
    expect(stages.reduce((a, s) => a + s.n, 0)).toBe(demoVisits.length);
    const [counts] = await ds.query<
      [{ readings: number; passes: number; chips: number; payments: number }]
    >(
      `SELECT (SELECT count(*)::int FROM film_readings) AS readings, (SELECT count(*)::int FROM correction_passes) AS passes,
              (SELECT count(*)::int FROM chips) AS chips, (SELECT count(*)::int FROM payments) AS payments`,
    );
    expect(counts.chips).toBe(8);
    expect(counts.readings).toBeGreaterThan(30);
    expect(counts.passes).toBeGreaterThan(0);
    expect(counts.payments).toBeGreaterThan(0);
  });

  it('signs in the demo owner and helper; the helper sees only their visits', async () => {
    const [owner, helper] = await Promise.all(
      demoPeople.map((p) =>
        http(app)
          .post('/api/auth/sign-in')
          .send({ email: p.email, password: DEMO_PASSWORD })
          .expect(200),
      ),
    );
    const all = await http(app)
      .get('/api/jobs')
      .auth(owner!.body.accessToken, { type: 'bearer' })
      .expect(200);
    const mine = await http(app)
      .get('/api/jobs')
      .auth(helper!.body.accessToken, { type: 'bearer' })
      .expect(200);
    expect(all.body.total).toBe(demoVisits.length);
    expect(mine.body.total).toBe(demoVisits.filter((v) => v.helper).length);
  });
});
