import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import { afterAll, describe, expect, it } from 'vitest';
import { useTestApp, type Agent, type TestApp } from '../helpers/app';
import { allKeys, buildWithCast, moneyKeys, signUp, type TestUser } from '../helpers/factories';

// A built client stand-in, so the app serves the HTML shell of /shared/:token as in production.
const clientDir = fs.mkdtempSync(path.join(os.tmpdir(), 'headroom-share-client-'));
fs.writeFileSync(
  path.join(clientDir, 'index.html'),
  `<!doctype html>
<html lang="en">
  <head>
    <meta charset="UTF-8" />
    <meta
      name="description"
      content="Headroom: plan, track and prove a diesel pickup power build."
    />
    <title>Headroom</title>
  </head>
  <body><div id="root"></div></body>
</html>`,
);
afterAll(() => fs.rmSync(clientDir, { recursive: true, force: true }));

const app = useTestApp({ serveClient: true, clientDir });
const limited = useTestApp({ sharedPageRateLimit: 2 });

const jpeg = (color: string) =>
  sharp({ create: { width: 120, height: 80, channels: 3, background: color } })
    .jpeg()
    .toBuffer();

const secretVendor = 'Quiet Ledger Supply';
const secretNotes = 'paid cash, do not tell anyone';

/** A build with money, vendors, notes, a shop's quote, photos, torque readings and a dyno day. */
async function sharedFixture(a: TestApp) {
  const cast = await buildWithCast(a);
  const { owner, crew, build } = cast;
  const base = `/api/builds/${build.id}`;
  const shopId = (await owner.agent.get(`${base}/members`)).body.members.find(
    (m: { role: string }) => m.role === 'shop',
  ).userId;
  const post = async (agent: Agent, url: string, body: object) => {
    const res = await agent.post(`${base}${url}`).send(body);
    expect(res.status, `${url}: ${JSON.stringify(res.body)}`).toBe(201);
    return res.body;
  };
  await post(owner.agent, '/parts', {
    category: 'bottom-end',
    name: 'Stock crank and rods',
    vendor: secretVendor,
    partNumber: 'QLS-0042',
    status: 'installed',
    unitPriceCents: 123_456,
    notes: secretNotes,
    ratingValue: 520,
    ratingUnit: 'hp-crank',
    ratingFor: 'bottom end as assembled',
  });
  await post(owner.agent, '/parts', {
    category: 'fuel-injection',
    name: 'Injector set',
    vendor: secretVendor,
    status: 'at-shop',
    shopUserId: shopId,
    sentOutOn: '2026-11-01',
    labourCents: 96_000,
    notes: `call ${cast.shop.email} when done`,
  });
  await post(owner.agent, '/parts', {
    category: 'cooling',
    name: 'Thermostat (wrong flange)',
    status: 'returned',
    unitPriceCents: 3_900,
  });
  const { job } = await post(crew.agent, '/jobs', { title: 'Head studs', notes: secretNotes });
  const { step } = await post(crew.agent, `/jobs/${job.id}/steps`, {
    title: 'Torque the head studs',
    description: secretNotes,
  });
  const { fastener } = await post(crew.agent, `/steps/${step.id}/fasteners`, {
    name: 'Head stud nuts',
    count: 2,
    targetValue: 100,
    targetUnit: 'lbf-ft',
    toleranceType: 'percent',
    toleranceValue: 5,
    threadCondition: 'oiled',
    specSource: "Maker's service manual (owner's entry)",
  });
  await post(crew.agent, `/fasteners/${fastener.id}/readings`, {
    position: 1,
    value: 101,
    unit: 'lbf-ft',
    wrench: "Teddy's click wrench",
  });
  await post(crew.agent, `/fasteners/${fastener.id}/readings`, {
    position: 2,
    value: 80,
    unit: 'lbf-ft',
  });
  const upload = async (color: string, caption: string) => {
    const res = await crew.agent
      .post(`${base}/steps/${step.id}/photos`)
      .field('caption', caption)
      .attach('photos', await jpeg(color), 'p.jpg');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    return res.body.photos[0] as { id: string };
  };
  const publicPhoto = await upload('#336699', 'Studs in, ready for the heads');
  const privatePhoto = await upload('#993333', 'Receipt on the bench');
  const { session } = await post(owner.agent, '/dyno-sessions', {
    date: '2026-11-14',
    place: 'Secret cell',
    dynoKind: 'chassis',
    runBy: 'Operator Name',
    notes: secretNotes,
  });
  await post(owner.agent, `/dyno-sessions/${session.id}/runs`, {
    status: 'complete',
    powerUnit: 'hp',
    torqueUnit: 'lbf-ft',
    boostUnit: 'psi',
    egtUnit: 'f',
    mixtureKind: 'afr',
    peakPower: 480,
    peakPowerRpm: 3000,
    peakTorque: 950,
    peakTorqueRpm: 2000,
  });
  return { ...cast, base, publicPhoto, privatePhoto, step };
}

