import type { Dirent } from 'node:fs';
import fs from 'node:fs/promises';
import path from 'node:path';
import type { Readable } from 'node:stream';
import { assertStorageKey, StorageNotFoundError, type Storage } from './storage';

const isMissing = (e: unknown) => (e as NodeJS.ErrnoException).code === 'ENOENT';

/** Files under one folder (UPLOAD_DIR): the default, for an install on one machine. */
export class DiskStorage implements Storage {
  readonly driver = 'local' as const;
  constructor(readonly rootDir: string) {}

  /** The file's path; refuses anything that could leave the root (see assertStorageKey). */
  resolve(key: string): string {
    return path.join(this.rootDir, assertStorageKey(key));
  }

  async put(key: string, data: Buffer) {
    const file = this.resolve(key);
    await fs.mkdir(path.dirname(file), { recursive: true });
    // Written beside, then renamed: a reader never sees half a file.
    const tmp = `${file}.${process.pid}.${Date.now()}.tmp`;
    await fs.writeFile(tmp, data);
    await fs.rename(tmp, file);
    return { key, size: data.length };
  }

  async get(key: string): Promise<Readable> {
    // Opened before the stream is handed out, so a missing file is a rejection here rather than
    // an 'error' event after the answer's headers went out.
    try {
      const handle = await fs.open(this.resolve(key), 'r');
      return handle.createReadStream();
    } catch (e) {
      if (isMissing(e)) throw new StorageNotFoundError(key);
      throw e;
    }
  }

  async read(key: string) {
    try {
      return await fs.readFile(this.resolve(key));
    } catch (e) {
      if (isMissing(e)) throw new StorageNotFoundError(key);
      throw e;
    }
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

  async prepare() {
    const removed = await this.removeTemporaryFiles();
    return removed ? `removed ${removed} unfinished upload file(s) left by an earlier run` : null;
  }

  close() {}

  /**
   * Deletes the temporary files `put` writes before renaming (`<name>.<pid>.<ms>.tmp`) that a
   * crash or `kill -9` left behind. Only files older than `olderThanMs` go, so a second server
   * sharing the folder keeps the uploads it is writing. Returns how many went.
   */
  async removeTemporaryFiles(olderThanMs = 15 * 60_000): Promise<number> {
    const before = Date.now() - olderThanMs;
    let removed = 0;
    const walk = async (dir: string): Promise<void> => {
      let entries: Dirent[];
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
