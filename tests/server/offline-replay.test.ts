/**
 * Field mode without signal (issue 7): a create replayed by its client-made id never makes a
 * second record, an offline edit that meets a newer version is answered 409 with the record as
 * it stands, and the phone's outbox (IndexedDB, here fake-indexeddb) sent against the real API
 * twice, or after a lost answer, leaves exactly one hole and one copy of each photo.
 * Source for the replay rule: RFC 9110 §9.2.2 (a retried request must not repeat its effect;
 * POST is made safe to retry by the client-made key).
 */
import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import type { HoleDto, PhotoDto, Problem } from '@shared/api';
import type { HoleCreateInput } from '@shared/schemas/hole';
import { Photo, TestHole, UtilityLine } from '@server/entities';
import { ApiError } from '@/lib/api-client';
import { sendOutbox, type OutboxTransport } from '@/features/outbox/outbox-sender';
import { dropHole, keepHole, keepPhotos, listOutbox, updateHole } from '@/features/outbox/outbox-store';
import { unsentExport } from '@/features/outbox/export-unsent';
import { importUnsentFile } from '@/features/outbox/import-unsent';
import { plainPng } from './exif-fixture';
import { makeFixtures, makeTestApp, type Fixtures, type TestContext } from './helpers';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await makeTestApp();
});
afterAll(() => ctx.close());
beforeEach(async () => {
  for (const h of await listOutbox()) await dropHole(h.clientId);
});

const api = (f: Fixtures, path: string) => `/api/projects/${f.project.id}${path}`;

function body(f: Fixtures, number: string): HoleCreateInput {
  return { clientId: randomUUID(), number, lineId: f.line.id, positionSource: 'grid', easting: 3000100, northing: 13800020, depthToTop: 4.2 } as HoleCreateInput;
}

/** A hole on a line on no record (a 0.5 ft pipe running N 83° E), as the form sends it. */
function newLineBody(f: Fixtures, number: string, label: string): HoleCreateInput {
  return {
    clientId: randomUUID(), number, newLine: { label }, positionSource: 'grid', easting: 3000120, northing: 13800040,
    depthToTop: 3.9, measuredSize: 0.5, direction: 'N 83° E',
  } as HoleCreateInput;
}

async function lineCount(f: Fixtures, label: string): Promise<number> {
  return ctx.orm.em.fork().count(UtilityLine, { project: f.project.id, label });
}

async function counts(f: Fixtures, clientId: string): Promise<{ holes: number; photos: number }> {
  const em = ctx.orm.em.fork();
  const holes = await em.find(TestHole, { project: f.project.id, clientId });
  const photos = holes.length ? await em.count(Photo, { hole: holes.map((h) => h.id) }) : 0;
  return { holes: holes.length, photos };
}

/** The outbox's transport over the real API (supertest), failing as the browser client would. */
function transport(f: Fixtures, opts: { loseAnswers?: number; withoutPhotoIds?: boolean } = {}): OutboxTransport & { calls: string[] } {
  let lose = opts.loseAnswers ?? 0;
  const calls: string[] = [];
  const fail = (res: request.Response): never => {
    throw new ApiError({ ...(res.body as Problem), status: res.status });
  };
  const lost = () => {
    if (lose > 0) {
      lose--;
      // The server did the work; the phone never heard back.
      throw new ApiError({ type: 'about:blank', title: 'Cannot reach the Threadline server', status: 0 });
    }
  };
  return {
    calls,
    async createHole(projectId, input) {
      calls.push(`create ${input.number}`);
      const res = await request(ctx.app).post(`/api/projects/${projectId}/holes`).set('Cookie', ctx.cookie('field')).send(input);
      if (res.status >= 300) fail(res);
      lost();
      return res.body as HoleDto;
    },
    async uploadPhoto(projectId, holeId, file, photo) {
      calls.push(`photo ${file.name}`);
      let req = request(ctx.app)
        .post(`/api/projects/${projectId}/holes/${holeId}/photos`)
        .set('Cookie', ctx.cookie('field'))
        .field('takenAt', photo.takenAt);
      if (!opts.withoutPhotoIds) req = req.field('clientId', photo.clientId);
      const res = await req
        .attach('photos', Buffer.from(await file.arrayBuffer()), { filename: file.name, contentType: file.type });
      if (res.status >= 300) fail(res);
      lost();
      return res.body as PhotoDto[];
    },
    async listPhotos(projectId, holeId) {
      const res = await request(ctx.app).get(`/api/projects/${projectId}/holes/${holeId}/photos`).set('Cookie', ctx.cookie('field'));
      if (res.status >= 300) fail(res);
      return res.body as PhotoDto[];
    },
  };
}

