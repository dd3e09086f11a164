import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { openDatabase } from '@server/db';
import { MIGRATIONS } from '@server/migrations';
import { ormConfig } from '@server/mikro-orm.config';
import { MikroORM } from '@mikro-orm/sqlite';

async function describeSchema(orm: MikroORM) {
  const conn = orm.em.getConnection();
  const tables = await conn.execute<{ name: string }[]>(`select name from sqlite_master where type = 'table' and name not like 'sqlite_%' and name != 'mikro_orm_migrations' order by name`);
  const out: Record<string, unknown> = {};
  for (const { name } of tables) {
    const cols = await conn.execute<{ name: string; type: string; notnull: number; pk: number }[]>(`pragma table_info(\`${name}\`)`);
    const idx = await conn.execute<{ name: string; unique: number }[]>(`pragma index_list(\`${name}\`)`);
    out[name] = {
      columns: cols.map((c) => `${c.name} ${c.type} ${c.notnull ? 'not null' : 'null'}${c.pk ? ' pk' : ''}`).sort(),
      indexes: idx.map((i) => `${i.name}${i.unique ? ' unique' : ''}`).sort(),
    };
  }
  return out;
}

const dir = mkdtempSync(join(tmpdir(), 'tl-migrate-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('migrations', () => {
  it('when applied to an empty database file, then every table exists, foreign keys are on and the journal is WAL', async () => {
    const orm = await openDatabase(join(dir, 'fresh.sqlite'));
    try {
      const conn = orm.em.getConnection();
      const executed = await orm.getMigrator().getExecutedMigrations();
      expect(executed.map((m) => m.name)).toEqual(MIGRATIONS.map((m) => m.name));
      const tables = (await conn.execute<{ name: string }[]>(`select name from sqlite_master where type = 'table'`)).map((t) => t.name);
      for (const t of ['users', 'projects', 'project_members', 'bores', 'pits', 'utility_lines', 'test_holes', 'photos', 'clearance_rules', 'conflicts', 'conflict_events', 'activity_entries']) {
        expect(tables).toContain(t);
      }
      expect(await conn.execute('pragma foreign_keys')).toEqual([{ foreign_keys: 1 }]);
      expect(await conn.execute('pragma journal_mode')).toEqual([{ journal_mode: 'wal' }]);
    } finally {
      await orm.close(true);
    }
  });

  it('when the migrated schema is compared with one built from the entities, then columns and indexes match', async () => {
    // MikroORM's SQLite diff reports false changes for enum check constraints, so compare the
    // two schemas ourselves: every table's columns (name, type, null, pk) and index names.
    const migrated = await openDatabase(':memory:');
    const built = await MikroORM.init(ormConfig(':memory:'));
    try {
      await built.getSchemaGenerator().createSchema();
      expect(await describeSchema(migrated)).toEqual(await describeSchema(built));
    } finally {
      await migrated.close(true);
      await built.close(true);
    }
  });

  it('when opened a second time, then no migration runs again', async () => {
    const path = join(dir, 'twice.sqlite');
    await (await openDatabase(path)).close(true);
    const orm = await openDatabase(path);
    try {
      expect(await orm.getMigrator().getPendingMigrations()).toEqual([]);
    } finally {
      await orm.close(true);
    }
  });
});
