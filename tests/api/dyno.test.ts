/**
 * Dyno days over HTTP against a real PostgreSQL: who may see and record
 * which sessions, runs corrected on read under each standard (checked
 * against ../shared/reference.md, "Dynamometer correction"), the curve CSV
 * round trip, attachments checked by content, and bad input refused with
 * the field or row named and nothing saved.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { seedDemo } from '@db/seeds/demo';
import { listSessions } from '@server/features/dyno/sessions.service';
import { createLocalDiskStorage } from '@server/lib/storage';
import { useTestApp, type Agent } from '../helpers/app';
import { addMember, buildWithCast, moneyKeys, signUp, type TestUser } from '../helpers/factories';

const app = useTestApp();

function expectRel(actual: number, expected: number, rel = 1e-6) {
  expect(Math.abs(actual - expected), `${actual} vs ${expected}`).toBeLessThanOrEqual(
    rel * Math.abs(expected),
  );
}

/** reference.md's correction checks are at 30 °C and 97 kPa of dry air (no humidity given). */
const weather30at97 = { temperature: 30, temperatureUnit: 'c', pressure: 97, pressureUnit: 'kpa' };

const session = (over: Record<string, unknown> = {}) => ({
  date: '2026-11-14',
  place: 'Test dyno cell',
  dynoKind: 'chassis',
  runBy: 'Test operator',
  weather: weather30at97,
  ...over,
});

const typedRun = (over: Record<string, unknown> = {}) => ({
  status: 'complete',
  gear: '4th',
  tuneRevision: 'rev B',
  powerUnit: 'hp',
  torqueUnit: 'lbf-ft',
  boostUnit: 'psi',
  egtUnit: 'f',
  mixtureKind: 'afr',
  peakPower: 500,
  peakPowerRpm: 3000,
  peakTorque: 1000,
  peakTorqueRpm: 2000,
  ...over,
});

/** A curve as a dyno might write it: rows out of rpm order, a torque-only row, boost, EGT and AFR. */
const curveCsv = [
  '# exported from the test dyno',
  'rpm,power_hp,torque_lbft,boost_psi,egt_f,afr',
  '2500,412.37,866.1,31.5,1180,19.2',
  '1800,,790.25,22,1010,21.4',
  '3000,455.05,,36.25,1290,18.6',
  '2200,330.4,788.75,27,1100,20.1',
  '3400,431.9,667.2,37,1335,18.1',
].join('\n');

function csvBuffer(text: string) {
  return Buffer.from(text, 'utf8');
}

async function createSession(agent: Agent, base: string, over: Record<string, unknown> = {}) {
  const res = await agent.post(`${base}/dyno-sessions`).send(session(over));
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.session as { id: string; shop: { id: string } | null };
}

async function createRun(
  agent: Agent,
  base: string,
  sessionId: string,
  over: Record<string, unknown> = {},
) {
  const res = await agent.post(`${base}/dyno-sessions/${sessionId}/runs`).send(typedRun(over));
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.run as { id: string; runNumber: number };
}

async function importRun(
  agent: Agent,
  base: string,
  sessionId: string,
  csv: string | Buffer,
  run?: Record<string, unknown>,
  query = '',
) {
  const req = agent
    .post(`${base}/dyno-sessions/${sessionId}/runs/import${query}`)
    .attach('file', typeof csv === 'string' ? csvBuffer(csv) : csv, 'curve.csv');
  if (run) req.field('run', JSON.stringify(run));
  return req;
}

async function runCount(agent: Agent, base: string, sessionId: string) {
  const res = await agent.get(`${base}/dyno-sessions/${sessionId}`);
  expect(res.status).toBe(200);
  return res.body.runs.length as number;
}

/** The build's cast plus a second shop member, and the build's base path. */
async function dynoCast() {
  const cast = await buildWithCast(app);
  const shop2 = await signUp(app, 'shop2');
  await addMember(cast.owner, cast.build.id, shop2, 'shop');
  return { ...cast, shop2, base: `/api/builds/${cast.build.id}` };
}

// ---- who may --------------------------------------------------------------------------

