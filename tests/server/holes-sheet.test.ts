/**
 * The one-page test-hole sheet (SPEC §8 "A test-hole sheet carries…", §7 cautions), read back
 * with pdf-parse, a general-purpose PDF reader from npm.
 */
import { randomUUID } from 'node:crypto';
import { PDFParse } from 'pdf-parse';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Project, TestHole, User, UtilityLine } from '@server/entities';
import { thumbnails } from '@server/modules/holes/photo-queue';
import { twoToneJpeg, withExif } from './exif-fixture';
import { makeFixtures, makeTestApp, type TestContext } from './helpers';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await makeTestApp();
});
afterAll(async () => {
  await thumbnails.idle();
  await ctx.close();
});

async function readPdf(data: Buffer): Promise<{ text: string; pages: number }> {
  const parser = new PDFParse({ data: new Uint8Array(data) });
  try {
    const result = await parser.getText();
    return { text: result.text, pages: result.total };
  } finally {
    await parser.destroy();
  }
}

describe('test-hole sheet', () => {
  it('one page per excavation: every line exposed, the reference frame, depths with units, photos, prepared and reviewed by, and the cautions', async () => {
    const f = await makeFixtures(ctx);
    const base = `/api/projects/${f.project.id}`;
    // A second line exposed in the same excavation: a gas main, its own record under TH-1.
    const em = ctx.orm.em.fork();
    const gas = new UtilityLine(em.getReference(Project, f.project.id), 'G-7', 'Tallowmere Gas', 'gas', [
      [3000080, 13799980],
      [3000120, 13800040],
    ]);
    gas.diameter = 0.5;
    gas.material = 'PE';
    em.persist(gas);
    const second = new TestHole(em.getReference(Project, f.project.id), gas, randomUUID(), 'TH-1', 3000100, 13800010);
    second.status = 'dug';
    second.groundElevation = 100;
    second.depthToTop = 6.25;
    second.createdBy = em.getReference(User, ctx.users.field.id);
    em.persist(second);
    await em.flush();

    const patch = await request(ctx.app)
      .patch(`${base}/holes/${f.hole.id}`)
      .set('Cookie', ctx.cookie('field'))
      .send({
        crew: 'Vac crew 3',
        method: 'air',
        ticketNumber: '2611-0345-77',
        surfaceType: 'Asphalt pavement, 4 in',
        soil: 'Brown sandy clay',
        groundwater: 'None seen',
        restoration: 'Flowable fill and hot-mix patch',
        markerSet: true,
        material: 'Ductile iron',
        condition: 'Good, coating intact',
        direction: 'N-S',
        dugAt: '2026-11-03T15:00:00Z',
        version: f.hole.version,
      });
    expect(patch.status, JSON.stringify(patch.body)).toBe(200);
    const photo = await request(ctx.app)
      .post(`${base}/holes/${f.hole.id}/photos`)
      .set('Cookie', ctx.cookie('field'))
      .field('caption', 'Exposed main with tape')
      .attach('photos', withExif(await twoToneJpeg(64, 48), { orientation: 6 }), 'p.jpg');
    expect(photo.status).toBe(201);
    await thumbnails.idle();
    const accepted = await request(ctx.app).post(`${base}/holes/${f.hole.id}/review`).set('Cookie', ctx.cookie('designer')).send({ decision: 'accept', version: patch.body.version });
    expect(accepted.status, JSON.stringify(accepted.body).slice(0, 300)).toBe(200);

    const res = await request(ctx.app).get(`${base}/holes/${f.hole.id}/sheet.pdf`).set('Cookie', ctx.cookie('viewer')).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toContain('test-hole-TH-1.pdf');
    const { text, pages } = await readPdf(res.body as Buffer);
    expect(pages).toBe(1);
    const flat = text.replace(/\s+/g, ' ');
    for (const expected of [
      'Test hole TH-1',
      'CRS EPSG:2278',
      'Unit: US survey feet (US ft)',
      'Vertical datum: NAVD 88',
      '2026-11-03', // date dug
      'Vac crew 3',
      'Air vacuum excavation',
      '2611-0345-77',
      'Asphalt pavement, 4 in',
      'Brown sandy clay',
      'None seen',
      'Flowable fill and hot-mix patch',
      'W-1',
      'G-7',
      'Tallowmere Gas',
      '14.00 US ft', // depth to top of the water line, with its unit
      '6.25 US ft', // depth to top of the gas line
      '86.00 US ft NAVD 88', // top elevation of the water line: ground 100 − depth 14
      'Ductile iron',
      'Exposed main with tape',
      'Prepared by',
      'Test field',
      'Reviewed by',
      'Test designer',
      'Call before you dig.',
      'Entering a casing is confined-space work.',
      'Clearances here are a design aid.',
    ]) {
      expect(flat, expected).toContain(expected);
    }
    // Station of the hole on Bore 1 (begin 10+00, hole 100 US ft along, 10 US ft left of it).
    expect(flat).toContain('11+00.00, 10.00 US ft L on Bore 1');
  });

  it('a hole of another project is 404, and the sheet of a planned hole with no photos still explains itself', async () => {
    const f = await makeFixtures(ctx);
    const g = await makeFixtures(ctx);
    expect((await request(ctx.app).get(`/api/projects/${f.project.id}/holes/${g.hole.id}/sheet.pdf`).set('Cookie', ctx.cookie('viewer'))).status).toBe(404);
    const planned = await request(ctx.app)
      .post(`/api/projects/${f.project.id}/holes`)
      .set('Cookie', ctx.cookie('designer'))
      .send({ clientId: randomUUID(), number: 'TH-P', lineId: f.line.id, positionSource: 'grid', easting: 3000100, northing: 13800060 });
    const res = await request(ctx.app).get(`/api/projects/${f.project.id}/holes/${planned.body.id}/sheet.pdf`).set('Cookie', ctx.cookie('field')).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(res.status).toBe(200);
    const { text } = await readPdf(res.body as Buffer);
    const flat = text.replace(/\s+/g, ' ');
    expect(flat).toContain('No photos yet.');
    expect(flat).toContain('not reviewed yet');
  });
});
