import type { Readable } from 'node:stream';
import { DeleteObjectCommand, GetObjectCommand, HeadBucketCommand, HeadObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import { assertStorageKey, StorageNotFoundError, type Storage } from './storage';

/** One bucket of an S3-compatible store (AWS S3 or another service speaking its API). */
export interface S3StorageConfig {
  bucket: string;
  /** The store's URL; unset for AWS itself. */
  endpoint?: string;
  region: string;
  /** Both or neither; neither uses the SDK's own chain (instance role, AWS_* variables, profile). */
  accessKeyId?: string;
  secretAccessKey?: string;
  /** `https://host/bucket/key` instead of `https://bucket.host/key` (most self-hosted stores need it). */
  forcePathStyle: boolean;
  /** Put before every key (`<prefix>/<key>`), so several installs can share a bucket; '' for none. */
  prefix: string;
}

type S3Failure = { name?: string; $metadata?: { httpStatusCode?: number } };

/** A missing object; a missing bucket answers 404 too, but by another name (and prepare() catches it at start). */
function isMissing(e: unknown): boolean {
  const f = e as S3Failure;
  return f.name === 'NoSuchKey' || f.name === 'NotFound' || (f.$metadata?.httpStatusCode === 404 && f.name !== 'NoSuchBucket');
}

/** Uploads in a bucket, shared by every app instance that points at it. */
export class S3Storage implements Storage {
  readonly driver = 's3' as const;
  private readonly client: S3Client;

  constructor(private readonly config: S3StorageConfig) {
    this.client = new S3Client({
      region: config.region,
      endpoint: config.endpoint,
      forcePathStyle: config.forcePathStyle,
      credentials: config.accessKeyId && config.secretAccessKey ? { accessKeyId: config.accessKeyId, secretAccessKey: config.secretAccessKey } : undefined,
      // Checksums only where the API requires them: several S3-compatible stores refuse the
      // SDK's newer default CRC headers, and TLS already guards the bytes in transit.
      requestChecksumCalculation: 'WHEN_REQUIRED',
      responseChecksumValidation: 'WHEN_REQUIRED',
      // A store that stops answering fails the request in bounded time instead of holding it.
      requestHandler: { connectionTimeout: 5_000, requestTimeout: 60_000 },
    });
  }

  private objectKey(key: string): string {
    assertStorageKey(key);
    return this.config.prefix ? `${this.config.prefix}/${key}` : key;
  }

  async put(key: string, data: Buffer, opts: { contentType?: string } = {}) {
    await this.client.send(new PutObjectCommand({ Bucket: this.config.bucket, Key: this.objectKey(key), Body: data, ContentType: opts.contentType }));
    return { key, size: data.length };
  }

  private async object(key: string) {
    try {
      const res = await this.client.send(new GetObjectCommand({ Bucket: this.config.bucket, Key: this.objectKey(key) }));
      if (!res.Body) throw new StorageNotFoundError(key);
      return res.Body;
    } catch (e) {
      if (isMissing(e)) throw new StorageNotFoundError(key);
      throw e;
    }
  }

  async get(key: string): Promise<Readable> {
    // In Node the SDK's body is an http.IncomingMessage: a Readable.
    return (await this.object(key)) as Readable;
  }

  async read(key: string) {
    return Buffer.from(await (await this.object(key)).transformToByteArray());
  }

  async exists(key: string) {
    try {
      await this.client.send(new HeadObjectCommand({ Bucket: this.config.bucket, Key: this.objectKey(key) }));
      return true;
    } catch (e) {
      if (isMissing(e)) return false;
      throw e;
    }
  }

  async delete(key: string) {
    // S3 answers 204 for a key with no object as well.
    await this.client.send(new DeleteObjectCommand({ Bucket: this.config.bucket, Key: this.objectKey(key) }));
  }

  async prepare() {
    const where = `bucket "${this.config.bucket}" at ${this.config.endpoint ?? `AWS ${this.config.region}`}`;
    try {
      await this.client.send(new HeadBucketCommand({ Bucket: this.config.bucket }));
    } catch (e) {
      const f = e as S3Failure & { message?: string };
      const status = f.$metadata?.httpStatusCode;
      const why = status === 404 ? 'no such bucket' : status === 403 ? 'access denied (check S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY)' : f.message || f.name;
      throw new Error(`object storage: the ${where} cannot be used: ${why}`);
    }
    return `uploads are kept in the ${where}`;
  }

  close() {
    this.client.destroy();
  }
}
