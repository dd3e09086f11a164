/** Restore a backup into DATA_DIR (npm run restore -- <backup folder>). Stop the server first. */
import { resolve } from 'node:path';
import { restoreBackup } from '../server/backup';
import { loadConfig } from '../server/config';

const from = process.argv[2];
if (!from) {
  console.error('Usage: npm run restore -- <backup folder>');
  process.exit(1);
}
const config = loadConfig();
restoreBackup(resolve(from), config.dataDir);
console.log(`Restored ${resolve(from)} into ${config.dataDir}. Start the server: npm run serve`);
