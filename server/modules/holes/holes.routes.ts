import { UniqueConstraintViolationException, type EntityManager } from '@mikro-orm/sqlite';
import type { ActivityDto, HoleDto, PhotoDto } from '@shared/api';
import { holeCreateSchema, holeReviewSchema, holeSurveySchema, holeUpdateSchema } from '@shared/schemas/hole';
import type { AppConfig } from '../../config';
import { AppError, badRequest, conflict, notFound } from '../../errors';
import { createAudited, deleteAudited, updateAudited } from '../../http/audited';
import { ApiRouter, idOf, type RouteMeta } from '../../http/api-router';
import { recompute } from '../clearances/recompute-hook';
import type { FileStorage } from '../../storage/storage';
import { UtilityLine } from '../lines/utility-line.entity';
import type { Project } from '../projects/project.entity';
import { User } from '../users/user.entity';
import { presentHole, presentPhoto } from './hole.presenter';
import { assertCanEdit, resolvePosition, statusAfterLogging, unidentifiedLineAtHole } from './holes.service';
import { ActivityEntry } from '../activity/activity-entry.entity';
import { logActivity } from '../activity/activity.service';
import { presentLine } from '../lines/line.presenter';
import { Photo } from './photo.entity';
import { addPhotoRoutes } from './photos.routes';
import { photoKeys } from './photos.service';
import { addSheetRoutes } from './hole-sheet.routes';
import { addSurveyImportRoutes } from './survey-import.routes';
import { TestHole } from './test-hole.entity';

async function photoCounts(em: EntityManager, holeIds: number[]): Promise<Map<number, number>> {
  const counts = new Map<number, number>();
  if (holeIds.length === 0) return counts;
  const placeholders = holeIds.map(() => '?').join(',');
  const rows = await em
    .getConnection()
    .execute<{ hole_id: number; n: number }[]>(`select hole_id, count(*) as n from photos where hole_id in (${placeholders}) group by hole_id`, holeIds);
  for (const row of rows) counts.set(Number(row.hole_id), Number(row.n));
  return counts;
}

/** Photo counts of every hole of a project, in one grouped query. */
async function projectPhotoCounts(em: EntityManager, projectId: number): Promise<Map<number, number>> {
  const rows = await em
    .getConnection()
    .execute<{ hole_id: number; n: number }[]>(
      'select p.hole_id, count(*) as n from photos p join test_holes h on h.id = p.hole_id where h.project_id = ? group by p.hole_id',
      [projectId],
    );
  return new Map(rows.map((r) => [Number(r.hole_id), Number(r.n)]));
}

/** A query-builder row shaped like the entity for the presenter (relations as `{ id }`). */
function holeFromRow(row: Record<string, unknown>): TestHole {
  const ref = (v: unknown) => (v == null ? null : { id: Number(v) });
  const date = (v: unknown) => (v == null ? null : new Date(v as string | Date));
  return {
    ...row,
    project: ref(row.project),
    line: ref(row.line),
    bore: ref(row.bore),
    createdBy: ref(row.createdBy),
    dugAt: date(row.dugAt),
    createdAt: date(row.createdAt),
    updatedAt: date(row.updatedAt),
  } as unknown as TestHole;
}

/** The hole a client id already made in this project (a replay), or null; 409 when another project used the id. */
async function replayOf(em: EntityManager, project: Project, clientId: string): Promise<HoleDto | null> {
  const existing = await em.findOne(TestHole, { clientId }, { populate: ['project'] });
  if (!existing) return null;
  if (existing.project.id !== project.id) throw conflict('This client id is already used by another record.');
  return presentHole(existing, (await photoCounts(em, [existing.id])).get(existing.id) ?? 0);
}

async function findHole(em: EntityManager, project: Project, params: Record<string, string>): Promise<TestHole> {
  const hole = await em.findOne(TestHole, { id: idOf(params, 'holeId', 'Test hole'), project }, { populate: ['line', 'bore', 'createdBy'] });
  if (!hole) throw notFound('Test hole');
  return hole;
}

async function findLine(em: EntityManager, project: Project, lineId: number): Promise<UtilityLine> {
  const line = await em.findOne(UtilityLine, { id: lineId, project });
  if (!line) throw badRequest('The line is not in this project.', [{ path: 'lineId', message: 'no such line in this project' }]);
  return line;
}

