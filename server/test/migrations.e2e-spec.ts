import { DataSource } from 'typeorm';
import { dataSourceOptions } from '../src/database/data-source';
import { migrations } from '../src/database/migrations';

/** A database of its own, so going down to empty does not disturb the other e2e files. */
const baseUrl = process.env.DATABASE_URL!;
const scratchName = `migrations_check_${process.pid}`;
const scratchUrl = baseUrl.replace(/\/[^/]+$/, `/${scratchName}`);

describe('migrations', () => {
  let admin: DataSource;

  beforeAll(async () => {
    admin = await new DataSource({ type: 'postgres', url: baseUrl }).initialize();
    await admin.query(`DROP DATABASE IF EXISTS "${scratchName}"`);
    await admin.query(`CREATE DATABASE "${scratchName}"`);
  });
  afterAll(async () => {
    await admin.query(`DROP DATABASE IF EXISTS "${scratchName}" WITH (FORCE)`);
    await admin.destroy();
  });

  it('go from empty to head, back down to empty, and up again', async () => {
    const ds = await new DataSource(dataSourceOptions(scratchUrl)).initialize();
    try {
      const up = await ds.runMigrations({ transaction: 'each' });
      expect(up).toHaveLength(migrations.length);
      for (let i = 0; i < migrations.length; i++)
        await ds.undoLastMigration({ transaction: 'each' });
      const tables: { n: string }[] = await ds.query(
        `SELECT count(*)::text AS n FROM information_schema.tables WHERE table_schema = 'public' AND table_name <> 'migrations'`,
      );
      expect(tables[0]?.n).toBe('0');
      expect(await ds.runMigrations({ transaction: 'each' })).toHaveLength(migrations.length);
    } finally {
      await ds.destroy();
    }
  });

  it('leave nothing for the entities to add: migrations and entities agree', async () => {
    const ds = await new DataSource(dataSourceOptions(scratchUrl)).initialize();
    try {
      await ds.runMigrations({ transaction: 'each' });
      const pending = await ds.driver.createSchemaBuilder().log();
      expect(pending.upQueries.map((q) => q.query)).toEqual([]);
    } finally {
      await ds.destroy();
    }
  });
});
