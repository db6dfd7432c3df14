/**
 * Moving stored files from the local disk to the object store, each verified
 * by SHA-256: the bytes read back from the store must hash to the local
 * file's. Safe to run again: a key the store already holds with the same size
 * and checksum is left alone, anything else is copied (again). Local files are
 * removed only when asked, and only after their copy was read back whole.
 */
import type { LocalDiskStorage, Storage } from '@server/lib/storage';
import { sha256Hex } from '@server/lib/storage';

export type MigrationTarget = Storage & Required<Pick<Storage, 'head'>>;

export type MigrationReport = {
  copied: string[];
  alreadyThere: string[];
  failed: { key: string; error: string }[];
  /** Local files removed after verification (with removeLocal). */
  removed: string[];
  /** What a dry run would copy. */
  wouldCopy: string[];
};

const contentTypes: Record<string, string> = {
  jpg: 'image/jpeg',
  jpeg: 'image/jpeg',
  png: 'image/png',
  webp: 'image/webp',
  pdf: 'application/pdf',
  csv: 'text/csv',
  json: 'application/json',
  txt: 'text/plain',
};

/** The type to store with a key, from its extension (routes fix the served type themselves). */
export function contentTypeFor(key: string) {
  const ext = /\.([a-z0-9]+)$/.exec(key)?.[1] ?? '';
  return contentTypes[ext] ?? 'application/octet-stream';
}

export async function migrateStorage(opts: {
  from: LocalDiskStorage;
  to: MigrationTarget;
  dryRun?: boolean;
  removeLocal?: boolean;
  /** Files copied at once. */
  concurrency?: number;
  log?: (line: string) => void;
}): Promise<MigrationReport> {
  const log = opts.log ?? (() => undefined);
  const report: MigrationReport = {
    copied: [],
    alreadyThere: [],
    failed: [],
    removed: [],
    wouldCopy: [],
  };
  const keys: string[] = [];
  for await (const key of opts.from.list()) keys.push(key);
  keys.sort();
  log(`${keys.length} files under ${opts.from.root}`);

  /** Reads the store's copy and compares it with the local bytes. */
  const verify = async (key: string, sha256: string) => {
    const back = await opts.to.get(key);
    if (!back) throw new Error('not in the store after copying');
    if (sha256Hex(back) !== sha256) throw new Error('checksum of the copy differs');
  };

  const one = async (key: string) => {
    const local = await opts.from.get(key);
    if (!local) return; // removed since it was listed (its row was deleted): nothing to move
    const sha256 = sha256Hex(local);
    const there = await opts.to.head(key);
    const same = there?.size === local.length && there.sha256 === sha256;
    if (opts.dryRun) {
      (same ? report.alreadyThere : report.wouldCopy).push(key);
      return;
    }
    if (same) {
      // The store's own checksum matches; read it back before trusting it with the only copy.
      if (opts.removeLocal) await verify(key, sha256);
      report.alreadyThere.push(key);
    } else {
      await opts.to.put(key, local, contentTypeFor(key));
      await verify(key, sha256);
      report.copied.push(key);
      log(`copied ${key} (${local.length} bytes, sha256 ${sha256.slice(0, 12)}…)`);
    }
    if (opts.removeLocal) {
      await opts.from.delete(key);
      report.removed.push(key);
    }
  };

  // A failure may be passing (a dropped connection, a store busy for a moment): every key
  // that failed is tried once more, one at a time, before it is reported.
  const failed: string[] = [];
  const attempt = async (key: string, last: boolean) => {
    try {
      await one(key);
    } catch (err) {
      const error = err instanceof Error ? err.message : String(err);
      if (!last) {
        failed.push(key);
        log(`retrying later ${key}: ${error}`);
        return;
      }
      report.failed.push({ key, error });
      log(`FAILED ${key}: ${error}`);
    }
  };
  let next = 0;
  const worker = async () => {
    while (next < keys.length) await attempt(keys[next++], false);
  };
  await Promise.all(Array.from({ length: Math.max(1, opts.concurrency ?? 4) }, worker));
  for (const key of failed.sort()) await attempt(key, true);
  return report;
}