async function png(name: string): Promise<File> {
  return new File([new Uint8Array(await plainPng(24, 16))], name, { type: 'image/png' });
}

describe('replayed creates', () => {
  it('when the same create is sent three times, one after another and then at once, then one hole and the same record each time', async () => {
    const f = await makeFixtures(ctx);
    const input = body(f, 'TH-R1');
    const first = await request(ctx.app).post(api(f, '/holes')).set('Cookie', ctx.cookie('field')).send(input);
    expect(first.status).toBe(201);
    const again = await request(ctx.app).post(api(f, '/holes')).set('Cookie', ctx.cookie('field')).send(input);
    expect(again.status).toBe(200);
    expect(again.body.id).toBe(first.body.id);
    const together = await Promise.all([1, 2].map(() => request(ctx.app).post(api(f, '/holes')).set('Cookie', ctx.cookie('field')).send(input)));
    for (const r of together) expect(r.body.id).toBe(first.body.id);
    expect(await counts(f, input.clientId)).toEqual({ holes: 1, photos: 0 });
    const activity = await request(ctx.app).get(api(f, `/holes/${first.body.id}/activity`)).set('Cookie', ctx.cookie('viewer'));
    expect((activity.body as { action: string }[]).filter((a) => a.action === 'create')).toHaveLength(1);
  });

  it('when a replay carries a client id already used in another project, then 409 and nothing is made there', async () => {
    const f = await makeFixtures(ctx);
    const g = await makeFixtures(ctx);
    const input = body(f, 'TH-R2');
    await request(ctx.app).post(api(f, '/holes')).set('Cookie', ctx.cookie('field')).send(input).expect(201);
    const res = await request(ctx.app).post(api(g, '/holes')).set('Cookie', ctx.cookie('field')).send({ ...input, lineId: g.line.id });
    expect(res.status).toBe(409);
    expect(await ctx.orm.em.fork().count(TestHole, { project: g.project.id, number: 'TH-R2' })).toBe(0);
  });
});

describe('an offline edit meeting a newer version', () => {
  it('when the phone sends its edit on an old version, then 409 stale_version with both values to show, and the chosen value saves on the current version', async () => {
    const f = await makeFixtures(ctx);
    const made = (await request(ctx.app).post(api(f, '/holes')).set('Cookie', ctx.cookie('field')).send(body(f, 'TH-R3'))).body as HoleDto;
    // The office changes the depth while the crew is out of signal.
    await request(ctx.app).patch(api(f, `/holes/${made.id}`)).set('Cookie', ctx.cookie('designer')).send({ depthToTop: 5.1, version: made.version }).expect(200);
    const stale = await request(ctx.app).patch(api(f, `/holes/${made.id}`)).set('Cookie', ctx.cookie('field')).send({ depthToTop: 4.8, version: made.version });
    expect(stale.status).toBe(409);
    expect(stale.body.code).toBe('stale_version');
    expect(stale.body.current.depthToTop).toBe(5.1);
    expect(stale.body.current.version).toBeGreaterThan(made.version);
    const chosen = await request(ctx.app).patch(api(f, `/holes/${made.id}`)).set('Cookie', ctx.cookie('field')).send({ depthToTop: 4.8, version: stale.body.current.version });
    expect(chosen.status).toBe(200);
    expect(chosen.body.depthToTop).toBe(4.8);
  });
});

