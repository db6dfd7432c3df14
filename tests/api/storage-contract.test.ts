/**
 * The storage contract: one set of tests, run on every store Headroom can use —
 * the local disk, and the object store against a local S3 fake (s3rver, started
 * and stopped here on loopback), once serving by signed links and once
 * streaming. Serving is checked as the browser sees it: through
 * sendStoredFile, following the store's redirect where there is one.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { HeadObjectCommand, S3Client } from '@aws-sdk/client-s3';
import express from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { errorHandler } from '@server/middleware/error-handler';
import { createLogger } from '@server/lib/logger';
import { createLocalDiskStorage, sha256Hex, type Storage } from '@server/lib/storage';
import { createS3Storage } from '@server/lib/storage-s3';
import { sendStoredFile, signedUrlGraceSeconds } from '@server/lib/stored-file';
import { fakeCredentials, startFakeS3, type FakeS3 } from '../helpers/s3';

type Subject = { storage: Storage; close: () => Promise<void>; fake?: FakeS3 };

const stores: { name: string; s3: boolean; signs: boolean; make: () => Promise<Subject> }[] = [
  {
    name: 'local disk',
    s3: false,
    signs: false,
    make: async () => {
      const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'headroom-contract-'));
      return {
        storage: createLocalDiskStorage(dir),
        close: async () => fs.rmSync(dir, { recursive: true, force: true }),
      };
    },
  },
  {
    name: 'S3 fake, signed links',
    s3: true,
    signs: true,
    make: async () => {
      const fake = await startFakeS3();
      const storage = createS3Storage(fake.settings());
      return { storage, fake, close: async () => (storage.close(), fake.close()) };
    },
  },
  {
    name: 'S3 fake, streamed through the app',
    s3: true,
    signs: false,
    make: async () => {
      const fake = await startFakeS3();
      const storage = createS3Storage(fake.settings({ presignedUrls: false }));
      return { storage, fake, close: async () => (storage.close(), fake.close()) };
    },
  },
];

const bytes = (text: string) => Buffer.from(text, 'utf8');
/** Every byte value, so nothing on the way may treat the body as text. */
const allBytes = Buffer.from(Array.from({ length: 512 }, (_, i) => i % 256));

async function collect(it: AsyncIterable<string>) {
  const out: string[] = [];
  for await (const k of it) out.push(k);
  return out.sort();
}

const invalidKeys = [
  '',
  '/etc/passwd',
  '../outside.jpg',
  'builds/../../outside.jpg',
  'builds/./x.jpg',
  'builds//x.jpg',
  'builds/x.jpg/',
  'Builds/X.JPG',
  'builds/a b.jpg',
  'builds\\x.jpg',
  'builds/é.jpg',
  'builds/x.jpg?versionId=1',
  `builds/${'a'.repeat(520)}.jpg`,
];

