import { cpSync, existsSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';
import sqlite3 from 'sqlite3';
import { MikroORM } from '@mikro-orm/sqlite';
import { ormConfig } from './mikro-orm.config';

/** The parts of node-sqlite3's backup object we use (its type declarations omit it). */
interface SqliteBackup {
  step(pages: number, callback: (err: Error | null) => void): void;
  finish(callback?: (err: Error | null) => void): void;
  readonly completed: boolean;
  readonly failed: boolean;
}

/** Copy a live database with SQLite's online backup API, a batch of pages at a time. */
async function onlineCopy(source: string, target: string): Promise<void> {
  const db = await new Promise<sqlite3.Database>((resolve, reject) => {
    const handle = new sqlite3.Database(source, sqlite3.OPEN_READONLY, (err) => (err ? reject(err) : resolve(handle)));
  });
  try {
    const backup = (db as unknown as { backup(file: string): SqliteBackup }).backup(target);
    // Small steps let writers go on between them; SQLite restarts the copy if a write lands mid-way.
    while (!backup.completed && !backup.failed) {
      await new Promise<void>((resolve, reject) => backup.step(256, (err) => (err ? reject(err) : resolve())));
    }
    await new Promise<void>((resolve) => backup.finish(() => resolve()));
    if (backup.failed) throw new Error('the SQLite backup failed');
  } finally {
    await new Promise<void>((resolve) => db.close(() => resolve()));
  }
}

export interface BackupResult {
  databaseCopy: string;
  filesCopied: boolean;
}

/**
 * Online backup: a consistent copy of the database made with SQLite's backup API while other
 * connections keep writing (WAL mode), checked with `integrity_check`, plus the files.
 */
export async function backupDatabase(databasePath: string, filesDir: string | null, targetDir: string): Promise<BackupResult> {
  mkdirSync(targetDir, { recursive: true });
  const databaseCopy = join(targetDir, 'threadline.sqlite');
  if (existsSync(databaseCopy)) throw new Error(`${databaseCopy} already exists`);
  await onlineCopy(databasePath, databaseCopy);
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
