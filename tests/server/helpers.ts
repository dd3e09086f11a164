import { randomUUID } from 'node:crypto';
import bcrypt from 'bcryptjs';
import type { MikroORM } from '@mikro-orm/sqlite';
import type { Express } from 'express';
import { ROLES, type Role } from '@shared/domain';
import { defaultProjectSettings } from '@shared/defaults';
import { createApp } from '@server/app';
import { testConfig, type AppConfig } from '@server/config';
import { openDatabase } from '@server/db';
import { signSession } from '@server/http/session';
import { Bore, ClearanceRule, Conflict, Photo, Pit, Project, ProjectMember, TestHole, User, UtilityLine } from '@server/entities';
import { MemoryStorage } from '@server/storage/storage';
import { recomputeConflicts } from '@server/modules/clearances/clearance.service';

export const TEST_PASSWORD = 'correct horse battery';
const TEST_HASH = bcrypt.hashSync(TEST_PASSWORD, 4);

export interface TestContext {
  app: Express;
  orm: MikroORM;
  config: AppConfig;
  storage: MemoryStorage;
  users: Record<Role, User>;
  /** A session cookie header for a user of the role. */
  cookie(role: Role): string;
  close(): Promise<void>;
}

/** A fresh app on an in-memory database (migrations applied), with one user per role. */
export async function makeTestApp(overrides: Partial<AppConfig> = {}): Promise<TestContext> {
  const config = testConfig(overrides);
  const orm = await openDatabase(':memory:');
  const storage = new MemoryStorage();
  const app = createApp({ orm, config, storage });
  const em = orm.em.fork();
  const users = {} as Record<Role, User>;
  for (const role of ROLES) {
    users[role] = new User(`${role}@test.example.com`, `Test ${role}`, role, TEST_HASH);
    em.persist(users[role]);
  }
  await em.flush();
  return {
    app,
    orm,
    config,
    storage,
    users,
    cookie: (role) => `tl_session=${signSession(config, users[role].id)}`,
    close: () => orm.close(true),
  };
}

export interface Fixtures {
  project: Project;
  bore: Bore;
  pit: Pit;
  line: UtilityLine;
  hole: TestHole;
  rule: ClearanceRule;
  photo: Photo;
  conflict: Conflict;
}

/**
 * A small project in US survey feet with every role as a member: one bore with a pit, one
 * water line crossing it, a test hole logged by the field user, a rule and a photo.
 */
export async function makeFixtures(ctx: TestContext, name = `Fixture ${randomUUID().slice(0, 8)}`, members: Role[] = [...ROLES]): Promise<Fixtures> {
  const em = ctx.orm.em.fork();
  const project = new Project({
    name,
    client: 'Test client',
    crsCode: 'EPSG:2278',
    crsProj4: '+proj=lcc +lat_0=27.8333333333333 +lon_0=-99 +lat_1=30.2833333333333 +lat_2=28.3833333333333 +x_0=600000 +y_0=4000000 +ellps=GRS80 +units=us-ft +no_defs',
    unit: 'usft',
    verticalDatum: 'NAVD 88',
    stationStyle: '100',
    settings: defaultProjectSettings('usft'),
  });
  em.persist(project);
  for (const role of members) em.persist(new ProjectMember(project, em.getReference(User, ctx.users[role].id)));
  const bore = new Bore(project, {
    name: 'Bore 1',
    method: 'auger_bore',
    alignment: [
      [3000000, 13800000],
      [3000250, 13800000],
    ],
    beginStation: 1000,
    profile: [
      { station: 1000, elevation: 85 },
      { station: 1250, elevation: 84 },
    ],
    casingOd: 3,
  });
  em.persist(bore);
  const pit = new Pit(bore, 'launch', [
    [2999980, 13799990],
    [3000000, 13799990],
    [3000000, 13800010],
    [2999980, 13800010],
  ], 80);
  em.persist(pit);
  const line = new UtilityLine(project, 'W-1', 'Test water district', 'water', [
    [3000100, 13799900],
    [3000100, 13800100],
  ]);
  line.diameter = 1;
  em.persist(line);
  const hole = new TestHole(project, line, randomUUID(), 'TH-1', 3000100, 13800010);
  hole.status = 'dug';
  hole.groundElevation = 100;
  hole.depthToTop = 14; // top 86, bottom 85: through the casing (centreline ≈ 84.6, radius 1.5) → an overlap conflict
  hole.createdBy = em.getReference(User, ctx.users.field.id);
  em.persist(hole);
  const rule = new ClearanceRule(project, 'water', 1.5, 10);
  em.persist(rule);
  await em.flush();
  const photo = new Photo(hole, { fileKey: `photos/${project.id}/fixture.jpg`, thumbnailKey: `photos/${project.id}/fixture.thumb.jpg`, mimeType: 'image/jpeg', width: 4, height: 4, byteSize: 3 });
  em.persist(photo);
  await em.flush();
  await ctx.storage.put(photo.fileKey, Buffer.from([0xff, 0xd8, 0xff]), 'image/jpeg');
  await ctx.storage.put(photo.thumbnailKey, Buffer.from([0xff, 0xd8, 0xff]), 'image/jpeg');
  await recomputeConflicts(em, project, null);
  await em.flush();
  const conflict = await em.findOneOrFail(Conflict, { project });
  return { project, bore, pit, line, hole, rule, photo, conflict };
}

/** Row counts of every table, to prove a refused request wrote nothing. */
export async function tableCounts(orm: MikroORM): Promise<Record<string, number>> {
  const conn = orm.em.getConnection();
  const tables = await conn.execute<{ name: string }[]>(`select name from sqlite_master where type = 'table' and name not like 'sqlite_%' and name != 'mikro_orm_migrations'`);
  const counts: Record<string, number> = {};
  for (const { name } of tables) {
    const [row] = await conn.execute<{ n: number }[]>(`select count(*) as n from \`${name}\``);
    counts[name] = Number(row!.n);
  }
  return counts;
}

/** A route path with the fixture's ids put in (ids of records a fixture lacks answer 404). */
export function fillRoute(path: string, f: Fixtures, userId: number): string {
  return path
    .replace(':projectId', String(f.project.id))
    .replace(':boreId', String(f.bore.id))
    .replace(':pitId', String(f.pit.id))
    .replace(':lineId', String(f.line.id))
    .replace(':holeId', String(f.hole.id))
    .replace(':ruleId', String(f.rule.id))
    .replace(':photoId', String(f.photo.id))
    .replace(':conflictId', String(f.conflict.id))
    // No stake mark, captured message or outbox message exists in a fresh fixture: allowed roles get 404.
    .replace(':markId', '999999')
    .replace(':capturedId', '999999')
    .replace(':outboxId', '999999')
    // Zip jobs live in memory per person: a made-up id answers 404 to allowed roles.
    .replace(':jobId', 'no-such-job')
    .replace(':userId', String(userId));
}
