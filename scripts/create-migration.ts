/**
 * Generate a migration from the difference between the entities and the committed migrations.
 * Usage: npm run db:migration:create [-- --initial]
 * Then add the new class to server/migrations/index.ts.
 */
import { MikroORM } from '@mikro-orm/sqlite';
import { ormConfig } from '../server/mikro-orm.config';

const initial = process.argv.includes('--initial');
const orm = await MikroORM.init(ormConfig(':memory:'));
try {
  const migrator = orm.getMigrator();
  await migrator.up();
  const result = await migrator.createMigration('server/migrations', false, initial);
  if (!result.fileName) {
    console.log('No changes: the entities match the migrations.');
  } else {
    console.log(`Created server/migrations/${result.fileName}; add it to server/migrations/index.ts.`);
  }
} finally {
  await orm.close(true);
}
