import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { ConflictDto, ConflictEventDto, ConflictRowDto } from '@shared/api';
import { randomUUID } from 'node:crypto';
import { Conflict, OutboxMessage, Project, TestHole, UtilityLine } from '@server/entities';
import { recomputeConflicts } from '@server/modules/clearances/clearance.service';
import { loadConflictRegister } from '@server/modules/conflicts/conflict-rows';
import { deliverDue } from '@server/modules/mail/outbox';
import { loopbackSender } from '@server/modules/mail/transport';
import { makeFixtures, makeTestApp, tableCounts, type Fixtures, type TestContext } from './helpers';
import { startTestSmtp, type TestSmtp } from './mail-support';

let ctx: TestContext;
let smtp: TestSmtp;
beforeAll(async () => {
  ctx = await makeTestApp();
  smtp = await startTestSmtp();
});
afterAll(async () => {
  await smtp.close();
  await ctx.close();
});

type Role = Parameters<TestContext['cookie']>[0];
const base = (f: Fixtures) => `/api/projects/${f.project.id}/conflicts`;
const get = (url: string, role: Role = 'viewer') => request(ctx.app).get(url).set('Cookie', ctx.cookie(role));
const patch = (url: string, body: object, role: Role) => request(ctx.app).patch(url).set('Cookie', ctx.cookie(role)).send(body);
const post = (url: string, body: object, role: Role) => request(ctx.app).post(url).set('Cookie', ctx.cookie(role)).send(body);

async function current(f: Fixtures): Promise<ConflictRowDto> {
  const res = await get(`${base(f)}/${f.conflict.id}`);
  expect(res.status).toBe(200);
  return res.body as ConflictRowDto;
}

async function move(f: Fixtures, status: string, reason: string, role: Role) {
  const c = await current(f);
  return patch(`${base(f)}/${f.conflict.id}/status`, { status, reason, version: c.version }, role);
}

describe('the register row of the fixture crossing (SPEC §8 columns)', () => {
  let f: Fixtures;
  beforeAll(async () => {
    f = await makeFixtures(ctx);
  });

  it('when the list is read, then each row carries the line, bore, holes and hand-worked figures', async () => {
    // Worked by hand (tests/server/clearances.test.ts): the line W-1 crosses Bore 1 square at
    // E 3,000,100 → station 10+00 + 100 = 11+00, offset 0; TH-1 gives top 86.00 (NAVD 88);
    // clearance 85.00 − 86.10 = −1.10 US ft against the water rule of 1.50 → overlap.
    const res = await get(base(f));
    expect(res.status).toBe(200);
    const rows = res.body as ConflictRowDto[];
    expect(rows).toHaveLength(1);
    const row = rows[0]!;
    expect(row.number).toBe(`C-${f.conflict.id}`);
    expect(row.bore).toEqual({ id: f.bore.id, name: 'Bore 1' });
    expect(row.line).toMatchObject({ label: 'W-1', owner: 'Test water district', kind: 'water', diameter: 1, qualityLevel: 'D', contactEmail: null });
    expect(row.relation).toBe('crossing');
    expect(row.station).toBeCloseTo(1100, 6);
    expect(row.stationFrom).toBeCloseTo(1100, 6);
    expect(row.stationTo).toBeCloseTo(1100, 6);
    expect(row.offset).toBeCloseTo(0, 6);
    expect(row.lineTop).toBeCloseTo(86, 6);
    expect(row.clearance).toBeCloseTo(-1.1, 6);
    expect(row.required).toBe(1.5);
    expect(row.margin).toBeCloseTo(-2.6, 6);
    expect(row.governing).toBe('vertical');
    expect(row.computedStatus).toBe('overlap');
    expect(row.status).toBe('open');
    expect(row.holes).toEqual([{ id: f.hole.id, number: 'TH-1', status: 'dug', verifying: true }]);
    expect(row.pits).toEqual([]); // the launch pit's footprint ends 100 ft west of the line, beyond the 10 ft horizontal rule
    expect(row.closedAt).toBeNull();
    expect(row.ownerNotifiedAt).toBeNull();
  });

  it('when the list is filtered, then only matching rows come back, and a bad filter names the parameter', async () => {
    expect(((await get(`${base(f)}?status=open,in_review`)).body as unknown[]).length).toBe(1);
    expect(((await get(`${base(f)}?status=void`)).body as unknown[]).length).toBe(0);
    expect(((await get(`${base(f)}?kind=gas`)).body as unknown[]).length).toBe(0);
    expect(((await get(`${base(f)}?kind=water&computedStatus=overlap&assignee=none&boreId=${f.bore.id}`)).body as unknown[]).length).toBe(1);
    expect(((await get(`${base(f)}?q=w-1`)).body as unknown[]).length).toBe(1);
    const bad = await get(`${base(f)}?status=open,bogus`);
    expect(bad.status).toBe(400);
    expect(bad.body.errors[0].path).toBe('query.status.1');
  });

  it('when a conflict of another project is asked for through this one, then 404', async () => {
    const other = await makeFixtures(ctx, 'Other register', ['admin']);
    expect((await get(`${base(f)}/${other.conflict.id}`, 'admin')).status).toBe(404);
    expect((await get(`${base(f)}/999999`, 'admin')).status).toBe(404);
  });
});