describe('dyno days: who sees and records what', () => {
  it('shows a shop only the sessions assigned to it, a second shop nothing, and everyone else all', async () => {
    const { owner, crew, shop, shop2, viewer, base } = await dynoCast();
    const assigned = await createSession(owner.agent, base, {
      shopUserId: shop.id,
      place: 'Shop dyno',
    });
    const garage = await createSession(crew.agent, base, { place: 'Garage day' });
    const shopOwn = await createSession(shop.agent, base, { place: 'Shop own' });
    expect(assigned.shop?.id).toBe(shop.id);
    expect(garage.shop).toBeNull();
    // A shop's own session is assigned to itself.
    expect(shopOwn.shop?.id).toBe(shop.id);

    const ids = async (u: TestUser) => {
      const res = await u.agent.get(`${base}/dyno-sessions`);
      expect(res.status).toBe(200);
      expect(moneyKeys(res.body)).toEqual([]);
      return (res.body.sessions as { id: string }[]).map((s) => s.id).sort();
    };
    const all = [assigned.id, garage.id, shopOwn.id].sort();
    expect(await ids(owner)).toEqual(all);
    expect(await ids(crew)).toEqual(all);
    expect(await ids(viewer)).toEqual(all);
    expect(await ids(shop)).toEqual([assigned.id, shopOwn.id].sort());
    expect(await ids(shop2)).toEqual([]);

    // A session that is not assigned to a shop does not exist for it.
    expect((await shop.agent.get(`${base}/dyno-sessions/${garage.id}`)).status).toBe(404);
    for (const id of all) {
      expect((await shop2.agent.get(`${base}/dyno-sessions/${id}`)).status).toBe(404);
    }
    const seen = await shop.agent.get(`${base}/dyno-sessions/${assigned.id}`);
    expect(seen.status).toBe(200);
    expect(moneyKeys(seen.body)).toEqual([]);
  });

  it('lets owner, crew and a shop (on its own sessions) record runs; a viewer reads only', async () => {
    const { owner, crew, shop, shop2, viewer, base } = await dynoCast();
    const assigned = await createSession(owner.agent, base, { shopUserId: shop.id });
    const garage = await createSession(owner.agent, base);

    await createRun(owner.agent, base, assigned.id);
    await createRun(crew.agent, base, assigned.id);
    const shopRun = await createRun(shop.agent, base, assigned.id);
    expect(shopRun.runNumber).toBe(3);
    expect(
      (await shop.agent.post(`${base}/dyno-sessions/${garage.id}/runs`).send(typedRun())).status,
    ).toBe(404);
    expect(
      (await shop2.agent.post(`${base}/dyno-sessions/${assigned.id}/runs`).send(typedRun())).status,
    ).toBe(404);
    expect(
      (await viewer.agent.post(`${base}/dyno-sessions/${assigned.id}/runs`).send(typedRun()))
        .status,
    ).toBe(403);
    expect((await viewer.agent.post(`${base}/dyno-sessions`).send(session())).status).toBe(403);
    expect(
      (await viewer.agent.patch(`${base}/dyno-sessions/${garage.id}`).send({ notes: 'x' })).status,
    ).toBe(403);

    // Every role that may see a run reads it; a second shop does not see it at all.
    for (const u of [owner, crew, shop, viewer]) {
      const res = await u.agent.get(`${base}/dyno-runs/${shopRun.id}`);
      expect(res.status).toBe(200);
      expect(moneyKeys(res.body)).toEqual([]);
    }
    expect((await shop2.agent.get(`${base}/dyno-runs/${shopRun.id}`)).status).toBe(404);
    expect((await shop2.agent.get(`${base}/dyno-runs/${shopRun.id}/curve.csv`)).status).toBe(404);

    // The shop edits its run and its session, but cannot hand the session to anyone.
    expect(
      (await shop.agent.patch(`${base}/dyno-runs/${shopRun.id}`).send({ gear: '3rd' })).status,
    ).toBe(200);
    expect(
      (
        await shop.agent
          .patch(`${base}/dyno-sessions/${assigned.id}`)
          .send({ notes: 'Rollers warm' })
      ).status,
    ).toBe(200);
    expect(
      (
        await shop.agent
          .patch(`${base}/dyno-sessions/${assigned.id}`)
          .send({ shopUserId: shop2.id })
      ).status,
    ).toBe(403);
  });

  it('lets owner and crew assign a session to a shop member only, and the shop then sees it', async () => {
    const { owner, crew, shop2, viewer, base } = await dynoCast();
    const s = await createSession(owner.agent, base);
    expect((await shop2.agent.get(`${base}/dyno-sessions/${s.id}`)).status).toBe(404);
    const res = await crew.agent
      .patch(`${base}/dyno-sessions/${s.id}`)
      .send({ shopUserId: shop2.id });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.session.shop.id).toBe(shop2.id);
    expect((await shop2.agent.get(`${base}/dyno-sessions/${s.id}`)).status).toBe(200);

    const notShop = await owner.agent
      .patch(`${base}/dyno-sessions/${s.id}`)
      .send({ shopUserId: viewer.id });
    expect(notShop.status).toBe(400);
    expect(notShop.body.error.fields.shopUserId).toMatch(/shop/);
    const unassign = await owner.agent
      .patch(`${base}/dyno-sessions/${s.id}`)
      .send({ shopUserId: null });
    expect(unassign.body.session.shop).toBeNull();
    expect((await shop2.agent.get(`${base}/dyno-sessions/${s.id}`)).status).toBe(404);
  });

  it('lets only the owner delete sessions, runs and attachments', async () => {
    const { owner, crew, shop, viewer, base } = await dynoCast();
    const s = await createSession(owner.agent, base, { shopUserId: shop.id });
    const run = await createRun(owner.agent, base, s.id);
    for (const u of [crew, shop, viewer]) {
      expect((await u.agent.delete(`${base}/dyno-runs/${run.id}`)).status).toBe(403);
      expect((await u.agent.delete(`${base}/dyno-runs/${run.id}/attachment`)).status).toBe(403);
      expect((await u.agent.delete(`${base}/dyno-sessions/${s.id}`)).status).toBe(403);
    }
    expect((await owner.agent.delete(`${base}/dyno-runs/${run.id}`)).status).toBe(204);
    expect((await owner.agent.get(`${base}/dyno-runs/${run.id}`)).status).toBe(404);
    expect((await owner.agent.delete(`${base}/dyno-sessions/${s.id}`)).status).toBe(204);
    expect((await owner.agent.get(`${base}/dyno-sessions/${s.id}`)).status).toBe(404);
  });

  it('answers a stranger 404 and a signed-out caller 401 on every dyno route', async () => {
    const { owner, stranger, base } = await dynoCast();
    const s = await createSession(owner.agent, base);
    const run = await createRun(owner.agent, base, s.id);
    const routes: [string, string][] = [
      ['get', `${base}/dyno-sessions`],
      ['post', `${base}/dyno-sessions`],
      ['get', `${base}/dyno-sessions/${s.id}`],
      ['patch', `${base}/dyno-sessions/${s.id}`],
      ['delete', `${base}/dyno-sessions/${s.id}`],
      ['post', `${base}/dyno-sessions/${s.id}/runs`],
      ['post', `${base}/dyno-sessions/${s.id}/runs/import`],
      ['get', `${base}/dyno-runs/${run.id}`],
      ['patch', `${base}/dyno-runs/${run.id}`],
      ['delete', `${base}/dyno-runs/${run.id}`],
      ['get', `${base}/dyno-runs/${run.id}/curve.csv`],
      ['put', `${base}/dyno-runs/${run.id}/curve.csv`],
      ['get', `${base}/dyno-runs/${run.id}/attachment`],
      ['put', `${base}/dyno-runs/${run.id}/attachment`],
      ['delete', `${base}/dyno-runs/${run.id}/attachment`],
    ];
    const signedOut = app.agent();
    for (const [method, url] of routes) {
      const call = (a: Agent) =>
        (a as unknown as Record<string, (u: string) => Promise<{ status: number }>>)[method](url);
      expect((await call(stranger.agent)).status, `${method} ${url}`).toBe(404);
      expect((await call(signedOut)).status, `${method} ${url}`).toBe(401);
    }
    // Nothing was changed by them.
    expect((await owner.agent.get(`${base}/dyno-runs/${run.id}`)).status).toBe(200);
  });
});

