/**
 * The role × route matrix. Expectations are written here by hand from SPEC §2 (who may do what),
 * independently of shared/permissions.ts, and every route the router holds must have a row:
 * a new route without one fails this test.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { ROLES, type Role } from '@shared/domain';
import type { RouteMeta } from '@server/http/api-router';
import { fillRoute as fill, makeFixtures, makeTestApp, type TestContext } from './helpers';

const ALL: Role[] = [...ROLES];
const PUBLIC = 'public' as const;

/** Roles that may call each route (others must get 403). `public` routes need no sign-in. */
const EXPECTED: Record<string, Role[] | typeof PUBLIC> = {
  'get /api/health': PUBLIC,
  'post /api/auth/login': PUBLIC,
  'post /api/auth/logout': PUBLIC,
  'get /api/auth/me': ALL,
  'get /api/users/': ['admin', 'manager'],
  'post /api/users/': ['admin'],
  'patch /api/users/:userId': ['admin'],
  'get /api/projects/': ALL,
  'post /api/projects/': ['admin', 'manager'],
  'get /api/projects/:projectId': ALL,
  'patch /api/projects/:projectId': ['admin', 'manager'],
  'delete /api/projects/:projectId': ['admin'],
  'get /api/projects/:projectId/members': ALL,
  'post /api/projects/:projectId/members': ['admin', 'manager'],
  'delete /api/projects/:projectId/members/:userId': ['admin', 'manager'],
  'get /api/projects/:projectId/activity': ALL,
  'get /api/projects/:projectId/bores': ALL,
  'post /api/projects/:projectId/bores': ['admin', 'designer'],
  'get /api/projects/:projectId/bores/:boreId': ALL,
  'patch /api/projects/:projectId/bores/:boreId': ['admin', 'designer'],
  'delete /api/projects/:projectId/bores/:boreId': ['admin', 'designer'],
  'get /api/projects/:projectId/pits': ALL,
  'post /api/projects/:projectId/pits': ['admin', 'designer'],
  'patch /api/projects/:projectId/pits/:pitId': ['admin', 'designer'],
  'delete /api/projects/:projectId/pits/:pitId': ['admin', 'designer'],
  'get /api/projects/:projectId/lines/': ALL,
  'post /api/projects/:projectId/lines/': ['admin', 'designer'],
  'get /api/projects/:projectId/lines/:lineId': ALL,
  'patch /api/projects/:projectId/lines/:lineId': ['admin', 'designer'],
  'delete /api/projects/:projectId/lines/:lineId': ['admin', 'designer'],
  'get /api/projects/:projectId/holes': ALL,
  'post /api/projects/:projectId/holes': ['admin', 'designer', 'field'],
  'get /api/projects/:projectId/holes/:holeId': ALL,
  'patch /api/projects/:projectId/holes/:holeId': ['admin', 'designer', 'field'],
  'delete /api/projects/:projectId/holes/:holeId': ['admin', 'designer', 'field'],
  'put /api/projects/:projectId/holes/:holeId/survey': ['admin', 'surveyor'],
  'post /api/projects/:projectId/holes/:holeId/review': ['admin', 'designer'],
  'get /api/projects/:projectId/holes/:holeId/photos': ALL,
  'get /api/projects/:projectId/photos/:photoId/file': ALL,
  'get /api/projects/:projectId/photos/:photoId/thumbnail': ALL,
  // test-hole register (issue 4): photos, per-hole activity, the sheet, survey imports
  'get /api/projects/:projectId/photos/:photoId/original': ALL,
  'post /api/projects/:projectId/holes/:holeId/photos': ['admin', 'designer', 'surveyor', 'field'],
  'patch /api/projects/:projectId/photos/:photoId': ['admin', 'designer', 'surveyor', 'field'],
  'delete /api/projects/:projectId/photos/:photoId': ['admin', 'designer', 'surveyor', 'field'],
  'get /api/projects/:projectId/holes/:holeId/activity': ALL,
  'get /api/projects/:projectId/holes/:holeId/sheet.pdf': ALL,
  'post /api/projects/:projectId/survey-imports/preview': ['admin', 'surveyor'],
  'post /api/projects/:projectId/survey-imports/commit': ['admin', 'surveyor'],
  'get /api/projects/:projectId/rules/': ALL,
  'post /api/projects/:projectId/rules/': ['admin', 'designer'],
  'patch /api/projects/:projectId/rules/:ruleId': ['admin', 'designer'],
  'delete /api/projects/:projectId/rules/:ruleId': ['admin', 'designer'],
  'get /api/projects/:projectId/conflicts/': ALL,
  'patch /api/projects/:projectId/conflicts/:conflictId/status': ['admin', 'manager', 'designer'],
  'get /api/projects/:projectId/conflicts/:conflictId/history': ALL,
  // conflict register, stake-out and mail (issue 6: items 1, 2, 4)
  'get /api/projects/:projectId/conflicts/:conflictId': ALL,
  'patch /api/projects/:projectId/conflicts/:conflictId': ['admin', 'manager', 'designer'],
  'patch /api/projects/:projectId/conflicts/:conflictId/assignment': ['admin', 'manager'],
  'post /api/projects/:projectId/conflicts/:conflictId/comments': ['admin', 'manager', 'designer', 'surveyor', 'field'],
  'get /api/projects/:projectId/stakeout/': ALL,
  'post /api/projects/:projectId/stakeout/marks': ['admin', 'surveyor'],
  'delete /api/projects/:projectId/stakeout/marks/:markId': ['admin', 'surveyor'],
  'post /api/projects/:projectId/mail/owners': ['admin', 'manager'],
  'get /api/admin/mail/': ['admin'],
  'get /api/admin/mail/captured/:capturedId': ['admin'],
  'post /api/admin/mail/outbox/:outboxId/retry': ['admin'],
  'get /api/projects/:projectId/clearances/': ALL,
  // exports for every role, line imports for those who edit lines (issue 6: items 3, 5)
  'get /api/projects/:projectId/exports/': ALL,
  'get /api/projects/:projectId/exports/conflicts.csv': ALL,
  'get /api/projects/:projectId/exports/conflicts.xlsx': ALL,
  'get /api/projects/:projectId/exports/conflicts.pdf': ALL,
  'get /api/projects/:projectId/exports/stakeout.csv': ALL,
  'get /api/projects/:projectId/exports/stakeout.dxf': ALL,
  'get /api/projects/:projectId/exports/project.geojson': ALL,
  'post /api/projects/:projectId/exports/bundle': ALL,
  'get /api/projects/:projectId/exports/bundle/:jobId': ALL,
  'get /api/projects/:projectId/exports/bundle/:jobId/download': ALL,
  'post /api/projects/:projectId/imports/lines/preview': ['admin', 'designer'],
  'post /api/projects/:projectId/imports/lines/commit': ['admin', 'designer'],
  // base-map tiles: everyone on the project reads them; only an administrator uploads or removes (issue 5)
  'get /api/projects/:projectId/tiles/': ALL,
  'get /api/projects/:projectId/tiles/:z/:x/:y.png': ALL,
  'post /api/projects/:projectId/tiles/': ['admin'],
  'delete /api/projects/:projectId/tiles/': ['admin'],
};

