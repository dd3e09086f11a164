/** Load the invented demo scenario into the configured database (npm run db:seed). Idempotent. */
import { loadConfig } from '../server/config';
import { openDatabase } from '../server/db';
import { seedDemo } from '../server/seed/seeder';
import { createStorage } from '../server/storage/create-storage';

const config = loadConfig();
const orm = await openDatabase(config.databasePath);
const report = await seedDemo(orm.em, createStorage(config));
console.log(`Users created: ${report.usersCreated}; projects created: ${report.projectsCreated.join(', ') || 'none (already there)'}.`);
await orm.close();
