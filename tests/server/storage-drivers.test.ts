// The upload storage contract, run against both drivers: the local folder and S3 (against s3rver,
// a local S3-compatible store started here on a free port), plus the storage variables' checks.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { text } from 'node:stream/consumers';
import { GetObjectCommand, S3Client } from '@aws-sdk/client-s3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig } from '../../server/config';
import { DiskStorage, S3Storage, StorageNotFoundError, type Storage } from '../../server/lib/storage';
import { startS3Fake, type S3Fake } from '../helpers/s3-fake';

let fake: S3Fake;
const folder = fs.mkdtempSync(path.join(os.tmpdir(), 'quiltline-storage-'));
const drivers: Record<string, Storage> = {};
const s3Settings = () => ({
  bucket: fake.bucket,
  endpoint: fake.endpoint,
  region: 'us-east-1',
  accessKeyId: fake.env.S3_ACCESS_KEY_ID,
  secretAccessKey: fake.env.S3_SECRET_ACCESS_KEY,
  forcePathStyle: true,
  prefix: '',
});

beforeAll(async () => {
  fake = await startS3Fake();
  drivers.local = new DiskStorage(folder);
  drivers.s3 = new S3Storage(s3Settings());
});
afterAll(async () => {
  for (const d of Object.values(drivers)) d.close();
  await fake?.close();
  fs.rmSync(folder, { recursive: true, force: true });
});

describe.each(['local', 's3'])('%s storage', (name) => {
  const storage = () => drivers[name];

  it('stores a file, streams and reads it back, and deletes it', async () => {
    const key = `org-1/photos/job-1/${name}-a.jpg`;
    expect(await storage().put(key, Buffer.from('jpeg bytes'), { contentType: 'image/jpeg' })).toEqual({ key, size: 10 });
    expect(await storage().exists(key)).toBe(true);
    expect(await text(await storage().get(key))).toBe('jpeg bytes');
    expect((await storage().read(key)).toString()).toBe('jpeg bytes');
    await storage().delete(key);
    expect(await storage().exists(key)).toBe(false);
    await expect(storage().get(key)).rejects.toBeInstanceOf(StorageNotFoundError);
  });

  it('answers a key never written as not found, and deleting it is no error', async () => {
    const key = `org-1/logo/${name}-never.png`;
    expect(await storage().exists(key)).toBe(false);
    await expect(storage().get(key)).rejects.toBeInstanceOf(StorageNotFoundError);
    await expect(storage().read(key)).rejects.toThrow(/no stored file under/);
    await expect(storage().delete(key)).resolves.toBeUndefined();
  });

  it('replaces a file written again under the same key, byte for byte', async () => {
    const key = `org-1/logo/${name}-logo.png`;
    const bytes = Buffer.from(Array.from({ length: 70_000 }, (_, i) => (i * 7) % 256));
    await storage().put(key, Buffer.from('old'));
    await storage().put(key, bytes);
    expect((await storage().read(key)).equals(bytes)).toBe(true);
  });

  it.each(['../escape.txt', 'a/../../b', '/etc/passwd', 'a//b', 'a/./b', '', 'a/b c'])('refuses the key %j', async (key) => {
    await expect(storage().put(key, Buffer.from('x'))).rejects.toThrow(/invalid storage key/);
    await expect(storage().get(key)).rejects.toThrow(/invalid storage key/);
  });
});

