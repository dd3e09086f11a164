/** Apply pending migrations to the configured database (npm run db:migrate). */
import { loadConfig } from '../server/config';
import { openDatabase } from '../server/db';

const config = loadConfig();
const orm = await openDatabase(config.databasePath);
const executed = await orm.getMigrator().getExecutedMigrations();
console.log(`Database ${config.databasePath} is at ${executed.at(-1)?.name ?? '(empty)'} (${executed.length} migrations).`);
await orm.close();