async function switchOn(owner: TestUser, base: string, body: object = {}) {
  const res = await owner.agent.put(`${base}/share`).send({ enabled: true, ...body });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body.share as { token: string; url: string; enabled: boolean };
}

describe('sharing: the owner’s switch', () => {
  it('is the owner’s alone: 403 for other roles, 404 for a stranger, 401 signed out', async () => {
    const { owner, crew, shop, viewer, stranger, build } = await buildWithCast(app);
    const base = `/api/builds/${build.id}`;
    const first = await owner.agent.get(`${base}/share`);
    expect(first.status).toBe(200);
    expect(first.body.share).toMatchObject({ enabled: false, token: null, url: null });
    for (const u of [crew, shop, viewer]) {
      expect((await u.agent.get(`${base}/share`)).status).toBe(403);
      expect((await u.agent.put(`${base}/share`).send({ enabled: true })).status).toBe(403);
      expect((await u.agent.post(`${base}/share/regenerate`).send({})).status).toBe(403);
    }
    expect((await stranger.agent.get(`${base}/share`)).status).toBe(404);
    expect((await stranger.agent.put(`${base}/share`).send({ enabled: true })).status).toBe(404);
    expect((await app.agent().get(`${base}/share`)).status).toBe(401);
    expect((await app.agent().put(`${base}/share`).send({ enabled: true })).status).toBe(401);
  });

  it('refuses bad input with a message per field, never a 500', async () => {
    const { owner, build } = await buildWithCast(app);
    const base = `/api/builds/${build.id}`;
    const cases: [object, string][] = [
      [{}, '_'],
      [{ enabled: 'yes' }, 'enabled'],
      [{ sections: { parts: 1 } }, 'sections.parts'],
      [{ sections: { money: true } }, 'sections.money'],
      [{ coverPhotoId: 'not-an-id' }, 'coverPhotoId'],
      [{ tokenLength: 8 }, 'tokenLength'],
    ];
    for (const [body, field] of cases) {
      const res = await owner.agent.put(`${base}/share`).send(body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(Object.keys(res.body.error.fields)).toContain(field);
    }
    const other = await sharedFixture(app);
    // A photo of another build cannot be the cover, nor be made public from here.
    const cover = await owner.agent
      .put(`${base}/share`)
      .send({ coverPhotoId: other.publicPhoto.id });
    expect(cover.status).toBe(400);
    expect(cover.body.error.fields.coverPhotoId).toMatch(/public/);
    const mark = await owner.agent
      .put(`${base}/share/photos/${other.publicPhoto.id}`)
      .send({ public: true });
    expect(mark.status).toBe(404);
    expect((await owner.agent.post(`${base}/share/regenerate`).send({ x: 1 })).status).toBe(400);
  });

  it('gives an address of 256 random bits that opens without a session', async () => {
    const { owner, base, build } = await sharedFixture(app);
    const share = await switchOn(owner, base);
    expect(share.token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    expect(share.url).toBe(`${app.origin}/shared/${share.token}`);
    const res = await app.bare().get(`/api/shared/${share.token}`);
    expect(res.status).toBe(200);
    expect(res.headers['set-cookie']).toBeUndefined();
    expect(res.body.build.name).toBe(build.name);
    // Another build's address is another token.
    const other = await sharedFixture(app);
    expect((await switchOn(other.owner, other.base)).token).not.toBe(share.token);
    // Nothing under the public address is writable.
    for (const method of ['post', 'put', 'patch', 'delete'] as const) {
      const w = await app.agent()[method](`/api/shared/${share.token}`).send({ enabled: false });
      expect(w.status).toBe(404);
    }
  });
});

describe('sharing: what the public page carries', () => {
  it('never money, vendors, notes, private photos, e-mails or names the owner did not choose', async () => {
    const f = await sharedFixture(app);
    const { owner, base } = f;
    expect(
      (await owner.agent.put(`${base}/share/photos/${f.publicPhoto.id}`).send({ public: true }))
        .status,
    ).toBe(200);
    const share = await switchOn(owner, base);
    const res = await app.bare().get(`/api/shared/${share.token}`);
    expect(res.status).toBe(200);
    const text = JSON.stringify(res.body);
    const view = res.body.build;

    expect(moneyKeys(res.body)).toEqual([]);
    expect(allKeys(res.body).filter((k) => /vendor|partNumber|notes|email|quote/i.test(k))).toEqual(
      [],
    );
    for (const secret of [
      secretVendor,
      'QLS-0042',
      secretNotes,
      'Operator Name',
      'Secret cell',
      "Teddy's click wrench",
      'Receipt on the bench',
      f.privatePhoto.id,
      "Maker's service manual",
      '123456',
      '96000',
    ]) {
      expect(text, secret).not.toContain(secret);
    }
    for (const u of [f.owner, f.crew, f.shop, f.viewer]) {
      expect(text).not.toContain(u.email);
      expect(text).not.toContain(u.displayName);
    }
    expect(text).not.toMatch(/[^\s"]+@[^\s"]+\.test/);
    // What it does carry.
    expect(view.crew).toBeNull();
    expect(view.parts.categories.map((c: { category: string }) => c.category)).toEqual([
      'fuel-injection',
      'bottom-end',
    ]);
    expect(view.estimate.weakestLink.name).toBe('Stock crank and rods');
    expect(view.install.totals).toMatchObject({ positionsRecorded: 2, inSpec: 1, outOfSpec: 1 });
    expect(view.dyno.sessions[0].best.peakPower).toBeGreaterThan(400);
    expect(view.photos.map((p: { id: string }) => p.id)).toEqual([f.publicPhoto.id]);
    expect(view.cover.id).toBe(f.publicPhoto.id);
    expect(view.money).toBeNull();
  });

  it('shows names only when the owner chooses, and still no e-mail address', async () => {
    const f = await sharedFixture(app);
    // One reading is out of spec: the owner signs the step off over it, saying why.
    const signed = await f.owner.agent
      .post(`${f.base}/steps/${f.step.id}/sign-off`)
      .send({ overrideReason: 'Re-torqued and re-read on the bench' });
    expect(signed.status, JSON.stringify(signed.body)).toBe(200);
    const hidden = await switchOn(f.owner, f.base);
    const before = (await app.bare().get(`/api/shared/${hidden.token}`)).body.build;
    const signOff = (v: typeof before) => v.install.jobs[0].steps[0].signOff;
    expect(signOff(before)).toMatchObject({ by: null, override: true });
    expect(before.crew).toBeNull();

    await f.owner.agent.put(`${f.base}/share`).send({ showMemberNames: true }).expect(200);
    const view = (await app.bare().get(`/api/shared/${hidden.token}`)).body.build;
    expect(view.crew.map((m: { name: string }) => m.name)).toContain(f.crew.displayName);
    expect(signOff(view).by).toBe(f.owner.displayName);
    const text = JSON.stringify(view);
    for (const u of [f.owner, f.crew, f.shop, f.viewer]) expect(text).not.toContain(u.email);
    expect(text).not.toContain('Re-torqued and re-read');
  });

  it('leaves out every section the owner switched off', async () => {
    const f = await sharedFixture(app);
    const share = await switchOn(f.owner, f.base, {
      sections: { summary: false, parts: false, estimate: false, install: false, dyno: false },
    });
    const view = (await app.bare().get(`/api/shared/${share.token}`)).body.build;
    expect(view).toMatchObject({
      summary: null,
      parts: null,
      estimate: null,
      install: null,
      dyno: null,
    });
    expect(view.bench).not.toBeNull();
  });
});

describe('sharing: addresses that stop working', () => {
  it('answers 404 once switched off, and for the old address once renewed', async () => {
    const f = await sharedFixture(app);
    await f.owner.agent.put(`${f.base}/share/photos/${f.publicPhoto.id}`).send({ public: true });
    const first = await switchOn(f.owner, f.base);
    const photoUrl = (token: string) => `/api/shared/${token}/photos/${f.publicPhoto.id}/thumb`;
    expect((await app.bare().get(photoUrl(first.token))).status).toBe(200);

    await f.owner.agent.put(`${f.base}/share`).send({ enabled: false }).expect(200);
    expect((await app.bare().get(`/api/shared/${first.token}`)).status).toBe(404);
    expect((await app.bare().get(photoUrl(first.token))).status).toBe(404);
    expect((await app.bare().get(`/shared/${first.token}`)).status).toBe(404);

    // Back on: the same address again, until the owner renews it.
    await switchOn(f.owner, f.base);
    expect((await app.bare().get(`/api/shared/${first.token}`)).status).toBe(200);
    const renewed = (await f.owner.agent.post(`${f.base}/share/regenerate`).send({})).body.share;
    expect(renewed.token).not.toBe(first.token);
    expect(renewed.enabled).toBe(true);
    expect((await app.bare().get(`/api/shared/${first.token}`)).status).toBe(404);
    expect((await app.bare().get(photoUrl(first.token))).status).toBe(404);
    expect((await app.bare().get(`/api/shared/${renewed.token}`)).status).toBe(200);
    expect((await app.bare().get(photoUrl(renewed.token))).status).toBe(200);
  });

  it('serves only public photos of the shared build, and none when photos are hidden', async () => {
    const f = await sharedFixture(app);
    const other = await sharedFixture(app);
    await f.owner.agent.put(`${f.base}/share/photos/${f.publicPhoto.id}`).send({ public: true });
    await other.owner.agent
      .put(`${other.base}/share/photos/${other.publicPhoto.id}`)
      .send({ public: true });
    const { token } = await switchOn(f.owner, f.base);
    const get = (id: string, size = 'web') =>
      app.bare().get(`/api/shared/${token}/photos/${id}/${size}`);
    const ok = await get(f.publicPhoto.id);
    expect(ok.status).toBe(200);
    expect(ok.headers['content-type']).toMatch(/^image\/jpeg/);
    expect(ok.headers['cache-control']).toBe('no-cache');
    expect(ok.headers.etag).toMatch(/^"/);
    expect((await get(f.privatePhoto.id)).status).toBe(404);
    expect((await get(other.publicPhoto.id)).status).toBe(404);
    expect((await get('not-a-uuid')).status).toBe(404);
    // Made private again: gone at once.
    await f.owner.agent.put(`${f.base}/share/photos/${f.publicPhoto.id}`).send({ public: false });
    expect((await get(f.publicPhoto.id)).status).toBe(404);
    await f.owner.agent.put(`${f.base}/share/photos/${f.publicPhoto.id}`).send({ public: true });
    await f.owner.agent.put(`${f.base}/share`).send({ sections: { photos: false } });
    expect((await get(f.publicPhoto.id, 'thumb')).status).toBe(404);
    const view = (await app.bare().get(`/api/shared/${token}`)).body.build;
    expect(view.photos).toBeNull();
    expect(view.cover).toBeNull();
  });

  it('answers 404 to text that is not an address, without a 500', async () => {
    for (const token of ['x', 'A'.repeat(43), '%00', 'a'.repeat(300), '..%2F..']) {
      const res = await app.bare().get(`/api/shared/${token}`);
      expect(res.status, token).toBe(404);
    }
  });
});

describe('sharing: caching and robots headers', () => {
  it('answers no-cache with an ETag, 304 when it matches, noindex unless allowed', async () => {
    const f = await sharedFixture(app);
    const { token } = await switchOn(f.owner, f.base);
    const res = await app.bare().get(`/api/shared/${token}`);
    expect(res.headers['cache-control']).toBe('no-cache');
    expect(res.headers['x-robots-tag']).toMatch(/noindex/);
    const etag = res.headers.etag;
    expect(etag).toMatch(/^"[A-Za-z0-9_-]+"$/);
    const again = await app.bare().get(`/api/shared/${token}`).set('If-None-Match', etag);
    expect(again.status).toBe(304);
    expect(again.text ?? '').toBe('');
    // A change makes a new ETag: the old one no longer matches.
    await f.owner.agent.put(`${f.base}/share`).send({ sections: { parts: false } });
    const changed = await app.bare().get(`/api/shared/${token}`).set('If-None-Match', etag);
    expect(changed.status).toBe(200);
    expect(changed.headers.etag).not.toBe(etag);
    // Switched off: If-None-Match does not bring back a 304.
    await f.owner.agent.put(`${f.base}/share`).send({ enabled: false });
    const off = await app.bare().get(`/api/shared/${token}`).set('If-None-Match', etag);
    expect(off.status).toBe(404);

    await f.owner.agent.put(`${f.base}/share`).send({ enabled: true, allowIndexing: true });
    const indexed = await app.bare().get(`/api/shared/${token}`);
    expect(indexed.headers['x-robots-tag']).toBeUndefined();
    const html = await app.bare().get(`/shared/${token}`);
    expect(html.headers['x-robots-tag']).toBeUndefined();
    expect(html.text).not.toContain('name="robots"');
  });

  it('sends link-preview tags in the HTML itself, escaped, with an absolute image', async () => {
    const f = await sharedFixture(app);
    await f.owner.agent.patch(f.base).send({ name: 'Hauler <script>alert(1)</script> & "Co"' });
    await f.owner.agent.put(`${f.base}/share/photos/${f.publicPhoto.id}`).send({ public: true });
    const { token } = await switchOn(f.owner, f.base, { coverPhotoId: f.publicPhoto.id });
    const res = await app.bare().get(`/shared/${token}`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/html/);
    expect(res.headers['cache-control']).toBe('no-cache');
    expect(res.headers['x-robots-tag']).toMatch(/noindex/);
    expect(res.headers.etag).toBeTruthy();
    const html = res.text;
    expect(html).not.toContain('<script>alert');
    expect(html).toContain(
      '<meta property="og:title" content="Hauler &lt;script&gt;alert(1)&lt;/script&gt; &amp; &quot;Co&quot;" />',
    );
    expect(html).toMatch(/<meta property="og:description" content="2005 Three-quarter-ton pickup/);
    expect(html).toContain(
      `<meta property="og:image" content="${app.origin}/api/shared/${token}/photos/${f.publicPhoto.id}/web" />`,
    );
    expect(html).toContain(`<meta property="og:url" content="${app.origin}/shared/${token}" />`);
    expect(html).toContain('<meta name="robots" content="noindex, nofollow, noarchive" />');
    expect(html.match(/name="description"/g)).toHaveLength(1);
    expect(html).toContain('<div id="root"></div>');
    const again = await app.bare().get(`/shared/${token}`).set('If-None-Match', res.headers.etag);
    expect(again.status).toBe(304);
    // The printable sheet's address carries the same tags.
    expect((await app.bare().get(`/shared/${token}/sheet`)).text).toContain('og:title');

    await f.owner.agent.put(`${f.base}/share`).send({ enabled: false });
    const off = await app.bare().get(`/shared/${token}`);
    expect(off.status).toBe(404);
    expect(off.text).not.toContain('Hauler');
    expect(off.text).toContain('noindex');
  });

  it('limits requests per client address', async () => {
    const f = await sharedFixture(limited);
    const { token } = await switchOn(f.owner, f.base);
    expect((await limited.bare().get(`/api/shared/${token}`)).status).toBe(200);
    expect((await limited.bare().get(`/api/shared/${token}`)).status).toBe(200);
    const third = await limited.bare().get(`/api/shared/${token}`);
    expect(third.status).toBe(429);
    expect(third.body.error.code).toBe('rate_limited');
  });
});

describe('the build sheet', () => {
  it('carries money only for the owner who asks; crew and viewer read it without; shop 403', async () => {
    const f = await sharedFixture(app);
    const plain = await f.owner.agent.get(`${f.base}/sheet`);
    expect(plain.status).toBe(200);
    expect(plain.body.mayShowMoney).toBe(true);
    expect(moneyKeys(plain.body)).toEqual([]);
    expect(plain.body.sheet.estimate.weakestLink.name).toBe('Stock crank and rods');
    expect(plain.body.sheet.parts.total).toBe(3);

    const withMoney = await f.owner.agent.get(`${f.base}/sheet?money=1`);
    expect(withMoney.body.sheet.money.plannedCents).toBeGreaterThan(0);
    expect(moneyKeys(withMoney.body)).toContain('totalCents');

    for (const u of [f.crew, f.viewer]) {
      const res = await u.agent.get(`${f.base}/sheet?money=1`);
      expect(res.status).toBe(200);
      expect(res.body.mayShowMoney).toBe(false);
      expect(moneyKeys(res.body)).toEqual([]);
      expect(res.body.sheet.money).toBeNull();
    }
    expect((await f.shop.agent.get(`${f.base}/sheet`)).status).toBe(403);
    expect((await f.stranger.agent.get(`${f.base}/sheet`)).status).toBe(404);
    expect((await app.agent().get(`${f.base}/sheet`)).status).toBe(401);
    const bad = await f.owner.agent.get(`${f.base}/sheet?money=yes`);
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.money).toBeTruthy();
  });

  it('works for a build with nothing in it yet', async () => {
    const owner = await signUp(app, 'bare');
    const build = (
      await owner.agent.post('/api/builds').send({
        name: 'Empty bay',
        cylinders: 6,
        aspiration: 'single-turbo',
        targetPowerHp: 500,
        targetPowerBasis: 'crank',
      })
    ).body.build;
    const base = `/api/builds/${build.id}`;
    const sheet = await owner.agent.get(`${base}/sheet`);
    expect(sheet.status).toBe(200);
    expect(sheet.body.sheet).toMatchObject({
      name: 'Empty bay',
      estimate: { weakestLink: null, supported: null },
      install: { jobs: [] },
      dyno: { best: null, sessions: [] },
      bench: { sheets: [] },
    });
    const { token } = await switchOn(owner, base);
    const view = (await app.bare().get(`/api/shared/${token}`)).body.build;
    expect(view.photos).toEqual([]);
    expect(view.cover).toBeNull();
  });
});
