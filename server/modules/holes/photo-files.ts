import { randomUUID } from 'node:crypto';
import { Jimp } from 'jimp';
import type { FileStorage } from '../../storage/storage';

export const THUMBNAIL_SIZE = 320;

export interface StoredPhoto {
  fileKey: string;
  thumbnailKey: string;
  mimeType: string;
  width: number;
  height: number;
  byteSize: number;
}

/**
 * Store a JPEG and its thumbnail under server-made keys. Jimp applies the EXIF orientation to
 * the pixels when it reads, so the thumbnail is upright whatever the camera wrote.
 */
export async function storeJpeg(storage: FileStorage, projectId: number, data: Buffer): Promise<StoredPhoto> {
  const image = await Jimp.read(data);
  const width = image.bitmap.width;
  const height = image.bitmap.height;
  image.scaleToFit({ w: THUMBNAIL_SIZE, h: THUMBNAIL_SIZE });
  const thumbnail = await image.getBuffer('image/jpeg', { quality: 80 });
  const id = randomUUID();
  const fileKey = `photos/${projectId}/${id}.jpg`;
  const thumbnailKey = `photos/${projectId}/${id}.thumb.jpg`;
  await storage.put(fileKey, data, 'image/jpeg');
  await storage.put(thumbnailKey, thumbnail, 'image/jpeg');
  return { fileKey, thumbnailKey, mimeType: 'image/jpeg', width, height, byteSize: data.length };
}
