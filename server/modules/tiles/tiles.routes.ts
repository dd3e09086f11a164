import { createHash, randomUUID } from 'node:crypto';
import { mkdirSync } from 'node:fs';
import { rename, rm } from 'node:fs/promises';
import { join } from 'node:path';
import type { Request, Response } from 'express';
import multer from 'multer';
import type { TilesetDto } from '@shared/api';
import { isValidTile } from '@shared/tiles';
import type { AppConfig } from '../../config';
import { AppError, badRequest, notFound } from '../../errors';
import { ApiRouter, type RouteMeta } from '../../http/api-router';
import { logActivity } from '../activity/activity.service';
import { CONTENT_TYPES, Mbtiles, MbtilesError } from './mbtiles';
import { TileStore } from './tile-store';

/** Largest MBTiles file an administrator may upload. */
export const MAX_TILESET_BYTES = 256 * 1024 * 1024;

/** Browsers keep a tile a day; the tile set's version in the URL changes when the file does. */
const TILE_CACHE_CONTROL = 'private, max-age=86400';

async function receiveFile(req: Request, res: Response, dir: string): Promise<Express.Multer.File | undefined> {
  if (!req.is('multipart/form-data')) return undefined;
  mkdirSync(dir, { recursive: true });
  const upload = multer({
    storage: multer.diskStorage({ destination: dir, filename: (_req, _file, cb) => cb(null, `${randomUUID()}.upload`) }),
    limits: { fileSize: MAX_TILESET_BYTES, files: 1, fields: 2, parts: 3 },
  }).single('file');
  return new Promise((resolve, reject) => {
    upload(req, res, (err: unknown) => {
      if (!err) return resolve(req.file);
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') {
          return reject(new AppError(413, 'too_large', `The file is larger than ${MAX_TILESET_BYTES / 1024 / 1024} MB.`));
        }
        return reject(badRequest('The upload is not valid.', [{ path: err.field ?? 'file', message: err.message }]));
      }
      reject(err);
    });
  });
}

function parseTileParams(params: Record<string, string>): { z: number; x: number; y: number } {
  const out = { z: NaN, x: NaN, y: NaN };
  const errors: { path: string; message: string }[] = [];
  for (const key of ['z', 'x', 'y'] as const) {
    const raw = params[key] ?? '';
    if (!/^\d{1,8}$/.test(raw)) errors.push({ path: key, message: 'must be a whole number' });
    else out[key] = Number(raw);
  }
  if (errors.length === 0 && !isValidTile(out.z, out.x, out.y)) {
    if (out.z > 24) errors.push({ path: 'z', message: 'must be from 0 to 24' });
    else {
      const n = 2 ** out.z;
      if (out.x >= n) errors.push({ path: 'x', message: `must be below ${n} at zoom ${out.z}` });
      if (out.y >= n) errors.push({ path: 'y', message: `must be below ${n} at zoom ${out.z}` });
    }
  }
  if (errors.length > 0) throw badRequest('This is not a tile address (z/x/y).', errors);
  return out;
}

/**
 * Base-map tiles of a project, read from its MBTiles file (see tile-store.ts for which file),
 * and the administrator's upload of a replacement.
 */
export function tileRoutes(registry: RouteMeta[], config: AppConfig, store = new TileStore(config.dataDir)): ApiRouter {
  const api = new ApiRouter('/api/projects/:projectId/tiles', registry, config);

  api.get('/', { access: 'project.read' }, async ({ project }): Promise<TilesetDto> => store.describe(project));

  api.get('/:z/:x/:y.png', { access: 'project.read' }, async ({ project, params, res }) => {
    const { z, x, y } = parseTileParams(params);
    let open;
    try {
      open = await store.open(project);
    } catch (e) {
      if (e instanceof MbtilesError) throw notFound('Tile');
      throw e;
    }
    if (!open) throw notFound('Tile');
    const data = await open.mbtiles.tile(z, x, y);
    if (!data) throw notFound('Tile');
    const etag = `"${createHash('sha1').update(data).digest('base64url')}"`;
    res.set({ 'Cache-Control': TILE_CACHE_CONTROL, ETag: etag, 'Content-Type': CONTENT_TYPES[open.mbtiles.info.format] });
    // Express answers 304 itself when If-None-Match carries this ETag.
    res.send(data);
  });

  api.post('/', { access: 'basemap.upload' }, async ({ em, project, user, req, res, status }): Promise<TilesetDto> => {
    const incoming = join(store.uploadDir, 'incoming');
    const file = await receiveFile(req, res, incoming);
    if (!file) throw badRequest('Choose an MBTiles file to upload.', [{ path: 'file', message: 'is required (an .mbtiles file)' }]);
    try {
      let checked: Mbtiles;
      try {
        checked = await Mbtiles.open(file.path);
      } catch (e) {
        if (e instanceof MbtilesError) throw badRequest(`This file is not a usable MBTiles tile set: ${e.message}.`, [{ path: 'file', message: e.message }]);
        throw e;
      }
      const info = checked.info;
      await checked.close();
      const before = await store.describe(project);
      const target = store.uploadedPath(project.id);
      await store.evict(target);
      await rename(file.path, target);
      logActivity(em, {
        project,
        user,
        entity: 'tileset',
        entityId: null,
        action: 'upload',
        before: before.available ? { source: before.source, name: before.name, tileCount: before.tileCount } : null,
        after: { source: 'uploaded', name: info.name, fileName: file.originalname, tileCount: info.tileCount, minZoom: info.minZoom, maxZoom: info.maxZoom, bounds: info.bounds },
      });
      await em.flush();
      status(201);
      return store.describe(project);
    } finally {
      await rm(file.path, { force: true });
    }
  });

  api.delete('/', { access: 'basemap.upload' }, async ({ em, project, user }) => {
    const target = store.uploadedPath(project.id);
    const before = await store.describe(project);
    if (before.source !== 'uploaded' && !(before.problem && store.locate(project)?.source === 'uploaded')) throw notFound('Uploaded base map');
    await store.evict(target);
    await rm(target, { force: true });
    logActivity(em, { project, user, entity: 'tileset', entityId: null, action: 'delete', before: { source: 'uploaded', name: before.name, tileCount: before.tileCount }, after: null });
    await em.flush();
  });

  return api;
}
