/**
 * Test harness: a real app from createApp() on a real PostgreSQL, listening on a
 * loopback port, and signed-in agents that carry cookies and the right Origin.
 */
import type { AddressInfo } from 'node:net';
import { createServer, type Server } from 'node:http';
import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import supertest from 'supertest';
import { afterAll, beforeAll } from 'vitest';
import { createApp } from '@server/app';
import type { RouteInfo } from '@server/routes';
import { loadConfig, type AppConfig } from '@server/config';
import { createDatabase, type Database } from '@server/lib/database';
import { createLogger } from '@server/lib/logger';
import type { Storage } from '@server/lib/storage';
import { createStorage } from '@server/lib/stores';
import type { ObjectStoreSettings } from '@server/storage-config';
import { createOwnDatabase } from './database';
import { prepareTestMail, type TestMail } from './mail';
import { startFakeS3, type FakeS3 } from './s3';

export type Agent = ReturnType<typeof supertest.agent>;

export type TestApp = {
  db: Database;
  origin: string;
  /** An agent with the app's own Origin and no session. */
  agent: () => Agent;
  /** A raw request without Origin, for the CSRF checks. */
  bare: () => ReturnType<typeof supertest>;
  /** Only with useTestApp(…, { mail: true }): the catcher, the worker and the caught messages. */
  mail: TestMail;
  /** Every API route of the app, from its routers (server/routes.ts). */
  routes: RouteInfo[];
  /** This app's own photo store and upload temp folder (fresh temp folders, removed afterwards). */
  storageDir: string;
  uploadTmpDir: string;
  /** The store the app uses: the local disk in storageDir, or the S3 fake with { objectStore }. */
  storage: Storage;
  /** Only with useTestApp(…, { objectStore }): the S3 fake, started and stopped with the app. */
  s3: FakeS3;
};

export type TestAppOptions = {
  mail?: boolean;
  /** Photos and attachments in a local S3 fake (s3rver) instead of the local disk. */
  objectStore?: boolean | Partial<ObjectStoreSettings>;
  /** The file's own migrated database (the mail option implies it). */
  ownDatabase?: boolean;
};

/**
 * Starts one app for the test file; `overrides` changes config (e.g. a low rate limit).
 * `{ mail: true }` gives the file its own database, a mail catcher and a worker (see ./mail.ts);
 * `{ objectStore: true }` keeps its files in a local S3 fake (see ./s3.ts).
 */
export function useTestApp(
  overrides: Partial<AppConfig> = {},
  options: TestAppOptions = {},
): TestApp {
  const ctx = {} as TestApp & { server: Server };
  let mailSetup: Awaited<ReturnType<typeof prepareTestMail>> | undefined;
  let ownDatabase: Awaited<ReturnType<typeof createOwnDatabase>> | undefined;
  let filesDir: string | undefined;
  beforeAll(async () => {
    filesDir = fs.mkdtempSync(path.join(os.tmpdir(), 'headroom-test-files-'));
    // Listen first: the app's origin (its port) is part of its config, as APP_URL is in production.
    ctx.server = createServer();
    await new Promise<void>((resolve) => ctx.server.listen(0, '127.0.0.1', resolve));
    const { port } = ctx.server.address() as AddressInfo;
    ctx.origin = `http://127.0.0.1:${port}`;
    const base = loadConfig({ ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'silent' });
    let config: AppConfig = {
      ...base,
      authRateLimit: 100_000,
      passwordResetRateLimit: 100_000,
      rateLimitPrefix: `test-${randomUUID()}:`,
      serveClient: false,
      storageDir: path.join(filesDir, 'uploads'),
      uploadTmpDir: path.join(filesDir, 'upload-tmp'),
      appUrl: ctx.origin,
      allowedOrigins: [ctx.origin],
      ...overrides,
    };
    if (options.mail) {
      mailSetup = await prepareTestMail(config);
      config = mailSetup.config;
    } else if (options.ownDatabase) {
      ownDatabase = await createOwnDatabase(config.databaseUrl);
      config = { ...config, databaseUrl: ownDatabase.databaseUrl };
    }
    if (options.objectStore) {
      ctx.s3 = await startFakeS3();
      const extra = typeof options.objectStore === 'object' ? options.objectStore : {};
      config = { ...config, objectStore: ctx.s3.settings(extra) };
    }
    ctx.storageDir = config.storageDir;
    ctx.uploadTmpDir = config.uploadTmpDir;
    ctx.storage = createStorage(config);
    ctx.db = createDatabase(config.databaseUrl);
    const app = createApp({
      db: ctx.db,
      config,
      logger: createLogger('silent'),
      storage: ctx.storage,
    });
    ctx.server.on('request', app);
    ctx.routes = app.routes;
    ctx.agent = () => supertest.agent(ctx.origin).set('Origin', ctx.origin);
    ctx.bare = () => supertest(ctx.origin);
    if (mailSetup) ctx.mail = mailSetup.attach(ctx.db, ctx.origin);
  });
  afterAll(async () => {
    await new Promise((r) => ctx.server?.close(r));
    await ctx.db?.close();
    await mailSetup?.teardown();
    await ownDatabase?.drop();
    (ctx.storage as { close?: () => void } | undefined)?.close?.();
    await ctx.s3?.close();
    if (filesDir) fs.rmSync(filesDir, { recursive: true, force: true });
  });
  return ctx;
}
