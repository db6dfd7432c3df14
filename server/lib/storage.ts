/**
 * File storage behind one small interface, so photos can move from the local
 * disk to an S3-compatible object store without touching routes or services:
 * an S3 implementation maps put/get/delete to PutObject/GetObject/DeleteObject
 * with the same keys.
 *
 * Keys are relative, slash-separated paths of lowercase letters, digits, '-',
 * '_' and '.', e.g. `builds/<buildId>/photos/<photoId>/web.jpg`; no segment may
 * be '.' or '..', so a key can never leave the store's folder.
 */
import { randomUUID } from 'node:crypto';
import fs from 'node:fs/promises';
import path from 'node:path';

export interface Storage {
  /** Writes (or replaces) the object at key. */
  put(key: string, body: Buffer, contentType: string): Promise<void>;
  /** The object's bytes, or null when there is none. */
  get(key: string): Promise<Buffer | null>;
  /** Removes the object; removing a missing object is not an error. */
  delete(key: string): Promise<void>;
}

const keyPattern = /^[a-z0-9][a-z0-9_.-]*(\/[a-z0-9][a-z0-9_.-]*)*$/;

export function assertValidKey(key: string) {
  if (
    !keyPattern.test(key) ||
    key.split('/').some((s) => s === '.' || s === '..') ||
    key.length > 512
  ) {
    throw new Error(`Invalid storage key: ${JSON.stringify(key)}`);
  }
}

/**
 * Local-disk store under `root` (STORAGE_DIR, .data/uploads by default). Writes
 * go to a temporary name first and are renamed into place, so a reader never
 * sees half a file.
 */
export function createLocalDiskStorage(root: string): Storage & { root: string } {
  const absoluteRoot = path.resolve(root);
  const fileFor = (key: string) => {
    assertValidKey(key);
    return path.join(absoluteRoot, ...key.split('/'));
  };

  return {
    root: absoluteRoot,

    async put(key, body) {
      const file = fileFor(key);
      await fs.mkdir(path.dirname(file), { recursive: true });
      const temp = `${file}.${randomUUID()}.part`;
      try {
        await fs.writeFile(temp, body);
        await fs.rename(temp, file);
      } catch (err) {
        await fs.rm(temp, { force: true });
        throw err;
      }
    },

    async get(key) {
      try {
        return await fs.readFile(fileFor(key));
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code === 'ENOENT') return null;
        throw err;
      }
    },

    async delete(key) {
      const file = fileFor(key);
      await fs.rm(file, { force: true });
      // Tidy the now-empty folders up to the root; a folder still in use stays.
      let dir = path.dirname(file);
      while (dir.startsWith(absoluteRoot + path.sep)) {
        try {
          await fs.rmdir(dir);
        } catch {
          break;
        }
        dir = path.dirname(dir);
      }
    },
  };
}
