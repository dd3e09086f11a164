import { randomUUID } from 'node:crypto';
import { UniqueConstraintViolationException, type EntityManager } from '@mikro-orm/sqlite';
import exifr from 'exifr';
import { Jimp } from 'jimp';
import type { Logger } from 'pino';
import type { PhotoDto } from '@shared/api';
import type { PhotoUploadFields } from '@shared/schemas/photo';
import { AppError, badRequest, forbidden } from '../../errors';
import { logActivity } from '../activity/activity.service';
import { Project } from '../projects/project.entity';
import { User } from '../users/user.entity';
import type { FileStorage } from '../../storage/storage';
import { presentPhoto } from './hole.presenter';
import { inspectImage } from './photo-image';
import { thumbnails } from './photo-queue';
import { THUMBNAIL_SIZE } from './photo-files';
import { Photo } from './photo.entity';
import { TestHole } from './test-hole.entity';

/** Longest side of the upright copy served for viewing and printing. */
export const DISPLAY_SIZE = 2048;

/** The few facts of a photo the activity log keeps. */
export function photoSummary(p: Photo) {
  return { id: p.id, caption: p.caption ?? null, takenAt: p.takenAt?.toISOString() ?? null, gpsLat: p.gpsLat ?? null, gpsLon: p.gpsLon ?? null, width: p.width, height: p.height };
}

/** Reviewed holes take no new photos and no photo changes; a designer reopens them first. */
export function assertHoleOpen(hole: TestHole): void {
  if (hole.status === 'reviewed') {
    throw new AppError(409, 'locked', `Test hole ${hole.number} is reviewed and locked. A designer must reopen it, with a reason, before its photos can change.`);
  }
}

/** Field crews add photos only to the holes they logged. */
export function assertCanUpload(user: User, hole: TestHole): void {
  assertHoleOpen(hole);
  if (user.role === 'field' && hole.createdBy?.id !== user.id) {
    throw forbidden('Field crews may add photos only to the test holes they logged.');
  }
}

/** Designers and admins change any photo; others only photos they uploaded (field crews also those on their own holes). */
export function assertCanChangePhoto(user: User, photo: Photo): void {
  assertHoleOpen(photo.hole);
  if (user.role === 'admin' || user.role === 'designer') return;
  const own = photo.uploadedBy?.id === user.id;
  const ownHole = user.role === 'field' && photo.hole.createdBy?.id === user.id;
  if (!own && !ownHole) throw forbidden('You may change only the photos you uploaded.');
}

export interface UploadedFile {
  buffer: Buffer;
}

/**
 * Check every file, store the originals under server-made keys, write the rows and the activity
 * entry in one transaction, and queue the upright copies and thumbnails. Any refusal or failure
 * leaves no row and no file. A file whose client id the hole already has is not stored again:
 * the kept photo stands for it in the answer.
 */
