import type { EntityManager } from '@mikro-orm/sqlite';
import { DEMO_SCENARIOS, DEMO_USERS } from '../../seeds/demo';
import type { DemoScenario } from '../../seeds/demo/types';
import { makeDemoPhoto } from '../../seeds/photos';
import { Bore } from '../modules/bores/bore.entity';
import { Pit } from '../modules/bores/pit.entity';
import { Photo } from '../modules/holes/photo.entity';
import { storeJpeg } from '../modules/holes/photo-files';
import { TestHole } from '../modules/holes/test-hole.entity';
import { UtilityLine } from '../modules/lines/utility-line.entity';
import { ProjectMember } from '../modules/projects/project-member.entity';
import { Project } from '../modules/projects/project.entity';
import { ClearanceRule } from '../modules/rules/clearance-rule.entity';
import { recomputeConflicts } from '../modules/clearances/clearance.service';
import { hashPassword } from '../modules/users/password';
import { User } from '../modules/users/user.entity';
import type { FileStorage } from '../storage/storage';

export interface SeedReport {
  usersCreated: number;
  projectsCreated: string[];
}

/**
 * Load the invented demo scenario. Idempotent: users are matched by e-mail and projects by
 * name, and a project that exists is left alone, so running it again changes nothing.
 */
export async function seedDemo(rootEm: EntityManager, storage: FileStorage, options: { photos?: boolean } = {}): Promise<SeedReport> {
  const em = rootEm.fork();
  const report: SeedReport = { usersCreated: 0, projectsCreated: [] };
  const users = new Map<string, User>();
  for (const u of DEMO_USERS) {
    let user = await em.findOne(User, { email: u.email });
    if (!user) {
      user = new User(u.email, u.name, u.role, await hashPassword(u.password));
      user.active = u.active ?? true;
      em.persist(user);
      report.usersCreated++;
    }
    users.set(u.email, user);
  }
  await em.flush();

  for (const scenario of DEMO_SCENARIOS) {
    if ((await em.count(Project, { name: scenario.project.name })) > 0) continue;
    await em.transactional(async (tem) => {
      const project = await seedScenario(tem, storage, scenario, users, options.photos ?? true);
      await recomputeConflicts(tem, project, null);
    });
    report.projectsCreated.push(scenario.project.name);
  }
  return report;
}

async function seedScenario(em: EntityManager, storage: FileStorage, s: DemoScenario, users: Map<string, User>, withPhotos: boolean): Promise<Project> {
  const { settings, description, ...projectFields } = s.project;
  const project = new Project({ ...projectFields, settings: settings! });
  project.description = description ?? null;
  em.persist(project);
  for (const email of s.members) {
    const user = users.get(email);
    if (user) em.persist(new ProjectMember(project, user));
  }
  for (const r of s.rules) {
    const rule = new ClearanceRule(project, r.kind, r.vertical, r.horizontal);
    rule.source = r.source ?? null;
    em.persist(rule);
  }
  const bores = new Map<string, Bore>();
  for (const { key, pits, ...b } of s.bores) {
    const bore = Object.assign(new Bore(project, b), b);
    em.persist(bore);
    bores.set(key, bore);
    for (const p of pits) {
      const pit = new Pit(bore, p.kind, p.footprint, p.bottomElevation);
      pit.notes = p.notes ?? null;
      em.persist(pit);
    }
  }
  const lines = new Map<string, UtilityLine>();
  for (const { key, ...l } of s.lines) {
    const line = Object.assign(new UtilityLine(project, l.label, l.owner, l.kind, l.path), l, { contactEmail: l.contactEmail || null });
    em.persist(line);
    lines.set(key, line);
  }
  await em.flush();

  let photoSeed = 1;
  for (const h of s.holes) {
    const line = lines.get(h.lineKey);
    if (!line) throw new Error(`demo hole ${h.number}: unknown line ${h.lineKey}`);
    const { lineKey: _l, boreKey, clientId, status, createdByEmail, photos, dugAt, ...fields } = h;
    const hole = new TestHole(project, line, clientId, h.number, h.easting ?? 0, h.northing ?? 0);
    Object.assign(hole, fields);
    hole.status = status;
    hole.dugAt = dugAt ? new Date(dugAt) : null;
    hole.approximate = h.positionSource === 'gps';
    hole.bore = boreKey ? (bores.get(boreKey) ?? null) : null;
    hole.createdBy = users.get(createdByEmail) ?? null;
    em.persist(hole);
    await em.flush();
    if (withPhotos) {
      for (const p of photos ?? []) {
        const jpeg = await makeDemoPhoto({ holeNumber: h.number, lineKind: line.kind, caption: p.caption, kind: p.kind, seed: photoSeed++ });
        const stored = await storeJpeg(storage, project.id, jpeg);
        const photo = new Photo(hole, stored);
        photo.caption = p.caption;
        photo.takenAt = hole.dugAt;
        photo.uploadedBy = hole.createdBy;
        em.persist(photo);
      }
    }
  }
  await em.flush();
  return project;
}