// ---- corrections ----------------------------------------------------------------------

describe('dyno days: a run corrected on read, never stored corrected', () => {
  /** An engine-dyno run (crank) of 500 hp at 3000 rpm in a session with the given weather. */
  async function engineRun(weather: Record<string, unknown>, over: Record<string, unknown> = {}) {
    const { owner, base } = await dynoCast();
    const s = await createSession(owner.agent, base, { dynoKind: 'engine', weather });
    const run = await createRun(owner.agent, base, s.id, over);
    const read = async (query: string) => {
      const res = await owner.agent.get(`${base}/dyno-runs/${run.id}${query}`);
      expect(res.status, JSON.stringify(res.body)).toBe(200);
      return res.body;
    };
    return { read, owner, base, run, session: s };
  }

  it('gives SAE J1349, R85 (turbo and naturally aspirated), J607, DIN 70020 and uncorrected factors as reference.md', async () => {
    const { read } = await engineRun(weather30at97);
    // reference.md, "Dynamometer correction": SAE J1349 (AUG2004), (30 °C, 97 kPa) → 1.0343913.
    const j1349 = await read('?standard=sae-j1349');
    expectRel(j1349.corrected.correction.factor, 1.0343913);
    expectRel(j1349.corrected.corrected.power, 500 * 1.0343913);
    expectRel(j1349.corrected.corrected.torque, 1000 * 1.0343913);
    // The stored run is the measured one.
    expect(j1349.run.peakPower).toBe(500);
    expect(j1349.corrected.measured.power).toBe(500);

    // UN ECE R85: no boost was typed, so f_m is not computed; the chosen 0.66 → α_d 1.0262402.
    const r85 = await read('?standard=ece-r85&engineFactor=0.66');
    expectRel(r85.corrected.correction.factor, 1.0262402);
    expect(r85.corrected.correction.engineFactor).toMatchObject({ value: 0.66, source: 'chosen' });
    expect(r85.corrected.correction.engineFactor.reason).toMatch(/boost/);
    // None chosen: the standard's lowest f_m 0.3 → 1.0118431, and the answer says so.
    const r85default = await read('?standard=ece-r85');
    expectRel(r85default.corrected.correction.factor, 1.0118431);
    expect(r85default.corrected.correction.warnings.map((w: { code: string }) => w.code)).toContain(
      'engine-factor-default',
    );
    // Naturally aspirated f_a = 1.0325757; with f_m 1.2 → 1.0325757^1.2.
    const na = await read('?standard=ece-r85&aspiration=naturally-aspirated&engineFactor=1.2');
    expectRel(na.corrected.correction.factor, 1.0325757 ** 1.2);

    // SAE J607 [memory] (86 °F, 29.00 inHg) → 1.0572026 and DIN 70020 [memory] (30 °C, 970 mbar) → 1.0620017.
    const j607 = await engineRun({
      temperature: 86,
      temperatureUnit: 'f',
      pressure: 29,
      pressureUnit: 'inhg',
    });
    expectRel((await j607.read('?standard=sae-j607')).corrected.correction.factor, 1.0572026);
    const din = await engineRun({
      temperature: 30,
      temperatureUnit: 'c',
      pressure: 970,
      pressureUnit: 'mbar',
    });
    const dinRead = await din.read('?standard=din-70020');
    expectRel(dinRead.corrected.correction.factor, 1.0620017);
    expectRel(dinRead.corrected.corrected.power, 500 * 1.0620017);

    const none = await read('?standard=uncorrected');
    expect(none.corrected.correction.factor).toBe(1);
    expect(none.corrected.corrected.power).toBe(500);
  });

  it('computes R85’s f_m from the run, the build’s displacement and the BSFC assumption when it can', async () => {
    // 500 crank hp at 3000 rpm, 35 psi boost, 6.6 L, the default 0.40 lb/(hp·h), 30 °C and 97 kPa.
    const { read } = await engineRun(weather30at97, { boost: 35 });
    const body = await read('?standard=ece-r85');
    const fm = body.corrected.correction.engineFactor;
    expect(fm.source).toBe('computed');
    // By hand with reference.md's factors: hp → W 745.69987158227; lb/(hp·h) → g/kWh 608.27739;
    // psi → kPa 6.894757293168361; q = 120000 × fuel[g/s] / (D[L] × rpm); q_c = q / r.
    const kw = (500 * 745.69987158227) / 1000;
    const fuel = (kw * 0.4 * 608.27739) / 3600;
    const q = (120000 * fuel) / (6.6 * 3000);
    const r = (97 + 35 * 6.894757293168361) / 97;
    const qc = q / r;
    expectRel(fm.qc, qc, 1e-6);
    expect(qc).toBeGreaterThan(37.2);
    expect(qc).toBeLessThan(65);
    expectRel(fm.value, 0.036 * qc - 1.14, 1e-6);
    // α_d = f_a^f_m with reference.md's turbo f_a at 30 °C, 97 kPa = 1.0400255.
    expectRel(body.corrected.correction.factor, 1.0400255 ** (0.036 * qc - 1.14), 1e-6);
    // The working says where each input came from.
    const froms = fm.working.inputs.map((i: { from: string }) => i.from);
    expect(froms).toEqual(expect.arrayContaining(['run', 'assumption', 'build', 'weather']));
  });

  it('says so when a factor is outside the standard’s range, without clipping it', async () => {
    // 60 °C and 60 kPa are allowed weather, but far from R85's reference: α_d > 1.1.
    const { read } = await engineRun({
      temperature: 60,
      temperatureUnit: 'c',
      pressure: 60,
      pressureUnit: 'kpa',
    });
    const body = await read('?standard=ece-r85&engineFactor=1.2');
    const c = body.corrected.correction;
    expect(c.valid).toBe(false);
    expect(c.factor).toBeGreaterThan(1.1);
    expect(c.message).toMatch(/outside the 0.9 to 1.1 range/);
  });

  it('reads a session under any standard and reports its best run against the target and the estimate', async () => {
    const { owner, base } = await dynoCast();
    // A rated bottom end gives the estimate a "most the build supports".
    expect(
      (
        await owner.agent.post(`${base}/parts`).send({
          category: 'bottom-end',
          name: 'Stock bottom end',
          ratingValue: 700,
          ratingUnit: 'hp-crank',
        })
      ).status,
    ).toBe(201);
    const s = await createSession(owner.agent, base); // chassis: wheel figures
    await createRun(owner.agent, base, s.id, { peakPower: 480 });
    const best = await createRun(owner.agent, base, s.id, { peakPower: 510 });
    await createRun(owner.agent, base, s.id, {
      peakPower: 530,
      status: 'aborted',
      abortReason: 'Belt slip on the rollers',
    });
    const res = await owner.agent.get(`${base}/dyno-sessions/${s.id}?standard=sae-j1349`);
    expect(res.status).toBe(200);
    const report = res.body.report;
    expect(report.basis).toBe('wheel');
    // A stopped run never counts as the best.
    expect(report.best.id).toBe(best.id);
    expectRel(report.best.peakPowerHp, 510 * 1.0343913);
    // The test build targets 650 crank hp; the wheel result goes to the crank with the 18 % default loss.
    const crank = (510 * 1.0343913) / (1 - 0.18);
    expectRel(report.vsTarget.achieved.value, crank);
    expectRel(report.vsTarget.progressPct.value, (crank / 650) * 100);
    expectRel(report.vsSupported.pctOfSupported.value, (crank / 700) * 100);
    // The target line drawn over wheel curves: 650 × (1 − 0.18).
    expectRel(report.targetPower.value, 650 * 0.82);
    expect(res.body.plan.drivetrainLossPct).toBe(18);

    // The list carries the same best and the build-wide comparison.
    const list = await owner.agent.get(`${base}/dyno-sessions?standard=uncorrected`);
    expect(list.body.sessions[0].best).toMatchObject({ runId: best.id, peakPower: 510, factor: 1 });
    expectRel(list.body.summary.vsTarget.progressPct.value, (510 / 0.82 / 650) * 100);
  });

  it('gives the drivetrain loss a crank and a wheel figure imply', async () => {
    const { owner, base } = await dynoCast();
    const engine = await createSession(owner.agent, base, { dynoKind: 'engine' });
    await createRun(owner.agent, base, engine.id, { peakPower: 600 });
    const chassis = await createSession(owner.agent, base, { dynoKind: 'chassis' });
    await createRun(owner.agent, base, chassis.id, { peakPower: 498 });
    const list = await owner.agent.get(`${base}/dyno-sessions?standard=sae-j1349`);
    const summary = list.body.summary;
    // Both corrected alike, so the factor cancels: 1 − 498/600 = 17 %.
    expectRel(summary.impliedLoss.loss.value, (1 - 498 / 600) * 100);
    expect(summary.bestCrank.sessionId).toBe(engine.id);
    expect(summary.bestWheel.sessionId).toBe(chassis.id);
  });
});

