/**
 * Online backup (npm run backup [-- <folder>]): a consistent copy of the database made with
 * SQLite's `VACUUM INTO` while the server keeps running, checked with `integrity_check`,
 * plus a copy of the uploaded files. Restore: see README "Where data lives, and backups".
 */
import { cpSync, existsSync, mkdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { MikroORM } from '@mikro-orm/sqlite';
import { loadConfig } from '../server/config';
import { ormConfig } from '../server/mikro-orm.config';

const config = loadConfig();
const stamp = new Date().toISOString().replace(/[:.]/g, '-');
const target = resolve(process.argv[2] ?? join('backups', stamp));
mkdirSync(target, { recursive: true });
const dbCopy = join(target, 'threadline.sqlite');
if (existsSync(dbCopy)) throw new Error(`${dbCopy} already exists`);

const source = await MikroORM.init(ormConfig(config.databasePath));
await source.em.getConnection().execute('pragma busy_timeout = 5000');
await source.em.getConnection().execute(`vacuum into '${dbCopy.replace(/'/g, "''")}'`);
await source.close();

const copy = await MikroORM.init(ormConfig(dbCopy));
const [check] = await copy.em.getConnection().execute<{ integrity_check: string }[]>('pragma integrity_check');
await copy.close();
if (check?.integrity_check !== 'ok') throw new Error(`integrity check of the copy failed: ${JSON.stringify(check)}`);

const files = join(config.dataDir, 'files');
if (existsSync(files)) cpSync(files, join(target, 'files'), { recursive: true });
console.log(`Backup written to ${target} (integrity check: ok).`);
