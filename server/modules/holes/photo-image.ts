import exifr from 'exifr';
import { fileTypeFromBuffer } from 'file-type';
import { AppError } from '../../errors';

/** Types a photo may be: checked from the bytes, never from the name or the declared type. */
export const PHOTO_TYPES = { 'image/jpeg': 'jpg', 'image/png': 'png' } as const;
export type PhotoMime = keyof typeof PHOTO_TYPES;

export interface InspectedImage {
  mime: PhotoMime;
  ext: (typeof PHOTO_TYPES)[PhotoMime];
  /** Pixels as stored in the file. */
  storedWidth: number;
  storedHeight: number;
  /** EXIF orientation, 1 (upright) to 8; 1 when absent. */
  orientation: number;
  /** Pixels once the orientation is applied (what every view shows). */
  width: number;
  height: number;
  /** Capture time from EXIF; `hasOffset` false when the camera wrote no time zone. */
  exifTakenAt: { at: Date; hasOffset: boolean } | null;
  /** Position from EXIF GPS, WGS 84 degrees. */
  exifGps: { lat: number; lon: number } | null;
}

/** Width and height from the image header, read without decoding a pixel. */
export function headerSize(mime: string, data: Buffer): { width: number; height: number } | null {
  if (mime === 'image/png') {
    // PNG: 8-byte signature, then the IHDR chunk: length, "IHDR", width, height (big-endian).
    if (data.length < 24 || data.toString('latin1', 12, 16) !== 'IHDR') return null;
    return { width: data.readUInt32BE(16), height: data.readUInt32BE(20) };
  }
  if (mime === 'image/jpeg') return jpegSize(data);
  return null;
}

/**
 * JPEG: walk the marker segments from SOI to the first start-of-frame (SOF0–SOF15 except DHT
 * C4, JPG C8 and DAC CC) and read its height and width (ITU-T T.81 §B.2.2). Segments such as
 * APP1 (EXIF, with its own embedded thumbnail) are skipped by their length.
 */
function jpegSize(data: Buffer): { width: number; height: number } | null {
  let i = 2;
  while (i + 4 <= data.length) {
    if (data[i] !== 0xff) return null;
    const marker = data[i + 1]!;
    if (marker === 0xff) {
      i += 1; // fill byte
      continue;
    }
    if (marker === 0x01 || (marker >= 0xd0 && marker <= 0xd7)) {
      i += 2; // markers without a length
      continue;
    }
    if (marker === 0xd9 || marker === 0xda) return null; // end of image or scan before any frame header
    const length = data.readUInt16BE(i + 2);
    if (length < 2) return null;
    const isSof = marker >= 0xc0 && marker <= 0xcf && marker !== 0xc4 && marker !== 0xc8 && marker !== 0xcc;
    if (isSof) {
      if (i + 9 > data.length) return null;
      return { height: data.readUInt16BE(i + 5), width: data.readUInt16BE(i + 7) };
    }
    i += 2 + length;
  }
  return null;
}

function megapixels(pixels: number): string {
  return (pixels / 1_000_000).toLocaleString('en-US', { maximumFractionDigits: 1 });
}

/** `YYYY:MM:DD HH:MM:SS` (+ optional `±HH:MM`) → a Date; without an offset, read in the server's zone. */
export function exifDate(raw: unknown, offset: unknown): { at: Date; hasOffset: boolean } | null {
  if (typeof raw !== 'string') return null;
  const m = /^(\d{4}):(\d{2}):(\d{2})[ T](\d{2}):(\d{2}):(\d{2})/.exec(raw.trim());
  if (!m) return null;
  const [, y, mo, d, h, mi, s] = m;
  const iso = `${y}-${mo}-${d}T${h}:${mi}:${s}`;
  const off = typeof offset === 'string' && /^[+-]\d{2}:\d{2}$/.test(offset.trim()) ? offset.trim() : null;
  const at = new Date(off ? `${iso}${off}` : iso);
  if (Number.isNaN(at.getTime()) || at.getUTCFullYear() < 1990) return null;
  return { at, hasOffset: off !== null };
}

/**
 * Check an uploaded file before anything is stored: its real type from the bytes (file-type),
 * its pixel size from the header (a "decompression bomb" is a tiny file claiming huge
 * dimensions: refused before any decoder allocates for it), and its EXIF orientation, capture
 * time and GPS position (exifr). `path` names the file in error messages (`photos.0`).
 */
export async function inspectImage(data: Buffer, path: string, maxPixels: number): Promise<InspectedImage> {
  const type = await fileTypeFromBuffer(data);
  if (!type || !(type.mime in PHOTO_TYPES)) {
    const found = type ? `${type.mime} content` : 'content that is not an image this server knows';
    const hint =
      type?.mime === 'image/heic' || type?.mime === 'image/heif'
        ? ' Set the phone camera to save JPEG ("most compatible").'
        : type?.mime === 'image/webp'
          ? ' WebP cannot be processed on this server yet; save or export the photo as JPEG.'
          : '';
    throw new AppError(415, 'unsupported_type', 'Only JPEG and PNG photos can be uploaded.', {
      errors: [{ path, message: `the file holds ${found}, not a JPEG or PNG photo.${hint}` }],
    });
  }
  const mime = type.mime as PhotoMime;
  const size = headerSize(mime, data);
  if (!size || size.width === 0 || size.height === 0) {
    throw new AppError(400, 'unreadable_image', 'The photo cannot be read.', { errors: [{ path, message: 'the image header is damaged or incomplete' }] });
  }
  const pixels = size.width * size.height;
  if (pixels > maxPixels) {
    throw new AppError(413, 'image_too_large', `The photo is larger than ${megapixels(maxPixels)} megapixels.`, {
      errors: [{ path, message: `the image is ${size.width} × ${size.height} pixels (${megapixels(pixels)} MP); the limit is ${megapixels(maxPixels)} MP` }],
    });
  }

  let orientation = 1;
  let exifTakenAt: InspectedImage['exifTakenAt'] = null;
  let exifGps: InspectedImage['exifGps'] = null;
  if (mime === 'image/jpeg') {
    const o = await exifr.orientation(data).catch(() => undefined);
    if (typeof o === 'number' && o >= 1 && o <= 8) orientation = o;
    const tags = (await exifr
      .parse(data, { pick: ['DateTimeOriginal', 'OffsetTimeOriginal', 'CreateDate', 'OffsetTime'], reviveValues: false })
      .catch(() => null)) as Record<string, unknown> | null;
    if (tags) exifTakenAt = exifDate(tags.DateTimeOriginal, tags.OffsetTimeOriginal) ?? exifDate(tags.CreateDate, tags.OffsetTime);
    const gps = await exifr.gps(data).catch(() => null);
    if (gps && Number.isFinite(gps.latitude) && Number.isFinite(gps.longitude) && Math.abs(gps.latitude) <= 90 && Math.abs(gps.longitude) <= 180 && !(gps.latitude === 0 && gps.longitude === 0)) {
      exifGps = { lat: gps.latitude, lon: gps.longitude };
    }
  }
  // Orientations 5–8 turn the picture a quarter: width and height swap (EXIF 2.32, tag 0x0112).
  const turned = orientation >= 5;
  return {
    mime,
    ext: PHOTO_TYPES[mime],
    storedWidth: size.width,
    storedHeight: size.height,
    orientation,
    width: turned ? size.height : size.width,
    height: turned ? size.width : size.height,
    exifTakenAt,
    exifGps,
  };
}
