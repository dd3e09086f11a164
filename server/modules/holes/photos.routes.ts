import type { Request, Response } from 'express';
import type { EntityManager } from '@mikro-orm/sqlite';
import multer, { MulterError } from 'multer';
import pLimit from 'p-limit';
import type { Logger } from 'pino';
import type { PhotoDto } from '@shared/api';
import { photoUpdateSchema, photoUploadFieldsSchema } from '@shared/schemas/photo';
import type { AppConfig } from '../../config';
import { AppError, badRequest, notFound, zodProblemErrors } from '../../errors';
import { idOf, type ApiRouter } from '../../http/api-router';
import { logActivity } from '../activity/activity.service';
import type { FileStorage } from '../../storage/storage';
import { presentPhoto } from './hole.presenter';
import { assertCanChangePhoto, assertCanUpload, photoKeys, photoSummary, receivePhotos } from './photos.service';
import { Photo } from './photo.entity';
import { TestHole } from './test-hole.entity';
import { Project } from '../projects/project.entity';
import { User } from '../users/user.entity';

/** At most this many photos in one upload. */
export const MAX_PHOTOS_PER_UPLOAD = 10;

const mb = (bytes: number) => `${(bytes / (1024 * 1024)).toLocaleString('en-US', { maximumFractionDigits: 1 })} MB`;

/**
 * The multipart parser: memory storage (nothing touches the disk before the bytes are checked),
 * every limit set, and a synchronous file filter that takes files only from the `photos` field
 * and refuses a declared SVG at once (the real type is checked from the bytes afterwards).
 */
function photoUploader(config: AppConfig) {
  return multer({
    storage: multer.memoryStorage(),
    limits: {
      fileSize: config.photoMaxBytes,
      files: MAX_PHOTOS_PER_UPLOAD,
      fields: 20,
      parts: 40,
      fieldSize: 4096,
      fieldNameSize: 100,
      headerPairs: 100,
    },
    fileFilter: (_req, file, cb) => {
      if (file.fieldname !== 'photos') {
        cb(new AppError(400, 'unexpected_field', 'Photos go in the form field "photos".', { errors: [{ path: file.fieldname.slice(0, 100), message: 'files are taken only from the field "photos"' }] }));
        return;
      }
      if (file.mimetype === 'image/svg+xml') {
        cb(new AppError(415, 'unsupported_type', 'Only JPEG and PNG photos can be uploaded.', { errors: [{ path: 'photos', message: 'SVG drawings are refused; send a JPEG or PNG photo' }] }));
        return;
      }
      cb(null, true);
    },
  }).array('photos');
}

/** Turn multer's errors into problem details with a clear message. */
function uploadProblem(err: unknown, config: AppConfig): unknown {
  if (!(err instanceof MulterError)) {
    if (err instanceof AppError) return err;
    const message = err instanceof Error ? err.message : 'the multipart body could not be read';
    return new AppError(400, 'malformed_upload', 'The upload could not be read. Send the photos as multipart/form-data in the field "photos".', {
      errors: [{ path: 'photos', message }],
    });
  }
  switch (err.code) {
    case 'LIMIT_FILE_SIZE':
      return new AppError(413, 'too_large', `A photo is larger than ${mb(config.photoMaxBytes)}.`, {
        errors: [{ path: 'photos', message: `each photo may be at most ${mb(config.photoMaxBytes)}; nothing was saved` }],
      });
    case 'LIMIT_FILE_COUNT':
      return new AppError(413, 'too_many_files', `At most ${MAX_PHOTOS_PER_UPLOAD} photos in one upload.`, {
        errors: [{ path: 'photos', message: `send at most ${MAX_PHOTOS_PER_UPLOAD} photos at a time; nothing was saved` }],
      });
    case 'LIMIT_PART_COUNT':
    case 'LIMIT_FIELD_COUNT':
      return new AppError(413, 'too_many_parts', 'The upload has too many form fields.', { errors: [{ path: '(body)', message: err.message }] });
    case 'LIMIT_FIELD_KEY':
    case 'LIMIT_FIELD_VALUE':
      return new AppError(413, 'field_too_large', 'A form field is too long.', { errors: [{ path: err.field ?? '(body)', message: err.message }] });
    case 'LIMIT_UNEXPECTED_FILE':
      return new AppError(400, 'unexpected_field', 'Photos go in the form field "photos".', {
        errors: [{ path: err.field ?? '(body)', message: 'files are taken only from the field "photos"' }],
      });
    default:
      return new AppError(400, 'malformed_upload', 'The upload could not be read.', { errors: [{ path: 'photos', message: err.message }] });
  }
}