describe('status workflow: open → in review → resolved, each move with a reason', () => {
  let f: Fixtures;
  beforeAll(async () => {
    f = await makeFixtures(ctx);
  });

  it('when a move has no reason, then 400 names the field and nothing is written', async () => {
    const before = await tableCounts(ctx.orm);
    const c = await current(f);
    const res = await patch(`${base(f)}/${f.conflict.id}/status`, { status: 'in_review', reason: '  ', version: c.version }, 'designer');
    expect(res.status).toBe(400);
    expect(res.body.errors.map((e: { path: string }) => e.path)).toEqual(['reason']);
    expect(await tableCounts(ctx.orm)).toEqual(before);
  });

  it('when reviewers or crews try to move it, then 403', async () => {
    for (const role of ['viewer', 'field', 'surveyor'] as const) expect((await move(f, 'in_review', 'looking', role)).status).toBe(403);
  });

  it('when the designer moves it to in review, then the status is a person’s and history has the reason', async () => {
    const res = await move(f, 'in_review', 'Checking the profile against TH-1', 'designer');
    expect(res.status).toBe(200);
    expect((res.body as ConflictDto).status).toBe('in_review');
    expect((res.body as ConflictDto).statusSetByPerson).toBe(true);
  });

  it('when the designer tries to waive it, then 403: a waiver is recorded by the project manager', async () => {
    const res = await move(f, 'waived', 'Owner agreed', 'designer');
    expect(res.status).toBe(403);
    expect(res.body.detail).toMatch(/project manager/);
  });

  it('when the manager resolves it by redesign, then it is closed with the reason as its resolution', async () => {
    const res = await move(f, 'resolved_redesign', 'Bore lowered 3 ft at 11+00 (profile rev. B)', 'manager');
    expect(res.status).toBe(200);
    const row = await current(f);
    expect(row.status).toBe('resolved_redesign');
    expect(row.closedAt).not.toBeNull();
    expect(row.resolutionNote).toBe('Bore lowered 3 ft at 11+00 (profile rev. B)');
  });

  it('when a closed conflict is moved to another closing status, then 409: it must be reopened first', async () => {
    const res = await move(f, 'void', 'Not a conflict', 'manager');
    expect(res.status).toBe(409);
    expect(res.body.code).toBe('invalid_move');
  });

  it('when the clearance check runs again, then the person’s status stands', async () => {
    const em = ctx.orm.em.fork();
    await recomputeConflicts(em, await em.findOneOrFail('Project', f.project.id), null);
    await em.flush();
    expect((await current(f)).status).toBe('resolved_redesign');
  });

  it('when it is reopened with a reason, then the closed date is cleared; moving to the same status is refused', async () => {
    const res = await move(f, 'open', 'Revised profile not issued yet', 'designer');
    expect(res.status).toBe(200);
    expect((await current(f)).closedAt).toBeNull();
    expect((await move(f, 'open', 'again', 'designer')).status).toBe(409);
  });

  it('when someone moves it from a stale copy, then 409 with the record as it stands', async () => {
    const res = await patch(`${base(f)}/${f.conflict.id}/status`, { status: 'void', reason: 'stale', version: 1 }, 'manager');
    expect(res.status).toBe(409);
    expect(res.body.current.status).toBe('open');
  });

  it('then the history lists found and every move, in order, with who and why', async () => {
    const events = (await get(`${base(f)}/${f.conflict.id}/history`)).body as ConflictEventDto[];
    expect(events.map((e) => e.kind)).toEqual(['found', 'status', 'status', 'status']);
    // The hand-worked fixture crossing (see the register test above), with its unit.
    expect(events[0]!.note).toBe('Computed status: Overlap. Clearance -1.10 US ft against 1.50 US ft required (margin -2.60 US ft).');
    expect(events.slice(1).map((e) => e.data)).toEqual([
      { from: 'open', to: 'in_review' },
      { from: 'in_review', to: 'resolved_redesign' },
      { from: 'resolved_redesign', to: 'open' },
    ]);
    expect(events.slice(1).map((e) => e.byName)).toEqual(['Test designer', 'Test manager', 'Test designer']);
    expect(events[2]!.note).toBe('Bore lowered 3 ft at 11+00 (profile rev. B)');
  });
});