// ---- CSV ------------------------------------------------------------------------------

describe('dyno days: curves from CSV and back', () => {
  it('imports a curve sorted by rpm, exports it marked uncorrected, and re-imports it unchanged under every standard', async () => {
    const { owner, crew, base } = await dynoCast();
    const s = await createSession(owner.agent, base, { dynoKind: 'engine' });

    const preview = await importRun(crew.agent, base, s.id, curveCsv, { gear: '1:1' }, '?dryRun=1');
    expect(preview.status, JSON.stringify(preview.body)).toBe(200);
    expect(preview.body.preview).toMatchObject({ rowCount: 5, reordered: true });
    expect(await runCount(owner.agent, base, s.id)).toBe(0);

    const first = await importRun(crew.agent, base, s.id, curveCsv, {
      gear: '1:1',
      tuneRevision: 'rev C',
    });
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    const run = first.body.run;
    expect(run.curve.map((r: { rpm: number }) => r.rpm)).toEqual([1800, 2200, 2500, 3000, 3400]);
    expect(run).toMatchObject({
      powerUnit: 'hp',
      torqueUnit: 'lbf-ft',
      boostUnit: 'psi',
      egtUnit: 'f',
      mixtureKind: 'afr',
    });
    expect(run.curve[0]).toEqual({
      rpm: 1800,
      power: null,
      torque: 790.25,
      boost: 22,
      egt: 1010,
      mixture: 21.4,
    });

    const exported = await owner.agent.get(`${base}/dyno-runs/${run.id}/curve.csv`);
    expect(exported.status).toBe(200);
    expect(exported.headers['content-type']).toMatch(/text\/csv/);
    expect(exported.headers['content-disposition']).toMatch(/uncorrected\.csv/);
    const text = exported.text;
    const lines = text.split('\r\n');
    expect(lines[0]).toMatch(/^# .*uncorrected/);
    expect(lines[1]).toBe('rpm,power_hp_uncorrected,torque_lbft_uncorrected,boost_psi,egt_f,afr');

    const again = await importRun(owner.agent, base, s.id, text);
    expect(again.status, JSON.stringify(again.body)).toBe(201);
    expect(again.body.run.curve).toEqual(run.curve);

    for (const standard of ['uncorrected', 'sae-j1349', 'ece-r85', 'sae-j607', 'din-70020']) {
      const [a, b] = await Promise.all(
        [run.id, again.body.run.id].map(async (id) => {
          const res = await owner.agent.get(`${base}/dyno-runs/${id}?standard=${standard}`);
          expect(res.status).toBe(200);
          return res.body.corrected;
        }),
      );
      expect(b.correction.factor).toBe(a.correction.factor);
      expect(b.corrected).toEqual(a.corrected);
      expect(b.curve).toEqual(a.curve);
    }
    // Corrected once on read: the corrected curve is the stored one times the factor.
    const j1349 = (await owner.agent.get(`${base}/dyno-runs/${run.id}?standard=sae-j1349`)).body
      .corrected;
    expectRel(j1349.curve[1].power, 330.4 * 1.0343913);
    // The torque-only row's power comes from P = 2πnT/60: 790.25 × 1800 / 5252.1131220.
    expectRel(j1349.curve[0].power, ((790.25 * 1800) / 5252.113122) * 1.0343913);
  });

  it('refuses a corrected column, so nothing is corrected twice', async () => {
    const { owner, base } = await dynoCast();
    const s = await createSession(owner.agent, base);
    const res = await importRun(owner.agent, base, s.id, 'rpm,power_hp_corrected\n2000,300\n');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad_csv');
    expect(res.body.error.fields['file.power_hp_corrected']).toMatch(/corrected/);
    expect(await runCount(owner.agent, base, s.id)).toBe(0);
  });

  it('replaces a typed run’s curve from a file in other units, converting what was typed', async () => {
    const { owner, base } = await dynoCast();
    const s = await createSession(owner.agent, base);
    const run = await createRun(owner.agent, base, s.id, { peakPower: 500, boost: 30 });
    const res = await owner.agent
      .put(`${base}/dyno-runs/${run.id}/curve.csv`)
      .attach(
        'file',
        csvBuffer('rpm,power_kw,boost_kpa\n3000,372.85,206.8\n2000,250,\n'),
        'kw.csv',
      );
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.run.powerUnit).toBe('kw');
    expect(res.body.run.curve.map((r: { rpm: number }) => r.rpm)).toEqual([2000, 3000]);
    // 500 hp × 745.69987158227 W/hp (NIST SP 811 B.9) = 372.849936 kW; 30 psi × 6.894757293 = 206.8427 kPa.
    expectRel(res.body.run.peakPower, 372.849936);
    expectRel(res.body.run.boost, 30 * 6.894757293168361);
  });

  it('names each bad row and saves nothing; refuses unknown columns, units, non-UTF-8, too many rows and too many bytes', async () => {
    const { owner, base } = await dynoCast();
    const s = await createSession(owner.agent, base);
    const bad = await importRun(
      owner.agent,
      base,
      s.id,
      'rpm,power_hp,torque_lbft\n2000,300,800\n0,310,790\n2400,-5,700\n2600,abc,\n',
    );
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('invalid_rows');
    const rows = bad.body.error.rows as { row: number; fields: Record<string, string> }[];
    expect(rows.map((r) => r.row)).toEqual([2, 3, 4]);
    expect(rows[0].fields.rpm).toMatch(/above zero/);
    expect(rows[1].fields.power_hp).toMatch(/negative/);
    expect(rows[2].fields.power_hp).toMatch(/not a number/);

    const unknownColumn = await importRun(
      owner.agent,
      base,
      s.id,
      'rpm,power_hp,wheel_speed\n2000,300,40\n',
    );
    expect(unknownColumn.status).toBe(400);
    expect(unknownColumn.body.error.fields['file.wheel_speed']).toMatch(/Unknown column/);
    const unknownUnit = await importRun(owner.agent, base, s.id, 'rpm,power_bhp\n2000,300\n');
    expect(unknownUnit.status).toBe(400);
    expect(unknownUnit.body.error.fields['file.power_bhp']).toMatch(/Unknown unit "bhp"/);

    const latin1 = Buffer.from('rpm,power_hp\n2000,300\n# caf\xe9\n', 'latin1');
    const notUtf8 = await importRun(owner.agent, base, s.id, latin1);
    expect(notUtf8.status).toBe(400);
    expect(notUtf8.body.error.code).toBe('not_utf8');
    expect(notUtf8.body.error.fields.file).toMatch(/UTF-8/);

    const many = ['rpm,power_hp', ...Array.from({ length: 20_001 }, (_, i) => `${1000 + i},300`)];
    const tooMany = await importRun(owner.agent, base, s.id, many.join('\n'));
    expect(tooMany.status).toBe(400);
    expect(tooMany.body.error.message).toMatch(/20001 rows; a curve has at most 20000/);

    const big = `rpm,power_hp\n${'# padding to pass two megabytes\n'.repeat(70_000)}2000,300\n`;
    expect(Buffer.byteLength(big)).toBeGreaterThan(2 * 1024 * 1024);
    const tooBig = await importRun(owner.agent, base, s.id, big);
    expect(tooBig.status).toBe(400);
    expect(tooBig.body.error.code).toBe('file_too_large');
    expect(tooBig.body.error.fields.file).toMatch(/2 MB/);

    const wrongUnit = await importRun(owner.agent, base, s.id, curveCsv, { powerUnit: 'kw' });
    expect(wrongUnit.status).toBe(400);
    expect(wrongUnit.body.error.fields.powerUnit).toMatch(/in hp, not kw/);
    const badField = await importRun(owner.agent, base, s.id, curveCsv, { status: 'aborted' });
    expect(badField.status).toBe(400);
    expect(badField.body.error.fields.abortReason).toMatch(/why/);

    expect(await runCount(owner.agent, base, s.id)).toBe(0);
  });
});

