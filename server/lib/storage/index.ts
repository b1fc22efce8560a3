import { DiskStorage } from './disk-storage';
import { S3Storage, type S3StorageConfig } from './s3-storage';
import type { Storage } from './storage';

export { DiskStorage } from './disk-storage';
export { S3Storage, type S3StorageConfig } from './s3-storage';
export { StorageNotFoundError, type Storage } from './storage';

/** Which driver keeps the uploads (from STORAGE_DRIVER and its S3_* variables, server/config/storage.ts). */
export type StorageConfig = { driver: 'local'; dir: string } | ({ driver: 's3' } & S3StorageConfig);

/** The configured driver; call `prepare()` once at start. */
export function createStorage(config: StorageConfig): Storage {
  return config.driver === 's3' ? new S3Storage(config) : new DiskStorage(config.dir);
}
