/**
 * Where uploads are kept. STORAGE_DRIVER=local (the default): files under UPLOAD_DIR, for one
 * machine. STORAGE_DRIVER=s3: one bucket of an S3-compatible store, shared by every instance.
 */
import { z } from 'zod';
import type { StorageConfig } from '../lib/storage';

const flag = z
  .enum(['1', '0', 'true', 'false', 'yes', 'no', ''])
  .optional()
  .transform((v) => v !== undefined && ['1', 'true', 'yes'].includes(v));

const optionalText = z
  .string()
  .optional()
  .transform((v) => (v === '' ? undefined : v));

/** The storage variables, merged into the one environment schema (server/config/index.ts). */
export const storageEnvShape = {
  STORAGE_DRIVER: z.enum(['local', 's3'], { error: 'STORAGE_DRIVER must be "local" (files under UPLOAD_DIR) or "s3"' }).default('local'),
  S3_BUCKET: optionalText,
  /** The store's URL, e.g. https://s3.eu-west-2.amazonaws.com or http://127.0.0.1:9000; unset for AWS. */
  S3_ENDPOINT: z.url({ error: 'S3_ENDPOINT must be a URL such as https://storage.example.com' }).optional(),
  S3_REGION: z.string().min(1).default('us-east-1'),
  S3_ACCESS_KEY_ID: optionalText,
  S3_SECRET_ACCESS_KEY: optionalText,
  S3_FORCE_PATH_STYLE: flag,
  S3_PREFIX: z
    .string()
    .regex(/^([A-Za-z0-9_-][A-Za-z0-9._-]*(\/[A-Za-z0-9_-][A-Za-z0-9._-]*)*)?$/, {
      error: 'S3_PREFIX must be folder names of letters, digits, ".", "_" or "-" joined by "/", with no "/" at either end',
    })
    .default(''),
};

type StorageEnv = z.output<z.ZodObject<typeof storageEnvShape>>;

/** The rules across variables: an S3 bucket for the s3 driver, both access keys or neither. */
export function refineStorageEnv(env: StorageEnv, ctx: z.RefinementCtx) {
  if (env.STORAGE_DRIVER !== 's3') return;
  if (!env.S3_BUCKET) ctx.addIssue({ code: 'custom', path: ['S3_BUCKET'], message: 'S3_BUCKET is required when STORAGE_DRIVER=s3' });
  if (!env.S3_ACCESS_KEY_ID !== !env.S3_SECRET_ACCESS_KEY) {
    const missing = env.S3_ACCESS_KEY_ID ? 'S3_SECRET_ACCESS_KEY' : 'S3_ACCESS_KEY_ID';
    ctx.addIssue({
      code: 'custom',
      path: [missing],
      message: `${missing} is missing: set S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY together, or neither to use the machine's own credentials`,
    });
  }
}

/** The driver and its settings, from the checked variables. */
export function storageConfigFromEnv(env: StorageEnv, uploadDir: string): StorageConfig {
  if (env.STORAGE_DRIVER === 'local') return { driver: 'local', dir: uploadDir };
  return {
    driver: 's3',
    bucket: env.S3_BUCKET!,
    endpoint: env.S3_ENDPOINT,
    region: env.S3_REGION,
    accessKeyId: env.S3_ACCESS_KEY_ID,
    secretAccessKey: env.S3_SECRET_ACCESS_KEY,
    forcePathStyle: env.S3_FORCE_PATH_STYLE,
    prefix: env.S3_PREFIX,
  };
}
