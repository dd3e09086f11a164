/**
 * The test-hole workflow (SPEC §3, §2; issue 4): planned → dug → surveyed → reviewed, who may
 * move a hole along, the lock on reviewed holes, reasons for sending back and reopening, stale
 * edits, and the per-hole activity log with before and after values.
 */
import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ActivityDto, HoleDto } from '@shared/api';
import type { Role } from '@shared/domain';
import { TestHole } from '@server/entities';
import { makeFixtures, makeTestApp, type Fixtures, type TestContext } from './helpers';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await makeTestApp();
});
afterAll(() => ctx.close());

const api = (f: Fixtures, path: string) => `/api/projects/${f.project.id}${path}`;

async function createHole(f: Fixtures, role: Role, extra: Record<string, unknown> = {}): Promise<HoleDto> {
  const res = await request(ctx.app)
    .post(api(f, '/holes'))
    .set('Cookie', ctx.cookie(role))
    .send({ clientId: randomUUID(), number: `TH-${Math.floor(Math.random() * 1e6)}`, lineId: f.line.id, positionSource: 'grid', easting: 3000100, northing: 13800020, ...extra });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as HoleDto;
}

async function getHole(f: Fixtures, id: number): Promise<HoleDto> {
  return (await request(ctx.app).get(api(f, `/holes/${id}`)).set('Cookie', ctx.cookie('viewer'))).body as HoleDto;
}

async function activity(f: Fixtures, id: number): Promise<ActivityDto[]> {
  const res = await request(ctx.app).get(api(f, `/holes/${id}/activity`)).set('Cookie', ctx.cookie('viewer'));
  expect(res.status).toBe(200);
  return res.body as ActivityDto[];
}

describe('planned → dug', () => {
  it('when a field crew logs a hole without a depth it is planned, and logging the depth makes it dug, with the change in its activity', async () => {
    const f = await makeFixtures(ctx);
    const hole = await createHole(f, 'field');
    expect(hole.status).toBe('planned');
    const res = await request(ctx.app).patch(api(f, `/holes/${hole.id}`)).set('Cookie', ctx.cookie('field')).send({ depthToTop: 4.5, groundElevation: 101.2, version: hole.version });
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('dug');
    expect(res.body.version).toBe(hole.version + 1);
    const log = await activity(f, hole.id);
    expect(log.map((a) => a.action)).toEqual(['update', 'create']); // newest first
    expect(log[0]!.changes.status).toEqual({ before: 'planned', after: 'dug' });
    expect(log[0]!.changes.depthToTop).toEqual({ before: null, after: 4.5 });
    expect(log[0]!.userName).toBe('Test field');
  });

  it('when a field crew edits a hole another person logged, then 403 and nothing changes', async () => {
    const f = await makeFixtures(ctx);
    const hole = await createHole(f, 'designer');
    const res = await request(ctx.app).patch(api(f, `/holes/${hole.id}`)).set('Cookie', ctx.cookie('field')).send({ depthToTop: 3, version: hole.version });
    expect(res.status).toBe(403);
    expect((await getHole(f, hole.id)).depthToTop).toBeNull();
    expect((await activity(f, hole.id)).map((a) => a.action)).toEqual(['create']);
  });

  it('when an edit carries a stale version, then 409 with the record as it stands', async () => {
    const f = await makeFixtures(ctx);
    const hole = await createHole(f, 'field');
    await request(ctx.app).patch(api(f, `/holes/${hole.id}`)).set('Cookie', ctx.cookie('field')).send({ notes: 'first', version: hole.version }).expect(200);
    const res = await request(ctx.app).patch(api(f, `/holes/${hole.id}`)).set('Cookie', ctx.cookie('field')).send({ notes: 'second', version: hole.version });
    expect(res.status).toBe(409);
    expect(res.body.code).toBe('stale_version');
    expect(res.body.current.notes).toBe('first');
  });
});

