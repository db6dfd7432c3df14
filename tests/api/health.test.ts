/**
 * The health check asks PostgreSQL through the pool the app's reads use (lib/database.ts
 * ping): when that pool has no connection to give, health says so instead of "ok".
 */
import type { Knex } from 'knex';
import { describe, expect, it } from 'vitest';
import { useTestApp } from '../helpers/app';

const app = useTestApp();

describe('GET /api/health', () => {
  it('answers ok while the database answers', async () => {
    const res = await app.agent().get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true });
  });

  it(
    'answers 503 while every connection of the reads’ pool is held, then ok again',
    { timeout: 30_000 },
    async () => {
      const knex = app.db.knex;
      const size = (knex.client.config as Knex.Config).pool?.max ?? 10;
      const held: Knex.Transaction[] = [];
      for (let i = 0; i < size; i++) held.push(await knex.transaction());
      try {
        const res = await app.agent().get('/api/health').timeout(15_000);
        expect(res.status).toBe(503);
        expect(res.body.error.code).toBe('database_unavailable');
      } finally {
        for (const trx of held) await trx.rollback();
      }
      expect((await app.agent().get('/api/health')).status).toBe(200);
    },
  );
});
