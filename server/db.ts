import { mkdirSync } from 'node:fs';
import { dirname } from 'node:path';
import { MikroORM } from '@mikro-orm/sqlite';
import { ormConfig } from './mikro-orm.config';

/**
 * Open the database, set SQLite's pragmas and bring the schema up to date with the committed
 * migrations. `synchronous = NORMAL` in WAL mode: a commit survives a process crash; only an OS
 * crash or power cut may lose the last transactions (never corrupt the file).
 */
export async function openDatabase(dbPath: string): Promise<MikroORM> {
  if (dbPath !== ':memory:') mkdirSync(dirname(dbPath), { recursive: true });
  const orm = await MikroORM.init(ormConfig(dbPath));
  const conn = orm.em.getConnection();
  await conn.execute('pragma foreign_keys = on');
  if (dbPath !== ':memory:') await conn.execute('pragma journal_mode = wal');
  await conn.execute('pragma synchronous = normal');
  await conn.execute('pragma busy_timeout = 5000');
  await orm.getMigrator().up();
  return orm;
}
