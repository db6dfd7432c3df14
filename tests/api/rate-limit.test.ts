import { describe, expect, it } from 'vitest';
import { useTestApp } from '../helpers/app';
import { password, uniqueEmail } from '../helpers/factories';

const app = useTestApp({ authRateLimit: 3 });

describe('rate limit on sign-in and sign-up', () => {
  it('answers 429 with a clear message after too many attempts', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++) {
      const res = await app
        .agent()
        .post('/api/auth/sign-in')
        .send({ email: uniqueEmail(), password });
      statuses.push(res.status);
      if (res.status === 429) {
        expect(res.body.error.code).toBe('rate_limited');
        expect(res.body.error.message).toMatch(/try again/i);
      }
    }
    expect(statuses).toEqual([401, 401, 401, 429]);
    // Sign-up shares the counter: the same client is still held back.
    const signUp = await app
      .agent()
      .post('/api/auth/sign-up')
      .send({ email: uniqueEmail(), password, displayName: 'A' });
    expect(signUp.status).toBe(429);
  });

  it('keeps the counter in PostgreSQL, not in the process', async () => {
    const rows = await app.db.knex('rate_limit_hits').where('key', 'like', 'test-%').select('hits');
    expect(rows.some((r: { hits: number }) => r.hits >= 4)).toBe(true);
  });
});
