/**
 * The S3-compatible storage (issue 4): the same FileStorage contract as the disk folder,
 * tested against s3rver (a local fake S3 from npm) that this test starts on a free port, and a
 * photo upload going through it end to end. Configuration chooses the implementation.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import S3rver from 's3rver';
import { Jimp } from 'jimp';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '@server/app';
import { ConfigError, loadConfig } from '@server/config';
import { thumbnails } from '@server/modules/holes/photo-queue';
import { createStorage } from '@server/storage/create-storage';
import { S3Storage } from '@server/storage/s3-storage';
import { DiskStorage } from '@server/storage/storage';
import { twoToneJpeg, withExif } from './exif-fixture';
import { makeFixtures, makeTestApp, type TestContext } from './helpers';

const BUCKET = 'threadline-test';
let dir: string;
let server: S3rver;
let endpoint: string;
let storage: S3Storage;
let ctx: TestContext;

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'tl-s3-'));
  server = new S3rver({ address: '127.0.0.1', port: 0, silent: true, directory: dir, configureBuckets: [{ name: BUCKET }] });
  const address = await server.run();
  endpoint = `http://127.0.0.1:${address.port}`;
  // s3rver accepts the fixed credentials S3RVER / S3RVER (its documentation).
  storage = new S3Storage({ bucket: BUCKET, region: 'us-east-1', endpoint, accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' });
  ctx = await makeTestApp();
});

afterAll(async () => {
  await thumbnails.idle();
  storage?.close();
  await ctx?.close();
  await server?.close();
  rmSync(dir, { recursive: true, force: true });
});

describe('S3 storage against a local fake S3', () => {
  it('puts, gets, lists and deletes files by key; a missing key reads as null', async () => {
    const data = Buffer.from([0, 1, 2, 3, 254, 255]);
    await storage.put('roundtrip/1/a.jpg', data, 'image/jpeg');
    await storage.put('roundtrip/1/a.thumb.jpg', Buffer.from('thumb'), 'image/jpeg');
    await storage.put('roundtrip/2/b.jpg', Buffer.from('other project'), 'image/jpeg');
    expect(Buffer.compare((await storage.get('roundtrip/1/a.jpg'))!, data)).toBe(0);
    expect(await storage.list('roundtrip/1/')).toEqual(['roundtrip/1/a.jpg', 'roundtrip/1/a.thumb.jpg']);
    await storage.delete('roundtrip/1/a.jpg');
    expect(await storage.get('roundtrip/1/a.jpg')).toBeNull();
    expect(await storage.get('roundtrip/9/never.jpg')).toBeNull();
    await storage.delete('roundtrip/9/never.jpg'); // removing a missing file is not an error
    expect(await storage.list('roundtrip/')).toEqual(['roundtrip/1/a.thumb.jpg', 'roundtrip/2/b.jpg']);
  });

  it('refuses keys that are not server-made, as the disk storage does', async () => {
    await expect(storage.put('../escape.jpg', Buffer.from('x'), 'image/jpeg')).rejects.toThrow(/invalid storage key/);
    await expect(new DiskStorage(dir).put('../escape.jpg', Buffer.from('x'), 'image/jpeg')).rejects.toThrow(/invalid storage key/);
  });

  it('a photo uploaded through the app lands in the bucket, its thumbnail is served from it, and deleting it empties the bucket of it', async () => {
    const app = createApp({ orm: ctx.orm, config: ctx.config, storage });
    const f = await makeFixtures(ctx);
    const jpeg = withExif(await twoToneJpeg(40, 20), { orientation: 6 });
    const res = await request(app).post(`/api/projects/${f.project.id}/holes/${f.hole.id}/photos`).set('Cookie', ctx.cookie('field')).attach('photos', jpeg, 'p.jpg');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    await thumbnails.idle();
    const keys = await storage.list(`photos/${f.project.id}/`);
    expect(keys).toHaveLength(3); // original, upright copy, thumbnail
    const thumb = await request(app).get(`/api/projects/${f.project.id}/photos/${res.body[0].id}/thumbnail`).set('Cookie', ctx.cookie('viewer')).buffer(true);
    expect(thumb.status).toBe(200);
    const image = await Jimp.read(thumb.body as Buffer);
    expect([image.bitmap.width, image.bitmap.height]).toEqual([20, 40]);
    const original = await request(app).get(`/api/projects/${f.project.id}/photos/${res.body[0].id}/original`).set('Cookie', ctx.cookie('viewer')).buffer(true);
    expect(Buffer.compare(original.body as Buffer, jpeg)).toBe(0);
    await request(app).delete(`/api/projects/${f.project.id}/photos/${res.body[0].id}`).set('Cookie', ctx.cookie('field')).expect(204);
    expect(await storage.list(`photos/${f.project.id}/`)).toEqual([]);
  });
});

describe('choosing the storage from the environment', () => {
  it('STORAGE=s3 with a bucket gives the S3 storage; disk is the default', () => {
    const base = { NODE_ENV: 'test', DATA_DIR: dir, JWT_SECRET: 'x'.repeat(40) };
    const s3 = loadConfig({ ...base, STORAGE: 's3', S3_ENDPOINT: endpoint, S3_BUCKET: BUCKET, S3_ACCESS_KEY_ID: 'S3RVER', S3_SECRET_ACCESS_KEY: 'S3RVER' });
    expect(s3.storage).toEqual({ kind: 's3', endpoint, bucket: BUCKET, region: 'us-east-1', accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' });
    const chosen = createStorage(s3);
    expect(chosen).toBeInstanceOf(S3Storage);
    (chosen as S3Storage).close();
    expect(createStorage(loadConfig(base))).toBeInstanceOf(DiskStorage);
  });

  it('STORAGE=s3 without a bucket, or with half the credentials, refuses to start with a message', () => {
    const base = { NODE_ENV: 'test', DATA_DIR: dir, JWT_SECRET: 'x'.repeat(40) };
    expect(() => loadConfig({ ...base, STORAGE: 's3' })).toThrow(ConfigError);
    expect(() => loadConfig({ ...base, STORAGE: 's3' })).toThrow(/S3_BUCKET/);
    expect(() => loadConfig({ ...base, STORAGE: 's3', S3_BUCKET: BUCKET, S3_ACCESS_KEY_ID: 'only-one' })).toThrow(/S3_SECRET_ACCESS_KEY/);
    expect(() => loadConfig({ ...base, STORAGE: 'ftp' })).toThrow(/STORAGE/);
  });
});
