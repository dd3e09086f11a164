import { z } from 'zod';
import { isoDate } from './common';

/** Blank multipart fields count as absent. */
const blankToUndefined = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v);
const numberField = (schema: z.ZodNumber) =>
  z.preprocess(blankToUndefined, z.coerce.number({ error: 'must be a number' }).pipe(schema).optional());

/**
 * The text fields sent with a photo upload (multipart/form-data, files in the field `photos`).
 * `takenAt`, `lat`, `lon` and `accuracy` are what the form itself recorded when the photo was
 * taken (WGS 84 degrees; accuracy in metres as the device reports it), kept when the photo's
 * own EXIF has no time or position (phone browsers often strip them).
 */
export const photoUploadFieldsSchema = z
  .strictObject({
    caption: z.preprocess(blankToUndefined, z.string().trim().max(300, 'at most 300 characters').optional()),
    takenAt: z.preprocess(blankToUndefined, isoDate.optional()),
    lat: numberField(z.number().min(-90, 'latitude is between -90 and 90').max(90, 'latitude is between -90 and 90')),
    lon: numberField(z.number().min(-180, 'longitude is between -180 and 180').max(180, 'longitude is between -180 and 180')),
    accuracy: numberField(z.number().gt(0, 'must be greater than zero (metres)').max(100_000)),
    /**
     * Client-made ids, one per file in the order the files are sent (the field repeated). A
     * photo whose id this hole already has is not stored again: the upload answers the photo
     * already kept. Optional: uploads without ids are stored as sent.
     */
    clientId: z.preprocess(
      (v) => (v === undefined || v === '' ? undefined : Array.isArray(v) ? v : [v]),
      z.array(z.uuid({ error: 'must be a UUID made by the client' })).max(10).optional(),
    ),
  })
  .superRefine((v, ctx) => {
    if ((v.lat === undefined) !== (v.lon === undefined)) {
      ctx.addIssue({ code: 'custom', path: [v.lat === undefined ? 'lat' : 'lon'], message: 'send latitude and longitude together' });
    }
    if (v.clientId && new Set(v.clientId).size !== v.clientId.length) {
      ctx.addIssue({ code: 'custom', path: ['clientId'], message: 'each photo needs its own client id' });
    }
  });
export type PhotoUploadFields = z.infer<typeof photoUploadFieldsSchema>;

/** Change a photo's caption (null or blank clears it). */
export const photoUpdateSchema = z.strictObject({
  caption: z.string().trim().max(300, 'at most 300 characters').nullable(),
});
export type PhotoUpdateInput = z.infer<typeof photoUpdateSchema>;
