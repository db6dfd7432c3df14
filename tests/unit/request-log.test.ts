/** The request log: one line a request, with no cookie, body or link token in it. */
import { Writable } from 'node:stream';
import express from 'express';
import { pino } from 'pino';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { requestLog } from '@server/middleware/request-log';

function appWithLog() {
  const lines: Record<string, unknown>[] = [];
  const sink = new Writable({
    write(chunk: Buffer, _enc, done) {
      for (const l of chunk.toString().split('\n').filter(Boolean)) lines.push(JSON.parse(l));
      done();
    },
  });
  const app = express();
  app.use(requestLog(pino(sink), { ignore: (url) => url === '/api/health' }));
  app.use(express.json());
  app.get('/api/health', (_req, res) => void res.json({ ok: true }));
  app.post('/api/invitations/:token/accept', (_req, res) => void res.status(201).json({}));
  app.get('/api/broken', (_req, res) => void res.status(500).json({}));
  return { app, lines };
}

const token = 'A'.repeat(43);
const settle = () => new Promise((r) => setTimeout(r, 20));

describe('request log', () => {
  it('writes one line: method, URL with the token redacted, status and time', async () => {
    const { app, lines } = appWithLog();
    await request(app)
      .post(`/api/invitations/${token}/accept?x=1`)
      .set('Cookie', 'headroom_session=secret-session')
      .send({ password: 'hunter2-hunter2' });
    await settle();
    expect(lines).toHaveLength(1);
    const [line] = lines;
    expect(line).toMatchObject({
      level: 30,
      msg: 'request completed',
      req: { method: 'POST', url: '/api/invitations/[token]/accept?x=1' },
      res: { status: 201 },
    });
    expect(typeof line.responseTime).toBe('number');
    const text = JSON.stringify(line);
    for (const secret of [token, 'secret-session', 'hunter2']) expect(text).not.toContain(secret);
  });

  it('logs a 5xx at error level and skips the health check', async () => {
    const { app, lines } = appWithLog();
    await request(app).get('/api/health');
    await request(app).get('/api/broken');
    await settle();
    expect(lines.map((l) => [l.level, l.msg, (l.res as { status: number }).status])).toEqual([
      [50, 'request errored', 500],
    ]);
  });
});
