import {
  DeleteObjectCommand,
  GetObjectCommand,
  ListObjectsV2Command,
  NoSuchKey,
  PutObjectCommand,
  S3Client,
  type S3ClientConfig,
} from '@aws-sdk/client-s3';
import { assertKey, type FileStorage } from './storage';

export interface S3StorageOptions {
  bucket: string;
  region: string;
  /** An S3-compatible service's URL (MinIO, Ceph, a cloud's S3 API); omit for AWS itself. */
  endpoint?: string | null;
  accessKeyId?: string | null;
  secretAccessKey?: string | null;
  /** Prefix inside the bucket, e.g. `threadline/`; empty by default. */
  prefix?: string;
}

/**
 * Files in S3-compatible object storage through @aws-sdk/client-s3. Path-style addressing
 * (`endpoint/bucket/key`) so self-hosted services work without wildcard DNS. The bucket must
 * exist; keys are the same server-made keys the disk storage uses.
 */
export class S3Storage implements FileStorage {
  readonly client: S3Client;
  private readonly bucket: string;
  private readonly prefix: string;

  constructor(options: S3StorageOptions) {
    const config: S3ClientConfig = { region: options.region, forcePathStyle: true };
    if (options.endpoint) config.endpoint = options.endpoint;
    if (options.accessKeyId && options.secretAccessKey) {
      config.credentials = { accessKeyId: options.accessKeyId, secretAccessKey: options.secretAccessKey };
    }
    this.client = new S3Client(config);
    this.bucket = options.bucket;
    this.prefix = options.prefix ?? '';
  }

  private objectKey(key: string): string {
    assertKey(key);
    return `${this.prefix}${key}`;
  }

  async put(key: string, data: Buffer, contentType: string): Promise<void> {
    await this.client.send(
      new PutObjectCommand({ Bucket: this.bucket, Key: this.objectKey(key), Body: data, ContentType: contentType, ContentLength: data.length }),
    );
  }

  async get(key: string): Promise<Buffer | null> {
    try {
      const out = await this.client.send(new GetObjectCommand({ Bucket: this.bucket, Key: this.objectKey(key) }));
      if (!out.Body) return null;
      return Buffer.from(await out.Body.transformToByteArray());
    } catch (err) {
      if (err instanceof NoSuchKey || (err as { name?: string }).name === 'NoSuchKey' || (err as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode === 404) {
        return null;
      }
      throw err;
    }
  }

  async delete(key: string): Promise<void> {
    await this.client.send(new DeleteObjectCommand({ Bucket: this.bucket, Key: this.objectKey(key) }));
  }

  async list(prefix: string): Promise<string[]> {
    const keys: string[] = [];
    let token: string | undefined;
    do {
      const out = await this.client.send(
        new ListObjectsV2Command({ Bucket: this.bucket, Prefix: `${this.prefix}${prefix}`, ContinuationToken: token }),
      );
      for (const o of out.Contents ?? []) if (o.Key) keys.push(o.Key.slice(this.prefix.length));
      token = out.IsTruncated ? out.NextContinuationToken : undefined;
    } while (token);
    return keys.sort();
  }

  /** Release the SDK's sockets. */
  close(): void {
    this.client.destroy();
  }
}
