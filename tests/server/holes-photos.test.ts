/**
 * Photos of test holes (issue 4, SPEC §8 "Photos stay upright"; ../shared/STACK.md §6 and its
 * security traps): the type is read from the bytes, size and pixel limits hold, the EXIF
 * orientation is applied to the pixels, EXIF time and GPS are read (the form's own kept when
 * the browser stripped them), thumbnails are made after the upload answers, and every refusal
 * leaves no row and no file.
 */
import { randomUUID } from 'node:crypto';
import { mkdtempSync, readdirSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import { createCanvas } from '@napi-rs/canvas';
import exifr from 'exifr';
import { intToRGBA, Jimp } from 'jimp';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { PhotoDto } from '@shared/api';
import type { Role } from '@shared/domain';
import { createApp } from '@server/app';
import { Photo } from '@server/entities';
import { thumbnails } from '@server/modules/holes/photo-queue';
import { DiskStorage, type FileStorage } from '@server/storage/storage';
import { jpegBomb, plainPng, pngBomb, twoToneJpeg, withExif } from './exif-fixture';
import { makeFixtures, makeTestApp, tableCounts, type Fixtures, type TestContext } from './helpers';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await makeTestApp();
});
afterAll(async () => {
  await thumbnails.idle();
  await ctx.close();
});

const url = (f: Fixtures, path: string) => `/api/projects/${f.project.id}${path}`;

// The position and time written into the test photo's EXIF. An invented point near the demo
// town; the EXIF stores degrees, minutes and seconds to 1/1000 s, so it reads back to ~1e-7°.
const LAT = 29.758367;
const LON = -95.3635;
const EXIF_TIME = '2026:11:03 09:15:42';
const EXIF_OFFSET = '-06:00';

function upload(f: Fixtures, role: Role = 'field', app = ctx.app, holeId = f.hole.id) {
  return request(app).post(url(f, `/holes/${holeId}/photos`)).set('Cookie', ctx.cookie(role));
}

/** Rows in every table and every stored key: a refused upload must change neither. */
async function snapshot(storage: FileStorage = ctx.storage) {
  return { rows: await tableCounts(ctx.orm), keys: await storage.list('') };
}

/** A gate that holds the thumbnail queue, so a test can look at a photo before its copies exist. */
function holdQueue(): () => void {
  let release!: () => void;
  const gate = new Promise<void>((resolve) => {
    release = resolve;
  });
  thumbnails.add(() => gate);
  return release;
}

