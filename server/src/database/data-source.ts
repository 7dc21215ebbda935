import 'reflect-metadata';
import { DataSource, DataSourceOptions } from 'typeorm';
import { SnakeNamingStrategy } from 'typeorm-naming-strategies';
import { entities } from './entities';
import { migrations } from './migrations';

/** Options shared by the app, the migration runner and the tests. Never `synchronize`. */
export function dataSourceOptions(url: string): DataSourceOptions {
  return {
    type: 'postgres',
    url,
    entities,
    migrations,
    namingStrategy: new SnakeNamingStrategy(),
    synchronize: false,
    migrationsRun: false,
    migrationsTransactionMode: 'each',
    extra: { max: 20, connectionTimeoutMillis: 5000 },
  };
}

/** For the TypeORM CLI: `typeorm migration:run -d dist/database/data-source.js`. */
export default new DataSource(
  dataSourceOptions(process.env.DATABASE_URL ?? 'postgres://panelpass@127.0.0.1:54329/panelpass'),
);
