import { describe, expect, it } from 'vitest';
import { useTestApp } from '../helpers/app';
import { password, signUp, uniqueEmail } from '../helpers/factories';

describe('failed sign-ins from one address', () => {
  const app = useTestApp({ authRateLimit: 3, accountRateLimit: 100 });

  it('answers 429 with a clear message after too many failures, on a counter of its own', async () => {
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
    // Sign-up counts on its own counter: the failed sign-ins do not hold it back.
    const signUpRes = await app
      .agent()
      .post('/api/auth/sign-up')
      .send({ email: uniqueEmail(), password, displayName: 'A' });
    expect(signUpRes.status).toBe(201);
  });

  it('keeps the counters in PostgreSQL, not in the process', async () => {
    const rows = await app.db.knex('rate_limit_hits').where('key', 'like', 'test-%sign-in:ip:%');
    expect(rows.some((r: { hits: number }) => r.hits >= 3)).toBe(true);
  });
});

describe('successful sign-ins', () => {
  const app = useTestApp({ authRateLimit: 2, accountRateLimit: 2 });

  it('are not counted: a garage behind one address can sign in all day', async () => {
    const user = await signUp(app, 'garage');
    for (let i = 0; i < 6; i++) {
      const res = await app.agent().post('/api/auth/sign-in').send({ email: user.email, password });
      expect(res.status).toBe(200);
    }
  });
});

describe('failed sign-ins to one account', () => {
  const app = useTestApp({ authRateLimit: 1000, accountRateLimit: 3 });

  it('slow that account only, while the same address still signs in to others', async () => {
    const [target, other] = [await signUp(app, 'target'), await signUp(app, 'other')];
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++) {
      statuses.push(
        (
          await app
            .agent()
            .post('/api/auth/sign-in')
            .send({ email: target.email, password: 'wrong-password-here' })
        ).status,
      );
    }
    expect(statuses).toEqual([401, 401, 401, 429]);
    // The right password for the locked account waits too: the lock is on the account.
    const locked = await app
      .agent()
      .post('/api/auth/sign-in')
      .send({ email: target.email, password });
    expect(locked.status).toBe(429);
    const fine = await app.agent().post('/api/auth/sign-in').send({ email: other.email, password });
    expect(fine.status).toBe(200);
  });
});
