import { DataSource } from 'typeorm';
import { dataSourceOptions } from '../src/database/data-source';

/** Before any e2e test: an empty schema with every migration applied, as in production. */
export default async function globalSetup(): Promise<void> {
  const url = process.env.DATABASE_URL;
  if (!url)
    throw new Error('e2e tests need DATABASE_URL (scripts/test sets it to a throwaway cluster)');
  const ds = await new DataSource(dataSourceOptions(url)).initialize();
  try {
    await ds.query('DROP SCHEMA public CASCADE');
    await ds.query('CREATE SCHEMA public');
    await ds.runMigrations({ transaction: 'each' });
  } finally {
    await ds.destroy();
  }
}
