/**
 * Online backup (npm run backup [-- <folder>]) while the server keeps running; see README
 * "Where data lives, and backups". Restore: npm run restore -- <backup folder>.
 */
import { join, resolve } from 'node:path';
import { backupDatabase } from '../server/backup';
import { loadConfig } from '../server/config';

const config = loadConfig();
const stamp = new Date().toISOString().replace(/[:.]/g, '-');
const target = resolve(process.argv[2] ?? join('backups', stamp));
const result = await backupDatabase(config.databasePath, join(config.dataDir, 'files'), target);
console.log(`Backup written to ${target} (integrity check: ok${result.filesCopied ? ', files copied' : ''}).`);
