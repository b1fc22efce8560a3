import { createReadStream } from 'node:fs';
import fs from 'node:fs/promises';
import path from 'node:path';
import type { Readable } from 'node:stream';

/**
 * Where uploaded files live (photos, logos, plan backgrounds). Keys are relative paths such as
 * `<organisationId>/photos/<uuid>.jpg`; callers build them and keep them in the database.
 * Disk today; an S3-compatible store can implement the same interface.
 */
export interface Storage {
  put(key: string, data: Buffer): Promise<{ key: string; size: number }>;
  get(key: string): Promise<Buffer>;
  stream(key: string): Readable;
  exists(key: string): Promise<boolean>;
  delete(key: string): Promise<void>;
}

const KEY_RE = /^[A-Za-z0-9_-][A-Za-z0-9._-]*(\/[A-Za-z0-9_-][A-Za-z0-9._-]*)*$/;

export class DiskStorage implements Storage {
  constructor(readonly rootDir: string) {}

  /** Refuses anything that could leave the root: `..`, absolute paths, odd characters. */
  resolve(key: string): string {
    if (!KEY_RE.test(key) || key.split('/').some((p) => p === '..' || p === '.')) {
      throw new Error(`invalid storage key: ${JSON.stringify(key)}`);
    }
    return path.join(this.rootDir, key);
  }

  async put(key: string, data: Buffer) {
    const file = this.resolve(key);
    await fs.mkdir(path.dirname(file), { recursive: true });
    const tmp = `${file}.${process.pid}.${Date.now()}.tmp`;
    await fs.writeFile(tmp, data);
    await fs.rename(tmp, file);
    return { key, size: data.length };
  }

  get(key: string) {
    return fs.readFile(this.resolve(key));
  }

  stream(key: string) {
    return createReadStream(this.resolve(key));
  }

  async exists(key: string) {
    try {
      await fs.access(this.resolve(key));
      return true;
    } catch {
      return false;
    }
  }

  async delete(key: string) {
    await fs.rm(this.resolve(key), { force: true });
  }

  /**
   * Deletes the temporary files `put` writes before renaming (`<name>.<pid>.<ms>.tmp`) that a
   * crash or `kill -9` left behind. Call at start. Only files older than `olderThanMs` go, so a
   * second server sharing the folder keeps the uploads it is writing. Returns how many went.
   */
  async removeTemporaryFiles(olderThanMs = 15 * 60_000): Promise<number> {
    const before = Date.now() - olderThanMs;
    let removed = 0;
    const walk = async (dir: string): Promise<void> => {
      let entries: import('node:fs').Dirent[];
      try {
        entries = await fs.readdir(dir, { withFileTypes: true });
      } catch {
        return; // no uploads folder yet
      }
      for (const e of entries) {
        const p = path.join(dir, e.name);
        if (e.isDirectory()) await walk(p);
        else if (TMP_RE.test(e.name) && (await fs.stat(p)).mtimeMs < before) {
          await fs.rm(p, { force: true });
          removed++;
        }
      }
    };
    await walk(this.rootDir);
    return removed;
  }
}

const TMP_RE = /\.\d+\.\d+\.tmp$/;
