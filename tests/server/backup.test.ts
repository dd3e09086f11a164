import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { openDatabase } from '@server/db';
import { backupDatabase, restoreBackup } from '@server/backup';
import { ActivityEntry } from '@server/entities';

const dir = mkdtempSync(join(tmpdir(), 'tl-backup-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('online backup and restore', () => {
  it('when a backup runs while writes continue, then the copy passes the integrity check and restores to a working database', async () => {
    const dataDir = join(dir, 'live');
    const orm = await openDatabase(join(dataDir, 'threadline.sqlite'));
    let written = 0;
    let stop = false;
    // A writer committing small transactions throughout the backup.
    const writer = (async () => {
      while (!stop) {
        const em = orm.em.fork();
        em.persist(new ActivityEntry({ project: null, user: null, entity: 'test', entityId: written, action: 'write', changes: {} }));
        await em.flush();
        written++;
        await new Promise((r) => setImmediate(r));
      }
    })();
    while (written < 50) await new Promise((r) => setTimeout(r, 5));
    const atStart = written;
    const result = await backupDatabase(join(dataDir, 'threadline.sqlite'), null, join(dir, 'backup'));
    stop = true;
    await writer;
    await orm.close();
    expect(written).toBeGreaterThan(atStart); // writes went on (not asserting any speed)

    restoreBackup(join(dir, 'backup'), join(dir, 'restored'));
    const restored = await openDatabase(join(dir, 'restored', 'threadline.sqlite'));
    try {
      const [check] = await restored.em.getConnection().execute<{ integrity_check: string }[]>('pragma integrity_check');
      expect(check!.integrity_check).toBe('ok');
      const rows = await restored.em.fork().count(ActivityEntry, { entity: 'test' });
      expect(rows).toBeGreaterThanOrEqual(atStart);
      expect(rows).toBeLessThanOrEqual(written);
      expect(result.databaseCopy).toBe(join(dir, 'backup', 'threadline.sqlite'));
    } finally {
      await restored.close();
    }
  });

  it('when restoring over a data folder with a live WAL file, then it refuses', async () => {
    const dataDir = join(dir, 'busy');
    const orm = await openDatabase(join(dataDir, 'threadline.sqlite'));
    try {
      expect(() => restoreBackup(join(dir, 'backup'), dataDir)).toThrow(/stop the server/);
    } finally {
      await orm.close();
    }
  });
});
