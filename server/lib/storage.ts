/**
 * File storage behind one small interface, so photos and attachments live on
 * the local disk or in an S3-compatible object store (./storage-s3.ts) without
 * routes or services knowing which: put/get/delete map to
 * PutObject/GetObject/DeleteObject with the same keys. Routes serve files with
 * sendStoredFile (./stored-file.ts), which uses the optional methods below.
 *
 * Keys are relative, slash-separated paths of lowercase letters, digits, '-',
 * '_' and '.', e.g. `builds/<buildId>/photos/<photoId>/web.jpg`; no segment may
 * be '.' or '..', so a key can never leave the store's folder.
 */
import { createHash, randomUUID } from 'node:crypto';
import { createReadStream, type Dirent } from 'node:fs';
import fs from 'node:fs/promises';
import path from 'node:path';
import type { Readable } from 'node:stream';

/** An object opened for reading: its bytes as a stream, and what is known of it. */
export type StoredObject = { body: Readable; size: number; etag?: string };

/** What a store knows of an object without reading it. */
export type StoredObjectInfo = {
  size: number;
  /** SHA-256 (hex) of the bytes when the store kept it; S3 objects written by Headroom carry it. */
  sha256?: string;
};

/** How the response to a signed URL must look: Headroom fixes these, never the object's metadata. */
export type SignedGetOptions = {
  contentType: string;
  contentDisposition: string;
  cacheControl: string;
  /** The signature's time; rounding it down makes one URL serve a whole window, so browsers cache. */
  signingDate: Date;
  /** From signingDate; at most 7 days (S3's limit). */
  expiresInSeconds: number;
};

export interface Storage {
  /** Writes (or replaces) the object at key. The content type is kept where the store keeps metadata. */
  put(key: string, body: Buffer, contentType: string): Promise<void>;
  /** The object's bytes, or null when there is none. */
  get(key: string): Promise<Buffer | null>;
  /** Removes the object; removing a missing object is not an error. */
  delete(key: string): Promise<void>;
  /** The object as a stream, or null when there is none (stores without it are read whole with get). */
  open?(key: string): Promise<StoredObject | null>;
  /** Size (and checksum, where kept) without reading the bytes; null when there is none. */
  head?(key: string): Promise<StoredObjectInfo | null>;
  /** Every key in the folder prefix (e.g. `builds/<id>`; all keys without one), in no particular order. */
  list?(prefix?: string): AsyncIterable<string>;
  /**
   * A URL any browser may GET the object at, without credentials, until it
   * expires. Only stores that can sign have it; the others are streamed.
   */
  signedGetUrl?(key: string, options: SignedGetOptions): Promise<string>;
  /** The origin signed URLs point at (for the content security policy). */
  readonly signedUrlOrigin?: string;
}

/**
 * The store cannot be reached or is failing (connection refused, timeout, 5xx,
 * throttling): a passing condition, answered 503 like a database outage. A
 * refusal that needs a person (bad credentials, no such bucket) stays a plain
 * error, logged as such.
 */
export class StorageUnavailableError extends Error {
  constructor(cause: unknown) {
    super(`file store unavailable: ${cause instanceof Error ? cause.message : String(cause)}`, {
      cause,
    });
    this.name = 'StorageUnavailableError';
  }
}

export const isStorageUnavailable = (err: unknown) => err instanceof StorageUnavailableError;

export const sha256Hex = (data: Buffer) => createHash('sha256').update(data).digest('hex');

const keyPattern = /^[a-z0-9][a-z0-9_.-]*(\/[a-z0-9][a-z0-9_.-]*)*$/;

export const isValidKey = (key: string) =>
  keyPattern.test(key) && !key.split('/').some((s) => s === '.' || s === '..') && key.length <= 512;

export function assertValidKey(key: string) {
  if (!isValidKey(key)) throw new Error(`Invalid storage key: ${JSON.stringify(key)}`);
}

export type LocalDiskStorage = Storage &
  Required<Pick<Storage, 'open' | 'head' | 'list'>> & { root: string };

/** A write in progress: `<name>.<uuid>.part`, renamed into place when complete. */
const tempFile = /\.[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}\.part$/;

/** No file there: nothing at all, or a folder of other keys (S3 has no folders). */
const isMissing = (err: unknown) =>
  ['ENOENT', 'EISDIR', 'ENOTDIR'].includes((err as NodeJS.ErrnoException).code ?? '');

/**
 * Local-disk store under `root` (STORAGE_DIR, .data/uploads by default). Writes
 * go to a temporary name first and are renamed into place, so a reader never
 * sees half a file.
 */
export function createLocalDiskStorage(root: string): LocalDiskStorage {
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
        if (isMissing(err)) return null;
        throw err;
      }
    },

    async open(key) {
      const file = fileFor(key);
      let handle: fs.FileHandle;
      try {
        handle = await fs.open(file, 'r');
      } catch (err) {
        if (isMissing(err)) return null;
        throw err;
      }
      try {
        const stat = await handle.stat();
        if (!stat.isFile()) {
          await handle.close();
          return null;
        }
        // The stream owns the handle from here: it closes it at the end or on destroy.
        const body = createReadStream('', { fd: handle, autoClose: true });
        return {
          body,
          size: stat.size,
          etag: `W/"${stat.size.toString(16)}-${stat.mtimeMs.toString(16)}"`,
        };
      } catch (err) {
        await handle.close();
        throw err;
      }
    },

    async head(key) {
      try {
        const stat = await fs.stat(fileFor(key));
        return stat.isFile() ? { size: stat.size } : null;
      } catch (err) {
        if (isMissing(err)) return null;
        throw err;
      }
    },

    async *list(prefix = '') {
      const folder = prefix.replace(/\/+$/, '');
      const start = folder ? fileFor(folder) : absoluteRoot;
      let entries: Dirent[];
      try {
        entries = await fs.readdir(start, { recursive: true, withFileTypes: true });
      } catch (err) {
        if (isMissing(err)) return;
        throw err;
      }
      for (const entry of entries) {
        if (!entry.isFile() || tempFile.test(entry.name)) continue;
        const key = path
          .relative(absoluteRoot, path.join(entry.parentPath, entry.name))
          .split(path.sep)
          .join('/');
        if (isValidKey(key)) yield key;
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