describe('the phone outbox sent to the real API', () => {
  const project = (f: Fixtures) => ({ id: f.project.id, name: f.project.name, crsCode: f.project.crsCode, unit: f.project.unit, verticalDatum: f.project.verticalDatum });

  it('when two holes with photos are kept offline and the outbox is sent twice, then each hole and photo arrives once, in the order made', async () => {
    const f = await makeFixtures(ctx);
    const a = await keepHole(project(f), body(f, 'TH-O1'));
    const b = await keepHole(project(f), body(f, 'TH-O2'));
    await keepHole(project(f), a.input); // keeping the same client id twice keeps one record
    await keepPhotos(a.clientId, [await png('a1.png'), await png('a2.png')]);
    await keepPhotos(b.clientId, [await png('b1.png')]);
    expect((await listOutbox()).map((h) => [h.number, h.status])).toEqual([
      ['TH-O1', 'local'],
      ['TH-O2', 'local'],
    ]);
    const t = transport(f);
    expect(await sendOutbox(t)).toEqual({ sent: 2, refused: 0, stopped: false });
    expect(t.calls).toEqual(['create TH-O1', 'photo a1.png', 'photo a2.png', 'create TH-O2', 'photo b1.png']);
    const again = transport(f);
    expect(await sendOutbox(again)).toEqual({ sent: 0, refused: 0, stopped: false });
    expect(again.calls).toEqual([]);
    expect(await counts(f, a.clientId)).toEqual({ holes: 1, photos: 2 });
    expect(await counts(f, b.clientId)).toEqual({ holes: 1, photos: 1 });
    const after = await listOutbox();
    expect(after.every((h) => h.status === 'sent' && h.photos.every((p) => p.status === 'sent'))).toBe(true);
    expect(unsentExport(after).holes).toHaveLength(0);
  });

  it('when the answers to a create and a photo are lost, then the resend finds them kept and makes no duplicate', async () => {
    const f = await makeFixtures(ctx);
    const a = await keepHole(project(f), body(f, 'TH-O3'));
    await keepPhotos(a.clientId, [await png('c1.png')]);
    const lossy = transport(f, { loseAnswers: 1 });
    const first = await sendOutbox(lossy);
    expect(first.stopped).toBe(true);
    expect((await listOutbox())[0]!.status).toBe('local'); // not "sent": the phone never heard back
    expect(await counts(f, a.clientId)).toEqual({ holes: 1, photos: 0 });
    const photoLost = transport(f, { loseAnswers: 0 });
    // Lose the photo's answer next: the create now answers 200 with the kept record.
    let lose = 1;
    const upload = photoLost.uploadPhoto.bind(photoLost);
    photoLost.uploadPhoto = async (...args) => {
      const r = await upload(...args);
      if (lose-- > 0) throw new ApiError({ type: 'about:blank', title: 'Cannot reach the Threadline server', status: 0 });
      return r;
    };
    expect((await sendOutbox(photoLost)).stopped).toBe(true);
    expect((await listOutbox())[0]!.photos[0]!.status).toBe('sending');
    const last = transport(f);
    expect(await sendOutbox(last)).toEqual({ sent: 0, refused: 0, stopped: false });
    // Sent again with the same client id: the server answers the photo it kept and stores none.
    expect(last.calls).toEqual(['photo c1.png']);
    expect(await counts(f, a.clientId)).toEqual({ holes: 1, photos: 1 });
    expect((await listOutbox())[0]!.photos[0]!.status).toBe('sent');
  });

  it('when the server refuses a kept hole, then it is marked refused with the server’s reason, the next one still goes, and the export carries it with CRS, unit and datum', async () => {
    const f = await makeFixtures(ctx);
    const bad = await keepHole(project(f), { ...body(f, 'TH-O4'), lineId: 987654 });
    const good = await keepHole(project(f), body(f, 'TH-O5'));
    const result = await sendOutbox(transport(f));
    expect(result).toEqual({ sent: 1, refused: 1, stopped: false });
    const [b, g] = await listOutbox();
    expect(b!.clientId).toBe(bad.clientId);
    expect(b!.status).toBe('refused');
    expect(b!.reason).toMatch(/line/i);
    expect(g!.clientId).toBe(good.clientId);
    expect(g!.status).toBe('sent');
    const file = unsentExport(await listOutbox());
    expect(file.holes.map((h) => h.number)).toEqual(['TH-O4']);
    expect(file.holes[0]).toMatchObject({ crs: f.project.crsCode, unit: f.project.unit, verticalDatum: f.project.verticalDatum, body: { clientId: bad.clientId } });
  });
});