describe('dug → surveyed', () => {
  it('when the surveyor records the top and position, the hole becomes surveyed; field crews and designers may not survey', async () => {
    const f = await makeFixtures(ctx);
    const body = { surveyedTopElevation: 86.12, surveyedEasting: 3000100.04, surveyedNorthing: 13800010.02, version: f.hole.version };
    for (const role of ['field', 'designer', 'viewer', 'manager'] as Role[]) {
      expect((await request(ctx.app).put(api(f, `/holes/${f.hole.id}/survey`)).set('Cookie', ctx.cookie(role)).send(body)).status, role).toBe(403);
    }
    const res = await request(ctx.app).put(api(f, `/holes/${f.hole.id}/survey`)).set('Cookie', ctx.cookie('surveyor')).send(body);
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('surveyed');
    expect(res.body.surveyedTopElevation).toBe(86.12);
    const [entry] = await activity(f, f.hole.id);
    expect(entry!.action).toBe('survey');
    expect(entry!.changes.status).toEqual({ before: 'dug', after: 'surveyed' });
  });

  it('when only the ground is surveyed, the hole stays dug (a top and a position are needed)', async () => {
    const f = await makeFixtures(ctx);
    const res = await request(ctx.app).put(api(f, `/holes/${f.hole.id}/survey`)).set('Cookie', ctx.cookie('surveyor')).send({ surveyedGroundElevation: 100.3, version: f.hole.version });
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('dug');
  });
});

describe('review: accept, send back, reopen', () => {
  it('when the designer accepts, the hole is reviewed and locked for the field crew, the surveyor and photo uploads', async () => {
    const f = await makeFixtures(ctx);
    for (const role of ['field', 'surveyor', 'viewer', 'manager'] as Role[]) {
      expect((await request(ctx.app).post(api(f, `/holes/${f.hole.id}/review`)).set('Cookie', ctx.cookie(role)).send({ decision: 'accept', version: f.hole.version })).status, role).toBe(403);
    }
    const accepted = await request(ctx.app).post(api(f, `/holes/${f.hole.id}/review`)).set('Cookie', ctx.cookie('designer')).send({ decision: 'accept', version: f.hole.version });
    expect(accepted.status).toBe(200);
    expect(accepted.body.status).toBe('reviewed');
    const v = accepted.body.version as number;

    const edit = await request(ctx.app).patch(api(f, `/holes/${f.hole.id}`)).set('Cookie', ctx.cookie('field')).send({ notes: 'late note', version: v });
    expect(edit.status).toBe(409);
    expect(edit.body.code).toBe('locked');
    const del = await request(ctx.app).delete(api(f, `/holes/${f.hole.id}`)).set('Cookie', ctx.cookie('field'));
    expect(del.status).toBe(409);
    const survey = await request(ctx.app).put(api(f, `/holes/${f.hole.id}/survey`)).set('Cookie', ctx.cookie('surveyor')).send({ surveyedTopElevation: 80, version: v });
    expect(survey.status).toBe(409);
    expect(survey.body.code).toBe('locked');
    for (const role of ['field', 'surveyor', 'designer'] as Role[]) {
      const upload = await request(ctx.app).post(api(f, `/holes/${f.hole.id}/photos`)).set('Cookie', ctx.cookie(role)).attach('photos', Buffer.from([0xff, 0xd8, 0xff]), 'a.jpg');
      expect(upload.status, role).toBe(409);
      expect(upload.body.code).toBe('locked');
    }
    const caption = await request(ctx.app).patch(api(f, `/photos/${f.photo.id}`)).set('Cookie', ctx.cookie('field')).send({ caption: 'changed' });
    expect(caption.status).toBe(409);
    const photoDelete = await request(ctx.app).delete(api(f, `/photos/${f.photo.id}`)).set('Cookie', ctx.cookie('designer'));
    expect(photoDelete.status).toBe(409);
    const after = await getHole(f, f.hole.id);
    expect(after.notes).toBeNull();
    expect(after.version).toBe(v);
  });

  it('when the designer sends a hole back it needs a reason, and the hole returns to dug with the reason kept', async () => {
    const f = await makeFixtures(ctx);
    const noReason = await request(ctx.app).post(api(f, `/holes/${f.hole.id}/review`)).set('Cookie', ctx.cookie('designer')).send({ decision: 'send_back', version: f.hole.version });
    expect(noReason.status).toBe(400);
    expect(noReason.body.errors.map((e: { path: string }) => e.path)).toContain('reason');
    const res = await request(ctx.app)
      .post(api(f, `/holes/${f.hole.id}/review`))
      .set('Cookie', ctx.cookie('designer'))
      .send({ decision: 'send_back', reason: 'Depth looks like it was taken to the bottom of the pipe; re-measure to the top.', version: f.hole.version });
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('dug');
    expect(res.body.reviewNote).toMatch(/re-measure/);
    const [entry] = await activity(f, f.hole.id);
    expect(entry!.action).toBe('send_back');
  });

  it('when a reviewed hole is reopened it needs a reason, and it returns to surveyed (it had a surveyed top) and can be edited again', async () => {
    const f = await makeFixtures(ctx);
    const surveyed = await request(ctx.app)
      .put(api(f, `/holes/${f.hole.id}/survey`))
      .set('Cookie', ctx.cookie('surveyor'))
      .send({ surveyedTopElevation: 86.1, surveyedEasting: 3000100, surveyedNorthing: 13800010, version: f.hole.version });
    const accepted = await request(ctx.app).post(api(f, `/holes/${f.hole.id}/review`)).set('Cookie', ctx.cookie('designer')).send({ decision: 'accept', version: surveyed.body.version });
    const v = accepted.body.version as number;
    const noReason = await request(ctx.app).post(api(f, `/holes/${f.hole.id}/review`)).set('Cookie', ctx.cookie('designer')).send({ decision: 'reopen', reason: '   ', version: v });
    expect(noReason.status).toBe(400);
    const bySurveyor = await request(ctx.app).post(api(f, `/holes/${f.hole.id}/review`)).set('Cookie', ctx.cookie('surveyor')).send({ decision: 'reopen', reason: 'mine', version: v });
    expect(bySurveyor.status).toBe(403);
    const reopened = await request(ctx.app).post(api(f, `/holes/${f.hole.id}/review`)).set('Cookie', ctx.cookie('designer')).send({ decision: 'reopen', reason: 'Owner asked for a second photo of the marker.', version: v });
    expect(reopened.status).toBe(200);
    expect(reopened.body.status).toBe('surveyed');
    const edit = await request(ctx.app).patch(api(f, `/holes/${f.hole.id}`)).set('Cookie', ctx.cookie('field')).send({ notes: 'marker photo added', version: reopened.body.version });
    expect(edit.status).toBe(200);
    const actions = (await activity(f, f.hole.id)).map((a) => a.action);
    expect(actions.slice(0, 4)).toEqual(['update', 'reopen', 'accept', 'survey']);
  });

  it('when a planned hole is accepted or sent back, or a hole that is not reviewed is reopened, then 409 wrong_state', async () => {
    const f = await makeFixtures(ctx);
    const planned = await createHole(f, 'designer');
    const accept = await request(ctx.app).post(api(f, `/holes/${planned.id}/review`)).set('Cookie', ctx.cookie('designer')).send({ decision: 'accept', version: planned.version });
    expect(accept.status).toBe(409);
    expect(accept.body.code).toBe('wrong_state');
    const back = await request(ctx.app).post(api(f, `/holes/${planned.id}/review`)).set('Cookie', ctx.cookie('designer')).send({ decision: 'send_back', reason: 'x', version: planned.version });
    expect(back.status).toBe(409);
    const reopen = await request(ctx.app).post(api(f, `/holes/${f.hole.id}/review`)).set('Cookie', ctx.cookie('designer')).send({ decision: 'reopen', reason: 'x', version: f.hole.version });
    expect(reopen.status).toBe(409);
  });
});

