/**
 * A bounded, seeded fuzz of every route the routers declare (server/routes.ts):
 * odd ids, hostile and random JSON, malformed bodies and broken multipart, from
 * every role. Any 5xx fails the test with what to replay. Rate limits are raised
 * for this app so a 429 can never hide a 500.
 *
 * Replay one run: FUZZ_SEED=<seed> npx vitest run tests/api/fuzz.test.ts
 */
import { randomUUID } from 'node:crypto';
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { useTestApp, type Agent } from '../helpers/app';
import { buildWithCast, signUp } from '../helpers/factories';

const seed = Number(process.env.FUZZ_SEED ?? 20261202);
const perRoute = Number(process.env.FUZZ_PER_ROUTE ?? 45);

const app = useTestApp({
  authRateLimit: 1_000_000,
  accountRateLimit: 1_000_000,
  passwordResetRateLimit: 1_000_000,
  estimateRateLimit: 1_000_000,
  invitationLimits: { perHour: 1_000_000, perDay: 1_000_000 },
});

/** mulberry32: a small seeded generator, so a failure can be replayed exactly. */
function generator(s: number) {
  let a = s >>> 0;
  const next = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const int = (n: number) => Math.floor(next() * n);
  const pick = <T>(xs: readonly T[]): T => xs[int(xs.length)];
  return { next, int, pick };
}
type Rng = ReturnType<typeof generator>;

// Field names the schemas use, so random bodies reach past "unknown field" now and then.
const keys = [
  'name',
  'category',
  'status',
  'email',
  'role',
  'password',
  'displayName',
  'title',
  'description',
  'notes',
  'label',
  'done',
  'caption',
  'value',
  'unit',
  'position',
  'count',
  'targetValue',
  'targetUnit',
  'toleranceType',
  'toleranceValue',
  'stages',
  'angleDegrees',
  'threadCondition',
  'retorque',
  'retorqueAfterHeatCycles',
  'retorqueAfterMiles',
  'overrideReason',
  'note',
  'wrench',
  'partIds',
  'quantity',
  'unitPriceCents',
  'labourCents',
  'orderedOn',
  'expectedOn',
  'receivedOn',
  'sentOutOn',
  'backOn',
  'installedOn',
  'ratingValue',
  'ratingUnit',
  'ratingFor',
  'shopUserId',
  'turnaroundDays',
  'targetPowerHp',
  'targetTorqueLbft',
  'targetDate',
  'cylinders',
  'displacementLiters',
  'budgetCents',
  'currency',
  'vehicleYear',
  'bsfc',
  'afr',
  'liftsVehicle',
  'part-received',
  'occasion',
  'testedOn',
  'points',
  'values',
  'tolerance',
  'weather',
  'curve',
  'peakPower',
  'peakPowerRpm',
  'date',
  'dynoKind',
  '__proto__',
  'constructor',
  'toString',
];
const strings = [
  '',
  ' ',
  'a',
  'x'.repeat(5000),
  '\u0000',
  'nul\u0000inside',
  '0000-01-01',
  '9999-12-31',
  '2027-02-30',
  '2027-06-01',
  '1e309',
  'NaN',
  '-1',
  '<script>alert(1)</script>',
  "'; drop table parts;--",
  '\uD800',
  '😀🚚',
  'ｆｕｌｌ＝width',
  '../../etc/passwd',
  '%00',
  'owner',
  'shop',
  'crew',
  'viewer',
  'lbf-ft',
  'n-m',
  'percent',
  'fuel-injection',
  'planned',
  'at-shop',
  'a@example.test',
  'true',
  randomUUID(),
];
const numbers = [
  0,
  -1,
  1,
  1.5,
  -0.0001,
  1e308,
  -1e308,
  2 ** 53 + 1,
  1e-320,
  12345678901234,
  3,
  100,
];

function value(r: Rng, depth: number): unknown {
  const k = r.int(depth > 2 ? 5 : 8);
  if (k === 0) return r.pick(strings);
  if (k === 1) return r.pick(numbers);
  if (k === 2) return r.next() < 0.5;
  if (k === 3) return null;
  if (k === 4) return r.pick(strings).slice(0, 40);
  if (k === 5) return Array.from({ length: r.int(4) }, () => value(r, depth + 1));
  return object(r, depth + 1);
}

function object(r: Rng, depth = 0): Record<string, unknown> {
  const o: Record<string, unknown> = {};
  for (let i = r.int(6); i >= 0; i--) {
    const key = r.next() < 0.9 ? r.pick(keys) : r.pick(strings).slice(0, 20);
    Object.defineProperty(o, key, { value: value(r, depth), enumerable: true, writable: true });
  }
  return o;
}

async function jpeg() {
  return sharp({ create: { width: 64, height: 48, channels: 3, background: '#7a5a3a' } })
    .jpeg()
    .toBuffer();
}