describe('comments, working fields and history', () => {
  let f: Fixtures;
  beforeAll(async () => {
    f = await makeFixtures(ctx);
  });

  it('when a field crew comments, then it joins the history; reviewers cannot comment; empty text is refused', async () => {
    const res = await post(`${base(f)}/${f.conflict.id}/comments`, { text: 'Line looked deeper on the east side of TH-1.' }, 'field');
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ kind: 'comment', note: 'Line looked deeper on the east side of TH-1.', byName: 'Test field' });
    expect((await post(`${base(f)}/${f.conflict.id}/comments`, { text: 'me too' }, 'viewer')).status).toBe(403);
    const empty = await post(`${base(f)}/${f.conflict.id}/comments`, { text: '' }, 'designer');
    expect(empty.status).toBe(400);
    expect(empty.body.errors[0].path).toBe('text');
  });

  it('when the manager records the responsible party and owner dates, then they show on the row and in history', async () => {
    const c = await current(f);
    const res = await patch(
      `${base(f)}/${f.conflict.id}`,
      { responsibleParty: 'Test water district', ownerNotifiedAt: '2027-03-01', answerDueAt: '2027-03-15', notes: 'Called their engineer.', version: c.version },
      'manager',
    );
    expect(res.status).toBe(200);
    const row = await current(f);
    expect(row.responsibleParty).toBe('Test water district');
    expect(row.ownerNotifiedAt).toBe('2027-03-01T00:00:00.000Z');
    expect(row.answerDueAt).toBe('2027-03-15T00:00:00.000Z');
    expect(row.notes).toBe('Called their engineer.');
    const bad = await patch(`${base(f)}/${f.conflict.id}`, { answerDueAt: '15/03/2027', version: row.version }, 'manager');
    expect(bad.status).toBe(400);
    expect(bad.body.errors[0].path).toBe('answerDueAt');
    expect((await patch(`${base(f)}/${f.conflict.id}`, { notes: 'x', version: row.version }, 'surveyor')).status).toBe(403);
    const events = (await get(`${base(f)}/${f.conflict.id}/history`)).body as ConflictEventDto[];
    expect(events.map((e) => e.kind)).toEqual(['found', 'comment', 'details']);
    expect(Object.keys((events[2]!.data as { changes: object }).changes).sort()).toEqual(['answerDueAt', 'notes', 'ownerNotifiedAt', 'responsibleParty']);
  });
});

describe('assignment tells the assignee by mail', () => {
  let f: Fixtures;
  beforeAll(async () => {
    f = await makeFixtures(ctx);
  });

  it('when the designer tries to assign, then 403; a non-member assignee gives 400 on assigneeId', async () => {
    const c = await current(f);
    expect((await patch(`${base(f)}/${f.conflict.id}/assignment`, { assigneeId: ctx.users.designer.id, dueDate: null, version: c.version }, 'designer')).status).toBe(403);
    // The surveyor leaves the project: no longer a possible assignee.
    const em = ctx.orm.em.fork();
    await em.nativeDelete('ProjectMember', { project: f.project.id, user: ctx.users.surveyor.id });
    const res = await patch(`${base(f)}/${f.conflict.id}/assignment`, { assigneeId: ctx.users.surveyor.id, dueDate: null, version: c.version }, 'manager');
    expect(res.status).toBe(400);
    expect(res.body.errors[0].path).toBe('assigneeId');
  });

  it('when the manager assigns the designer with a due date, then a message is queued and the SMTP server receives it', async () => {
    const c = await current(f);
    const res = await patch(`${base(f)}/${f.conflict.id}/assignment`, { assigneeId: ctx.users.designer.id, dueDate: '2027-04-01', version: c.version }, 'manager');
    expect(res.status).toBe(200);
    const row = await current(f);
    expect(row.assigneeName).toBe('Test designer');
    expect(row.dueDate).toBe('2027-04-01T00:00:00.000Z');

    const em = ctx.orm.em.fork();
    const queued = await em.find(OutboxMessage, { project: f.project.id, purpose: 'assignment' });
    expect(queued).toHaveLength(1);
    expect(queued[0]!.status).toBe('queued');

    const report = await deliverDue(em, loopbackSender(smtp.port), 'Threadline <threadline@test.example.com>', new Date());
    expect(report.sent).toContain(queued[0]!.id);
    // Read back with mailparser: recipient, subject and the figures in the text.
    const mails = (await smtp.parsed()).filter((m) => m.subject?.startsWith(`C-${f.conflict.id} assigned`));
    expect(mails).toHaveLength(1);
    const mail = mails[0]!;
    expect(mail.to && !Array.isArray(mail.to) ? mail.to.value.map((v) => v.address) : []).toEqual(['designer@test.example.com']);
    expect(mail.subject).toBe(`C-${f.conflict.id} assigned to you: W-1 × Bore 1, due 2027-04-01`);
    expect(mail.replyTo?.value[0]?.address).toBe('manager@test.example.com');
    expect(mail.text).toContain('Station 11+00.00');
    expect(mail.text).toContain('Clearance -1.10 US ft, required 1.50 US ft');
    expect(mail.text).toMatch(/one-call/);
  });

  it('when only the due date moves, then the assignee is told again; a self-assignment sends nothing', async () => {
    let c = await current(f);
    expect((await patch(`${base(f)}/${f.conflict.id}/assignment`, { assigneeId: ctx.users.designer.id, dueDate: '2027-04-08', version: c.version }, 'manager')).status).toBe(200);
    c = await current(f);
    expect((await patch(`${base(f)}/${f.conflict.id}/assignment`, { assigneeId: ctx.users.manager.id, dueDate: '2027-04-08', version: c.version }, 'manager')).status).toBe(200);
    const em = ctx.orm.em.fork();
    const purposes = (await em.find(OutboxMessage, { project: f.project.id }, { orderBy: { id: 'asc' } })).map((m) => `${m.purpose} ${m.to}`);
    expect(purposes).toEqual(['assignment designer@test.example.com', 'due_date designer@test.example.com']);
    const events = (await get(`${base(f)}/${f.conflict.id}/history`)).body as ConflictEventDto[];
    expect(events.filter((e) => e.kind === 'assignment').map((e) => e.note)).toEqual([
      'Assigned to Test designer, due 2027-04-01.',
      'Assigned to Test designer, due 2027-04-08.',
      'Assigned to Test manager, due 2027-04-08.',
    ]);
    const conflict = await em.findOneOrFail(Conflict, f.conflict.id, { populate: ['assignee'] });
    expect(conflict.assignee?.id).toBe(ctx.users.manager.id);
  });
});

