import { describe, expect, it } from 'vitest';
import { estimateResultSchema } from '@shared/schemas/estimate';
import { useTestApp, type TestApp } from '../helpers/app';
import { buildInput, buildWithCast, createBuild, moneyKeys, signUp } from '../helpers/factories';

const app = useTestApp();

const request = {
  target: { powerHp: 600, basis: 'wheel' },
  assumptions: {
    bsfc: 0.4,
    bsfcUnit: 'lb-per-hp-h',
    afr: 18,
    drivetrainLossPct: 18,
    peakRpm: 3000,
    cylinders: 8,
  },
  components: [
    {
      id: 'be',
      name: 'Stock bottom end',
      category: 'bottom-end',
      ratingValue: 700,
      ratingUnit: 'hp-crank',
      quantity: 1,
    },
    {
      id: 'inj',
      name: 'Injectors',
      category: 'fuel-injection',
      ratingValue: 240,
      ratingUnit: 'mm3-per-stroke',
      quantity: 8,
    },
    {
      id: 'turbo',
      name: 'Turbo',
      category: 'turbocharger',
      ratingValue: 100,
      ratingUnit: 'lb-per-min',
      quantity: 1,
    },
  ],
};

// Typed in from reference.md, never imported from the code under test:
const HP_W_REF = 745.69987158227; // hp (550 ft·lbf/s) → W, NIST SP 811 (2008) B.9
const HP_TORQUE_REF = 5252.113122; // 33000/2π, definition of power (reference.md)
const G_PER_KWH_PER_LB_PER_HP_H = 608.27739; // lb/(hp·h) → g/kWh (reference.md)
const LB_KG_REF = 0.45359237; // NIST SP 811 (2008) B.8, exact

function expectRel(actual: number, expected: number, rel: number) {
  expect(Math.abs(actual - expected), `${actual} vs ${expected}`).toBeLessThanOrEqual(
    rel * Math.abs(expected),
  );
}

/**
 * Fuel per injector per stroke by reference.md's chain: fuel[kg/h] = kW × BSFC[g/kWh] / 1000,
 * ṁ[g/s] = kg/h ÷ 3.6, V[mm³] = ṁ × 1000 ÷ ρ ÷ (cylinders × rpm ÷ 120).
 */
function handDelivery(
  crankHp: number,
  o: { bsfcLb: number; density: number; cyl: number; rpm: number },
) {
  const kgPerH = (((crankHp * HP_W_REF) / 1000) * o.bsfcLb * G_PER_KWH_PER_LB_PER_HP_H) / 1000;
  return ((kgPerH / 3.6) * 1000) / o.density / ((o.cyl * o.rpm) / 120);
}

/** Every number anywhere in a JSON body, with its path: none may be null, NaN or ±Infinity. */
function numbersIn(value: unknown, path = '', out: [string, unknown][] = []): [string, unknown][] {
  if (typeof value === 'number') out.push([path, value]);
  else if (Array.isArray(value)) value.forEach((v, i) => numbersIn(v, `${path}.${i}`, out));
  else if (value && typeof value === 'object')
    for (const [k, v] of Object.entries(value)) numbersIn(v, `${path}.${k}`, out);
  return out;
}
function expectNoBadFigure(body: { estimate: Record<string, unknown> }) {
  const e = body.estimate as {
    requirements: Record<string, { value: unknown }>;
    components: Record<string, { value: unknown }>[];
    supported: Record<string, { value: unknown }> | null;
  };
  const figures = [
    ...Object.values(e.requirements),
    ...e.components.flatMap((c) => [
      c.capacity,
      c.requirement,
      c.headroomPct,
      c.supportedCrankPower,
    ]),
    ...(e.supported ? [e.supported.crankPower, e.supported.wheelPower] : []),
  ];
  for (const f of figures)
    expect(typeof f.value === 'number' && Number.isFinite(f.value)).toBe(true);
  for (const [path, n] of numbersIn(body)) expect(Number.isFinite(n), path).toBe(true);
  expect(JSON.stringify(body)).not.toMatch(/Infinity|NaN/);
}