describe('a hole on a new unidentified line kept without signal', () => {
  const project = (f: Fixtures) => ({ id: f.project.id, name: f.project.name, crsCode: f.project.crsCode, unit: f.project.unit, verticalDatum: f.project.verticalDatum });

  it('when a field crew keeps a hole with newLine offline and the answer to its send is lost, then the resend makes no second hole and no second line', async () => {
    const f = await makeFixtures(ctx);
    const a = await keepHole(project(f), newLineBody(f, 'TH-U1', 'Unidentified pipe U1'));
    await keepPhotos(a.clientId, [await png('u1.png')]);
    expect(await sendOutbox(transport(f, { loseAnswers: 1 }))).toMatchObject({ sent: 0, stopped: true });
    expect(await counts(f, a.clientId)).toEqual({ holes: 1, photos: 0 });
    const t = transport(f);
    expect(await sendOutbox(t)).toEqual({ sent: 1, refused: 0, stopped: false });
    expect(t.calls).toEqual(['create TH-U1', 'photo u1.png']); // one request for hole and line together
    expect(await sendOutbox(transport(f))).toEqual({ sent: 0, refused: 0, stopped: false });
    expect(await counts(f, a.clientId)).toEqual({ holes: 1, photos: 1 });
    expect(await lineCount(f, 'Unidentified pipe U1')).toBe(1);
    const hole = await ctx.orm.em.fork().findOneOrFail(TestHole, { clientId: a.clientId }, { populate: ['line'] });
    expect(hole.line.kind).toBe('unknown');
    expect(hole.line.qualityLevel).toBe('A');
  });

  it('when the record is exported, imported twice in the office and sent, then one hole, one line and one photo', async () => {
    const f = await makeFixtures(ctx);
    const a = await keepHole(project(f), newLineBody(f, 'TH-U2', 'Unidentified pipe U2'));
    await keepPhotos(a.clientId, [await png('u2.png')]);
    const exported = unsentExport(await listOutbox());
    expect(exported.holes[0]!.body).toMatchObject({ newLine: { label: 'Unidentified pipe U2' } });
    expect(exported.holes[0]!.body.lineId).toBeUndefined();
    expect(exported.holes[0]!.photos[0]!.clientId).toBe((await listOutbox())[0]!.photos[0]!.clientId);
    const file = JSON.stringify(exported);
    for (const h of await listOutbox()) await dropHole(h.clientId);
    expect(await importUnsentFile(file)).toEqual({ added: 1, inFile: 1 });
    expect(await importUnsentFile(file)).toEqual({ added: 0, inFile: 1 });
    await sendOutbox(transport(f));
    for (const h of await listOutbox()) await dropHole(h.clientId);
    await importUnsentFile(file); // another browser sends the same file again
    await sendOutbox(transport(f));
    expect(await counts(f, a.clientId)).toEqual({ holes: 1, photos: 1 });
    expect(await lineCount(f, 'Unidentified pipe U2')).toBe(1);
  });
});