describe('a phone photo with EXIF orientation 6 and a GPS tag', () => {
  it('is stored as sent, served upright (width and height swapped), with its EXIF position and time', async () => {
    const f = await makeFixtures(ctx);
    // Stored 64 × 32, left half red, right half blue; orientation 6 means "turn 90° clockwise
    // to view" (EXIF 2.32, tag 0x0112), so upright it is 32 × 64 with red on top.
    const jpeg = withExif(await twoToneJpeg(64, 32), { orientation: 6, latitude: LAT, longitude: LON, dateTimeOriginal: EXIF_TIME, offsetTimeOriginal: EXIF_OFFSET });
    expect(await exifr.orientation(jpeg)).toBe(6); // the fixture is what it claims (exifr, a reference reader)

    const release = holdQueue();
    const res = await upload(f).field('caption', 'Exposed main with tape').attach('photos', jpeg, { filename: 'IMG_0042.JPG', contentType: 'image/jpeg' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const [photo] = res.body as PhotoDto[];
    expect(photo).toMatchObject({ width: 32, height: 64, caption: 'Exposed main with tape', state: 'processing', gpsSource: 'exif', takenAtSource: 'exif' });
    expect(photo!.gpsLat).toBeCloseTo(LAT, 6);
    expect(photo!.gpsLon).toBeCloseTo(LON, 6);
    // 09:15:42 at UTC−06:00 is 15:15:42 UTC.
    expect(photo!.takenAt).toBe('2026-11-03T15:15:42.000Z');

    // Before the copies are made, the thumbnail and the viewing copy say so.
    const early = await request(ctx.app).get(url(f, `/photos/${photo!.id}/thumbnail`)).set('Cookie', ctx.cookie('viewer'));
    expect(early.status).toBe(404);
    expect(early.body.code).toBe('photo_processing');
    expect(early.headers['retry-after']).toBe('1');
    expect((await request(ctx.app).get(url(f, `/photos/${photo!.id}/file`)).set('Cookie', ctx.cookie('viewer'))).body.code).toBe('photo_processing');

    release();
    await thumbnails.idle();

    const list = await request(ctx.app).get(url(f, `/holes/${f.hole.id}/photos`)).set('Cookie', ctx.cookie('viewer'));
    expect(list.body.find((p: PhotoDto) => p.id === photo!.id).state).toBe('ready');

    for (const variant of ['file', 'thumbnail'] as const) {
      const got = await request(ctx.app).get(url(f, `/photos/${photo!.id}/${variant}`)).set('Cookie', ctx.cookie('viewer')).buffer(true);
      expect(got.status, variant).toBe(200);
      expect(got.headers['content-type']).toBe('image/jpeg');
      // Upright in the pixels themselves: no orientation tag left for a viewer to honour.
      expect(await exifr.orientation(got.body as Buffer)).toBeUndefined();
      const image = await Jimp.read(got.body as Buffer);
      expect([image.bitmap.width, image.bitmap.height], variant).toEqual([32, 64]);
      const top = intToRGBA(image.getPixelColor(16, 4));
      const bottom = intToRGBA(image.getPixelColor(16, 60));
      expect(top.r, `${variant} top is red`).toBeGreaterThan(200);
      expect(top.b).toBeLessThan(60);
      expect(bottom.b, `${variant} bottom is blue`).toBeGreaterThan(200);
      expect(bottom.r).toBeLessThan(60);
    }
    // The original is kept byte for byte, EXIF and all.
    const original = await request(ctx.app).get(url(f, `/photos/${photo!.id}/original`)).set('Cookie', ctx.cookie('viewer')).buffer(true);
    expect(Buffer.compare(original.body as Buffer, jpeg)).toBe(0);
    expect(original.headers['content-disposition']).toContain(`TH-1-photo-${photo!.id}.jpg`);
    const gps = await exifr.gps(original.body as Buffer);
    expect(gps.latitude).toBeCloseTo(LAT, 6);

    // Adding photos does not change the hole record: a crew's next edit of it is not stale.
    const holeNow = await request(ctx.app).get(url(f, `/holes/${f.hole.id}`)).set('Cookie', ctx.cookie('viewer'));
    expect(holeNow.body.version).toBe(f.hole.version);
    expect(holeNow.body.photoCount).toBe(2); // the fixture's photo and this one

    // Activity on the hole records the upload.
    const log = await request(ctx.app).get(url(f, `/holes/${f.hole.id}/activity`)).set('Cookie', ctx.cookie('viewer'));
    expect(log.body[0].action).toBe('photo-add');
    expect(log.body[0].changes.photos.after[0]).toMatchObject({ id: photo!.id, caption: 'Exposed main with tape', width: 32, height: 64 });
  });

  it('when the form sends its own position, the photo’s EXIF position still wins', async () => {
    const f = await makeFixtures(ctx);
    const jpeg = withExif(await twoToneJpeg(40, 30), { latitude: LAT, longitude: LON });
    const res = await upload(f).field('lat', '30.1').field('lon', '-97.2').field('accuracy', '8').attach('photos', jpeg, 'a.jpg');
    expect(res.status).toBe(201);
    expect(res.body[0].gpsSource).toBe('exif');
    expect(res.body[0].gpsLat).toBeCloseTo(LAT, 6);
    expect(res.body[0].gpsAccuracyMetres).toBeNull();
  });

  it('when the browser stripped EXIF, the form’s position, accuracy and time are kept and marked as from the device', async () => {
    const f = await makeFixtures(ctx);
    const res = await upload(f)
      .field('takenAt', '2026-11-04T08:01:02-06:00')
      .field('lat', '29.7601')
      .field('lon', '-95.3701')
      .field('accuracy', '6.5')
      .attach('photos', await twoToneJpeg(40, 30), 'stripped.jpg')
      .attach('photos', await plainPng(30, 20), 'marker.png');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toHaveLength(2);
    for (const p of res.body as PhotoDto[]) {
      expect(p).toMatchObject({ gpsSource: 'device', gpsLat: 29.7601, gpsLon: -95.3701, gpsAccuracyMetres: 6.5, takenAtSource: 'device', takenAt: '2026-11-04T14:01:02.000Z' });
    }
    await thumbnails.idle();
    const png = (res.body as PhotoDto[])[1]!;
    const thumb = await request(ctx.app).get(url(f, `/photos/${png.id}/thumbnail`)).set('Cookie', ctx.cookie('viewer')).buffer(true);
    expect(thumb.status).toBe(200);
    const image = await Jimp.read(thumb.body as Buffer);
    expect([image.bitmap.width, image.bitmap.height]).toEqual([30, 20]);
    // A PNG without orientation is already upright: its viewing copy is the original itself.
    const file = await request(ctx.app).get(url(f, `/photos/${png.id}/file`)).set('Cookie', ctx.cookie('viewer')).buffer(true);
    expect(file.headers['content-type']).toBe('image/png');
  });

  it('a large photo gets a viewing copy no larger than 2048 px and a 320 px thumbnail', async () => {
    const f = await makeFixtures(ctx);
    const big = await new Jimp({ width: 2200, height: 1100, color: 0x1f63c6ff }).getBuffer('image/jpeg', { quality: 70 });
    const res = await upload(f).attach('photos', big, 'wide.jpg');
    expect(res.status).toBe(201);
    await thumbnails.idle();
    const file = await Jimp.read((await request(ctx.app).get(url(f, `/photos/${res.body[0].id}/file`)).set('Cookie', ctx.cookie('viewer')).buffer(true)).body as Buffer);
    expect([file.bitmap.width, file.bitmap.height]).toEqual([2048, 1024]);
    const thumb = await Jimp.read((await request(ctx.app).get(url(f, `/photos/${res.body[0].id}/thumbnail`)).set('Cookie', ctx.cookie('viewer')).buffer(true)).body as Buffer);
    expect([thumb.bitmap.width, thumb.bitmap.height]).toEqual([320, 160]);
  });
});

describe('a photo that cannot be decoded', () => {
  it('is kept as sent but marked failed: the thumbnail says why and the file route serves the original', async () => {
    const f = await makeFixtures(ctx);
    const good = await twoToneJpeg(64, 64);
    // A real JPEG header (frame 64 × 64) followed by bytes that are not image data.
    const broken = Buffer.concat([good.subarray(0, 200), Buffer.alloc(300, 0x41)]);
    const res = await upload(f).attach('photos', broken, 'broken.jpg');
    expect(res.status).toBe(201);
    await thumbnails.idle();
    const list = await request(ctx.app).get(url(f, `/holes/${f.hole.id}/photos`)).set('Cookie', ctx.cookie('viewer'));
    expect(list.body.find((p: PhotoDto) => p.id === res.body[0].id).state).toBe('failed');
    const thumb = await request(ctx.app).get(url(f, `/photos/${res.body[0].id}/thumbnail`)).set('Cookie', ctx.cookie('viewer'));
    expect(thumb.status).toBe(404);
    expect(thumb.body.code).toBe('photo_unreadable');
    const file = await request(ctx.app).get(url(f, `/photos/${res.body[0].id}/file`)).set('Cookie', ctx.cookie('viewer')).buffer(true);
    expect(Buffer.compare(file.body as Buffer, broken)).toBe(0);
  });
});

describe('refused uploads leave no row and no file', () => {
  it('when a file is one byte over the size limit, then 413; at the limit it is taken', async () => {
    const jpeg = await twoToneJpeg(64, 32);
    const small = await makeTestApp({ photoMaxBytes: jpeg.length });
    try {
      const f = await makeFixtures(small);
      const before = { rows: await tableCounts(small.orm), keys: await small.storage.list('') };
      const over = await request(small.app)
        .post(url(f, `/holes/${f.hole.id}/photos`))
        .set('Cookie', small.cookie('field'))
        .attach('photos', Buffer.concat([jpeg, Buffer.from([0])]), 'big.jpg');
      expect(over.status).toBe(413);
      expect(over.body.detail).toMatch(/larger than/);
      expect(over.body.errors[0].path).toBe('photos');
      expect({ rows: await tableCounts(small.orm), keys: await small.storage.list('') }).toEqual(before);
      const at = await request(small.app).post(url(f, `/holes/${f.hole.id}/photos`)).set('Cookie', small.cookie('field')).attach('photos', jpeg, 'ok.jpg');
      expect(at.status).toBe(201);
      await thumbnails.idle();
    } finally {
      await small.close();
    }
  });

  it('when a file is a text file renamed .jpg, then 415 naming the file, and nothing is written', async () => {
    const f = await makeFixtures(ctx);
    const before = await snapshot();
    const res = await upload(f).attach('photos', Buffer.from('pothole notes: 4.5 ft to top\n'.repeat(20)), { filename: 'notes.jpg', contentType: 'image/jpeg' });
    expect(res.status).toBe(415);
    expect(res.body.errors[0]).toMatchObject({ path: 'photos.0' });
    expect(res.body.errors[0].message).toMatch(/not a JPEG or PNG/);
    expect(await snapshot()).toEqual(before);
  });

  it('when an SVG is sent, declared or disguised as a JPEG, then 415', async () => {
    const f = await makeFixtures(ctx);
    const before = await snapshot();
    const svg = Buffer.from('<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"><script>alert(1)</script></svg>');
    const declared = await upload(f).attach('photos', svg, { filename: 'drawing.svg', contentType: 'image/svg+xml' });
    expect(declared.status).toBe(415);
    const disguised = await upload(f).attach('photos', svg, { filename: 'drawing.jpg', contentType: 'image/jpeg' });
    expect(disguised.status).toBe(415);
    expect(await snapshot()).toEqual(before);
  });

  it('when a WebP is sent, then 415 saying to send JPEG (no WebP decoder is installed on the server)', async () => {
    const f = await makeFixtures(ctx);
    const canvas = createCanvas(16, 16);
    const webp = await canvas.encode('webp');
    const before = await snapshot();
    const res = await upload(f).attach('photos', webp, { filename: 'p.webp', contentType: 'image/webp' });
    expect(res.status).toBe(415);
    expect(res.body.errors[0].message).toMatch(/image\/webp content.*save or export the photo as JPEG/);
    expect(await snapshot()).toEqual(before);
  });

  it('when a tiny PNG claims 100000 × 100000 pixels (a decompression bomb), then 413 with the size, before any decoding', async () => {
    const f = await makeFixtures(ctx);
    const bomb = pngBomb(100_000, 100_000);
    expect(bomb.length).toBeLessThan(100);
    const before = await snapshot();
    const res = await upload(f).attach('photos', bomb, 'bomb.png');
    expect(res.status).toBe(413);
    expect(res.body.code).toBe('image_too_large');
    expect(res.body.errors[0].message).toContain('100000 × 100000 pixels (10,000 MP); the limit is 50 MP');
    expect(await snapshot()).toEqual(before);
  });

  it('when a JPEG frame header claims 65000 × 65000 pixels, then 413', async () => {
    const f = await makeFixtures(ctx);
    const before = await snapshot();
    const res = await upload(f).attach('photos', await jpegBomb(65_000, 65_000), 'bomb.jpg');
    expect(res.status).toBe(413);
    expect(res.body.errors[0].message).toContain('65000 × 65000');
    expect(await snapshot()).toEqual(before);
  });

  it('when one photo of a batch is bad, the whole batch is refused and none is stored', async () => {
    const f = await makeFixtures(ctx);
    const before = await snapshot();
    const res = await upload(f).attach('photos', await twoToneJpeg(20, 20), 'good.jpg').attach('photos', Buffer.from('GIF89a not really'), 'bad.jpg');
    expect(res.status).toBe(415);
    expect(res.body.errors[0].path).toBe('photos.1');
    expect(await snapshot()).toEqual(before);
  });

  it('when no file, too many files, a wrong field or a bad form field is sent, then a clear 400/413 and nothing is written', async () => {
    const f = await makeFixtures(ctx);
    const before = await snapshot();
    const none = await upload(f).field('caption', 'no photo');
    expect(none.status).toBe(400);
    expect(none.body.errors[0].path).toBe('photos');
    const jpeg = await twoToneJpeg(8, 8);
    let many = upload(f);
    for (let i = 0; i < 11; i++) many = many.attach('photos', jpeg, `p${i}.jpg`);
    const tooMany = await many;
    expect(tooMany.status).toBe(413);
    expect(tooMany.body.detail).toMatch(/At most 10 photos/);
    const wrongField = await upload(f).attach('picture', jpeg, 'p.jpg');
    expect(wrongField.status).toBe(400);
    expect(wrongField.body.detail).toMatch(/"photos"/);
    const badLat = await upload(f).field('lat', '200').field('lon', '10').attach('photos', jpeg, 'p.jpg');
    expect(badLat.status).toBe(400);
    expect(badLat.body.errors.map((e: { path: string }) => e.path)).toEqual(['lat']);
    const lonless = await upload(f).field('lat', '29.7').attach('photos', jpeg, 'p.jpg');
    expect(lonless.status).toBe(400);
    expect(lonless.body.errors[0].path).toBe('lon');
    expect(await snapshot()).toEqual(before);
  });

  it('when a field crew adds a photo to a hole someone else logged, then 403 before the upload is read', async () => {
    const f = await makeFixtures(ctx);
    const em = ctx.orm.em.fork();
    const other = await request(ctx.app)
      .post(url(f, '/holes'))
      .set('Cookie', ctx.cookie('designer'))
      .send({ clientId: randomUUID(), number: 'TH-9', lineId: f.line.id, positionSource: 'grid', easting: 3000100, northing: 13800030 });
    const before = await snapshot();
    const res = await upload(f, 'field', ctx.app, other.body.id).attach('photos', await twoToneJpeg(8, 8), 'p.jpg');
    expect(res.status).toBe(403);
    expect(await snapshot()).toEqual(before);
    expect(await em.count(Photo, { hole: other.body.id })).toBe(0);
  });
});

describe('a path-traversal file name', () => {
  let dir: string;
  beforeAll(() => {
    dir = mkdtempSync(join(tmpdir(), 'tl-photos-'));
  });
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  function filesUnder(root: string): string[] {
    return readdirSync(root, { recursive: true })
      .map(String)
      .filter((p) => statSync(join(root, p)).isFile())
      .map((p) => relative(root, join(root, p)).split('\\').join('/'))
      .sort();
  }

  it('is ignored: the file is stored under a server-made key inside the storage folder and nothing is written outside it', async () => {
    const root = join(dir, 'data', 'files');
    const storage = new DiskStorage(root);
    // Same database and users as the shared test app, but files on disk in a temporary folder.
    const app = createApp({ orm: ctx.orm, config: ctx.config, storage });
    const f = await makeFixtures(ctx);
    const before = filesUnder(dir);
    const names = ['../../../../escaped.jpg', '..\\..\\escaped2.jpg', '/etc/cron.d/escaped3.jpg', 'photos/../../../escaped4.jpg'];
    let req = request(app).post(url(f, `/holes/${f.hole.id}/photos`)).set('Cookie', ctx.cookie('field'));
    for (const name of names) req = req.attach('photos', await twoToneJpeg(16, 8), { filename: name, contentType: 'image/jpeg' });
    const res = await req;
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    await thumbnails.idle();
    const after = filesUnder(dir);
    const added = after.filter((p) => !before.includes(p));
    // Four originals and four thumbnails (16 × 8 with no orientation: the original is the viewing copy).
    expect(added).toHaveLength(8);
    const key = new RegExp(`^data/files/photos/${f.project.id}/[0-9a-f-]{36}(\\.thumb)?\\.jpg$`);
    for (const p of added) expect(p).toMatch(key);
    expect(after.some((p) => p.includes('escaped'))).toBe(false);
    expect(readdirSync(dir)).toEqual(['data']);
    expect(JSON.stringify(res.body)).not.toContain('escaped');
    for (const p of res.body as PhotoDto[]) expect(p.url).toMatch(new RegExp(`^/api/projects/${f.project.id}/photos/\\d+/file$`));
  });
});

describe('caption and removal', () => {
  it('the uploader changes the caption (logged on the hole); a surveyor who did not upload it may not', async () => {
    const f = await makeFixtures(ctx);
    const up = await upload(f).attach('photos', await twoToneJpeg(8, 8), 'p.jpg');
    const id = up.body[0].id as number;
    const denied = await request(ctx.app).patch(url(f, `/photos/${id}`)).set('Cookie', ctx.cookie('surveyor')).send({ caption: 'mine' });
    expect(denied.status).toBe(403);
    const viewer = await request(ctx.app).patch(url(f, `/photos/${id}`)).set('Cookie', ctx.cookie('viewer')).send({ caption: 'mine' });
    expect(viewer.status).toBe(403);
    const tooLong = await request(ctx.app).patch(url(f, `/photos/${id}`)).set('Cookie', ctx.cookie('field')).send({ caption: 'x'.repeat(301) });
    expect(tooLong.status).toBe(400);
    expect(tooLong.body.errors[0].path).toBe('caption');
    const ok = await request(ctx.app).patch(url(f, `/photos/${id}`)).set('Cookie', ctx.cookie('field')).send({ caption: 'Marker post set at the crossing' });
    expect(ok.status).toBe(200);
    expect(ok.body.caption).toBe('Marker post set at the crossing');
    const log = await request(ctx.app).get(url(f, `/holes/${f.hole.id}/activity`)).set('Cookie', ctx.cookie('viewer'));
    expect(log.body[0].action).toBe('photo-caption');
    expect(log.body[0].changes[`caption (photo ${id})`]).toEqual({ before: null, after: 'Marker post set at the crossing' });
    await thumbnails.idle();
  });

  it('deleting a photo removes its row and every stored file (original, viewing copy, thumbnail)', async () => {
    const f = await makeFixtures(ctx);
    const jpeg = withExif(await twoToneJpeg(24, 12), { orientation: 8 });
    const up = await upload(f).attach('photos', jpeg, 'p.jpg');
    await thumbnails.idle();
    const id = up.body[0].id as number;
    const photo = await ctx.orm.em.fork().findOneOrFail(Photo, id);
    expect(photo.displayKey).not.toBe(photo.fileKey); // orientation 8 needed an upright copy
    const keys = [photo.fileKey, photo.displayKey!, photo.thumbnailKey];
    for (const k of keys) expect(await ctx.storage.get(k)).not.toBeNull();
    const res = await request(ctx.app).delete(url(f, `/photos/${id}`)).set('Cookie', ctx.cookie('field'));
    expect(res.status).toBe(204);
    for (const k of keys) expect(await ctx.storage.get(k)).toBeNull();
    expect(await ctx.orm.em.fork().count(Photo, { id })).toBe(0);
    const log = await request(ctx.app).get(url(f, `/holes/${f.hole.id}/activity`)).set('Cookie', ctx.cookie('viewer'));
    expect(log.body[0]).toMatchObject({ action: 'photo-delete' });
    expect(log.body[0].changes.photo.before.id).toBe(id);
  });

  it('a photo deleted while its thumbnail is waiting leaves no file behind once the queue runs', async () => {
    const f = await makeFixtures(ctx);
    const release = holdQueue();
    const up = await upload(f).attach('photos', withExif(await twoToneJpeg(24, 12), { orientation: 6 }), 'p.jpg');
    const prefix = `photos/${f.project.id}/`;
    const keysWhileWaiting = await ctx.storage.list(prefix);
    expect(keysWhileWaiting.filter((k) => !k.includes('fixture'))).toHaveLength(1); // only the original so far
    await request(ctx.app).delete(url(f, `/photos/${up.body[0].id}`)).set('Cookie', ctx.cookie('field')).expect(204);
    release();
    await thumbnails.idle();
    expect((await ctx.storage.list(prefix)).filter((k) => !k.includes('fixture'))).toEqual([]);
  });
});
