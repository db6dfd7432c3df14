/**
 * The security headers are helmet's, worked out once at start-up (middleware/security-headers.ts):
 * every kind of answer carries exactly the headers helmet itself sets with the same settings.
 */
import type { AddressInfo } from 'node:net';
import express from 'express';
import helmet from 'helmet';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { helmetOptions } from '@server/middleware/security-headers';
import { useTestApp } from '../helpers/app';

const app = useTestApp();

/** helmet's own answer headers for the app's settings, from a bare Express app running helmet itself. */
let reference: Record<string, string>;
let close: () => void;
beforeAll(async () => {
  const bare = express();
  bare.disable('x-powered-by');
  bare.use(helmet(helmetOptions({ hsts: false })));
  bare.get('/', (_req, res) => res.json({ ok: true }));
  const server = bare.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  close = () => server.close();
  const res = await fetch(`http://127.0.0.1:${(server.address() as AddressInfo).port}/`);
  reference = {};
  res.headers.forEach((value, name) => {
    if (
      !['date', 'connection', 'keep-alive', 'content-type', 'content-length', 'etag'].includes(name)
    )
      reference[name] = value;
  });
});
afterAll(() => close?.());

function securityPart(headers: Record<string, string>) {
  return Object.fromEntries(Object.keys(reference).map((name) => [name, headers[name]]));
}

describe('security headers', () => {
  it('are the ones helmet sets (a sanity check of the reference itself)', () => {
    expect(reference['content-security-policy']).toContain("default-src 'self'");
    expect(reference['x-content-type-options']).toBe('nosniff');
    expect(reference['x-frame-options']).toBe('SAMEORIGIN');
    expect(Object.keys(reference).length).toBeGreaterThanOrEqual(10);
  });

  it('are on every kind of answer: health, a 401, a 404, a refused write', async () => {
    const answers = await Promise.all([
      app.agent().get('/api/health'),
      app.agent().get('/api/me'),
      app.agent().get('/api/no-such-thing'),
      app.bare().post('/api/auth/sign-in').send({}),
    ]);
    expect(answers.map((r) => r.status)).toEqual([200, 401, 404, 403]);
    for (const res of answers) {
      expect(securityPart(res.headers as Record<string, string>)).toEqual(reference);
      expect(res.headers['x-powered-by']).toBeUndefined();
    }
  });
});
