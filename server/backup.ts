import { cpSync, existsSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { MikroORM } from '@mikro-orm/sqlite';
import { ormConfig } from './mikro-orm.config';

export interface BackupResult {
  databaseCopy: string;
  filesCopied: boolean;
}

/**
 * Online backup: a consistent copy of the database made with SQLite's `VACUUM INTO` while
 * other connections keep writing (WAL mode), checked with `integrity_check`, plus the files.
 */
export async function backupDatabase(databasePath: string, filesDir: string | null, targetDir: string): Promise<BackupResult> {
  mkdirSync(targetDir, { recursive: true });
  const databaseCopy = join(targetDir, 'threadline.sqlite');
  if (existsSync(databaseCopy)) throw new Error(`${databaseCopy} already exists`);
  const source = await MikroORM.init(ormConfig(databasePath));
  try {
    await source.em.getConnection().execute('pragma busy_timeout = 5000');
    await source.em.getConnection().execute(`vacuum into '${databaseCopy.replace(/'/g, "''")}'`);
  } finally {
    await source.close();
  }
  const copy = await MikroORM.init(ormConfig(databaseCopy));
  try {
    const [check] = await copy.em.getConnection().execute<{ integrity_check: string }[]>('pragma integrity_check');
    if (check?.integrity_check !== 'ok') throw new Error(`integrity check of the copy failed: ${JSON.stringify(check)}`);
  } finally {
    await copy.close();
  }
  const filesCopied = filesDir !== null && existsSync(filesDir);
  if (filesCopied) cpSync(filesDir, join(targetDir, 'files'), { recursive: true });
  return { databaseCopy, filesCopied };
}

/**
 * Restore a backup into a data folder (the server must be stopped): the database file without
 * stale WAL files, and the files folder. Migrations bring an older copy up to date at start.
 */
export function restoreBackup(backupDir: string, dataDir: string): void {
  mkdirSync(dataDir, { recursive: true });
  const target = join(dataDir, 'threadline.sqlite');
  for (const suffix of ['-wal', '-shm']) {
    if (existsSync(target + suffix)) throw new Error(`${target + suffix} exists: stop the server and remove it first`);
  }
  cpSync(join(backupDir, 'threadline.sqlite'), target);
  if (existsSync(join(backupDir, 'files'))) cpSync(join(backupDir, 'files'), join(dataDir, 'files'), { recursive: true });
}