describe('hole activity', () => {
  it('lists only that hole’s entries, newest first, and a hole of another project is 404', async () => {
    const f = await makeFixtures(ctx);
    const other = await createHole(f, 'field');
    await request(ctx.app).patch(api(f, `/holes/${f.hole.id}`)).set('Cookie', ctx.cookie('field')).send({ crew: 'Crew 7', version: f.hole.version }).expect(200);
    const log = await activity(f, f.hole.id);
    expect(log.every((a) => a.entity === 'hole' && a.entityId === f.hole.id)).toBe(true);
    expect(log.some((a) => a.entityId === other.id)).toBe(false);
    expect(log[0]!.changes.crew).toEqual({ before: null, after: 'Crew 7' });
    const times = log.map((a) => Date.parse(a.at));
    expect([...times].sort((a, b) => b - a)).toEqual(times);
    const g = await makeFixtures(ctx);
    expect((await request(ctx.app).get(api(f, `/holes/${g.hole.id}/activity`)).set('Cookie', ctx.cookie('viewer'))).status).toBe(404);
  });
});

describe('fields of the test-hole sheet', () => {
  it('soil, groundwater and restoration are logged like the other crew fields', async () => {
    const f = await makeFixtures(ctx);
    const res = await request(ctx.app)
      .patch(api(f, `/holes/${f.hole.id}`))
      .set('Cookie', ctx.cookie('field'))
      .send({ soil: 'Brown sandy clay, moist', groundwater: 'None seen', restoration: 'Flowable fill, 2-in hot-mix patch', version: f.hole.version });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ soil: 'Brown sandy clay, moist', groundwater: 'None seen', restoration: 'Flowable fill, 2-in hot-mix patch' });
    const stored = await ctx.orm.em.fork().findOneOrFail(TestHole, f.hole.id);
    expect(stored.soil).toBe('Brown sandy clay, moist');
  });
});
