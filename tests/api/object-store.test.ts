/**
 * Photos and bench originals with the object store (a local S3 fake): members
 * are redirected to short-lived signed links after the usual access check; the
 * files of deleted rows leave the store, and a delete the store fails is
 * retried by the file worker. The same routes on the local disk are covered by
 * photos.test.ts and bench.test.ts.
 */
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { createFileWorker, pendingKeys } from '@server/features/files';
import { createLogger } from '@server/lib/logger';
import { signedUrlGraceSeconds } from '@server/lib/stored-file';
import { useTestApp, type TestApp } from '../helpers/app';
import { buildWithCast, type TestUser } from '../helpers/factories';

// Their own databases: the file-removal queue is shared by every app on a database, and
// these apps' passes over it (the worker, a failed store) must not touch other files' rows.
const app = useTestApp({}, { objectStore: true, ownDatabase: true });
// The same store, streamed through the app (S3_PRESIGNED_URLS=0).
const streamed = useTestApp({}, { objectStore: { presignedUrls: false }, ownDatabase: true });

const jpeg = () =>
  sharp({ create: { width: 640, height: 480, channels: 3, background: '#5a7d9a' } })
    .jpeg()
    .withExif({ IFD0: { Make: 'Test camera', Model: 'Fixture 1' } })
    .toBuffer();

const pdf = () =>
  Buffer.from(
    '%PDF-1.4\n1 0 obj <</Type /Catalog /Pages 2 0 R>> endobj\ntrailer <</Root 1 0 R>>\n%%EOF\n',
    'latin1',
  );

async function keysOf(t: TestApp, buildId: string) {
  const keys: string[] = [];
  for await (const k of t.storage.list!(`builds/${buildId}`)) keys.push(k);
  return keys.sort();
}

async function castWithPart(t: TestApp) {
  const cast = await buildWithCast(t);
  const base = `/api/builds/${cast.build.id}`;
  const part = (
    await cast.owner.agent.post(`${base}/parts`).send({
      category: 'fuel-injection',
      name: 'Injectors',
      status: 'at-shop',
      shopUserId: cast.shop.id,
    })
  ).body.part as { id: string };
  return { ...cast, base, part };
}

async function uploadPhoto(user: TestUser, base: string, partId: string) {
  const res = await user.agent
    .post(`${base}/parts/${partId}/photos`)
    .attach('photos', await jpeg(), 'IMG_0001.jpg');
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.photos[0] as {
    id: string;
    web: { url: string };
    thumb: { url: string };
  };
}

/** Follows a redirect the way a browser would: no cookie goes to the store. */
async function follow(location: string) {
  const res = await fetch(location);
  return { res, body: Buffer.from(await res.arrayBuffer()) };
}