/** Test holes: the crew's log, the surveyor's tie-in and the designer's review. */
export function holeRoutes(registry: RouteMeta[], config: AppConfig, storage: FileStorage): ApiRouter {
  const api = new ApiRouter('/api/projects/:projectId', registry, config);

  api.get('/holes', { access: 'project.read' }, async ({ em, project }): Promise<HoleDto[]> => {
    // Plain rows, not entities: the map asks for every hole of a corridor at once (2.5× faster at 20,000).
    const [rows, counts] = await Promise.all([
      em.createQueryBuilder(TestHole).select('*').where({ project: project.id }).orderBy({ number: 'asc', id: 'asc' }).execute('all'),
      projectPhotoCounts(em, project.id),
    ]);
    return rows.map((row) => presentHole(holeFromRow(row as unknown as Record<string, unknown>), counts.get(Number(row.id)) ?? 0));
  });

  // A line on no record may come with the hole (`newLine`): the crew that exposes it logs it on
  // the spot, with or without signal. The line and the hole are made in one transaction, each
  // with its activity entry; a replay of the client id answers the hole already made (200) and
  // makes no second line. Field crews may do this here though they cannot use POST /lines.
  api.post('/holes', { access: 'hole.create', body: holeCreateSchema }, async ({ em, project, user, body, status }) => {
    // A retried create (same client-made id) answers with the record already made.
    const replayed = await replayOf(em, project, body.clientId);
    if (replayed) return replayed;
    const line = body.lineId != null ? await findLine(em, project, body.lineId) : null;
    const position = await resolvePosition(em, project, body);
    const { clientId, lineId: _lineId, newLine, boreId: _boreId, dugAt, ...fields } = body;
    let dto: HoleDto;
    try {
      dto = await createAudited(
        { em, project, user, entity: 'hole', after: recompute(project, user) },
        async (tem) => {
          let exposed = line;
          if (!exposed) {
            exposed = unidentifiedLineAtHole(project, newLine!, body, position);
            await tem.persistAndFlush(exposed);
            logActivity(tem, { project, user, entity: 'line', entityId: exposed.id, action: 'create', before: null, after: presentLine(exposed) });
          }
          const hole = new TestHole(project, exposed, clientId, body.number, position.easting, position.northing);
          Object.assign(hole, fields, position, { dugAt: dugAt ? new Date(dugAt) : null, createdBy: tem.getReference(User, user.id) });
          hole.status = statusAfterLogging(hole, body);
          return hole;
        },
        (h) => presentHole(h),
      );
    } catch (err) {
      // Two sends of the same record at once: the other one made it first (the unique client id
      // refused this one, and its transaction, line included, was rolled back).
      if (err instanceof UniqueConstraintViolationException) {
        const other = await replayOf(em.fork(), project, body.clientId);
        if (other) return other;
      }
      throw err;
    }
    status(201);
    return dto;
  });

  api.get('/holes/:holeId', { access: 'project.read' }, async ({ em, project, params }) => {
    const hole = await findHole(em, project, params);
    return presentHole(hole, (await photoCounts(em, [hole.id])).get(hole.id) ?? 0);
  });

  api.patch('/holes/:holeId', { access: 'hole.update', body: holeUpdateSchema }, async ({ em, project, user, params, body }) => {
    const hole = await findHole(em, project, params);
    assertCanEdit(user, hole);
    const { version, lineId, boreId: _boreId, dugAt, ...fields } = body;
    const line = lineId !== undefined ? await findLine(em, project, lineId) : null;
    const positional = (['easting', 'northing', 'boreId', 'station', 'offset', 'offsetSide', 'gpsAccuracy'] as const).filter((k) => body[k] !== undefined);
    if (body.positionSource === undefined && positional.length > 0) {
      throw badRequest('Say where the new position comes from.', [{ path: 'positionSource', message: `is required when changing ${positional.join(', ')}` }]);
    }
    const position = body.positionSource !== undefined ? await resolvePosition(em, project, { ...body, positionSource: body.positionSource }) : null;
    const photos = (await photoCounts(em, [hole.id])).get(hole.id) ?? 0;
    return updateAudited(
      { em, project, user, entity: 'hole' , after: recompute(project, user) },
      hole,
      version,
      (h) => {
        Object.assign(h, fields);
        if (position) Object.assign(h, position);
        if (line) h.line = line;
        if (dugAt !== undefined) h.dugAt = dugAt ? new Date(dugAt) : null;
        h.status = statusAfterLogging(h, body);
      },
      (h) => presentHole(h, photos),
    );
  });

  api.delete('/holes/:holeId', { access: 'hole.delete' }, async ({ em, project, user, params }) => {
    const hole = await findHole(em, project, params);
    assertCanEdit(user, hole);
    const keys = (await em.find(Photo, { hole })).flatMap(photoKeys);
    await deleteAudited({ em, project, user, entity: 'hole' , after: recompute(project, user) }, hole, (h) => presentHole(h));
    await Promise.all(keys.map((k) => storage.delete(k)));
  });

  api.put('/holes/:holeId/survey', { access: 'hole.survey', body: holeSurveySchema }, async ({ em, project, user, params, body }) => {
    const hole = await findHole(em, project, params);
    if (hole.status === 'reviewed') throw new AppError(409, 'locked', `Test hole ${hole.number} is reviewed and locked.`);
    const { version, ...fields } = body;
    const photos = (await photoCounts(em, [hole.id])).get(hole.id) ?? 0;
    return updateAudited(
      { em, project, user, entity: 'hole' , after: recompute(project, user) },
      hole,
      version,
      (h) => {
        Object.assign(h, fields);
        const surveyed = h.surveyedTopElevation != null && h.surveyedEasting != null && h.surveyedNorthing != null;
        if (surveyed && (h.status === 'dug' || h.status === 'planned')) h.status = 'surveyed';
      },
      (h) => presentHole(h, photos),
      'survey',
    );
  });

  api.post('/holes/:holeId/review', { access: 'hole.review', body: holeReviewSchema }, async ({ em, project, user, params, body }) => {
    const hole = await findHole(em, project, params);
    const photos = (await photoCounts(em, [hole.id])).get(hole.id) ?? 0;
    if (body.decision === 'accept' && hole.status !== 'surveyed' && hole.status !== 'dug') {
      throw new AppError(409, 'wrong_state', `Only a dug or surveyed hole can be accepted; ${hole.number} is ${hole.status}.`);
    }
    if (body.decision === 'send_back' && hole.status === 'planned') {
      throw new AppError(409, 'wrong_state', `Test hole ${hole.number} has not been dug yet.`);
    }
    if (body.decision === 'reopen' && hole.status !== 'reviewed') {
      throw new AppError(409, 'wrong_state', `Only a reviewed hole can be reopened; ${hole.number} is ${hole.status}.`);
    }
    return updateAudited(
      { em, project, user, entity: 'hole' , after: recompute(project, user) },
      hole,
      body.version,
      (h) => {
        if (body.decision === 'accept') {
          h.status = 'reviewed';
          h.reviewNote = null;
        } else if (body.decision === 'send_back') {
          h.status = 'dug';
          h.reviewNote = body.reason;
        } else {
          h.status = h.surveyedTopElevation != null ? 'surveyed' : 'dug';
          h.reviewNote = body.reason;
        }
      },
      (h) => presentHole(h, photos),
      body.decision,
    );
  });

  api.get('/holes/:holeId/photos', { access: 'project.read' }, async ({ em, project, params }): Promise<PhotoDto[]> => {
    const hole = await findHole(em, project, params);
    return (await em.find(Photo, { hole }, { orderBy: { id: 'asc' } })).map((p) => presentPhoto(p, project.id));
  });

  // `file` is the upright copy for viewing, `thumbnail` the upright thumbnail, `original` the
  // file exactly as uploaded. While the copies are being made (just after an upload), `file`
  // and `thumbnail` answer 404 with code `photo_processing` and Retry-After; the client shows
  // a placeholder and asks again (PhotoDto.state says the same).
  for (const variant of ['file', 'thumbnail', 'original'] as const) {
    api.get(`/photos/:photoId/${variant}`, { access: 'project.read' }, async ({ em, project, params, res }) => {
      const photo = await em.findOne(Photo, { id: idOf(params, 'photoId', 'Photo'), hole: { project } }, { populate: ['hole'] });
      if (!photo) throw notFound('Photo');
      let key: string;
      let type: string;
      if (variant === 'original' || (variant === 'file' && photo.state === 'failed')) {
        key = photo.fileKey;
        type = photo.mimeType;
      } else if (photo.state === 'processing') {
        res.set('Retry-After', '1').set('Cache-Control', 'no-store');
        throw new AppError(404, 'photo_processing', 'The photo is still being prepared. Try again in a moment.');
      } else if (variant === 'thumbnail') {
        if (photo.state === 'failed') throw new AppError(404, 'photo_unreadable', 'This photo could not be decoded, so it has no thumbnail. Download the original.');
        key = photo.thumbnailKey;
        type = 'image/jpeg';
      } else {
        key = photo.displayKey ?? photo.fileKey;
        type = key === photo.fileKey ? photo.mimeType : 'image/jpeg';
      }
      const data = await storage.get(key);
      if (!data) throw notFound('Photo file');
      res.set('Cache-Control', 'private, max-age=86400, immutable').type(type);
      if (variant === 'original') {
        const ext = photo.fileKey.slice(photo.fileKey.lastIndexOf('.') + 1);
        const safeNumber = photo.hole.number.replace(/[^A-Za-z0-9._-]+/g, '_');
        res.attachment(`${safeNumber}-photo-${photo.id}.${ext}`);
      }
      res.send(data);
    });
  }

  addPhotoRoutes(api, config, storage);

  api.get('/holes/:holeId/activity', { access: 'project.read' }, async ({ em, project, params }): Promise<ActivityDto[]> => {
    const hole = await findHole(em, project, params);
    const entries = await em.find(
      ActivityEntry,
      { project, entity: 'hole', entityId: hole.id },
      { populate: ['user'], orderBy: { createdAt: 'desc', id: 'desc' }, limit: 500 },
    );
    return entries.map((a) => ({
      id: a.id,
      projectId: project.id,
      userId: a.user?.id ?? null,
      userName: a.user?.name ?? null,
      entity: a.entity,
      entityId: a.entityId,
      action: a.action,
      changes: a.changes,
      at: a.createdAt.toISOString(),
    }));
  });

  addSurveyImportRoutes(api);
  addSheetRoutes(api, storage);

  return api;
}
