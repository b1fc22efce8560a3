import type { Readable } from 'node:stream';

/**
 * Where uploaded files live (photos, logos, plan underlays, handover packs). Keys are relative
 * paths such as `<organisationId>/photos/<jobId>/<uuid>.jpg`; callers build them and keep them in
 * the database. Two drivers: a local folder (one machine) and an S3-compatible object store
 * (several instances behind a load balancer, each reading what any of them wrote).
 */
export interface Storage {
  /** `local` or `s3`, for start-up logs. */
  readonly driver: 'local' | 's3';
  /** Writes the whole file; a reader sees the old file or the new one, never half of one. */
  put(key: string, data: Buffer, opts?: { contentType?: string }): Promise<{ key: string; size: number }>;
  /** The file as a stream; rejects with StorageNotFoundError when there is none under `key`. */
  get(key: string): Promise<Readable>;
  /** The whole file in memory (for PDFs, which embed images); StorageNotFoundError when missing. */
  read(key: string): Promise<Buffer>;
  exists(key: string): Promise<boolean>;
  /** Removes the file; a key with no file is not an error. */
  delete(key: string): Promise<void>;
  /**
   * Start-up work, once per process: the local folder drops files a killed process left
   * half-written; S3 checks that the bucket answers (a wrong name or key fails the start, not the
   * first upload). Returns a line for the start-up log, or null.
   */
  prepare(): Promise<string | null>;
  /** Lets go of connections (the S3 client's sockets); nothing to do for the folder. */
  close(): void;
}

/** No file under the key (never written, or deleted). Services turn it into their own 404. */
export class StorageNotFoundError extends Error {
  readonly code = 'storage_not_found';
  constructor(readonly key: string) {
    super(`no stored file under ${JSON.stringify(key)}`);
    this.name = 'StorageNotFoundError';
  }
}

const KEY_RE = /^[A-Za-z0-9_-][A-Za-z0-9._-]*(\/[A-Za-z0-9_-][A-Za-z0-9._-]*)*$/;

/**
 * Refuses any key that could leave the folder or mean two things to an object store: `..`, `.`,
 * absolute paths, empty parts, characters outside letters, digits, `.`, `_` and `-`.
 */
export function assertStorageKey(key: string): string {
  if (!KEY_RE.test(key) || key.split('/').some((p) => p === '..' || p === '.')) {
    throw new Error(`invalid storage key: ${JSON.stringify(key)}`);
  }
  return key;
}