describe('serving from the object store', () => {
  it('sends a member to a signed link for a photo, after the same access check as before', async () => {
    const { crew, owner, viewer, stranger, base, part, build } = await castWithPart(app);
    const photo = await uploadPhoto(crew, base, part.id);
    // Both sizes are in the store under the build, and nothing is on the local disk.
    expect(await keysOf(app, build.id)).toEqual([
      `builds/${build.id}/photos/${photo.id}/thumb.jpg`,
      `builds/${build.id}/photos/${photo.id}/web.jpg`,
    ]);

    for (const user of [owner, viewer, crew]) {
      const res = await user.agent.get(photo.web.url).redirects(0);
      expect(res.status).toBe(302);
      expect(res.headers['cache-control']).toMatch(/^private, max-age=\d+$/);
      const location = new URL(res.headers.location);
      expect(location.origin).toBe(app.s3.endpoint);
      expect(location.pathname).toBe(
        `/${app.s3.bucket}/builds/${build.id}/photos/${photo.id}/web.jpg`,
      );
      const q = location.searchParams;
      expect(q.get('response-content-type')).toBe('image/jpeg');
      expect(q.get('response-content-disposition')).toBe(
        `inline; filename=photo-${photo.id}-web.jpg`,
      );
      expect(q.get('response-cache-control')).toBe('private, max-age=3600');
      // Signed at the top of the hour, for the hour plus a few minutes: one URL per hour.
      expect(q.get('X-Amz-Date')).toMatch(/^\d{8}T\d{2}0000Z$/);
      expect(q.get('X-Amz-Expires')).toBe(String(3600 + signedUrlGraceSeconds));
      expect(q.get('X-Amz-Credential')).toMatch(/^S3RVER\//);
    }

    const { res, body } = await follow(
      (await owner.agent.get(photo.thumb.url).redirects(0)).headers.location,
    );
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('image/jpeg');
    expect(res.headers.get('cache-control')).toBe('private, max-age=3600');
    const meta = await sharp(body).metadata();
    expect([meta.format, meta.width, meta.height, meta.exif]).toEqual([
      'jpeg',
      320,
      240,
      undefined,
    ]);

    // Nobody else is sent anywhere.
    for (const url of [photo.web.url, photo.thumb.url]) {
      const strangers = await stranger.agent.get(url).redirects(0);
      expect(strangers.status).toBe(404);
      expect(strangers.headers.location).toBeUndefined();
      const signedOut = await app.agent().get(url).redirects(0);
      expect(signedOut.status).toBe(401);
      expect(signedOut.headers.location).toBeUndefined();
    }
  });

  it('allows images from the store in the content security policy, and only then', async () => {
    const withStore = (await app.agent().get('/api/health')).headers['content-security-policy'];
    expect(withStore).toMatch(new RegExp(`img-src 'self' data: blob: ${app.s3.endpoint}(;|$)`));
    const streaming = (await streamed.agent().get('/api/health')).headers[
      'content-security-policy'
    ];
    expect(streaming).toMatch(/img-src 'self' data: blob:(;|$)/);
  });

  it('sends a bench original as a download whose name and type Headroom fixes', async () => {
    const { shop, owner, stranger, base, part } = await castWithPart(app);
    const sheet = (
      await shop.agent.post(`${base}/bench-sheets`).send({
        partId: part.id,
        occasion: 'As received',
        testedOn: '2026-11-02',
        points: [
          {
            kind: 'full-load',
            label: 'Full load',
            unit: 'mm3-per-stroke',
            tolerance: { type: 'percent', value: 1 },
            values: [52, 52.3, 51.8, 52.1, 50.2, 52.2, 51.9, 52.1],
          },
        ],
      })
    ).body.sheet as { id: string };
    const url = `${base}/bench-sheets/${sheet.id}/original`;
    const up = await shop.agent.put(url).attach('file', pdf(), 'Prüfblatt 0412.pdf');
    expect(up.status, JSON.stringify(up.body)).toBe(200);

    const res = await owner.agent.get(url).redirects(0);
    expect(res.status).toBe(302);
    const { res: file, body } = await follow(res.headers.location);
    expect(file.status).toBe(200);
    expect(file.headers.get('content-type')).toBe('application/pdf');
    expect(file.headers.get('content-disposition')).toBe(
      `attachment; filename="Pr?fblatt 0412.pdf"; filename*=UTF-8''Pr%C3%BCfblatt%200412.pdf`,
    );
    expect(body.equals(pdf())).toBe(true);
    expect((await stranger.agent.get(url).redirects(0)).status).toBe(404);
  });

  it('streams through the app when signed links are off, with the same headers', async () => {
    const { crew, owner, stranger, base, part } = await castWithPart(streamed);
    const photo = await uploadPhoto(crew, base, part.id);
    const res = await owner.agent.get(photo.web.url).redirects(0).buffer(true);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('image/jpeg');
    expect(res.headers['cache-control']).toBe('private, max-age=3600');
    expect(res.headers['content-disposition']).toBe(`inline; filename=photo-${photo.id}-web.jpg`);
    expect((await sharp(res.body).metadata()).width).toBe(640);
    expect((await stranger.agent.get(photo.web.url)).status).toBe(404);
  });
});

describe('when the object store is away', () => {
  it('answers an upload 503 storage_unavailable, saving nothing, and serves again once it is back', async () => {
    const { crew, owner, base, part, build } = await castWithPart(streamed);
    const before = await uploadPhoto(crew, base, part.id);
    await streamed.s3.stop();
    try {
      const res = await crew.agent
        .post(`${base}/parts/${part.id}/photos`)
        .attach('photos', await jpeg(), 'IMG_0002.jpg');
      expect(res.status).toBe(503);
      expect(res.headers['retry-after']).toBe('5');
      expect(res.body.error).toMatchObject({ code: 'storage_unavailable' });
      // Streaming needs the store too; the record itself is in PostgreSQL.
      expect((await owner.agent.get(before.web.url)).status).toBe(503);
      expect((await owner.agent.get(`${base}/photos/${before.id}`)).status).toBe(200);
    } finally {
      await streamed.s3.start();
    }
    const photos = (await owner.agent.get(`${base}/parts/${part.id}/photos`)).body.photos;
    expect(photos.map((p: { id: string }) => p.id)).toEqual([before.id]);
    expect(await keysOf(streamed, build.id)).toHaveLength(2);
    expect((await owner.agent.get(before.web.url)).status).toBe(200);
  });
});

describe('removing files from the object store', () => {
  it('removes the objects of a deleted photo, part and build', async () => {
    const { crew, owner, base, part, build } = await castWithPart(app);
    const first = await uploadPhoto(crew, base, part.id);
    expect(await keysOf(app, build.id)).toHaveLength(2);
    expect((await owner.agent.delete(`${base}/photos/${first.id}`)).status).toBe(204);
    expect(await keysOf(app, build.id)).toEqual([]);

    await uploadPhoto(crew, base, part.id);
    expect((await owner.agent.delete(`${base}/parts/${part.id}`)).status).toBe(204);
    expect(await keysOf(app, build.id)).toEqual([]);

    const other = (
      await owner.agent.post(`${base}/parts`).send({ category: 'exhaust', name: 'Down-pipe' })
    ).body.part;
    await uploadPhoto(crew, base, other.id);
    expect(await keysOf(app, build.id)).toHaveLength(2);
    expect((await owner.agent.delete(`/api/builds/${build.id}`)).status).toBe(204);
    expect(await keysOf(app, build.id)).toEqual([]);
    expect(await pendingKeys(app.db.knex)).toEqual([]);
  });

  it('retries a delete the store failed: the row goes at once, the objects on the worker’s later pass', async () => {
    const { crew, owner, base, part, build } = await castWithPart(app);
    const photo = await uploadPhoto(crew, base, part.id);
    const keys = await keysOf(app, build.id);
    expect(keys).toHaveLength(2);

    await app.s3.stop();
    try {
      // The store refuses connections: the delete still succeeds for the person.
      expect((await owner.agent.delete(`${base}/photos/${photo.id}`)).status).toBe(204);
      expect((await owner.agent.get(`${base}/photos/${photo.id}`)).status).toBe(404);
      expect((await owner.agent.get(`${base}/parts/${part.id}/photos`)).body.photos).toEqual([]);
      expect((await pendingKeys(app.db.knex)).sort()).toEqual(keys);
      const queued = await app.db
        .knex('file_deletions')
        .whereIn('key', keys)
        .select('attempts', 'last_error', 'next_attempt_at');
      for (const q of queued) {
        expect(q.attempts).toBe(1);
        expect(q.last_error).toBeTruthy();
        // Backed off: not due again for about a minute.
        expect(new Date(q.next_attempt_at).getTime()).toBeGreaterThan(Date.now() + 30_000);
      }
    } finally {
      await app.s3.start();
    }
    // The store is back and the objects are still there: nothing was lost or half-removed.
    expect(await keysOf(app, build.id)).toEqual(keys);

    // The worker's next pass, once the retry is due, removes them and empties the queue.
    await app.db
      .knex('file_deletions')
      .whereIn('key', keys)
      .update({ next_attempt_at: app.db.knex.fn.now() });
    const worker = createFileWorker(
      { knex: app.db.knex, storage: app.storage, logger: createLogger('silent') },
      50,
    );
    worker.start();
    try {
      const deadline = Date.now() + 10_000;
      while ((await pendingKeys(app.db.knex)).length && Date.now() < deadline) {
        await new Promise((r) => setTimeout(r, 50));
      }
    } finally {
      await worker.stop();
    }
    expect(await pendingKeys(app.db.knex)).toEqual([]);
    expect(await keysOf(app, build.id)).toEqual([]);
  });
});
