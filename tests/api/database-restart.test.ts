/**
 * PostgreSQL restarts under a running app: the process must live, answer a clean
 * 503 while the database is away (within seconds, no hang), and serve again on
 * the same process and the same session once it is back. The mail worker too.
 */
import type { AddressInfo } from 'node:net';
import { createServer, type Server } from 'node:http';
import knexFactory from 'knex';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { knexConfig } from '@db/knexfile';
import { createApp } from '@server/app';
import { loadConfig } from '@server/config';
import { createDatabase, type Database } from '@server/lib/database';
import { createLogger } from '@server/lib/logger';
import { createMailWorker } from '@server/features/mail/mail.worker';
import { enqueueMail } from '@server/features/mail/mail.repository';
import { createPgCluster, type PgCluster } from '../../scripts/lib/pg-cluster';
import { password } from '../helpers/factories';

let cluster: PgCluster;
let db: Database;
let server: Server;
let origin: string;
const poolErrors: Error[] = [];
const sent: string[] = [];

beforeAll(async () => {
  cluster = await createPgCluster();
  const migrator = knexFactory(knexConfig(cluster.url));
  await migrator.migrate.latest().finally(() => migrator.destroy());
  server = createServer();
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
  origin = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const config = {
    ...loadConfig({ ...process.env, DATABASE_URL: cluster.url, NODE_ENV: 'test' }),
    serveClient: false,
    rateLimitPrefix: 'restart-test:',
    allowedOrigins: [origin],
  };
  db = createDatabase(cluster.url, { onError: (e) => poolErrors.push(e) });
  server.on('request', createApp({ db, config, logger: createLogger('silent') }));
}, 60_000);

afterAll(async () => {
  await new Promise((r) => server?.close(r));
  await db?.close();
  cluster?.remove();
});

const timed = async <T>(f: () => Promise<T>) => {
  const t0 = Date.now();
  const value = await f();
  return { value, ms: Date.now() - t0 };
};

describe('the database goes away and comes back', () => {
  it('answers 503 meanwhile and serves again on the same process and session', async () => {
    const agent = supertest.agent(origin).set('Origin', origin);
    const signUp = await agent
      .post('/api/auth/sign-up')
      .send({ email: 'restart@example.test', password, displayName: 'Restart test' });
    expect(signUp.status).toBe(201);
    expect((await agent.get('/api/builds')).status).toBe(200);

    const worker = createMailWorker({
      knex: db.knex,
      mailer: {
        send: async (m: { to: string }) => {
          sent.push(m.to);
          return { messageId: `<${sent.length}@test>` };
        },
        close: () => undefined,
      } as never,
      logger: createLogger('silent'),
      appUrl: origin,
      pollMs: 100,
    });
    worker.start();

    // Light load across the stop: every answer is 200 or a clean 503, never a crash or a hang.
    let loading = true;
    const statuses: number[] = [];
    const load = (async () => {
      while (loading) {
        const r = await agent.get('/api/builds').timeout(10_000);
        statuses.push(r.status);
        await new Promise((res) => setTimeout(res, 50));
      }
    })();
    await new Promise((r) => setTimeout(r, 300));
    cluster.stop();

    const health = await timed(() => supertest(origin).get('/api/health').timeout(10_000));
    expect(health.value.status).toBe(503);
    expect(health.ms).toBeLessThan(8_000);
    const builds = await timed(() => agent.get('/api/builds').timeout(10_000));
    expect(builds.value.status).toBe(503);
    expect(builds.value.body.error.code).toBe('database_unavailable');
    expect(JSON.stringify(builds.value.body)).not.toMatch(/ECONNREFUSED|stack|at /);
    expect(builds.ms).toBeLessThan(8_000);
    const write = await agent.post('/api/builds').send({ name: 'x' });
    expect([400, 503]).toContain(write.status);
    // The load's own requests meet the outage too before it ends (stopping is synchronous, so
    // on a quiet machine the checks above can run before the load sends its next request).
    await vi.waitFor(() => expect(statuses).toContain(503), { timeout: 10_000, interval: 50 });

    cluster.start();
    let back = 0;
    for (let i = 0; i < 50 && back !== 200; i++) {
      back = (await supertest(origin).get('/api/health')).status;
      if (back !== 200) await new Promise((r) => setTimeout(r, 200));
    }
    expect(back).toBe(200);
    const again = await agent.get('/api/builds');
    expect(again.status).toBe(200);
    loading = false;
    await load;
    expect(statuses.every((s) => s === 200 || s === 503)).toBe(true);
    expect(statuses).toContain(503);

    // The worker kept polling through the outage and sends what is queued now.
    await enqueueMail(db.knex, {
      kind: 'notice',
      to: 'after-restart@example.test',
      subject: 'After the restart',
      heading: 'After the restart',
      body: 'Queued once the database was back.',
    });
    for (let i = 0; i < 50 && !sent.includes('after-restart@example.test'); i++) {
      await new Promise((r) => setTimeout(r, 100));
    }
    await worker.stop();
    expect(sent).toContain('after-restart@example.test');
  }, 90_000);
});
