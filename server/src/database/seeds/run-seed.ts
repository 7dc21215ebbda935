import * as argon2 from 'argon2';
import { DataSource } from 'typeorm';
import { Business } from '../../businesses/business.entity';
import { User } from '../../users/user.entity';
import { dataSourceOptions } from '../data-source';
import { DEMO_PASSWORD, demoBusiness, demoPeople } from './demo';

/** Loads the demo business into an empty database; leaves a database with data alone. */
export async function seedDemo(ds: DataSource): Promise<boolean> {
  const existing = await ds.getRepository(Business).count();
  if (existing > 0) return false;
  const passwordHash = await argon2.hash(DEMO_PASSWORD, {
    type: argon2.argon2id,
    memoryCost: 19456,
    timeCost: 2,
    parallelism: 1,
  });
  await ds.transaction(async (m) => {
    const business = await m.save(m.create(Business, { name: demoBusiness.name }));
    for (const p of demoPeople) {
      await m.save(
        m.create(User, {
          businessId: business.id,
          email: p.email,
          name: p.name,
          role: p.role,
          passwordHash,
        }),
      );
    }
  });
  return true;
}

async function main(): Promise<void> {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set');
  const ds = await new DataSource(dataSourceOptions(url)).initialize();
  try {
    const loaded = await seedDemo(ds);
    console.log(
      loaded
        ? `Loaded the demo business "${demoBusiness.name}"`
        : 'Database already has data; demo not loaded',
    );
  } finally {
    await ds.destroy();
  }
}

if (require.main === module) {
  main().catch((e: unknown) => {
    console.error(e instanceof Error ? e.message : e);
    process.exit(1);
  });
}