describe('fuzzing every route the routers declare', () => {
  it(`answers no 5xx to seeded hostile requests (seed ${seed})`, { timeout: 600_000 }, async () => {
    const routes = app.routes;
    expect(routes.length).toBeGreaterThan(30);
    const cast = await buildWithCast(app);
    const { owner, crew, shop, viewer, stranger, build } = cast;
    const base = `/api/builds/${build.id}`;
    const shopId = (await owner.agent.get(`${base}/members`)).body.members.find(
      (m: { role: string }) => m.role === 'shop',
    ).userId;
    const part = (
      await owner.agent.post(`${base}/parts`).send({
        category: 'fuel-injection',
        name: 'Injector set',
        status: 'at-shop',
        shopUserId: shopId,
        sentOutOn: '2026-11-01',
      })
    ).body.part;
    const job = (await crew.agent.post(`${base}/jobs`).send({ title: 'Injectors' })).body.job;
    const step = (
      await crew.agent
        .post(`${base}/jobs/${job.id}/steps`)
        .send({ title: 'Seat the injectors', partIds: [part.id] })
    ).body.step;
    const item = (
      await crew.agent.post(`${base}/steps/${step.id}/checklist`).send({ label: 'Bores clean' })
    ).body.item;
    const spec = (
      await crew.agent.post(`${base}/steps/${step.id}/fasteners`).send({
        name: 'Hold-down bolts',
        count: 2,
        targetValue: 100,
        targetUnit: 'lbf-ft',
        toleranceType: 'percent',
        toleranceValue: 5,
        threadCondition: 'oiled',
        specSource: "Maker's service manual (owner's entry)",
        retorqueAfterHeatCycles: 2,
      })
    ).body.fastener;
    const photo = (
      await crew.agent
        .post(`${base}/steps/${step.id}/photos`)
        .attach('photos', await jpeg(), 'step.jpg')
    ).body.photos[0];
    const invitation = (
      await owner.agent
        .post(`${base}/invitations`)
        .send({ email: `fuzz-${randomUUID().slice(0, 6)}@example.test`, role: 'viewer' })
    ).body.invitation;
    for (const [what, x] of Object.entries({ part, job, step, item, spec, photo, invitation })) {
      expect(x?.id, what).toBeTruthy();
    }
    const ids: Record<string, string> = {
      buildId: build.id,
      partId: part.id,
      jobId: job.id,
      stepId: step.id,
      itemId: item.id,
      specId: spec.id,
      photoId: photo.id,
      invitationId: invitation.id,
      userId: crew.id,
      token: 'A'.repeat(43),
    };
    const junkIds = ['0', 'x', randomUUID(), '%00', '..%2F..', 'a'.repeat(300), '%E2%82', '-1'];
    // Extra ids of every kind that each route may look up (sheets, sessions, runs … as they land).
    const anyId = (name: string, r: Rng) =>
      r.next() < 0.75 ? (ids[name] ?? randomUUID()) : r.pick(junkIds);

    const actors: { who: string; agent: () => Agent }[] = [
      { who: 'owner', agent: () => owner.agent },
      { who: 'crew', agent: () => crew.agent },
      { who: 'shop', agent: () => shop.agent },
      { who: 'viewer', agent: () => viewer.agent },
      { who: 'stranger', agent: () => stranger.agent },
      { who: 'anonymous', agent: () => app.agent() },
    ];

    const failures: string[] = [];
    let sent = 0;
    // Deletes last, so the build and its rows stay for the other routes as long as possible.
    const ordered = [...routes].sort(
      (a, b) => Number(a.method === 'DELETE') - Number(b.method === 'DELETE'),
    );
    for (const [routeIndex, route] of ordered.entries()) {
      const r = generator(seed + routeIndex * 7919);
      const count = route.method === 'GET' ? Math.ceil(perRoute / 3) : perRoute;
      for (let i = 0; i < count; i++) {
        const path = route.path.replace(/:(\w+)/g, (_m, name: string) => anyId(name, r));
        // Sign-out and sign-in on a shared agent would change who the others are: fresh agents there.
        const actor = route.path.startsWith('/api/auth')
          ? { who: 'fresh', agent: () => app.agent() }
          : r.pick(actors);
        const agent = actor.agent();
        const method = route.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
        let req = agent[method](path);
        const shape = r.int(10);
        let described = '';
        if (route.method !== 'GET') {
          if (shape < 6) {
            const body = r.next() < 0.85 ? object(r) : value(r, 0);
            described = JSON.stringify(body).slice(0, 300);
            // Written by hand: superagent will not send a bare number, and JSON.stringify keeps
            // a __proto__ key only when it is an own property (defineProperty above).
            req = req.set('Content-Type', 'application/json').send(JSON.stringify(body));
          } else if (shape === 6) {
            described = 'malformed JSON';
            req = req.set('Content-Type', 'application/json').send('{"name": "x", ');
          } else if (shape === 7) {
            described = 'multipart';
            req = req
              .field(r.pick(keys), String(r.pick(strings)).slice(0, 100))
              .attach(
                r.pick(['photos', 'file', 'sheet', 'x']),
                Buffer.from(r.pick(strings) || 'x'),
                'f.bin',
              );
          } else if (shape === 8) {
            described = 'text/plain';
            req = req.set('Content-Type', 'text/plain').send(String(r.pick(strings)));
          } else {
            described = 'no body';
          }
        } else if (shape < 3) {
          req = req.query({
            [r.pick(['status', 'dryRun', 'format', 'standard', 'x'])]: r.pick(strings),
          });
          described = 'query';
        }
        const res = await req.ok(() => true);
        sent++;
        if (res.status >= 500) {
          failures.push(
            `${res.status} ${route.method} ${path} as ${actor.who} [${described}] → ${JSON.stringify(res.body).slice(0, 200)} (seed ${seed}, route #${routeIndex}, try ${i})`,
          );
        }
      }
    }
    expect(sent).toBeGreaterThan(1000);
    expect(failures, failures.slice(0, 10).join('\n')).toEqual([]);
    // The fixture's owner can still use the app afterwards.
    expect((await owner.agent.get('/api/builds')).status).toBe(200);
    expect(await signUp(app, 'after-fuzz')).toBeTruthy();
  });
});