// ---- bad input ------------------------------------------------------------------------

describe('dyno days: bad input is a 400 naming the field, and nothing is saved', () => {
  it('refuses weather outside −60…60 °C, 50…110 kPa, 0…100 % and a dew point above the air', async () => {
    const { owner, base } = await dynoCast();
    const cases: [Record<string, unknown>, string][] = [
      [{ ...weather30at97, temperature: -61 }, 'weather.temperature'],
      [{ ...weather30at97, temperature: 141, temperatureUnit: 'f' }, 'weather.temperature'],
      [{ ...weather30at97, pressure: 49.9 }, 'weather.pressure'],
      [{ ...weather30at97, pressure: 32.6, pressureUnit: 'inhg' }, 'weather.pressure'],
      [{ ...weather30at97, relativeHumidityPct: 101 }, 'weather.relativeHumidityPct'],
      [{ ...weather30at97, relativeHumidityPct: -1 }, 'weather.relativeHumidityPct'],
      [{ ...weather30at97, dewPoint: 31 }, 'weather.dewPoint'],
    ];
    for (const [weather, field] of cases) {
      const res = await owner.agent.post(`${base}/dyno-sessions`).send(session({ weather }));
      expect(res.status, JSON.stringify(weather)).toBe(400);
      expect(Object.keys(res.body.error.fields)).toContain(field);
    }
    const list = await owner.agent.get(`${base}/dyno-sessions`);
    expect(list.body.sessions).toEqual([]);
  });

  it('refuses rpm at or below zero, negative power, a peak without its rpm and a stopped run without a reason', async () => {
    const { owner, base } = await dynoCast();
    const s = await createSession(owner.agent, base);
    const cases: [Record<string, unknown>, string][] = [
      [{ peakPowerRpm: 0 }, 'peakPowerRpm'],
      [{ peakTorqueRpm: -100 }, 'peakTorqueRpm'],
      [{ peakPower: -1 }, 'peakPower'],
      [{ peakPowerRpm: null }, 'peakPowerRpm'],
      [{ status: 'aborted' }, 'abortReason'],
      [{ curve: [{ rpm: 0, power: 100 }] }, 'curve.0.rpm'],
      [{ curve: [{ rpm: 2000, power: -3 }] }, 'curve.0.power'],
      [{ weather: { ...weather30at97, pressure: 120 } }, 'weather.pressure'],
      [{ powerUnit: 'bhp' }, 'powerUnit'],
    ];
    for (const [over, field] of cases) {
      const res = await owner.agent.post(`${base}/dyno-sessions/${s.id}/runs`).send(typedRun(over));
      expect(res.status, JSON.stringify(over)).toBe(400);
      expect(Object.keys(res.body.error.fields), JSON.stringify(res.body)).toContain(field);
    }
    // An edit is checked merged onto the stored run.
    const run = await createRun(owner.agent, base, s.id);
    const edit = await owner.agent
      .patch(`${base}/dyno-runs/${run.id}`)
      .send({ peakPowerRpm: null });
    expect(edit.status).toBe(400);
    expect(edit.body.error.fields.peakPowerRpm).toBeTruthy();
    expect(await runCount(owner.agent, base, s.id)).toBe(1);
    expect((await owner.agent.get(`${base}/dyno-runs/${run.id}`)).body.run.peakPowerRpm).toBe(3000);
  });

  it('refuses an unknown correction standard or an engine factor outside 0.3…1.2', async () => {
    const { owner, base } = await dynoCast();
    const s = await createSession(owner.agent, base);
    const a = await owner.agent.get(`${base}/dyno-sessions/${s.id}?standard=magic`);
    expect(a.status).toBe(400);
    expect(a.body.error.fields.standard).toBeTruthy();
    const b = await owner.agent.get(`${base}/dyno-sessions?standard=ece-r85&engineFactor=2`);
    expect(b.status).toBe(400);
    expect(b.body.error.fields.engineFactor).toMatch(/at most 1.2/);
  });
});

