/**
 * Headroom behind a load balancer: two apps from createApp() on different
 * ports, each with its own pools and its own store client as two processes
 * would have, sharing one PostgreSQL database and one object store (a local S3
 * fake). Whatever one of them wrote — a session, a photo — the other serves.
 */
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { randomUUID } from 'node:crypto';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '@server/app';
import { loadConfig, type AppConfig } from '@server/config';
import { createDatabase, type Database } from '@server/lib/database';
import { createLogger } from '@server/lib/logger';
import type { Storage } from '@server/lib/storage';
import { createStorage } from '@server/lib/stores';
import { createOwnDatabase } from '../helpers/database';
import { buildInput, password, uniqueEmail } from '../helpers/factories';
import { startFakeS3, type FakeS3 } from '../helpers/s3';

/** The address people use; the balancer forwards to either process. */
const publicOrigin = 'http://headroom.test';

type Process = { url: string; server: Server; db: Database; storage: Storage & { close?(): void } };

let s3: FakeS3;
let database: Awaited<ReturnType<typeof createOwnDatabase>>;
const processes: Process[] = [];

beforeAll(async () => {
  s3 = await startFakeS3();
  const base = loadConfig({ ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'silent' });
  // Its own database, so its file-removal passes meet only its own files.
  database = await createOwnDatabase(base.databaseUrl);
  const rateLimitPrefix = `test-${randomUUID()}:`;
  for (let i = 0; i < 2; i++) {
    const server = createServer();
    await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
    const { port } = server.address() as AddressInfo;
    const config: AppConfig = {
      ...base,
      databaseUrl: database.databaseUrl,
      port,
      serveClient: false,
      appUrl: publicOrigin,
      allowedOrigins: [publicOrigin],
      authRateLimit: 100_000,
      rateLimitPrefix,
      // Nothing on either process's disk: point the local store somewhere that does not exist.
      storageDir: `/nonexistent/headroom-process-${i}`,
      objectStore: s3.settings(),
    };
    const db = createDatabase(config.databaseUrl);
    const storage = createStorage(config);
    server.on('request', createApp({ db, config, logger: createLogger('silent'), storage }));
    processes.push({ url: `http://127.0.0.1:${port}`, server, db, storage });
  }
});

afterAll(async () => {
  for (const p of processes) {
    await new Promise((r) => p.server.close(r));
    await p.db.close();
    p.storage.close?.();
  }
  await database?.drop();
  await s3?.close();
});

/** A request to one process as the balancer would forward it, with the caller's cookie. */
function call(p: Process, method: string, path: string, cookie?: string, init: RequestInit = {}) {
  const headers = new Headers(init.headers);
  headers.set('Origin', publicOrigin);
  if (cookie) headers.set('Cookie', cookie);
  if (typeof init.body === 'string') headers.set('Content-Type', 'application/json');
  return fetch(`${p.url}${path}`, { ...init, method, headers, redirect: 'manual' });
}

describe('two app processes, one database, one object store', () => {
  it('serve the same sessions and the same photos', async () => {
    const [a, b] = processes;
    expect(a.url).not.toBe(b.url);

    // Sign up and sign in through A …
    const email = uniqueEmail('balanced');
    const signUp = await call(a, 'POST', '/api/auth/sign-up', undefined, {
      body: JSON.stringify({ email, password, displayName: 'Balanced owner' }),
    });
    expect(signUp.status).toBe(201);
    const signIn = await call(a, 'POST', '/api/auth/sign-in', undefined, {
      body: JSON.stringify({ email, password }),
    });
    expect(signIn.status).toBe(200);
    const cookie = signIn.headers.getSetCookie()[0].split(';')[0];
    expect(cookie).toMatch(/^headroom_session=/);

    // … and B knows the session.
    const me = await call(b, 'GET', '/api/me', cookie);
    expect(me.status).toBe(200);
    expect((await me.json()).user.email).toBe(email);

    // A build and a part through B, a photo uploaded through A.
    const build = (
      await (
        await call(b, 'POST', '/api/builds', cookie, { body: JSON.stringify(buildInput) })
      ).json()
    ).build;
    const base = `/api/builds/${build.id}`;
    const part = (
      await (
        await call(a, 'POST', `${base}/parts`, cookie, {
          body: JSON.stringify({ category: 'turbocharger', name: 'Turbo' }),
        })
      ).json()
    ).part;
    const image = await sharp({
      create: { width: 400, height: 300, channels: 3, background: '#884422' },
    })
      .jpeg()
      .toBuffer();
    const form = new FormData();
    form.append('caption', 'Compressor wheel');
    form.append('photos', new Blob([image], { type: 'image/jpeg' }), 'turbo.jpg');
    const upload = await call(a, 'POST', `${base}/parts/${part.id}/photos`, cookie, { body: form });
    expect(upload.status).toBe(201);
    const photo = (await upload.json()).photos[0];

    // B lists it and serves it: a signed link to the shared store, which has the bytes.
    const listed = await (await call(b, 'GET', `${base}/photos`, cookie)).json();
    expect(listed.photos.map((p: { id: string }) => p.id)).toEqual([photo.id]);
    const fromB = await call(b, 'GET', photo.web.url, cookie);
    expect(fromB.status).toBe(302);
    const stored = await fetch(fromB.headers.get('location')!);
    expect(stored.status).toBe(200);
    expect(stored.headers.get('content-type')).toBe('image/jpeg');
    const meta = await sharp(Buffer.from(await stored.arrayBuffer())).metadata();
    expect([meta.width, meta.height]).toEqual([400, 300]);
    // Both processes send a browser to the same URL within the hour, so it caches one copy.
    const fromA = await call(a, 'GET', photo.web.url, cookie);
    if (new Date().getUTCMinutes() !== 0) {
      expect(fromA.headers.get('location')).toBe(fromB.headers.get('location'));
    }

    // Deleted through B, gone for A and from the store.
    expect((await call(b, 'DELETE', `${base}/photos/${photo.id}`, cookie)).status).toBe(204);
    expect((await call(a, 'GET', photo.web.url, cookie)).status).toBe(404);
    const left: string[] = [];
    for await (const k of a.storage.list!(`builds/${build.id}`)) left.push(k);
    expect(left).toEqual([]);

    // Signing out through B ends the session for A as well.
    expect((await call(b, 'POST', '/api/auth/sign-out', cookie)).status).toBe(204);
    expect((await call(a, 'GET', '/api/me', cookie)).status).toBe(401);
  });
});
