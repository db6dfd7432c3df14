/**
 * What an attacker or a careless client can send: every case here once gave a
 * 500 or let something through, and must now be a clear 4xx with nothing changed.
 */
import http from 'node:http';
import { describe, expect, it } from 'vitest';
import { passwordChecks } from '@server/lib/auth';
import { useTestApp } from '../helpers/app';
import {
  addMember,
  buildInput,
  buildWithCast,
  createBuild,
  password,
  signUp,
  uniqueEmail,
} from '../helpers/factories';

const app = useTestApp();
// What the hardening issue asks for by default: at most 20 invitations an hour and 50 a day.
const invitationLimits = { perHour: 20, perDay: 50 };

/** A raw HTTP request, for bodies and paths supertest would tidy up. */
function raw(opts: {
  method: string;
  path: string;
  headers?: Record<string, string>;
  body?: Buffer | string;
}): Promise<{ status: number; body: string; headers: http.IncomingHttpHeaders }> {
  const url = new URL(app.origin);
  return new Promise((resolve, reject) => {
    const req = http.request(
      {
        host: url.hostname,
        port: url.port,
        method: opts.method,
        path: opts.path,
        headers: { Origin: app.origin, ...opts.headers },
      },
      (res) => {
        let body = '';
        res.on('data', (d) => (body += d));
        res.on('end', () => resolve({ status: res.statusCode!, body, headers: res.headers }));
      },
    );
    req.on('error', reject);
    if (opts.body) req.write(opts.body);
    req.end();
  });
}

const cookieOf = (agent: { jar: { getCookies: (o: object) => { toValueString(): string }[] } }) =>
  agent.jar
    .getCookies({ domain: '127.0.0.1', path: '/', secure: false, script: false })
    .map((c) => c.toValueString())
    .join('; ');

