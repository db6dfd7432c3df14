/**
 * npm run storage:migrate: every file of the local disk reaches the object
 * store (a local S3 fake) and is read back by checksum; a second run copies
 * nothing; a damaged or missing copy is copied again; local files go only when
 * asked, after their copy is verified.
 */
import { execFile } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createLocalDiskStorage, sha256Hex } from '@server/lib/storage';
import { createS3Storage, type S3Storage } from '@server/lib/storage-s3';
import { contentTypeFor, migrateStorage } from '../../scripts/lib/storage-migrate';
import { fakeCredentials, startFakeS3, type FakeS3 } from '../helpers/s3';

const root = path.resolve(import.meta.dirname, '../..');
let s3: FakeS3;
let store: S3Storage;
const dirs: string[] = [];

beforeAll(async () => {
  s3 = await startFakeS3();
  store = createS3Storage(s3.settings());
});
afterAll(async () => {
  store?.close();
  await s3?.close();
  for (const d of dirs) fs.rmSync(d, { recursive: true, force: true });
});

/** A local store as Headroom leaves it: photos, a bench original, and a write cut short. */
async function localStore(build: string) {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'headroom-migrate-'));
  dirs.push(dir);
  const local = createLocalDiskStorage(dir);
  const files: Record<string, Buffer> = {
    [`builds/${build}/photos/p1/web.jpg`]: Buffer.from('web jpeg bytes'),
    [`builds/${build}/photos/p1/thumb.jpg`]: Buffer.from('thumb jpeg bytes'),
    [`builds/${build}/bench/s1/o1/original.pdf`]: Buffer.from('%PDF-1.4 sheet'),
    [`builds/${build}/bench/s1/o2/original.png`]: Buffer.alloc(3 * 1024 * 1024, 0xab),
  };
  for (const [key, data] of Object.entries(files)) await local.put(key, data, 'x');
  // A write that never finished: never moved.
  fs.writeFileSync(
    path.join(
      dir,
      'builds',
      build,
      'photos',
      'p1',
      'web.jpg.0f8fad5b-d9cb-469f-a165-70867728950e.part',
    ),
    'half',
  );
  return { dir, local, files };
}

async function storeKeys(build: string) {
  const keys: string[] = [];
  for await (const k of store.list(`builds/${build}`)) keys.push(k);
  return keys.sort();
}

