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
    extra: {
      max: 20,
      connectionTimeoutMillis: 5000,
      // Named prepared statements (preparedQuery: the sync pull, a job, its workspace, the jobs
      // list) are planned once per connection and the plan kept. PostgreSQL's default plans
      // each of the first five runs afresh, and planning the pull costs about 17 ms against a
      // millisecond to run it: right after a start, or as the pool grew, pulls at 300 req/s
      // waited a median 38-509 ms against 6 ms (scripts/bench/api's data). TypeORM's own
      // queries are unnamed and planned each time, as before.
      options: '-c plan_cache_mode=force_generic_plan',
    },
  };
}

/** For the TypeORM CLI: `typeorm migration:run -d dist/database/data-source.js`. */
export default new DataSource(
  dataSourceOptions(process.env.DATABASE_URL ?? 'postgres://panelpass@127.0.0.1:54329/panelpass'),
);
