/** Load the invented demo scenario into the configured database (npm run db:seed). Idempotent. */
import { join } from 'node:path';
import { loadConfig } from '../server/config';
import { openDatabase } from '../server/db';
import { seedDemo } from '../server/seed/seeder';
import { DiskStorage } from '../server/storage/storage';

const config = loadConfig();
const orm = await openDatabase(config.databasePath);
const report = await seedDemo(orm.em, new DiskStorage(join(config.dataDir, 'files')));
console.log(`Users created: ${report.usersCreated}; projects created: ${report.projectsCreated.join(', ') || 'none (already there)'}.`);
await orm.close();