export async function receivePhotos(args: {
  em: EntityManager;
  storage: FileStorage;
  project: Project;
  user: User;
  hole: TestHole;
  files: UploadedFile[];
  fields: PhotoUploadFields;
  maxPixels: number;
  logger: Logger;
}): Promise<ReceivedPhotos> {
  const { em, storage, project, user, hole, files, fields } = args;
  const clientIds = fields.clientId;
  if (clientIds && clientIds.length !== files.length) {
    throw badRequest('Send one client id per photo.', [{ path: 'clientId', message: `${clientIds.length} client ids for ${files.length} photos; send one per photo, in the order of the files` }]);
  }
  // Photos this hole already has by their client-made ids (a resent upload) are not stored again.
  const known = await keptByClientId(em, hole.id, clientIds);
  const fresh = files.map((_, i) => i).filter((i) => !known.has(clientIds?.[i] ?? ''));
  if (fresh.length === 0) return { photos: clientIds!.map((c) => presentPhoto(known.get(c)!, project.id)), created: false };

  const inspected = [];
  for (const i of fresh) inspected.push(await inspectImage(files[i]!.buffer, `photos.${i}`, args.maxPixels));

  const written: string[] = [];
  let photos: Photo[];
  try {
    const planned = inspected.map((info, n) => {
      const id = randomUUID();
      const i = fresh[n]!;
      return { info, data: files[i]!.buffer, clientId: clientIds?.[i] ?? null, fileKey: `photos/${project.id}/${id}.${info.ext}`, thumbnailKey: `photos/${project.id}/${id}.thumb.jpg` };
    });
    for (const p of planned) {
      await storage.put(p.fileKey, p.data, p.info.mime);
      written.push(p.fileKey);
    }
    // A clean unit of work holding only references: nothing loaded elsewhere (the hole, the
    // project, the user) is flushed along with the photos, so their versions stay as they are.
    photos = await em.fork().transactional(async (tem) => {
      const made = planned.map((p) => {
        const photo = new Photo(tem.getReference(TestHole, hole.id), {
          fileKey: p.fileKey,
          thumbnailKey: p.thumbnailKey,
          mimeType: p.info.mime,
          width: p.info.width,
          height: p.info.height,
          byteSize: p.data.length,
        });
        photo.state = 'processing';
        photo.clientId = p.clientId;
        photo.caption = fields.caption ?? null;
        photo.uploadedBy = tem.getReference(User, user.id);
        // Capture time: EXIF with its time zone first; the form's own exact time next; EXIF
        // without a zone (read in the server's zone) last.
        const exifTime = p.info.exifTakenAt;
        if (exifTime?.hasOffset) {
          photo.takenAt = exifTime.at;
          photo.takenAtSource = 'exif';
        } else if (fields.takenAt) {
          photo.takenAt = new Date(fields.takenAt);
          photo.takenAtSource = 'device';
        } else if (exifTime) {
          photo.takenAt = exifTime.at;
          photo.takenAtSource = 'exif';
        }
        // Position: the photo's own EXIF GPS when present, else the form's fix (browsers strip EXIF GPS).
        if (p.info.exifGps) {
          photo.gpsLat = p.info.exifGps.lat;
          photo.gpsLon = p.info.exifGps.lon;
          photo.gpsSource = 'exif';
        } else if (fields.lat !== undefined && fields.lon !== undefined) {
          photo.gpsLat = fields.lat;
          photo.gpsLon = fields.lon;
          photo.gpsAccuracy = fields.accuracy ?? null;
          photo.gpsSource = 'device';
        }
        tem.persist(photo);
        return photo;
      });
      await tem.flush();
      logActivity(tem, {
        project: tem.getReference(Project, project.id),
        user: tem.getReference(User, user.id),
        entity: 'hole',
        entityId: hole.id,
        action: 'photo-add',
        before: { photos: null },
        after: { photos: made.map(photoSummary) },
      });
      await tem.flush();
      return made;
    });
  } catch (err) {
    await Promise.allSettled(written.map((k) => storage.delete(k)));
    // The same photo sent twice at once: the other upload kept it first, and this one's files
    // are gone again. Answer with what is kept when every photo of this upload is there.
    if (err instanceof UniqueConstraintViolationException && clientIds) {
      const now = await keptByClientId(em.fork(), hole.id, clientIds);
      if (clientIds.every((c) => now.has(c))) return { photos: clientIds.map((c) => presentPhoto(now.get(c)!, project.id)), created: false };
    }
    throw err;
  }
  queueCopies(em.fork(), storage, photos.map((p) => p.id), args.logger);
  // In the order of the files: photos already kept where their ids were known, the new ones elsewhere.
  const made = new Map(fresh.map((i, n) => [i, photos[n]!]));
  return { photos: files.map((_, i) => presentPhoto(made.get(i) ?? known.get(clientIds![i]!)!, project.id)), created: true };
}

/**
 * Queue the upright copies and thumbnails of stored photos. Kept outside `receivePhotos` on
 * purpose: a job made there would close over its scope, which holds the upload's buffers, and
 * every photo waiting in the queue kept its ~5 MB original alive (arrayBuffers climbed by about
 * 5 MB per queued photo in the 50-upload run). The jobs here hold only ids; the original is read
 * back from storage when its turn comes.
 */
function queueCopies(base: EntityManager, storage: FileStorage, photoIds: readonly number[], logger: Logger): void {
  for (const id of photoIds) thumbnails.add(() => processPhoto(base, storage, id, logger));
}

export interface ReceivedPhotos {
  /** One photo per file sent, in order. */
  photos: PhotoDto[];
  /** False when every photo was already kept (a resent upload): nothing was stored. */
  created: boolean;
}

