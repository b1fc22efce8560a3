// A local S3-compatible store (s3rver, pure JavaScript) on a free port, for the S3 storage driver.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import S3rver from 's3rver';

export interface S3Fake {
  /** The environment that points an app at the fake's bucket (STORAGE_DRIVER=s3 and the S3_* variables). */
  env: Record<string, string>;
  endpoint: string;
  bucket: string;
  /** The fake's own folder: what it holds, for checking that a file really went to the bucket. */
  directory: string;
  close(): Promise<void>;
}

/** s3rver's fixed credentials: it signs with these (any others are accepted for reading too). */
const KEY = 'S3RVER';

export async function startS3Fake(bucket = 'quiltline-test'): Promise<S3Fake> {
  const directory = fs.mkdtempSync(path.join(os.tmpdir(), 'quiltline-s3-'));
  const server = new S3rver({ address: '127.0.0.1', port: 0, directory, silent: true, configureBuckets: [{ name: bucket }] });
  const { port } = await server.run();
  const endpoint = `http://127.0.0.1:${port}`;
  return {
    endpoint,
    bucket,
    directory,
    env: {
      STORAGE_DRIVER: 's3',
      S3_BUCKET: bucket,
      S3_ENDPOINT: endpoint,
      S3_REGION: 'us-east-1',
      S3_ACCESS_KEY_ID: KEY,
      S3_SECRET_ACCESS_KEY: KEY,
      S3_FORCE_PATH_STYLE: 'true',
    },
    async close() {
      await server.close();
      fs.rmSync(directory, { recursive: true, force: true });
    },
  };
}