function parseMultipart(req: Request, res: Response, config: AppConfig): Promise<void> {
  const upload = photoUploader(config);
  return new Promise((resolve, reject) => {
    upload(req, res, (err: unknown) => (err ? reject(uploadProblem(err, config)) : resolve()));
  });
}

async function findPhoto(em: EntityManager, projectId: number, params: Record<string, string>): Promise<Photo> {
  const photo = await em.findOne(Photo, { id: idOf(params, 'photoId', 'Photo'), hole: { project: projectId } }, { populate: ['hole'] });
  if (!photo) throw notFound('Photo');
  return photo;
}

/** The project and user as bare references, so a write does not flush their loaded copies. */
function refs(em: EntityManager, projectId: number, userId: number): { project: Project; user: User } {
  return { project: em.getReference(Project, projectId), user: em.getReference(User, userId) };
}

/** Photo upload, caption edit and removal (mounted on the holes router). */
export function addPhotoRoutes(api: ApiRouter, config: AppConfig, storage: FileStorage): void {
  // Uploads are read into memory, so only a few are read at once; the rest wait with their
  // bodies unread (TCP back-pressure), which bounds memory however many phones send at once.
  const uploadSlots = pLimit(config.photoUploadConcurrency);
  api.post('/holes/:holeId/photos', { access: 'photo.upload' }, async ({ em, project, user, params, req, res, status }): Promise<PhotoDto[]> => {
    // Who may add photos is settled before a byte of the upload is read.
    const hole = await em.findOne(TestHole, { id: idOf(params, 'holeId', 'Test hole'), project });
    if (!hole) throw notFound('Test hole');
    assertCanUpload(user, hole);
    const dtos = await uploadSlots(async () => {
      await parseMultipart(req, res, config);
      const files = (req.files as Express.Multer.File[] | undefined) ?? [];
      if (files.length === 0) {
        throw badRequest('Choose at least one photo.', [{ path: 'photos', message: 'no photo was sent (multipart/form-data, field "photos")' }]);
      }
      const fields = photoUploadFieldsSchema.safeParse({ ...(req.body as Record<string, unknown> | undefined) });
      if (!fields.success) throw new AppError(400, 'validation', 'Some fields are not valid.', { errors: zodProblemErrors(fields.error) });
      const received = await receivePhotos({
        em,
        storage,
        project,
        user,
        hole,
        files,
        fields: fields.data,
        maxPixels: config.photoMaxPixels,
        logger: req.log as Logger,
      });
      req.files = undefined; // let the bodies go before the next upload is read
      return received;
    });
    // As a replayed hole create: 201 when something was stored, 200 with the photos already
    // kept when every file was a resend (same client id on this hole).
    status(dtos.created ? 201 : 200);
    return dtos.photos;
  });

  api.patch('/photos/:photoId', { access: 'photo.upload', body: photoUpdateSchema }, async ({ em, project, user, params, body }): Promise<PhotoDto> => {
    const photo = await findPhoto(em, project.id, params);
    assertCanChangePhoto(user, photo);
    const before = photo.caption ?? null;
    const after = body.caption === null || body.caption === '' ? null : body.caption;
    // A clean unit of work: only the photo and the activity entry are written.
    await em.fork().transactional(async (tem) => {
      const managed = await tem.findOneOrFail(Photo, photo.id);
      managed.caption = after;
      const key = `caption (photo ${photo.id})`;
      logActivity(tem, { ...refs(tem, project.id, user.id), entity: 'hole', entityId: photo.hole.id, action: 'photo-caption', before: { [key]: before }, after: { [key]: after } });
      await tem.flush();
    });
    photo.caption = after;
    return presentPhoto(photo, project.id);
  });

  api.delete('/photos/:photoId', { access: 'photo.upload' }, async ({ em, project, user, params }) => {
    const photo = await findPhoto(em, project.id, params);
    assertCanChangePhoto(user, photo);
    const keys = photoKeys(photo);
    await em.fork().transactional(async (tem) => {
      logActivity(tem, { ...refs(tem, project.id, user.id), entity: 'hole', entityId: photo.hole.id, action: 'photo-delete', before: { photo: photoSummary(photo) }, after: { photo: null } });
      tem.remove(tem.getReference(Photo, photo.id));
      await tem.flush();
    });
    await Promise.allSettled(keys.map((k) => storage.delete(k)));
  });
}