function post(body: unknown, t: TestApp = app) {
  return t
    .agent()
    .post('/api/estimate')
    .send(body as object);
}

/** Sends a JSON text as it is, for values JSON.stringify would not produce. */
function postRaw(text: string) {
  return app.agent().post('/api/estimate').set('Content-Type', 'application/json').send(text);
}

describe('POST /api/estimate', () => {
  it('answers without sign-in with the figures worked out by hand', async () => {
    const res = await post(request);
    expect(res.status).toBe(200);
    expect(estimateResultSchema.safeParse(res.body.estimate).success).toBe(true);
    const e = res.body.estimate;
    // 600 wheel hp at 18 % loss = 600 ÷ 0.82 crank hp (issue #4 formula; 18 % common practice)
    const crankHp = 600 / 0.82;
    expectRel(e.requirements.crankPower.value, crankHp, 1e-12);
    const byId = (id: string) => e.components.find((c: { id: string }) => c.id === id);
    // Bottom end 700 crank hp: headroom 700 ÷ 731.7 − 1 = −4.33 %, the weakest link.
    expectRel(byId('be').headroomPct.value, (700 / crankHp - 1) * 100, 1e-9);
    // Injectors 240 mm³/stroke against the reference.md chain at 0.40 lb/(hp·h), 0.85 kg/L,
    // 8 cylinders, 3000 rpm.
    const delivery = handDelivery(crankHp, { bsfcLb: 0.4, density: 0.85, cyl: 8, rpm: 3000 });
    expectRel(byId('inj').requirement.value, delivery, 1e-7);
    // Turbo 100 lb/min against air = fuel × AFR 18 ÷ 0.45359237 ÷ 60 (reference.md)
    const fuelKgPerH = (((crankHp * HP_W_REF) / 1000) * 0.4 * G_PER_KWH_PER_LB_PER_HP_H) / 1000;
    expectRel(byId('turbo').requirement.value, (fuelKgPerH * 18) / LB_KG_REF / 60, 1e-7);
    expect(e.weakestLink.componentId).toBe('be');
    expect(e.supported.crankPower.value).toBe(700);
    expect(e.warnings[0].code).toBe('target-exceeds-bottom-end');
    // One basis: the shortfall is the share of the requirement the part lacks, −headroom.
    expectRel(e.warnings[0].shortfall.pct, (1 - 700 / crankHp) * 100, 1e-9);
    expectNoBadFigure(res.body);
    expect(moneyKeys(res.body)).toEqual([]);
  });

  it('fills the assumptions and components when left out', async () => {
    const res = await post({ target: { powerHp: 500, basis: 'crank' } });
    expect(res.status).toBe(200);
    expect(res.body.estimate.assumptions).toMatchObject({
      bsfc: 0.4,
      afr: 18,
      cylinders: 8,
      peakRpm: 3000,
    });
    expect(res.body.estimate.warnings.map((w: { code: string }) => w.code)).toEqual([
      'no-bottom-end-rating',
      'no-rated-parts',
    ]);
  });

  it('answers 400 with the field for a zero, negative or tiny target', async () => {
    for (const powerHp of [0, -5, 1e-310]) {
      const res = await post({ ...request, target: { powerHp, basis: 'crank' } });
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('invalid_input');
      expect(res.body.error.fields['target.powerHp']).toMatch(/above zero/);
    }
    const torque = await post({
      ...request,
      target: { powerHp: 500, basis: 'crank', torqueLbft: -1 },
    });
    expect(torque.body.error.fields['target.torqueLbft']).toMatch(/above zero/);
  });

  it('answers 400 with the field for an unknown unit or basis', async () => {
    const res = await post({
      ...request,
      target: { powerHp: 500, basis: 'flywheel' },
      assumptions: { bsfcUnit: 'mpg' },
      components: [{ ...request.components[0], ratingUnit: 'furlongs-per-fortnight' }],
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual([
      'assumptions.bsfcUnit',
      'components.0.ratingUnit',
      'target.basis',
    ]);
  });

  it('answers 400 with the field for NaN and Infinity sent as strings', async () => {
    const res = await post({
      ...request,
      target: { powerHp: 'NaN', basis: 'crank' },
      assumptions: { afr: 'Infinity' },
      components: [{ ...request.components[0], ratingValue: '-Infinity' }],
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual([
      'assumptions.afr',
      'components.0.ratingValue',
      'target.powerHp',
    ]);
  });

  it('answers 400 with the field for a number too large for a double (JSON 1e999 parses as Infinity)', async () => {
    const res = await postRaw(
      '{"target":{"powerHp":1e999,"basis":"crank"},"assumptions":{"peakRpm":-1e999}}',
    );
    expect(res.status).toBe(400);
    expect(res.body.error.fields['target.powerHp']).toBeDefined();
    expect(res.body.error.fields['assumptions.peakRpm']).toBeDefined();
  });

  it('answers 400 with the field for absurd magnitudes', async () => {
    const res = await post({
      target: { powerHp: 1e300, basis: 'crank', torqueLbft: 1e9 },
      assumptions: {
        afr: 1e6,
        fuelDensityKgPerL: 850,
        drivetrainLossPct: 150,
        peakRpm: 1e7,
        cylinders: 1000,
        bsfc: 1e-300,
      },
      components: [{ ...request.components[0], ratingValue: 1e20, quantity: 1e9 }],
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual([
      'assumptions.afr',
      'assumptions.bsfc',
      'assumptions.cylinders',
      'assumptions.drivetrainLossPct',
      'assumptions.fuelDensityKgPerL',
      'assumptions.peakRpm',
      'components.0.quantity',
      'components.0.ratingValue',
      'target.powerHp',
      'target.torqueLbft',
    ]);
  });

  it('answers 400 with the field for a BSFC outside its range in the unit it was entered in', async () => {
    const res = await post({ ...request, assumptions: { bsfc: 500, bsfcUnit: 'g-per-kwh' } });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['assumptions.bsfc']).toMatch(/g\/kWh/);
  });

  it('answers 400 to 10,000 components', async () => {
    const components = Array.from({ length: 10_000 }, (_, i) => ({
      ...request.components[0],
      id: `c${i}`,
    }));
    const res = await post({ ...request, components });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.components).toMatch(/At most 500/);
  });

  it('answers 400 to unknown keys and a body that is not an object', async () => {
    const res = await post({ ...request, horsepower: 9000 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.horsepower).toBe('Unknown field');
    expect((await post([1, 2, 3])).status).toBe(400);
  });

  it('refuses a POST that does not come from the app (no Origin)', async () => {
    const res = await app.bare().post('/api/estimate').send(request);
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('bad_origin');
  });
});

describe('POST /api/estimate rate limit', () => {
  const limited = useTestApp();
  // Headroom's choice, stated in estimate.router.ts: 120 stateless estimates a minute.
  const ESTIMATE_RATE_LIMIT = 120;

  it(`answers 429 after ${ESTIMATE_RATE_LIMIT} estimates a minute from one client`, async () => {
    const body = { target: { powerHp: 500, basis: 'crank' } };
    const statuses: number[] = [];
    for (let i = 0; i < ESTIMATE_RATE_LIMIT; i += 20) {
      const batch = await Promise.all(Array.from({ length: 20 }, () => post(body, limited)));
      statuses.push(...batch.map((r) => r.status));
    }
    expect(statuses.every((s) => s === 200)).toBe(true);
    const over = await post(body, limited);
    expect(over.status).toBe(429);
    expect(over.body.error.code).toBe('rate_limited');
  });
});

// ---------------------------------------------------------------- stored builds

type PartRow = {
  category: string;
  name: string;
  quantity?: number;
  status?: string;
  rating_value?: number | null;
  rating_unit?: string | null;
};

async function insertParts(buildId: string, rows: PartRow[]): Promise<string[]> {
  const inserted = await app.db
    .knex('parts')
    .insert(rows.map((r) => ({ build_id: buildId, quantity: 1, status: 'planned', ...r })))
    .returning('id');
  return inserted.map((r: { id: string }) => r.id);
}

/** The factory build (650 crank hp, 8 cylinders) with a rated bottom end and injectors, a returned turbo and an unrated part. */
async function castWithRatedParts() {
  const cast = await buildWithCast(app);
  const [bottomEnd, injectors, returnedTurbo, unrated] = await insertParts(cast.build.id, [
    {
      category: 'bottom-end',
      name: 'Stock bottom end',
      status: 'installed',
      rating_value: 700,
      rating_unit: 'hp-crank',
    },
    {
      category: 'fuel-injection',
      name: 'Injectors',
      quantity: 8,
      status: 'in-hand',
      rating_value: 200,
      rating_unit: 'mm3-per-stroke',
    },
    {
      category: 'turbocharger',
      name: 'Wrong turbo',
      status: 'returned',
      rating_value: 40,
      rating_unit: 'lb-per-min',
    },
    {
      category: 'cooling',
      name: 'Intercooler',
      status: 'ordered',
      rating_value: null,
      rating_unit: null,
    },
  ]);
  return { ...cast, ids: { bottomEnd, injectors, returnedTurbo, unrated } };
}

describe('GET /api/builds/:buildId/estimate', () => {
  it('shows every member the estimate from the target, cylinders, assumptions and rated parts', async () => {
    const { owner, crew, shop, viewer, build, ids } = await castWithRatedParts();
    const bodies = [];
    for (const member of [owner, crew, viewer]) {
      const res = await member.agent.get(`/api/builds/${build.id}/estimate`);
      expect(res.status).toBe(200);
      expect(moneyKeys(res.body)).toEqual([]);
      bodies.push(res.body);
    }
    // Owner, crew and viewer read one and the same estimate.
    expect(bodies[1]).toEqual(bodies[0]);
    expect(bodies[2]).toEqual(bodies[0]);
    const e = bodies[0].estimate;
    expect(estimateResultSchema.safeParse(e).success).toBe(true);
    expect(e.components.map((c: { id: string }) => c.id).sort()).toEqual(
      [ids.bottomEnd, ids.injectors].sort(),
    );
    // The factory build: 650 crank hp, 8 cylinders, default assumptions (0.40 lb/(hp·h) and
    // 3000 rpm, common practice; 0.85 kg/L, Chevron 2007).
    const byId = (id: string) => e.components.find((c: { id: string }) => c.id === id);
    expectRel(byId(ids.bottomEnd).headroomPct.value, (700 / 650 - 1) * 100, 1e-9);
    const delivery = handDelivery(650, { bsfcLb: 0.4, density: 0.85, cyl: 8, rpm: 3000 });
    expectRel(byId(ids.injectors).requirement.value, delivery, 1e-7);
    // 200 mm³ injectors support 650 × 200 ÷ 192.7 = 674.6 hp, less than the 700 hp bottom end.
    expectRel(e.supported.crankPower.value, (650 * 200) / delivery, 1e-7);
    expect(e.supported.limitedBy).toBe(ids.injectors);
    // 650 hp at 3000 rpm = 650 × 5252.113122 / 3000 lbf·ft (definition of power, reference.md)
    expectRel(e.requirements.crankTorque.value, (650 * HP_TORQUE_REF) / 3000, 1e-9);
    // The cylinder count is the build's own, and the working says so.
    const cylinders = e.requirements.injectorDelivery.working.inputs.find(
      (i: { ref?: string }) => i.ref === 'cylinders',
    );
    expect(cylinders).toMatchObject({ value: 8, from: 'build' });
    expect(e.assumptions.cylindersFrom).toBe('build');

    // The shop gets the same figures, but parts not sent to it are not named.
    const res = await shop.agent.get(`/api/builds/${build.id}/estimate`);
    expect(res.status).toBe(200);
    expect(moneyKeys(res.body)).toEqual([]);
    expect(res.body.estimate.requirements).toEqual(e.requirements);
    expect(res.body.estimate.supported.crankPower.value).toBe(e.supported.crankPower.value);
    const text = JSON.stringify(res.body);
    for (const hidden of ['Stock bottom end', 'Injectors', ids.bottomEnd, ids.injectors])
      expect(text).not.toContain(hidden);
    expect(
      res.body.estimate.components.map((c: { name: string; anonymised?: boolean }) => [
        c.name,
        c.anonymised,
      ]),
    ).toEqual([
      ['Another part (bottom end)', true],
      ['Another part (fuel injection)', true],
    ]);
    // Nobody else's parts are marked as hidden.
    expect(e.components.some((c: { anonymised?: boolean }) => c.anonymised)).toBe(false);
  });

  it('names to a shop the parts sent to it, and only those', async () => {
    const { shop, build, ids } = await castWithRatedParts();
    await app.db
      .knex('parts')
      .where({ id: ids.injectors })
      .update({ status: 'at-shop', shop_user_id: shop.id, sent_out_on: '2026-11-01' });
    const res = await shop.agent.get(`/api/builds/${build.id}/estimate`);
    expect(res.status).toBe(200);
    const names = res.body.estimate.components.map(
      (c: { id: string; name: string; anonymised?: boolean }) => [c.id, c.name, c.anonymised],
    );
    // Its own part is a real part it can open in its ledger; the other is not a link.
    expect(names).toEqual([
      ['other-bottom-end-1', 'Another part (bottom end)', true],
      [ids.injectors, 'Injectors', undefined],
    ]);
    expect(JSON.stringify(res.body)).not.toContain('Stock bottom end');
  });

  it('leaves out returned and unrated parts and lists unrated categories as unknown', async () => {
    const { owner, build, ids } = await castWithRatedParts();
    const { estimate: e } = (await owner.agent.get(`/api/builds/${build.id}/estimate`)).body;
    const componentIds = e.components.map((c: { id: string }) => c.id);
    expect(componentIds).not.toContain(ids.returnedTurbo);
    expect(componentIds).not.toContain(ids.unrated);
    expect(e.unknownCategories).toContain('turbocharger');
    expect(e.unknownCategories).toContain('cooling');
    expect(e.assumptions.cylinders).toBe(buildInput.cylinders);
  });

  it('follows the target and the saved assumptions', async () => {
    const { owner, build, ids } = await castWithRatedParts();
    // 650 crank hp against a 700 hp bottom end: about 7.7 % headroom, tight under the 10 % default margin.
    let e = (await owner.agent.get(`/api/builds/${build.id}/estimate`)).body.estimate;
    expect(e.components.find((c: { id: string }) => c.id === ids.bottomEnd).status).toBe('tight');
    await owner.agent.patch(`/api/builds/${build.id}`).send({ targetPowerHp: 750 });
    e = (await owner.agent.get(`/api/builds/${build.id}/estimate`)).body.estimate;
    expect(e.warnings[0]).toMatchObject({
      code: 'target-exceeds-bottom-end',
      componentId: ids.bottomEnd,
    });
    expect(e.warnings[0].shortfall.crankHp).toBeCloseTo(50, 9);
    const put = await owner.agent
      .put(`/api/builds/${build.id}/assumptions`)
      .send({ peakRpm: 3400, drivetrainLossPct: 15 });
    expect(put.status).toBe(200);
    e = (await owner.agent.get(`/api/builds/${build.id}/estimate`)).body.estimate;
    expect(e.assumptions).toMatchObject({ peakRpm: 3400, drivetrainLossPct: 15 });
  });

  it('answers 404 to a stranger and for a missing build, 401 when signed out', async () => {
    const { stranger, build } = await castWithRatedParts();
    const res = await stranger.agent.get(`/api/builds/${build.id}/estimate`);
    expect(res.status).toBe(404);
    expect(JSON.stringify(res.body)).not.toMatch(/bottom end/i);
    expect(
      (await stranger.agent.get('/api/builds/00000000-0000-4000-8000-000000000000/estimate'))
        .status,
    ).toBe(404);
    expect((await stranger.agent.get('/api/builds/not-an-id/estimate')).status).toBe(404);
    expect((await app.agent().get(`/api/builds/${build.id}/estimate`)).status).toBe(401);
  });
});

describe('stored values the estimate must survive (issue #14)', () => {
  it('refuses targets and ratings finer than the database keeps, with the field named', async () => {
    const { owner, build, ids } = await castWithRatedParts();
    // target_power_hp and target_torque_lbft are numeric(8,1): 0.04 would be stored as 0.0.
    for (const body of [
      { targetPowerHp: 0.04 },
      { targetPowerHp: 650.25 },
      { targetTorqueLbft: 0.04 },
    ]) {
      const res = await owner.agent.patch(`/api/builds/${build.id}`).send(body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      const [field] = Object.keys(body);
      expect(res.body.error.fields[field]).toMatch(/one decimal place/);
    }
    expect(
      (await owner.agent.patch(`/api/builds/${build.id}`).send({ targetPowerHp: 650.3 })).status,
    ).toBe(200);
    // rating_value is numeric(12,3): 0.0004 would be stored as 0.000.
    const res = await owner.agent
      .patch(`/api/builds/${build.id}/parts/${ids.injectors}`)
      .send({ ratingValue: 0.0004 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.ratingValue).toMatch(/three decimal places/);
    const est = await owner.agent.get(`/api/builds/${build.id}/estimate`);
    expect(est.status).toBe(200);
    expectNoBadFigure(est.body);
  });

  it('answers a clear 409, not a 500, for a target stored as 0 before the rule', async () => {
    const { owner, build } = await castWithRatedParts();
    await app.db.knex('builds').where({ id: build.id }).update({ target_power_hp: 0 });
    const res = await owner.agent.get(`/api/builds/${build.id}/estimate`);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('no_target');
    expect(res.body.error.message).toMatch(/target power is stored as 0 hp/);
  });

  it('reads a torque target stored as 0 as none: no Infinity anywhere', async () => {
    const { owner, build } = await castWithRatedParts();
    await insertParts(build.id, [
      { category: 'transmission', name: 'Transmission', rating_value: 1500, rating_unit: 'lbf-ft' },
    ]);
    await app.db.knex('builds').where({ id: build.id }).update({ target_torque_lbft: 0 });
    const res = await owner.agent.get(`/api/builds/${build.id}/estimate`);
    expect(res.status).toBe(200);
    expectNoBadFigure(res.body);
    const e = res.body.estimate;
    expect(e.target.torqueLbft).toBeNull();
    const trans = e.components.find((c: { name: string }) => c.name === 'Transmission');
    // 1500 lbf·ft at 3000 rpm = 1500 × 3000 / 5252.113122 hp (definition of power, reference.md)
    expectRel(trans.supportedCrankPower.value, (1500 * 3000) / HP_TORQUE_REF, 1e-9);
  });

  it('leaves a part whose rating is stored as 0 out, with a warning, and no null figure', async () => {
    const { owner, build } = await castWithRatedParts();
    const [zero] = await insertParts(build.id, [
      {
        category: 'transmission',
        name: 'Zeroed transmission',
        rating_value: 0,
        rating_unit: 'lbf-ft',
      },
    ]);
    const res = await owner.agent.get(`/api/builds/${build.id}/estimate`);
    expect(res.status).toBe(200);
    expectNoBadFigure(res.body);
    const e = res.body.estimate;
    expect(e.components.map((c: { id: string }) => c.id)).not.toContain(zero);
    const w = e.warnings.find((x: { code: string }) => x.code === 'rating-unusable');
    expect(w).toMatchObject({ componentId: zero, severity: 'warning' });
    expect(w.message).toMatch(/Zeroed transmission is not checked: its rating is 0 lbf·ft/);
    expect(e.unknownCategories).toContain('transmission');
  });
});

describe('GET and PUT /api/builds/:buildId/assumptions', () => {
  it('gives every member the defaults until the owner saves a set', async () => {
    const { owner, crew, shop, viewer, build } = await buildWithCast(app);
    for (const member of [owner, crew, shop, viewer]) {
      const res = await member.agent.get(`/api/builds/${build.id}/assumptions`);
      expect(res.status).toBe(200);
      expect(res.body).toEqual({
        isDefault: true,
        assumptions: {
          bsfc: 0.4,
          bsfcUnit: 'lb-per-hp-h',
          afr: 18,
          fuelDensityKgPerL: 0.85,
          drivetrainLossPct: 18,
          peakRpm: 3000,
          tightMarginPct: 10,
        },
      });
    }
  });

  it('lets the owner save a set, BSFC in g/kWh shown back as typed, and replace it', async () => {
    const { owner, viewer, build } = await buildWithCast(app);
    const url = `/api/builds/${build.id}/assumptions`;
    const saved = {
      bsfc: 210,
      bsfcUnit: 'g-per-kwh',
      afr: 20,
      fuelDensityKgPerL: 0.84,
      drivetrainLossPct: 15,
      peakRpm: 3200,
      tightMarginPct: 12.5,
    };
    const res = await owner.agent.put(url).send(saved);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ isDefault: false, assumptions: saved });
    expect((await viewer.agent.get(url)).body).toEqual({ isDefault: false, assumptions: saved });
    // Stored in lb/(hp·h): 210 g/kWh ÷ 608.27739 (reference.md factor)
    const row = await app.db.knex('build_assumptions').where({ build_id: build.id }).first();
    expect(row.bsfc_lb_per_hp_h).toBeCloseTo(210 / 608.27739, 8);
    // PUT replaces the whole set: what is left out goes back to its default.
    const again = await owner.agent.put(url).send({ afr: 19 });
    expect(again.body.assumptions).toMatchObject({
      afr: 19,
      bsfc: 0.4,
      bsfcUnit: 'lb-per-hp-h',
      peakRpm: 3000,
    });
    expect(await app.db.knex('build_assumptions').where({ build_id: build.id })).toHaveLength(1);
  });

  it('refuses crew, shop and viewer with 403, a stranger with 404 and a signed-out caller with 401', async () => {
    const { crew, shop, viewer, stranger, build } = await buildWithCast(app);
    const url = `/api/builds/${build.id}/assumptions`;
    for (const m of [crew, shop, viewer])
      expect((await m.agent.put(url).send({ afr: 25 })).status).toBe(403);
    expect((await stranger.agent.put(url).send({ afr: 25 })).status).toBe(404);
    expect((await stranger.agent.get(url)).status).toBe(404);
    expect((await app.agent().put(url).send({ afr: 25 })).status).toBe(401);
    expect((await app.agent().get(url)).status).toBe(401);
    expect(await app.db.knex('build_assumptions').where({ build_id: build.id })).toEqual([]);
  });

  it('answers 400 with the fields for values out of range, unknown keys and cylinders', async () => {
    const owner = await signUp(app, 'owner');
    const build = await createBuild(owner);
    const res = await owner.agent
      .put(`/api/builds/${build.id}/assumptions`)
      .send({ afr: 2, drivetrainLossPct: -1, peakRpm: 'fast', tightMarginPct: 1e9, cylinders: 6 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual([
      'afr',
      'cylinders',
      'drivetrainLossPct',
      'peakRpm',
      'tightMarginPct',
    ]);
    expect(res.body.error.fields.cylinders).toBe('Unknown field');
    expect(await app.db.knex('build_assumptions').where({ build_id: build.id })).toEqual([]);
  });

  it('goes with the build when the build is deleted', async () => {
    const owner = await signUp(app, 'owner');
    const build = await createBuild(owner);
    await owner.agent.put(`/api/builds/${build.id}/assumptions`).send({ afr: 19 });
    expect((await owner.agent.delete(`/api/builds/${build.id}`)).status).toBe(204);
    expect(await app.db.knex('build_assumptions').where({ build_id: build.id })).toEqual([]);
  });
});