let ctx: TestContext;
let routes: RouteMeta[];
beforeAll(async () => {
  ctx = await makeTestApp();
  routes = ctx.app.locals.routes as RouteMeta[];
});
afterAll(() => ctx.close());

const keyOf = (r: RouteMeta) => `${r.method} ${r.path}`;


function call(method: RouteMeta['method'], url: string, cookie?: string) {
  const req = request(ctx.app)[method](url);
  if (cookie) req.set('Cookie', cookie);
  // An empty body: allowed roles get past authorisation and fail validation (400), never 403.
  return method === 'get' || method === 'delete' ? req : req.send({});
}

describe('role × route matrix', () => {
  it('every route has a row, and every row a route', () => {
    const actual = routes.map(keyOf).sort();
    expect(actual.filter((k) => !(k in EXPECTED))).toEqual([]);
    expect(Object.keys(EXPECTED).filter((k) => !actual.includes(k))).toEqual([]);
  });

  it('covers at least the CRUD routes of the foundation', () => {
    expect(routes.length).toBeGreaterThanOrEqual(40);
  });

  // One fresh fixture project per route, so destructive calls of one route cannot mask another.
  // Roles run from least to most powerful, so a successful delete comes last.
  const order: Role[] = ['viewer', 'field', 'surveyor', 'designer', 'manager', 'admin'];

  it('on the own project: allowed roles pass, every other role gets 403', async () => {
    const failures: string[] = [];
    for (const route of routes) {
      const expected = EXPECTED[keyOf(route)];
      if (!expected || expected === PUBLIC) continue;
      const f = await makeFixtures(ctx);
      for (const role of order) {
        const target = route.path.includes(':userId') && !route.path.includes('members') ? ctx.users.viewer.id : ctx.users.surveyor.id;
        const res = await call(route.method, fill(route.path, f, target), ctx.cookie(role));
        const allowed = expected.includes(role);
        const ok = allowed ? res.status !== 403 && res.status !== 401 && res.status < 500 : res.status === 403;
        if (!ok) failures.push(`${role} ${keyOf(route)} → ${res.status} (${allowed ? 'allowed' : 'refused'} expected) ${res.body?.detail ?? ''}`);
      }
    }
    expect(failures).toEqual([]);
  });

  it("on someone else's project: every project route answers 404 to non-admins, by id", async () => {
    const other = await makeFixtures(ctx, 'Not yours', ['admin']);
    const failures: string[] = [];
    for (const route of routes.filter((r) => r.project)) {
      for (const role of order.filter((r) => r !== 'admin')) {
        const res = await call(route.method, fill(route.path, other, ctx.users.viewer.id), ctx.cookie(role));
        if (res.status !== 404) failures.push(`${role} ${keyOf(route)} → ${res.status}`);
      }
    }
    expect(failures).toEqual([]);
  });

  it('a sub-record of another project cannot be reached through my project', async () => {
    const mine = await makeFixtures(ctx);
    const theirs = await makeFixtures(ctx, 'Theirs', ['admin']);
    const urls = [
      `/api/projects/${mine.project.id}/lines/${theirs.line.id}`,
      `/api/projects/${mine.project.id}/holes/${theirs.hole.id}`,
      `/api/projects/${mine.project.id}/bores/${theirs.bore.id}`,
      `/api/projects/${mine.project.id}/photos/${theirs.photo.id}/file`,
    ];
    for (const url of urls) expect((await call('get', url, ctx.cookie('designer'))).status).toBe(404);
    const patch = await request(ctx.app)
      .patch(`/api/projects/${mine.project.id}/lines/${theirs.line.id}`)
      .set('Cookie', ctx.cookie('designer'))
      .send({ label: 'stolen', version: 1 });
    expect(patch.status).toBe(404);
  });

  it('without a session every non-public route answers 401', async () => {
    const f = await makeFixtures(ctx);
    for (const route of routes) {
      if (EXPECTED[keyOf(route)] === PUBLIC) continue;
      const res = await call(route.method, fill(route.path, f, ctx.users.viewer.id));
      expect(res.status, keyOf(route)).toBe(401);
    }
  });

  it('when a field user edits a hole logged by someone else, then 403', async () => {
    const f = await makeFixtures(ctx);
    const em = ctx.orm.em.fork();
    const hole = await em.findOneOrFail('TestHole', f.hole.id);
    (hole as { createdBy: unknown }).createdBy = ctx.users.designer.id;
    await em.flush();
    const res = await request(ctx.app)
      .patch(`/api/projects/${f.project.id}/holes/${f.hole.id}`)
      .set('Cookie', ctx.cookie('field'))
      .send({ notes: 'mine now', version: (hole as { version: number }).version });
    expect(res.status).toBe(403);
  });
});
