/**
 * Test harness: a real app from createApp() on a real PostgreSQL, listening on a
 * loopback port, and signed-in agents that carry cookies and the right Origin.
 */
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { randomUUID } from 'node:crypto';
import supertest from 'supertest';
import { afterAll, beforeAll } from 'vitest';
import { createApp } from '../../server/app';
import { loadConfig, type AppConfig } from '../../server/config';
import { createDatabase, type Database } from '../../server/lib/database';
import { createLogger } from '../../server/lib/logger';

export type Agent = ReturnType<typeof supertest.agent>;

export type TestApp = {
  db: Database;
  origin: string;
  /** An agent with the app's own Origin and no session. */
  agent: () => Agent;
  /** A raw request without Origin, for the CSRF checks. */
  bare: () => ReturnType<typeof supertest>;
};

/** Starts one app for the test file; `overrides` changes config (e.g. a low rate limit). */
export function useTestApp(overrides: Partial<AppConfig> = {}): TestApp {
  const ctx = {} as TestApp & { server: Server };
  beforeAll(async () => {
    const base = loadConfig({ ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'silent' });
    const config: AppConfig = {
      ...base,
      authRateLimit: 100_000,
      rateLimitPrefix: `test-${randomUUID()}:`,
      serveClient: false,
      ...overrides,
    };
    ctx.db = createDatabase(config.databaseUrl);
    const app = createApp({ db: ctx.db, config, logger: createLogger('silent') });
    ctx.server = await new Promise<Server>((resolve) => {
      const s = app.listen(0, '127.0.0.1', () => resolve(s));
    });
    const { port } = ctx.server.address() as AddressInfo;
    ctx.origin = `http://127.0.0.1:${port}`;
    ctx.agent = () => supertest.agent(ctx.origin).set('Origin', ctx.origin);
    ctx.bare = () => supertest(ctx.origin);
  });
  afterAll(async () => {
    await new Promise((r) => ctx.server?.close(r));
    await ctx.db?.close();
  });
  return ctx;
}
