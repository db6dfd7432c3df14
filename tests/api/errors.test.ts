import { describe, expect, it } from 'vitest';
import { useTestApp } from '../helpers/app';
import { buildInput, signUp } from '../helpers/factories';

const app = useTestApp();

describe('bad input gets a clear 400 and changes nothing', () => {
  it('names each wrong-typed field', async () => {
    const owner = await signUp(app);
    const res = await owner.agent.post('/api/builds').send({
      ...buildInput,
      cylinders: 'eight',
      targetPowerHp: -5,
      budgetCents: 12.5,
      currency: 'XXX',
      targetDate: '31/12/2027',
    });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(Object.keys(res.body.error.fields).sort()).toEqual([
      'budgetCents',
      'currency',
      'cylinders',
      'targetDate',
      'targetPowerHp',
    ]);
    expect((await owner.agent.get('/api/builds')).body.builds).toEqual([]);
  });

  it('names each missing field', async () => {
    const owner = await signUp(app);
    const res = await owner.agent.post('/api/builds').send({});
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('name');
    expect(res.body.error.fields).toHaveProperty('cylinders');
    expect(res.body.error.fields).toHaveProperty('targetPowerHp');
  });

  it('refuses a 1 MB string with a field message, not a crash', async () => {
    const owner = await signUp(app);
    const res = await owner.agent
      .post('/api/builds')
      .send({ ...buildInput, name: 'x'.repeat(1_000_000) });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.name).toMatch(/at most 120/);
    const signUpRes = await app
      .agent()
      .post('/api/auth/sign-up')
      .send({ email: 'a@example.test', password: 'p'.repeat(1_000_000), displayName: 'x' });
    expect(signUpRes.status).toBe(400);
  });

  it('answers 400 to malformed JSON', async () => {
    const owner = await signUp(app);
    const res = await owner.agent
      .post('/api/builds')
      .set('Content-Type', 'application/json')
      .send('{"name": "half');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('malformed_json');
  });

  it('answers 413 to a body over the size limit', async () => {
    const owner = await signUp(app);
    const res = await owner.agent
      .post('/api/builds')
      .send({ ...buildInput, name: 'x'.repeat(3_000_000) });
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('too_large');
  });

  it('refuses a JSON body that is not an object', async () => {
    const owner = await signUp(app);
    const res = await owner.agent.post('/api/builds').send([1, 2, 3]);
    expect(res.status).toBe(400);
  });
});

describe('unknown routes and unexpected failures', () => {
  it('answers an unknown /api route with 404 JSON', async () => {
    const res = await app.agent().get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });

  it('answers 503 from /api/health and a clean 503 JSON error elsewhere when the database does not answer', async () => {
    // A second app whose database URL points at a closed port.
    const { createApp } = await import('@server/app');
    const { loadConfig } = await import('@server/config');
    const { createDatabase } = await import('@server/lib/database');
    const { createLogger } = await import('@server/lib/logger');
    const supertest = (await import('supertest')).default;
    const config = {
      ...loadConfig({ ...process.env, DATABASE_URL: 'postgres://headroom@127.0.0.1:1/none' }),
      serveClient: false,
    };
    const db = createDatabase(config.databaseUrl);
    const broken = createApp({ db, config, logger: createLogger('silent') });
    const health = await supertest(broken).get('/api/health');
    expect(health.status).toBe(503);
    const me = await supertest(broken).get('/api/me').set('Cookie', 'headroom_session=abc');
    expect(me.status).toBe(503);
    expect(me.body.error.code).toBe('database_unavailable');
    expect(JSON.stringify(me.body)).not.toMatch(/ECONNREFUSED|stack/);
    await db.close();
  });
});
