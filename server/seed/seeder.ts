import type { EntityManager } from '@mikro-orm/sqlite';
import { DEMO_SCENARIOS, DEMO_USERS } from '../../seeds/demo';
import type { DemoScenario } from '../../seeds/demo/types';
import { makeDemoPhoto } from '../../seeds/photos';
import { Bore } from '../modules/bores/bore.entity';
import { Pit } from '../modules/bores/pit.entity';
import { Photo } from '../modules/holes/photo.entity';
import { storeJpeg } from '../modules/holes/photo-files';
import { ActivityEntry } from '../modules/activity/activity-entry.entity';
import { diff } from '../modules/activity/activity.service';
import { presentHole } from '../modules/holes/hole.presenter';
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
    demoHistory(em, project, hole, s, users);
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

/**
 * The demo's holes carry the history their status implies, as the routes would have written it:
 * logged by their crew when dug, tied in by the project's surveyor a day later, accepted by its
 * design engineer two days later. Without it the Activity page is empty and the test-hole sheets
 * of reviewed holes name no reviewer.
 */
function demoHistory(em: EntityManager, project: Project, hole: TestHole, s: DemoScenario, users: Map<string, User>): void {
  const member = (role: string) => s.members.map((e) => users.get(e)).find((u) => u?.role === role) ?? null;
  const at = (hole.dugAt ?? new Date()).getTime();
  const entry = (user: User | null, action: string, before: object | null, after: object | null, hours: number) => {
    const e = new ActivityEntry({ project, user, entity: 'hole', entityId: hole.id, action, changes: diff(before, after) });
    e.createdAt = new Date(at + hours * 3_600_000);
    em.persist(e);
  };
  const now = presentHole(hole, 0);
  entry(hole.createdBy, 'create', null, { ...now, status: hole.status === 'planned' ? 'planned' : 'dug', surveyedTopElevation: null, surveyedGroundElevation: null, surveyedEasting: null, surveyedNorthing: null }, 0.25);
  const surveyed = hole.surveyedTopElevation != null || hole.surveyedGroundElevation != null;
  if (surveyed) {
    const survey = { surveyedEasting: hole.surveyedEasting ?? null, surveyedNorthing: hole.surveyedNorthing ?? null, surveyedTopElevation: hole.surveyedTopElevation ?? null, surveyedGroundElevation: hole.surveyedGroundElevation ?? null };
    entry(member('surveyor'), 'survey', { status: 'dug', surveyedEasting: null, surveyedNorthing: null, surveyedTopElevation: null, surveyedGroundElevation: null }, { status: 'surveyed', ...survey }, 24);
  }
  if (hole.status === 'reviewed') entry(member('designer'), 'accept', { status: surveyed ? 'surveyed' : 'dug' }, { status: 'reviewed' }, 48);
}