describe('photos kept by the earlier version, without a client id', () => {
  const project = (f: Fixtures) => ({ id: f.project.id, name: f.project.name, crsCode: f.project.crsCode, unit: f.project.unit, verticalDatum: f.project.verticalDatum });

  /** A kept hole already on the server, its one photo stripped of its client id and marked as the old sender left it. */
  async function legacy(f: Fixtures, number: string, status: 'local' | 'sending') {
    const a = await keepHole(project(f), body(f, number));
    await keepPhotos(a.clientId, [await png(`${number}.png`)]);
    await sendOutbox({ ...transport(f), uploadPhoto: () => Promise.reject(new ApiError({ type: 'about:blank', title: 'offline', status: 0 })) });
    await updateHole(a.clientId, (h) => {
      delete h.photos[0]!.clientId;
      h.photos[0]!.status = status;
    });
    return (await listOutbox()).find((h) => h.clientId === a.clientId)!;
  }

  it('when such a photo left "sending" had arrived (old upload, answer lost), then it is found by its capture time and not sent again', async () => {
    const f = await makeFixtures(ctx);
    const kept = await legacy(f, 'TH-L1', 'sending');
    const photo = kept.photos[0]!;
    // What the old version sent: the photo with its time, no id.
    await request(ctx.app)
      .post(api(f, `/holes/${kept.holeId}/photos`))
      .set('Cookie', ctx.cookie('field'))
      .field('takenAt', photo.takenAt)
      .attach('photos', Buffer.from(photo.data), { filename: photo.name, contentType: photo.type })
      .expect(201);
    const t = transport(f);
    await sendOutbox(t);
    expect(t.calls).toEqual([]);
    expect(await counts(f, kept.clientId)).toEqual({ holes: 1, photos: 1 });
    expect((await listOutbox())[0]!.photos[0]!.status).toBe('sent');
  });

  it('when such a photo is not on the server, then it is given a client id, kept with it, and sent once even if that answer is lost', async () => {
    const f = await makeFixtures(ctx);
    const kept = await legacy(f, 'TH-L2', 'sending');
    const lossy = transport(f);
    const upload = lossy.uploadPhoto.bind(lossy);
    lossy.uploadPhoto = async (...args) => {
      await upload(...args);
      throw new ApiError({ type: 'about:blank', title: 'Cannot reach the Threadline server', status: 0 });
    };
    expect((await sendOutbox(lossy)).stopped).toBe(true);
    const given = (await listOutbox())[0]!.photos[0]!.clientId;
    expect(given).toMatch(/^[0-9a-f-]{36}$/);
    await sendOutbox(transport(f));
    expect(await counts(f, kept.clientId)).toEqual({ holes: 1, photos: 1 });
    const rows = await ctx.orm.em.fork().find(Photo, { hole: kept.holeId! });
    expect(rows.map((r) => r.clientId)).toEqual([given]);
  });
});

describe('the office imports a phone\'s file of unsent records', () => {
  it('when the file is imported twice, and again in another browser, then each hole and photo arrives once', async () => {
    const f = await makeFixtures(ctx);
    const a = await keepHole({ id: f.project.id, name: f.project.name, crsCode: f.project.crsCode, unit: f.project.unit, verticalDatum: f.project.verticalDatum }, body(f, 'TH-X1'));
    await keepPhotos(a.clientId, [await png('x1.png'), await png('x2.png')]);
    const file = JSON.stringify(unsentExport(await listOutbox()));
    for (const h of await listOutbox()) await dropHole(h.clientId); // the phone is lost; the office has the file
    expect(await importUnsentFile(file)).toEqual({ added: 1, inFile: 1 });
    expect(await importUnsentFile(file)).toEqual({ added: 0, inFile: 1 });
    await sendOutbox(transport(f));
    expect(await counts(f, a.clientId)).toEqual({ holes: 1, photos: 2 });
    // Another browser imports the same file and sends it: the server already has everything.
    for (const h of await listOutbox()) await dropHole(h.clientId);
    await importUnsentFile(file);
    const again = transport(f);
    await sendOutbox(again);
    // The photos go again with their client ids (carried in the file); the server keeps its copies.
    expect(again.calls.filter((c) => c.startsWith('photo'))).toEqual(['photo x1.png', 'photo x2.png']);
    expect(await counts(f, a.clientId)).toEqual({ holes: 1, photos: 2 });
  });

  it('when the file is not an export of unsent records, then it is refused with a message and nothing is kept', async () => {
    await expect(importUnsentFile('not json')).rejects.toThrow(/not JSON/);
    await expect(importUnsentFile(JSON.stringify({ format: 'something-else', version: 1, holes: [] }))).rejects.toThrow(/not a file of unsent records/);
    await expect(
      importUnsentFile(JSON.stringify({ format: 'threadline-unsent-records', version: 1, holes: [{ clientId: 'x' }] })),
    ).rejects.toThrow(/cannot be imported: holes\.0\./);
    expect(await listOutbox()).toEqual([]);
  });
});
