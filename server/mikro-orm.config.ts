import { defineConfig } from '@mikro-orm/sqlite';
import { Migrator } from '@mikro-orm/migrations';
import { ENTITIES } from './entities';
import { MIGRATIONS } from './migrations';

/** MikroORM settings for a database file (or ':memory:' in tests). */
export function ormConfig(dbName: string, options: { debug?: boolean } = {}) {
  return defineConfig({
    dbName,
    entities: ENTITIES,
    extensions: [Migrator],
    debug: options.debug ?? false,
    forceUtcTimezone: true,
    // Listed, not globbed: MikroORM's own import() of .ts migration files fails under vitest.
    migrations: {
      migrationsList: MIGRATIONS,
      path: 'server/migrations',
      pathTs: 'server/migrations',
      emit: 'ts',
      snapshot: true,
      snapshotName: '.snapshot-threadline',
      transactional: true,
      allOrNothing: true,
      silent: true,
    },
    pool: { min: 1, max: 1 },
  });
}

/** Default export for the MikroORM CLI (`npm run orm -- migration:list`). */
export default ormConfig(process.env.DATABASE_PATH ?? 'data/threadline.sqlite');
