import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { ConflictRowDto, Problem } from '@shared/api';
import { ActivityEntry, Bore, Conflict, ConflictEvent, TestHole, UtilityLine } from '@server/entities';
import { makeFixtures, makeTestApp, tableCounts, type Fixtures, type TestContext } from './helpers';

/**
 * Deleting a line or a bore would erase its test holes and photos, or the history people wrote on
 * its conflicts. The register keeps what people worked on (SPEC §8 "History": who changed what
 * and when, on every record) and refuses such deletes with 409 `in_use`, naming what holds them.
 */

let ctx: TestContext;
beforeAll(async () => {
  ctx = await makeTestApp();
});
afterAll(() => ctx.close());

const del = (url: string) => request(ctx.app).delete(url).set('Cookie', ctx.cookie('designer'));
const lineUrl = (f: Fixtures) => `/api/projects/${f.project.id}/lines/${f.line.id}`;
const boreUrl = (f: Fixtures) => `/api/projects/${f.project.id}/bores/${f.bore.id}`;

async function deleteEntries(entity: string, entityId: number): Promise<number> {
  return ctx.orm.em.fork().count(ActivityEntry, { entity, entityId, action: 'delete' });
}

describe('deleting a line', () => {
  it('when the line has a test hole, then 409 in_use names the hole and nothing is deleted', async () => {
    const f = await makeFixtures(ctx);
    const before = await tableCounts(ctx.orm);
    const res = await del(lineUrl(f));
    expect(res.status).toBe(409);
    const problem = res.body as Problem;
    expect(problem.code).toBe('in_use');
    expect(problem.holds?.holes).toEqual(['TH-1']);
    expect(problem.detail).toMatch(/1 test hole \(TH-1\)/);
    expect(await tableCounts(ctx.orm)).toEqual(before);
    expect(await deleteEntries('line', f.line.id)).toBe(0);
  });

  it('when the line has no holes and its conflict only has the check’s own history, then it is deleted with that conflict and logged', async () => {
    const f = await makeFixtures(ctx);
    await ctx.orm.em.fork().nativeDelete(TestHole, { line: f.line.id });
    const res = await del(lineUrl(f));
    expect(res.status).toBe(204);
    const em = ctx.orm.em.fork();
    expect(await em.count(UtilityLine, { id: f.line.id })).toBe(0);
    expect(await em.count(Conflict, { line: f.line.id })).toBe(0);
    expect(await deleteEntries('line', f.line.id)).toBe(1);
  });

  it('when a person has commented on its conflict, then 409 names the conflict even with no holes left', async () => {
    const f = await makeFixtures(ctx);
    await ctx.orm.em.fork().nativeDelete(TestHole, { line: f.line.id });
    const comment = await request(ctx.app)
      .post(`/api/projects/${f.project.id}/conflicts/${f.conflict.id}/comments`)
      .set('Cookie', ctx.cookie('manager'))
      .send({ text: 'Owner says the main is ductile iron; asked for as-builts.' });
    expect(comment.status).toBe(201);
    const res = await del(lineUrl(f));
    expect(res.status).toBe(409);
    expect((res.body as Problem).holds).toEqual({ holes: [], conflicts: [f.conflict.id] });
    expect(await ctx.orm.em.fork().count(ConflictEvent, { conflict: f.conflict.id, kind: 'comment' })).toBe(1);
  });
});

describe('deleting a bore', () => {
  it('when a person has moved one of its conflicts, then 409 in_use and the bore, conflict and history stay', async () => {
    const f = await makeFixtures(ctx);
    const row = (await request(ctx.app).get(`/api/projects/${f.project.id}/conflicts/${f.conflict.id}`).set('Cookie', ctx.cookie('viewer'))).body as ConflictRowDto;
    const moved = await request(ctx.app)
      .patch(`/api/projects/${f.project.id}/conflicts/${f.conflict.id}/status`)
      .set('Cookie', ctx.cookie('designer'))
      .send({ status: 'in_review', reason: 'Checking a deeper profile.', version: row.version });
    expect(moved.status).toBe(200);
    const before = await tableCounts(ctx.orm);
    const res = await del(boreUrl(f));
    expect(res.status).toBe(409);
    expect((res.body as Problem).code).toBe('in_use');
    expect((res.body as Problem).holds?.conflicts).toEqual([f.conflict.id]);
    expect(await tableCounts(ctx.orm)).toEqual(before);
  });

  it('when its conflicts carry only the check’s own history, then it is deleted (pits and conflicts with it) and logged', async () => {
    const f = await makeFixtures(ctx);
    const res = await del(boreUrl(f));
    expect(res.status).toBe(204);
    const em = ctx.orm.em.fork();
    expect(await em.count(Bore, { id: f.bore.id })).toBe(0);
    expect(await em.count(Conflict, { bore: f.bore.id })).toBe(0);
    expect(await em.count(TestHole, { id: f.hole.id })).toBe(1); // the hole stays, off the bore
    expect(await deleteEntries('bore', f.bore.id)).toBe(1);
  });
});