describe.each(stores)('storage contract: $name', ({ make, s3, signs }) => {
  let subject: Subject;
  let storage: Storage;
  let server: Server;
  let base: string;

  beforeAll(async () => {
    subject = await make();
    storage = subject.storage;
    // The browser's view: a route that serves a key the way Headroom's file routes do.
    const app = express();
    app.get('/file', async (req, res) => {
      await sendStoredFile(res, storage, String(req.query.key), {
        contentType: String(req.query.type ?? 'image/jpeg'),
        disposition: req.query.download ? 'attachment' : 'inline',
        fileName: String(req.query.name ?? 'photo.jpg'),
        cacheSeconds: 3600,
        missingMessage: 'Photo file not found',
      });
    });
    app.use(errorHandler(createLogger('silent')));
    server = createServer(app);
    await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
    base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  });
  afterAll(async () => {
    await new Promise((r) => server?.close(r));
    await subject?.close();
  });

  it('gives back the bytes it was given, every byte value intact', async () => {
    await storage.put('builds/b1/photos/p1/web.jpg', allBytes, 'image/jpeg');
    expect((await storage.get('builds/b1/photos/p1/web.jpg'))!.equals(allBytes)).toBe(true);
    expect(await storage.head!('builds/b1/photos/p1/web.jpg')).toMatchObject({ size: 512 });
    const opened = await storage.open!('builds/b1/photos/p1/web.jpg');
    const chunks: Buffer[] = [];
    for await (const c of opened!.body) chunks.push(Buffer.from(c));
    expect(Buffer.concat(chunks).equals(allBytes)).toBe(true);
    expect(opened!.size).toBe(512);
  });

  it('replaces an object written again at the same key', async () => {
    await storage.put(
      'builds/b1/bench/s1/original.pdf',
      bytes('%PDF-1.4 first'),
      'application/pdf',
    );
    await storage.put(
      'builds/b1/bench/s1/original.pdf',
      bytes('%PDF-1.4 second, longer'),
      'application/pdf',
    );
    expect((await storage.get('builds/b1/bench/s1/original.pdf'))!.toString()).toBe(
      '%PDF-1.4 second, longer',
    );
    expect((await storage.head!('builds/b1/bench/s1/original.pdf'))!.size).toBe(23);
  });

  it('answers null for a missing key, and deleting one is not an error', async () => {
    expect(await storage.get('builds/none/photos/x/web.jpg')).toBeNull();
    expect(await storage.open!('builds/none/photos/x/web.jpg')).toBeNull();
    expect(await storage.head!('builds/none/photos/x/web.jpg')).toBeNull();
    await storage.delete('builds/none/photos/x/web.jpg');
    // A "folder" of other keys is not an object either.
    await storage.put('builds/b2/photos/p/web.jpg', bytes('x'), 'image/jpeg');
    expect(await storage.get('builds/b2/photos')).toBeNull();
    expect(await storage.head!('builds/b2')).toBeNull();
  });

  it('deletes an object and only that one', async () => {
    await storage.put('builds/b3/photos/p/web.jpg', bytes('web'), 'image/jpeg');
    await storage.put('builds/b3/photos/p/thumb.jpg', bytes('thumb'), 'image/jpeg');
    await storage.delete('builds/b3/photos/p/web.jpg');
    expect(await storage.get('builds/b3/photos/p/web.jpg')).toBeNull();
    expect((await storage.get('builds/b3/photos/p/thumb.jpg'))!.toString()).toBe('thumb');
    await storage.delete('builds/b3/photos/p/web.jpg');
    expect(await collect(storage.list!('builds/b3'))).toEqual(['builds/b3/photos/p/thumb.jpg']);
  });

  it('lists the keys in a folder, and nothing half-written', async () => {
    await storage.put('builds/b4/photos/p/web.jpg', bytes('1'), 'image/jpeg');
    await storage.put('builds/b4/bench/s/original.png', bytes('2'), 'image/png');
    await storage.put('builds/b40/photos/q/web.jpg', bytes('3'), 'image/jpeg');
    expect(await collect(storage.list!('builds/b4'))).toEqual([
      'builds/b4/bench/s/original.png',
      'builds/b4/photos/p/web.jpg',
    ]);
    expect(await collect(storage.list!('builds/b4/'))).toHaveLength(2);
    expect(await collect(storage.list!('builds/nothing-here'))).toEqual([]);
    const all = await collect(storage.list!());
    expect(all).toEqual(expect.arrayContaining(['builds/b40/photos/q/web.jpg']));
    expect(all.filter((k) => k.endsWith('.part'))).toEqual([]);
  });

  it('refuses keys that are not plain relative paths, on every method, writing nothing', async () => {
    const before = await collect(storage.list!());
    for (const key of invalidKeys) {
      const label = JSON.stringify(key);
      await expect(storage.put(key, bytes('x'), 'image/jpeg'), label).rejects.toThrow(
        /Invalid storage key/,
      );
      await expect(storage.get(key), label).rejects.toThrow(/Invalid storage key/);
      await expect(storage.delete(key), label).rejects.toThrow(/Invalid storage key/);
      await expect(storage.open!(key), label).rejects.toThrow(/Invalid storage key/);
      await expect(storage.head!(key), label).rejects.toThrow(/Invalid storage key/);
    }
    await expect(collect(storage.list!('../'))).rejects.toThrow(/Invalid storage key/);
    expect(await collect(storage.list!())).toEqual(before);
  });

  it('keeps a file larger than any upload Headroom accepts (21 MB), byte for byte', async () => {
    const large = Buffer.alloc(21 * 1024 * 1024);
    for (let i = 0; i < large.length; i += 4096) large.writeUInt32LE(i, i);
    await storage.put('builds/b5/bench/s/original.pdf', large, 'application/pdf');
    expect((await storage.head!('builds/b5/bench/s/original.pdf'))!.size).toBe(large.length);
    const back = await storage.get('builds/b5/bench/s/original.pdf');
    expect(sha256Hex(back!)).toBe(sha256Hex(large));

    const res = await fetch(
      `${base}/file?key=builds/b5/bench/s/original.pdf&type=application/pdf&download=1&name=big.pdf`,
    );
    expect(res.status).toBe(200);
    expect(res.headers.get('content-length')).toBe(String(large.length));
    expect(sha256Hex(Buffer.from(await res.arrayBuffer()))).toBe(sha256Hex(large));
  });

  // S3 makes a PUT visible whole or not at all; s3rver writes its file in place, so a
  // read racing a write there can see half of it. Only the local disk's own rename is tested.
  it.runIf(!s3)('never shows a reader half of a write', async () => {
    const a = Buffer.alloc(2 * 1024 * 1024, 'a');
    const b = Buffer.alloc(3 * 1024 * 1024, 'b');
    const key = 'builds/b6/photos/p/web.jpg';
    await storage.put(key, a, 'image/jpeg');
    const reads: Promise<Buffer | null>[] = [];
    const writes = [storage.put(key, b, 'image/jpeg'), storage.put(key, a, 'image/jpeg')];
    for (let i = 0; i < 5; i++) reads.push(storage.get(key));
    await Promise.all(writes);
    for (const r of await Promise.all(reads)) {
      expect(r!.equals(a) || r!.equals(b)).toBe(true);
    }
  });

  it('serves a file with the type, name and caching Headroom gives, not what the object says', async () => {
    // Stored as one type; served as another, because the route decides.
    await storage.put('builds/b7/bench/s/original.pdf', bytes('%PDF-1.7 sheet'), 'image/jpeg');
    const url = `${base}/file?key=builds/b7/bench/s/original.pdf&type=application/pdf&download=1&name=${encodeURIComponent('Prüfblatt 04.pdf')}`;
    const first = await fetch(url, { redirect: 'manual' });
    if (signs) {
      expect(first.status).toBe(302);
      expect(first.headers.get('cache-control')).toMatch(/^private, max-age=\d+$/);
      expect(new URL(first.headers.get('location')!).origin).toBe(storage.signedUrlOrigin);
    } else {
      expect(first.status).toBe(200);
      await first.arrayBuffer();
    }
    const res = await fetch(url);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toMatch(/^application\/pdf/);
    expect(res.headers.get('content-disposition')).toBe(
      `attachment; filename="Pr?fblatt 04.pdf"; filename*=UTF-8''Pr%C3%BCfblatt%2004.pdf`,
    );
    expect(res.headers.get('cache-control')).toBe('private, max-age=3600');
    expect(await res.text()).toBe('%PDF-1.7 sheet');

    const inline = await fetch(`${base}/file?key=builds/b7/bench/s/original.pdf&name=p.jpg`);
    expect(inline.headers.get('content-type')).toMatch(/^image\/jpeg/);
    expect(inline.headers.get('content-disposition')).toBe('inline; filename=p.jpg');
  });

  it.runIf(!s3)('answers a revisit with 304 when the file has not changed', async () => {
    await storage.put('builds/b10/photos/p/web.jpg', bytes('jpeg'), 'image/jpeg');
    const url = `${base}/file?key=builds/b10/photos/p/web.jpg`;
    const first = await fetch(url);
    const etag = first.headers.get('etag');
    expect(etag).toMatch(/^W\/"/);
    // As a browser revalidates (fetch itself would add Cache-Control: no-cache).
    const revalidate = { 'If-None-Match': etag!, 'Cache-Control': 'max-age=0' };
    expect((await fetch(url, { headers: revalidate })).status).toBe(304);
    await storage.put('builds/b10/photos/p/web.jpg', bytes('other jpeg'), 'image/jpeg');
    expect((await fetch(url, { headers: revalidate })).status).toBe(200);
  });

  it('answers 404 for a file that is not there', async () => {
    const res = await fetch(`${base}/file?key=builds/none/photos/x/web.jpg`);
    expect(res.status).toBe(404);
    // Streamed: Headroom's own error; signed: the store's, after the redirect.
    if (!signs) expect((await res.json()).error.message).toBe('Photo file not found');
  });

  it.runIf(signs)(
    'signs one URL per window, so browsers cache it, and the URL expires',
    async () => {
      await storage.put('builds/b8/photos/p/web.jpg', bytes('jpeg bytes'), 'image/jpeg');
      const options = {
        contentType: 'image/jpeg',
        contentDisposition: 'inline; filename="web.jpg"',
        cacheControl: 'private, max-age=3600',
      };
      const start = new Date('2026-12-02T10:00:00Z');
      const a = await storage.signedGetUrl!('builds/b8/photos/p/web.jpg', {
        ...options,
        signingDate: start,
        expiresInSeconds: 3600 + signedUrlGraceSeconds,
      });
      const b = await storage.signedGetUrl!('builds/b8/photos/p/web.jpg', {
        ...options,
        signingDate: start,
        expiresInSeconds: 3600 + signedUrlGraceSeconds,
      });
      expect(a).toBe(b);
      const params = new URL(a).searchParams;
      expect(params.get('X-Amz-Date')).toBe('20261202T100000Z');
      expect(params.get('X-Amz-Expires')).toBe(String(3600 + signedUrlGraceSeconds));

      // Two requests a moment apart get the same Location.
      const first = await fetch(`${base}/file?key=builds/b8/photos/p/web.jpg`, {
        redirect: 'manual',
      });
      const second = await fetch(`${base}/file?key=builds/b8/photos/p/web.jpg`, {
        redirect: 'manual',
      });
      const location = first.headers.get('location')!;
      const signedAt = new URL(location).searchParams.get('X-Amz-Date')!;
      // Signed at the start of a whole hour (the route's cacheSeconds).
      expect(signedAt).toMatch(/^\d{8}T\d{2}0000Z$/);
      if (second.headers.get('location') !== location) {
        // Only across an hour's turn.
        expect(new Date().getUTCMinutes()).toBe(0);
      }
      const maxAge = Number(/max-age=(\d+)/.exec(first.headers.get('cache-control')!)![1]);
      expect(maxAge).toBeLessThanOrEqual(3600);
      expect((await fetch(location)).status).toBe(200);

      // Signed two hours ago for one hour: the store refuses it.
      const expired = await storage.signedGetUrl!('builds/b8/photos/p/web.jpg', {
        ...options,
        signingDate: new Date(Date.now() - 2 * 3600_000),
        expiresInSeconds: 3600,
      });
      expect((await fetch(expired)).status).toBe(403);
      await expect(
        storage.signedGetUrl!('../x', { ...options, signingDate: start, expiresInSeconds: 60 }),
      ).rejects.toThrow(/Invalid storage key/);
    },
  );

  it.runIf(s3)('keeps the content type and checksum as object metadata', async () => {
    if (!subject.fake) throw new Error('no fake store');
    await storage.put('builds/b9/photos/p/web.webp', bytes('webp'), 'image/webp');
    const client = new S3Client({
      region: 'us-east-1',
      endpoint: subject.fake.endpoint,
      forcePathStyle: true,
      credentials: fakeCredentials,
    });
    try {
      const head = await client.send(
        new HeadObjectCommand({ Bucket: subject.fake.bucket, Key: 'builds/b9/photos/p/web.webp' }),
      );
      expect(head.ContentType).toBe('image/webp');
      expect(head.Metadata?.sha256).toBe(sha256Hex(bytes('webp')));
      expect((await storage.head!('builds/b9/photos/p/web.webp'))!.sha256).toBe(
        sha256Hex(bytes('webp')),
      );
    } finally {
      client.destroy();
    }
  });
});