// ---- attachments ----------------------------------------------------------------------

const pdf = Buffer.from(
  '%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n',
  'latin1',
);

function filesUnder(dir: string): string[] {
  if (!fs.existsSync(dir)) return [];
  return fs
    .readdirSync(dir, { recursive: true, withFileTypes: true })
    .filter((d) => d.isFile())
    .map((d) => path.join(d.parentPath, d.name));
}

describe('dyno days: a run’s attachment', () => {
  it('keeps a PDF for members only, replaces it, and removes the file with its run', async () => {
    const { owner, shop, shop2, viewer, base } = await dynoCast();
    const s = await createSession(owner.agent, base, { shopUserId: shop.id });
    const run = await createRun(owner.agent, base, s.id);
    const up = await shop.agent
      .put(`${base}/dyno-runs/${run.id}/attachment`)
      .attach('file', pdf, { filename: 'run-sheet.pdf', contentType: 'application/pdf' });
    expect(up.status, JSON.stringify(up.body)).toBe(200);
    expect(up.body.run.attachment).toMatchObject({
      name: 'run-sheet.pdf',
      kind: 'pdf',
      bytes: pdf.length,
    });
    // The storage key never leaves the server.
    expect(JSON.stringify(up.body)).not.toMatch(/attachmentKey|\/[0-9a-f-]{36}\.pdf/);

    const got = await viewer.agent.get(up.body.run.attachment.url).buffer(true);
    expect(got.status).toBe(200);
    expect(got.headers['content-type']).toBe('application/pdf');
    expect(got.headers['content-disposition']).toMatch(/^attachment; filename="?run-sheet\.pdf"?$/);
    expect(got.headers['cache-control']).toMatch(/private/);
    expect(Buffer.compare(got.body, pdf)).toBe(0);
    expect((await shop2.agent.get(up.body.run.attachment.url)).status).toBe(404);

    const stored = () => filesUnder(app.storageDir).filter((f) => f.includes(run.id));
    expect(stored()).toHaveLength(1);
    // A photo of the printout replaces it; the PDF's file goes.
    const photo = await sharp({
      create: { width: 64, height: 48, channels: 3, background: '#ddd' },
    })
      .jpeg()
      .withExif({ IFD0: { Make: 'Test camera' } })
      .toBuffer();
    const replaced = await owner.agent
      .put(`${base}/dyno-runs/${run.id}/attachment`)
      .attach('file', photo, { filename: 'printout.jpg', contentType: 'image/jpeg' });
    expect(replaced.status).toBe(200);
    expect(replaced.body.run.attachment.kind).toBe('image');
    expect(stored()).toHaveLength(1);
    const served = await owner.agent.get(replaced.body.run.attachment.url).buffer(true);
    expect((await sharp(served.body).metadata()).exif).toBeUndefined();

    expect((await owner.agent.delete(`${base}/dyno-sessions/${s.id}`)).status).toBe(204);
    expect(stored()).toHaveLength(0);
  });

  it('refuses a file that is not what it claims, a kind it does not keep, and an empty upload', async () => {
    const { owner, base } = await dynoCast();
    const s = await createSession(owner.agent, base);
    const run = await createRun(owner.agent, base, s.id);
    const put = (data: Buffer, filename: string, contentType = 'application/octet-stream') =>
      owner.agent
        .put(`${base}/dyno-runs/${run.id}/attachment`)
        .attach('file', data, { filename, contentType });

    const jpeg = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#000' } })
      .jpeg()
      .toBuffer();
    const asPdf = await put(jpeg, 'sheet.pdf');
    expect(asPdf.status).toBe(400);
    expect(asPdf.body.error.code).toBe('attachment_mismatch');
    expect(asPdf.body.error.fields.file).toMatch(
      /claims to be a PDF but its content is a JPEG photo/,
    );
    const typeLies = await put(pdf, 'sheet', 'image/png');
    expect(typeLies.status).toBe(400);
    expect(typeLies.body.error.fields.file).toMatch(
      /claims to be a PNG image but its content is a PDF/,
    );
    const binary = await put(Buffer.from([0x00, 0x01, 0x02, 0xff, 0xfe, 0x10]), 'run.dat');
    expect(binary.status).toBe(400);
    expect(binary.body.error.code).toBe('unsupported_attachment');
    const noExt = await put(Buffer.from([0x00, 0x01, 0x02, 0xff, 0xfe, 0x10]), 'run');
    expect(noExt.status).toBe(400);
    const cutPdf = await put(pdf.subarray(0, 30), 'sheet.pdf');
    expect(cutPdf.status).toBe(400);
    expect(cutPdf.body.error.code).toBe('damaged_file');
    const none = await owner.agent.put(`${base}/dyno-runs/${run.id}/attachment`);
    expect(none.status).toBe(400);
    expect(none.body.error.fields.file).toBeTruthy();

    const text = await put(Buffer.from('rpm,power_hp\n2000,300\n'), 'dyno-export.csv', 'text/csv');
    expect(text.status).toBe(200);
    expect(text.body.run.attachment).toMatchObject({
      kind: 'text',
      contentType: 'text/csv; charset=utf-8',
    });
    // The failures stored nothing.
    expect(filesUnder(app.storageDir).filter((f) => f.includes(run.id))).toHaveLength(1);
  });
});