describe('s3 storage', () => {
  it('keeps its files under S3_PREFIX in the bucket', async () => {
    const prefixed = new S3Storage({ ...s3Settings(), prefix: 'install-a/uploads' });
    const raw = new S3Client({
      endpoint: fake.endpoint,
      region: 'us-east-1',
      forcePathStyle: true,
      credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
    });
    try {
      await prefixed.put('org-2/photos/p.jpg', Buffer.from('in the prefix'));
      const object = await raw.send(new GetObjectCommand({ Bucket: fake.bucket, Key: 'install-a/uploads/org-2/photos/p.jpg' }));
      expect(await object.Body!.transformToString()).toBe('in the prefix');
      // The unprefixed driver does not see it.
      expect(await drivers.s3.exists('org-2/photos/p.jpg')).toBe(false);
    } finally {
      prefixed.close();
      raw.destroy();
    }
  });

  it('fails the start with the bucket named when the bucket does not exist', async () => {
    const wrong = new S3Storage({ ...s3Settings(), bucket: 'no-such-bucket' });
    try {
      await expect(wrong.prepare()).rejects.toThrow(/bucket "no-such-bucket" at http:\/\/127\.0\.0\.1:\d+ cannot be used: no such bucket/);
      expect(await drivers.s3.prepare()).toMatch(/uploads are kept in the bucket "quiltline-test"/);
    } finally {
      wrong.close();
    }
  });

  it('fails a store that does not answer in bounded time with the cause', async () => {
    const closed = new S3Storage({ ...s3Settings(), endpoint: 'http://127.0.0.1:9' });
    try {
      await expect(closed.prepare()).rejects.toThrow(/object storage: the bucket "quiltline-test" at http:\/\/127\.0\.0\.1:9 cannot be used/);
    } finally {
      closed.close();
    }
  });
});

describe('storage configuration', () => {
  const base = { DATABASE_URL: 'postgres://u:p@127.0.0.1/q', UPLOAD_DIR: '/srv/quiltline-data' };

  it('keeps uploads in UPLOAD_DIR unless STORAGE_DRIVER says otherwise', () => {
    expect(loadConfig(base).storage).toEqual({ driver: 'local', dir: '/srv/quiltline-data' });
  });

  it('reads the S3 variables', () => {
    const c = loadConfig({
      ...base,
      STORAGE_DRIVER: 's3',
      S3_BUCKET: 'uploads',
      S3_ENDPOINT: 'https://storage.example.com',
      S3_REGION: 'eu-west-2',
      S3_ACCESS_KEY_ID: 'AKEXAMPLE',
      S3_SECRET_ACCESS_KEY: 'secret-example',
      S3_FORCE_PATH_STYLE: 'true',
      S3_PREFIX: 'quiltline',
    });
    expect(c.storage).toEqual({
      driver: 's3',
      bucket: 'uploads',
      endpoint: 'https://storage.example.com',
      region: 'eu-west-2',
      accessKeyId: 'AKEXAMPLE',
      secretAccessKey: 'secret-example',
      forcePathStyle: true,
      prefix: 'quiltline',
    });
    // Neither key: the SDK's own credentials (an instance role); AWS itself when no endpoint.
    expect(loadConfig({ ...base, STORAGE_DRIVER: 's3', S3_BUCKET: 'uploads' }).storage).toMatchObject({
      endpoint: undefined,
      accessKeyId: undefined,
      forcePathStyle: false,
    });
  });

  it.each([
    [{ STORAGE_DRIVER: 'disk' }, /STORAGE_DRIVER: STORAGE_DRIVER must be "local"/],
    [{ STORAGE_DRIVER: 's3' }, /S3_BUCKET: S3_BUCKET is required when STORAGE_DRIVER=s3/],
    [{ STORAGE_DRIVER: 's3', S3_BUCKET: 'b', S3_ACCESS_KEY_ID: 'AKEXAMPLE' }, /S3_SECRET_ACCESS_KEY: S3_SECRET_ACCESS_KEY is missing/],
    [{ STORAGE_DRIVER: 's3', S3_BUCKET: 'b', S3_SECRET_ACCESS_KEY: 'x' }, /S3_ACCESS_KEY_ID: S3_ACCESS_KEY_ID is missing/],
    [{ STORAGE_DRIVER: 's3', S3_BUCKET: 'b', S3_ENDPOINT: 'storage' }, /S3_ENDPOINT: S3_ENDPOINT must be a URL/],
    [{ STORAGE_DRIVER: 's3', S3_BUCKET: 'b', S3_PREFIX: '/uploads/' }, /S3_PREFIX: S3_PREFIX must be folder names/],
  ])('refuses %j naming the variable', (env, message) => {
    expect(() => loadConfig({ ...base, ...env })).toThrow(message);
  });
});
