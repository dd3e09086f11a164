import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Jimp } from 'jimp';
import type { MikroORM } from '@mikro-orm/sqlite';
import { openDatabase } from '@server/db';
import { seedDemo } from '@server/seed/seeder';
import { MemoryStorage } from '@server/storage/storage';
import { storeJpeg, THUMBNAIL_SIZE } from '@server/modules/holes/photo-files';
import { DEMO_SCENARIOS, DEMO_USERS } from '../../seeds/demo';
import { makeDemoPhoto } from '../../seeds/photos';
import { ActivityEntry, TestHole } from '@server/entities';
import { tableCounts } from './helpers';

let orm: MikroORM;
beforeAll(async () => {
  orm = await openDatabase(':memory:');
});
afterAll(() => orm.close(true));

describe('demo seeder', () => {
  it('when run on an empty database, then every demo user, project, line and hole is there', async () => {
    const report = await seedDemo(orm.em, new MemoryStorage(), { photos: false });
    expect(report.usersCreated).toBe(DEMO_USERS.length);
    expect(report.projectsCreated).toEqual(DEMO_SCENARIOS.map((s) => s.project.name));
    const counts = await tableCounts(orm);
    expect(counts.users).toBe(DEMO_USERS.length);
    expect(counts.projects).toBe(DEMO_SCENARIOS.length);
    expect(counts.utility_lines).toBe(DEMO_SCENARIOS.reduce((n, s) => n + s.lines.length, 0));
    expect(counts.test_holes).toBe(DEMO_SCENARIOS.reduce((n, s) => n + s.holes.length, 0));
    expect(counts.pits).toBe(DEMO_SCENARIOS.reduce((n, s) => n + s.bores.reduce((m, b) => m + b.pits.length, 0), 0));
  });

  it('then each demo hole has the history its status implies: logged by its crew, tied in, accepted by a design engineer', async () => {
    const em = orm.em.fork();
    const holes = await em.find(TestHole, {}, { populate: ['createdBy'] });
    const entries = await em.find(ActivityEntry, { entity: 'hole' }, { populate: ['user'] });
    const of = (id: number, action: string) => entries.filter((e) => e.entityId === id && e.action === action);
    for (const h of holes) {
      expect(of(h.id, 'create').map((e) => e.user?.id ?? null)).toEqual([h.createdBy?.id ?? null]);
      expect(of(h.id, 'accept').map((e) => e.user?.role)).toEqual(h.status === 'reviewed' ? ['designer'] : []);
      expect(of(h.id, 'survey').map((e) => e.user?.role)).toEqual(h.surveyedTopElevation != null || h.surveyedGroundElevation != null ? ['surveyor'] : []);
    }
    expect(holes.some((h) => h.status === 'reviewed')).toBe(true);
  });

  it('when run a second time, then nothing changes (idempotent)', async () => {
    const before = await tableCounts(orm);
    const report = await seedDemo(orm.em, new MemoryStorage(), { photos: false });
    expect(report).toEqual({ usersCreated: 0, projectsCreated: [] });
    expect(await tableCounts(orm)).toEqual(before);
  });

  it('when a demo photo is stored, then its thumbnail fits the thumbnail size and keeps the aspect', async () => {
    const storage = new MemoryStorage();
    const jpeg = await makeDemoPhoto({ holeNumber: 'TH-01', lineKind: 'water', caption: 'exposed', kind: 'exposed', seed: 1 });
    const stored = await storeJpeg(storage, 1, jpeg);
    const thumb = await Jimp.read((await storage.get(stored.thumbnailKey))!);
    expect(Math.max(thumb.bitmap.width, thumb.bitmap.height)).toBe(THUMBNAIL_SIZE);
    expect(thumb.bitmap.width / thumb.bitmap.height).toBeCloseTo(stored.width / stored.height, 1);
    expect(stored.fileKey).toMatch(/^photos\/1\/[0-9a-f-]{36}\.jpg$/);
  });
});