// ---- demo data ------------------------------------------------------------------------

describe('dyno days: demo data', () => {
  it('seeds one dyno day with three pulls (one stopped early), weather, curves and a best run a little short of the target', async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'headroom-seed-'));
    const rollback = new Error('rollback');
    try {
      await app.db.knex
        .transaction(async (trx) => {
          const { buildId, userIds } = await seedDemo(trx, {
            storage: createLocalDiskStorage(dir),
          });
          const scope = {
            knex: trx,
            buildId,
            caller: { userId: userIds.owner, role: 'owner' as const },
          };
          const { sessions, summary, plan } = await listSessions(scope, { standard: 'sae-j1349' });
          expect(sessions).toHaveLength(1);
          expect(sessions[0]).toMatchObject({ dynoKind: 'chassis', runCount: 3 });
          expect(sessions[0].weather).not.toBeNull();
          expect(plan.target).toMatchObject({ powerHp: 600, basis: 'wheel' });
          // A little short: between 95 % and 100 % of the target, under the default standard.
          expect(summary.vsTarget!.reached).toBe(false);
          expect(summary.vsTarget!.progressPct.value).toBeGreaterThan(95);
          expect(summary.vsTarget!.progressPct.value).toBeLessThan(100);
          const runs = await trx('dyno_runs').where({ build_id: buildId }).orderBy('run_number');
          expect(runs.map((r: { status: string }) => r.status)).toEqual([
            'complete',
            'complete',
            'aborted',
          ]);
          expect(runs.every((r: { curve_rows: number }) => r.curve_rows > 10)).toBe(true);
          expect(runs[2].abort_reason).toBeTruthy();
          // The printout photo is in the store.
          expect(filesUnder(dir).filter((f) => f.includes(runs[1].id))).toHaveLength(1);
          expect(runs[1].attachment_kind).toBe('image');
          // A shop that was never assigned the session does not see it.
          const shop = { ...scope, caller: { userId: userIds.shop, role: 'shop' as const } };
          expect((await listSessions(shop, { standard: 'sae-j1349' })).sessions).toEqual([]);
          throw rollback;
        })
        .catch((err) => {
          if (err !== rollback) throw err;
        });
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
});