/** The hole's photos with one of the given client ids, by client id. */
async function keptByClientId(em: EntityManager, holeId: number, clientIds: readonly string[] | undefined): Promise<Map<string, Photo>> {
  if (!clientIds || clientIds.length === 0) return new Map();
  const rows = await em.fork().find(Photo, { hole: holeId, clientId: { $in: [...clientIds] } }, { populate: ['hole'] });
  return new Map(rows.map((p) => [p.clientId!, p]));
}

/**
 * Make the upright copy and the thumbnail of one stored photo. Jimp applies the EXIF
 * orientation to the pixels when it reads a JPEG (and its output carries no EXIF), so both are
 * upright whatever the camera wrote. A photo that cannot be decoded is marked `failed`.
 */
export async function processPhoto(baseEm: EntityManager, storage: FileStorage, photoId: number, logger: Logger): Promise<void> {
  const em = baseEm.fork();
  const photo = await em.findOne(Photo, photoId);
  if (!photo || photo.state !== 'processing') return;
  const written: string[] = [];
  try {
    const data = await storage.get(photo.fileKey);
    if (!data) throw new Error(`original ${photo.fileKey} is missing`);
    const image = await Jimp.read(data);
    const rotated = image.bitmap.width !== photo.width || image.bitmap.height !== photo.height;
    if (rotated && (image.bitmap.width !== photo.height || image.bitmap.height !== photo.width)) {
      throw new Error(`decoded size ${image.bitmap.width}×${image.bitmap.height} does not match the header`);
    }
    if (photo.mimeType === 'image/png') {
      // Transparent pixels would turn black in a JPEG: blend them onto white.
      const px = image.bitmap.data;
      for (let i = 0; i < px.length; i += 4) {
        const a = px[i + 3]! / 255;
        if (a === 1) continue;
        px[i] = Math.round(px[i]! * a + 255 * (1 - a));
        px[i + 1] = Math.round(px[i + 1]! * a + 255 * (1 - a));
        px[i + 2] = Math.round(px[i + 2]! * a + 255 * (1 - a));
        px[i + 3] = 255;
      }
    }
    const orientation = photo.mimeType === 'image/jpeg' ? ((await exifr.orientation(data).catch(() => 1)) ?? 1) : 1;
    let displayKey = photo.fileKey;
    const longest = Math.max(image.bitmap.width, image.bitmap.height);
    if (orientation !== 1 || longest > DISPLAY_SIZE) {
      if (longest > DISPLAY_SIZE) image.scaleToFit({ w: DISPLAY_SIZE, h: DISPLAY_SIZE });
      displayKey = photo.fileKey.replace(/\.[a-z]+$/, '.view.jpg');
      await storage.put(displayKey, await image.getBuffer('image/jpeg', { quality: 88 }), 'image/jpeg');
      written.push(displayKey);
    }
    if (image.bitmap.width > THUMBNAIL_SIZE || image.bitmap.height > THUMBNAIL_SIZE) image.scaleToFit({ w: THUMBNAIL_SIZE, h: THUMBNAIL_SIZE });
    await storage.put(photo.thumbnailKey, await image.getBuffer('image/jpeg', { quality: 80 }), 'image/jpeg');
    written.push(photo.thumbnailKey);
    photo.displayKey = displayKey;
    photo.state = 'ready';
  } catch (err) {
    logger.warn({ err, photoId }, 'photo could not be processed');
    photo.state = 'failed';
  }
  await em.flush();
  // Deleted while this job ran: remove what it wrote.
  if ((await baseEm.fork().count(Photo, { id: photoId })) === 0) {
    await Promise.allSettled(written.map((k) => storage.delete(k)));
  }
}

/** After a restart: queue the photos whose copies were not made before the server stopped. */
export async function requeuePendingPhotos(baseEm: EntityManager, storage: FileStorage, logger: Logger): Promise<number> {
  const pending = await baseEm.fork().find(Photo, { state: 'processing' }, { fields: ['id'] });
  for (const p of pending) thumbnails.add(() => processPhoto(baseEm, storage, p.id, logger));
  return pending.length;
}

/** Every stored file of a photo (original, upright copy, thumbnail). */
export function photoKeys(p: Pick<Photo, 'fileKey' | 'thumbnailKey' | 'displayKey'>): string[] {
  return [...new Set([p.fileKey, p.thumbnailKey, p.displayKey].filter((k): k is string => Boolean(k)))];
}