describe('the register is read in the same number of queries whatever the number of conflicts', () => {
  /** Every SQL statement the app sends during `run`, counted through knex's query event. */
  async function queriesDuring(run: () => Promise<unknown>): Promise<number> {
    const knex = ctx.orm.em.getConnection().getKnex();
    let n = 0;
    const count = () => n++;
    knex.on('query', count);
    try {
      await run();
    } finally {
      knex.removeListener('query', count);
    }
    return n;
  }

  /** Add `extra` lines crossing the fixture bore, each exposed by a hole that puts it on the casing (overlap). */
  async function withCrossings(f: Fixtures, extra: number): Promise<void> {
    const em = ctx.orm.em.fork();
    const project = await em.findOneOrFail(Project, f.project.id);
    for (let i = 0; i < extra; i++) {
      const e = 3000150 + i * 20; // between the water line (E 3,000,100) and the end of the bore (E 3,000,250)
      const line = new UtilityLine(project, `G-${i + 1}`, 'Test gas company', 'gas', [
        [e, 13799900],
        [e, 13800100],
      ]);
      line.diameter = 0.5;
      em.persist(line);
      const hole = new TestHole(project, line, randomUUID(), `TH-G${i + 1}`, e, 13800005);
      hole.status = 'dug';
      hole.groundElevation = 100;
      hole.depthToTop = 14.5; // top 85.50, bottom 85.00: inside the casing band, as in mail.test.ts
      em.persist(hole);
    }
    await em.flush();
    await recomputeConflicts(em, project, null);
    await em.flush();
  }

  it('when a project has one conflict or four, then the list, the CSV export and the owner mail preview each take as many queries', async () => {
    const one = await makeFixtures(ctx);
    const four = await makeFixtures(ctx);
    await withCrossings(four, 3);
    expect(((await get(base(four))).body as ConflictRowDto[]).length).toBe(4);
    const routes = (f: Fixtures) => [
      () => get(base(f)),
      () => get(`/api/projects/${f.project.id}/exports/conflicts.csv`),
      () => post(`/api/projects/${f.project.id}/mail/owners`, { mode: 'preview' }, 'manager'),
    ];
    const counts = async (f: Fixtures) => {
      const out: number[] = [];
      for (const route of routes(f)) out.push(await queriesDuring(route));
      return out;
    };
    const [a, b] = [await counts(one), await counts(four)];
    expect(b).toEqual(a);
    expect(a.every((n) => n > 0)).toBe(true);
    // The register itself: the conflicts with their bore, line and assignee, then the holes of those lines.
    const em = ctx.orm.em.fork();
    const project = await em.findOneOrFail(Project, four.project.id);
    let register: Awaited<ReturnType<typeof loadConflictRegister>> | undefined;
    expect(await queriesDuring(async () => (register = await loadConflictRegister(em, project)))).toBe(2);
    expect(register!.rows).toHaveLength(4);
  });
});
