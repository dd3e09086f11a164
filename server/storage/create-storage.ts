import { join } from 'node:path';
import type { AppConfig } from '../config';
import { S3Storage } from './s3-storage';
import { DiskStorage, type FileStorage } from './storage';

/** The storage the configuration names: `DATA_DIR/files` on disk, or an S3 bucket (STORAGE=s3). */
export function createStorage(config: Pick<AppConfig, 'storage' | 'dataDir'>): FileStorage {
  const s = config.storage;
  if (s.kind === 's3') {
    return new S3Storage({ bucket: s.bucket, region: s.region, endpoint: s.endpoint, accessKeyId: s.accessKeyId, secretAccessKey: s.secretAccessKey });
  }
  return new DiskStorage(join(config.dataDir, 'files'));
}

/** Where files go, for the start-up banner (never prints credentials). */
export function describeStorage(config: Pick<AppConfig, 'storage' | 'dataDir'>): string {
  const s = config.storage;
  return s.kind === 's3' ? `S3 bucket ${s.bucket}${s.endpoint ? ` at ${s.endpoint}` : ''}` : join(config.dataDir, 'files');
}