describe('text PostgreSQL cannot store', () => {
  it('refuses a NUL character in a JSON field, naming the field, and saves nothing', async () => {
    const owner = await signUp(app);
    const res = await owner.agent
      .post('/api/builds')
      .send({ ...buildInput, name: 'Nul\u0000build' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['name']);
    expect((await owner.agent.get('/api/builds')).body.builds).toEqual([]);
  });

  it('refuses a NUL in a photo caption and in a CSV cell', async () => {
    const { owner, build } = await buildWithCast(app);
    const part = await owner.agent
      .post(`/api/builds/${build.id}/parts`)
      .send({ category: 'fuel-injection', name: 'Injector set' });
    const upload = await owner.agent
      .post(`/api/builds/${build.id}/parts/${part.body.part.id}/photos`)
      .field('caption', 'bad\u0000caption')
      .attach('photos', Buffer.from('not read'), 'x.jpg');
    expect(upload.status).toBe(400);
    expect(upload.body.error.fields).toHaveProperty('caption');
    const csv = 'category,name\nfuel-injection,Nozzle\u0000set\n';
    const imp = await owner.agent
      .post(`/api/builds/${build.id}/parts/import`)
      .attach('file', Buffer.from(csv), 'parts.csv');
    expect(imp.status).toBe(400);
    expect(imp.body.error.rows[0].fields).toHaveProperty('name');
    expect((await owner.agent.get(`/api/builds/${build.id}/parts`)).body.parts).toHaveLength(1);
  });

  it('refuses the date 0000-01-01 and anything outside 1900–2100', async () => {
    const owner = await signUp(app);
    for (const targetDate of ['0000-01-01', '1899-12-31', '2101-01-01']) {
      const res = await owner.agent.post('/api/builds').send({ ...buildInput, targetDate });
      expect(res.status, targetDate).toBe(400);
      expect(Object.keys(res.body.error.fields)).toEqual(['targetDate']);
    }
    const ok = await owner.agent
      .post('/api/builds')
      .send({ ...buildInput, targetDate: '2100-12-31' });
    expect(ok.status).toBe(201);
  });

  it('names a field called __proto__ instead of answering with no fields', async () => {
    const owner = await signUp(app);
    // JSON.stringify would drop a __proto__ key, so the body is written by hand.
    const body = `{"__proto__":{"admin":true},${JSON.stringify(buildInput).slice(1)}`;
    const res = await raw({
      method: 'POST',
      path: '/api/builds',
      headers: { 'Content-Type': 'application/json', Cookie: cookieOf(owner.agent as never) },
      body,
    });
    expect(res.status).toBe(400);
    const fields = JSON.parse(res.body).error.fields;
    expect(Object.keys(fields)).toEqual(['__proto__']);
    expect(Object.values(fields)).toEqual(['Unknown field']);
  });
});

describe('bodies and paths that cannot be read', () => {
  it('answers 4xx to a Content-Encoding that the body does not have', async () => {
    const owner = await signUp(app);
    for (const encoding of ['gzip', 'deflate', 'br']) {
      const res = await raw({
        method: 'POST',
        path: '/api/builds',
        headers: {
          'Content-Type': 'application/json',
          'Content-Encoding': encoding,
          Cookie: cookieOf(owner.agent as never),
        },
        body: JSON.stringify(buildInput),
      });
      expect(res.status, encoding).toBeGreaterThanOrEqual(400);
      expect(res.status, encoding).toBeLessThan(500);
      expect(JSON.parse(res.body).error.code).toBeTruthy();
    }
    expect((await owner.agent.get('/api/builds')).body.builds).toEqual([]);
  });

  it('answers 400 to broken %-encoding in a path', async () => {
    const owner = await signUp(app);
    const build = await createBuild(owner);
    for (const bad of ['%E0%A4%A', '%ff%fe']) {
      const res = await raw({
        method: 'GET',
        path: `/api/builds/${build.id}/parts/${bad}`,
        headers: { Cookie: cookieOf(owner.agent as never) },
      });
      expect(res.status, bad).toBe(400);
      expect(JSON.parse(res.body).error.code).toBe('bad_path');
    }
  });

  it('answers 400 to broken multipart bodies on every upload route', async () => {
    const { owner, build } = await buildWithCast(app);
    const part = await owner.agent
      .post(`/api/builds/${build.id}/parts`)
      .send({ category: 'fuel-injection', name: 'Injector set' });
    const cookie = cookieOf(owner.agent as never);
    const routes = [
      `/api/builds/${build.id}/parts/import`,
      `/api/builds/${build.id}/parts/${part.body.part.id}/photos`,
    ];
    const bodies: [string, Record<string, string>, string][] = [
      ['no boundary', { 'Content-Type': 'multipart/form-data' }, 'whatever'],
      [
        'cut off',
        { 'Content-Type': 'multipart/form-data; boundary=XyZ' },
        '--XyZ\r\nContent-Disposition: form-data; name="file"; filename="a.csv"\r\n\r\ncategory,na',
      ],
      [
        'garbage headers',
        { 'Content-Type': 'multipart/form-data; boundary=XyZ' },
        '--XyZ\r\n\u0001\u0002garbage: :\r\nno colon here\r\n\r\nbody\r\n--XyZ--\r\n',
      ],
    ];
    for (const route of routes) {
      for (const [what, headers, body] of bodies) {
        const res = await raw({
          method: 'POST',
          path: route,
          headers: { ...headers, Cookie: cookie },
          body,
        });
        expect(res.status, `${what} → ${route}`).toBeGreaterThanOrEqual(400);
        expect(res.status, `${what} → ${route}`).toBeLessThan(500);
      }
    }
  });
});

describe('simultaneous first saves', () => {
  it('of notice preferences all succeed, and the choices are consistent', async () => {
    const { crew, build } = await buildWithCast(app);
    const url = `/api/builds/${build.id}/notice-preferences`;
    const results = await Promise.all(
      Array.from({ length: 6 }, () => crew.agent.put(url).send({ 'part-received': false })),
    );
    expect(results.map((r) => r.status)).toEqual([200, 200, 200, 200, 200, 200]);
    expect((await crew.agent.get(url)).body.preferences['part-received']).toBe(false);
  });
});

describe('requests from somewhere else', () => {
  it('refuses a write whose Origin matches its own Host but not the app (DNS rebinding)', async () => {
    const owner = await signUp(app);
    const res = await raw({
      method: 'POST',
      path: '/api/builds',
      headers: {
        Host: 'rebound.example.test',
        Origin: 'http://rebound.example.test',
        'Content-Type': 'application/json',
        Cookie: cookieOf(owner.agent as never),
      },
      body: JSON.stringify(buildInput),
    });
    expect(res.status).toBe(403);
    expect(JSON.parse(res.body).error.code).toBe('bad_origin');
  });

  it('shows caught mail only under the configured host name', async () => {
    const own = await raw({ method: 'GET', path: '/dev/mail?format=json' });
    expect(own.status).toBe(200);
    const rebound = await raw({
      method: 'GET',
      path: '/dev/mail?format=json',
      headers: { Host: 'rebound.example.test' },
    });
    expect(rebound.status).toBe(404);
  });
});

describe('invitations as a mailer', () => {
  it(`stop after ${invitationLimits.perHour} an hour from one owner, with a 429 that says so`, async () => {
    const owner = await signUp(app, 'bulk');
    const build = await createBuild(owner);
    const statuses: number[] = [];
    for (let i = 0; i <= invitationLimits.perHour; i++) {
      const res = await owner.agent
        .post(`/api/builds/${build.id}/invitations`)
        .send({ email: uniqueEmail('spam'), role: 'viewer' });
      statuses.push(res.status);
      if (res.status === 429) expect(res.body.error.code).toBe('invitation_limit');
    }
    expect(statuses.filter((s) => s === 201)).toHaveLength(invitationLimits.perHour);
    expect(statuses.at(-1)).toBe(429);
    // A second build of the same owner is held back too: the limit is per owner as well.
    const other = await createBuild(owner);
    const more = await owner.agent
      .post(`/api/builds/${other.id}/invitations`)
      .send({ email: uniqueEmail('spam'), role: 'viewer' });
    expect(more.status).toBe(429);
  });

  it('hold under simultaneous requests', async () => {
    const owner = await signUp(app, 'burst');
    const build = await createBuild(owner);
    const results = await Promise.all(
      Array.from({ length: 30 }, () =>
        owner.agent
          .post(`/api/builds/${build.id}/invitations`)
          .send({ email: uniqueEmail('burst'), role: 'viewer' }),
      ),
    );
    expect(results.filter((r) => r.status === 201)).toHaveLength(invitationLimits.perHour);
    expect(results.every((r) => r.status === 201 || r.status === 429)).toBe(true);
  });
});

describe('sessions', () => {
  it('signing in again in the same browser ends the session it had', async () => {
    const [a, b] = [await signUp(app, 'first'), await signUp(app, 'second')];
    const oldCookie = cookieOf(a.agent as never);
    const res = await a.agent.post('/api/auth/sign-in').send({ email: b.email, password });
    expect(res.status).toBe(200);
    const old = await raw({ method: 'GET', path: '/api/me', headers: { Cookie: oldCookie } });
    expect(old.status).toBe(401);
    expect((await a.agent.get('/api/me')).body.user.email).toBe(b.email);
  });

  it('checks a password hash for an unknown address too, so timing does not tell', async () => {
    const before = passwordChecks.count;
    const res = await app
      .agent()
      .post('/api/auth/sign-in')
      .send({ email: uniqueEmail('nobody'), password });
    expect(res.status).toBe(401);
    expect(passwordChecks.count).toBe(before + 1);
  });
});

describe('caching', () => {
  it('marks authenticated JSON no-store', async () => {
    const owner = await signUp(app);
    const res = await owner.agent.get('/api/builds');
    expect(res.headers['cache-control']).toBe('no-store');
    const me = await owner.agent.get('/api/me');
    expect(me.headers['cache-control']).toBe('no-store');
  });
});

describe('CSV export', () => {
  it('neutralises every text cell a spreadsheet could run, and a re-import restores it', async () => {
    const owner = await signUp(app);
    const build = await createBuild(owner);
    const shopEmail = `+shop-${Date.now()}@example.test`;
    const shopAgent = app.agent();
    expect(
      (
        await shopAgent
          .post('/api/auth/sign-up')
          .send({ email: shopEmail, password, displayName: 'Plus shop' })
      ).status,
    ).toBe(201);
    const shopUser = (await shopAgent.get('/api/me')).body.user;
    await addMember(owner, build.id, { ...shopUser, agent: shopAgent }, 'shop');
    const shopId = (await owner.agent.get(`/api/builds/${build.id}/members`)).body.members.find(
      (m: { email: string }) => m.email === shopEmail,
    ).userId;
    const names = [' =1+1', '\t=2+2', '\uFF1DSUM(A1)', '-3+3', '@cmd', 'Plain name'];
    for (const name of names) {
      const res = await owner.agent.post(`/api/builds/${build.id}/parts`).send({
        category: 'fuel-injection',
        name: name.trim() === name ? name : `x${name}`,
        notes: name,
        vendor: name.trim(),
        ...(name === 'Plain name'
          ? { shopUserId: shopId, status: 'at-shop', sentOutOn: '2026-11-01' }
          : {}),
      });
      expect(res.status, JSON.stringify(res.body)).toBe(201);
    }
    const csv = (await owner.agent.get(`/api/builds/${build.id}/parts.csv`)).text;
    expect(csv).toContain(`'${shopEmail}`);
    // No cell may begin (after a quote mark and optional spaces) with a formula character.
    const parsed = (await import('papaparse')).default.parse<string[]>(csv.replace(/^\uFEFF/, ''), {
      skipEmptyLines: true,
    }).data;
    for (const row of parsed.slice(1)) {
      for (const cell of row)
        expect(cell, JSON.stringify(cell)).not.toMatch(
          /^(?:[\t\r\n]|\s*[=+\-@\uFF1D\uFF0B\uFF0D\uFF20])/,
        );
    }
    // Importing the export into another build gives the original text back.
    const other = await createBuild(owner);
    await addMember(owner, other.id, { ...shopUser, agent: shopAgent }, 'shop');
    const imp = await owner.agent
      .post(`/api/builds/${other.id}/parts/import`)
      .attach('file', Buffer.from(csv), 'parts.csv');
    expect(imp.status, JSON.stringify(imp.body)).toBe(201);
    const notes = (await owner.agent.get(`/api/builds/${other.id}/parts`)).body.parts
      .map((p: { notes: string }) => p.notes)
      .sort();
    expect(notes).toEqual(names.map((n) => n.trim()).sort());
  });
});