describe('storage:migrate', () => {
  it('copies every file, verified by checksum, and copies nothing on a second run', async () => {
    const { local, files } = await localStore('m1');
    const first = await migrateStorage({ from: local, to: store });
    expect(first.failed).toEqual([]);
    expect(first.copied.sort()).toEqual(Object.keys(files).sort());
    expect(await storeKeys('m1')).toEqual(Object.keys(files).sort());
    for (const [key, data] of Object.entries(files)) {
      expect(sha256Hex((await store.get(key))!)).toBe(sha256Hex(data));
      expect((await store.head(key))!.sha256).toBe(sha256Hex(data));
    }

    const again = await migrateStorage({ from: local, to: store });
    expect(again.copied).toEqual([]);
    expect(again.alreadyThere.sort()).toEqual(Object.keys(files).sort());
    // Nothing local was touched.
    for (const [key, data] of Object.entries(files))
      expect((await local.get(key))!.equals(data)).toBe(true);
  });

  it('copies again what is missing or differs in the store; a dry run only says so', async () => {
    const { local, files } = await localStore('m2');
    await migrateStorage({ from: local, to: store });
    const damaged = 'builds/m2/photos/p1/web.jpg';
    const missing = 'builds/m2/bench/s1/o1/original.pdf';
    await store.put(damaged, Buffer.from('something else'), 'image/jpeg');
    await store.delete(missing);

    const dry = await migrateStorage({ from: local, to: store, dryRun: true });
    expect(dry.wouldCopy.sort()).toEqual([missing, damaged].sort());
    expect(await store.get(missing)).toBeNull();

    const fixed = await migrateStorage({ from: local, to: store });
    expect(fixed.copied.sort()).toEqual([missing, damaged].sort());
    expect((await store.get(damaged))!.equals(files[damaged])).toBe(true);
    expect((await store.get(missing))!.equals(files[missing])).toBe(true);
  });

  it('removes local files only when asked, and only those whose copy reads back whole', async () => {
    const { local, files } = await localStore('m3');
    const report = await migrateStorage({ from: local, to: store, removeLocal: true });
    expect(report.removed.sort(), JSON.stringify(report.failed)).toEqual(Object.keys(files).sort());
    const left: string[] = [];
    for await (const k of local.list()) left.push(k);
    expect(left).toEqual([]);
    expect(await storeKeys('m3')).toEqual(Object.keys(files).sort());

    // A store that hands back other bytes than it was given: the copy fails and the local file stays.
    const { local: other } = await localStore('m4');
    const liar = { ...store, get: async () => Buffer.from('not the same') };
    const bad = await migrateStorage({ from: other, to: liar, removeLocal: true });
    expect(bad.removed).toEqual([]);
    expect(bad.failed.map((f) => f.error)).toEqual(Array(4).fill('checksum of the copy differs'));
    let count = 0;
    for await (const _ of other.list()) count++;
    expect(count).toBe(4);
  });

  it('tries a failed copy once more before reporting it', async () => {
    const { local, files } = await localStore('retry');
    // A store whose first write of each key is refused, as a busy store's might be.
    const refused = new Set<string>();
    const flaky = {
      ...store,
      put: async (key: string, body: Buffer, type: string) => {
        if (!refused.has(key)) {
          refused.add(key);
          throw new Error('store busy');
        }
        return store.put(key, body, type);
      },
    };
    const report = await migrateStorage({ from: local, to: flaky, removeLocal: true });
    expect(report.failed).toEqual([]);
    expect(report.copied.sort()).toEqual(Object.keys(files).sort());
    expect(report.removed.sort()).toEqual(Object.keys(files).sort());
  });

  it('stores each file with the type its extension names', () => {
    expect(contentTypeFor('builds/a/photos/p/web.jpg')).toBe('image/jpeg');
    expect(contentTypeFor('builds/a/bench/s/o/original.pdf')).toBe('application/pdf');
    expect(contentTypeFor('builds/a/bench/s/o/original.webp')).toBe('image/webp');
    expect(contentTypeFor('builds/a/x/data.bin')).toBe('application/octet-stream');
  });

  it('runs as npm run storage:migrate with the server’s settings, and refuses without a store', async () => {
    const { dir, files } = await localStore('m5');
    const env = {
      ...process.env,
      STORAGE: 's3',
      S3_BUCKET: s3.bucket,
      S3_ENDPOINT: s3.endpoint,
      S3_FORCE_PATH_STYLE: '1',
      S3_REGION: 'us-east-1',
      AWS_ACCESS_KEY_ID: fakeCredentials.accessKeyId,
      AWS_SECRET_ACCESS_KEY: fakeCredentials.secretAccessKey,
      AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: 'true',
      STORAGE_DIR: dir,
    };
    const run = (extra: string[], e: NodeJS.ProcessEnv) =>
      promisify(execFile)(
        process.execPath,
        ['--import', 'tsx', 'scripts/storage-migrate.ts', '--quiet', ...extra],
        { cwd: root, env: e },
      );
    const first = await run([], env);
    expect(first.stdout.trim().split('\n').at(-1)).toBe(
      '4 copied and verified, 0 already there, 0 failed',
    );
    expect(await storeKeys('m5')).toEqual(Object.keys(files).sort());
    const second = await run(['--remove-local'], env);
    expect(second.stdout.trim().split('\n').at(-1)).toBe(
      '0 copied and verified, 4 already there, 4 local files removed, 0 failed',
    );

    const { STORAGE: _, ...withoutStore } = env;
    await expect(run([], withoutStore)).rejects.toMatchObject({
      code: 2,
      stderr: expect.stringMatching(/name the object store to move to: STORAGE=s3/),
    });
    await expect(run([], { ...env, S3_BUCKET: 'No_Such' })).rejects.toMatchObject({
      code: 2,
      stderr: expect.stringMatching(/S3_BUCKET: "No_Such" may hold only lowercase/),
    });
  }, 60_000);
});
