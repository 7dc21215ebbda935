import { DataSource } from 'typeorm';
import { dataSourceOptions } from './data-source';

/** `node dist/database/migrate.js [up|down]`: runs pending migrations (or reverts the last). */
async function main(): Promise<void> {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set');
  const ds = await new DataSource(dataSourceOptions(url)).initialize();
  try {
    if (process.argv[2] === 'down') {
      await ds.undoLastMigration({ transaction: 'each' });
    } else {
      const ran = await ds.runMigrations({ transaction: 'each' });
      console.log(
        ran.length
          ? `Applied ${ran.length} migration(s): ${ran.map((m) => m.name).join(', ')}`
          : 'Database schema is up to date',
      );
    }
  } finally {
    await ds.destroy();
  }
}

main().catch((e: unknown) => {
  console.error(e instanceof Error ? e.message : e);
  process.exit(1);
});
