import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { seedDemo } from '@db/seeds/demo';
import * as benchService from '@server/features/bench/bench.service';
import { createLocalDiskStorage } from '@server/lib/storage';
import { BENCH_ORIGINAL_MAX_BYTES } from '@shared/schemas/bench';
import { useTestApp } from '../helpers/app';
import { addMember, buildWithCast, moneyKeys, signUp, type TestUser } from '../helpers/factories';

// Its own database, mail catcher and worker: the owner's notice mail is read back from it.
const app = useTestApp({}, { mail: true });

// ---- fixtures -------------------------------------------------------------------------

/** Full load within about 1 % but for injector 5; return flow with injector 3 worn (≈ 2.1 × the others). */
const FULL_LOAD = [52.0, 52.3, 51.8, 52.1, 50.2, 52.2, 51.9, 52.1];
const RETURN_FLOW = [11.8, 12.1, 25.6, 12.4, 11.9, 12.2, 12.0, 11.7];

function point(kind: 'full-load' | 'return-flow', values: unknown[], extra = {}) {
  return kind === 'full-load'
    ? {
        kind,
        label: 'Full load',
        unit: 'mm3-per-stroke',
        tolerance: { type: 'percent', value: 1 },
        values,
        ...extra,
      }
    : {
        kind,
        label: 'Return flow',
        unit: 'mm3-per-stroke',
        tolerance: { type: 'absolute', value: 2 },
        values,
        ...extra,
      };
}

function sheetInput(partId: string, overrides: Record<string, unknown> = {}) {
  return {
    partId,
    occasion: 'As received',
    testedOn: '2026-11-02',
    testedBy: 'Bench 2',
    fluid: 'Calibration fluid to ISO 4113',
    fluidTemperature: { value: 40, unit: 'c' },
    points: [point('full-load', FULL_LOAD), point('return-flow', RETURN_FLOW)],
    ...overrides,
  };
}

const pdf = () =>
  Buffer.from(
    '%PDF-1.4\n1 0 obj <</Type /Catalog /Pages 2 0 R>> endobj\n2 0 obj <</Type /Pages /Kids [] /Count 0>> endobj\ntrailer <</Root 1 0 R>>\n%%EOF\n',
    'latin1',
  );

/** A phone photo of the sheet: large, with camera EXIF and a GPS position. */
function gpsPhoto() {
  return sharp({ create: { width: 2400, height: 1800, channels: 3, background: '#e8e4da' } })
    .jpeg()
    .withExif({
      IFD0: { Make: 'Test camera', Model: 'Fixture 1' },
      IFD3: {
        GPSLatitudeRef: 'N',
        GPSLatitude: '51/1 28/1 4000/100',
        GPSLongitudeRef: 'W',
        GPSLongitude: '0/1 0/1 500/100',
      },
    })
    .toBuffer();
}

function filesUnder(dir: string): string[] {
  if (!fs.existsSync(dir)) return [];
  return fs
    .readdirSync(dir, { recursive: true, withFileTypes: true })
    .filter((d) => d.isFile())
    .map((d) => path.join(d.parentPath, d.name));
}

/**
 * The cast, a second shop with its own injectors on the same build, and parts:
 * injectors out at the first shop, injectors out at the second, a down-pipe.
 */
async function cast() {
  const c = await buildWithCast(app);
  const shop2 = await signUp(app, 'shop2');
  await addMember(c.owner, c.build.id, shop2, 'shop');
  const base = `/api/builds/${c.build.id}`;
  const newPart = async (body: Record<string, unknown>) => {
    const res = await c.owner.agent.post(`${base}/parts`).send(body);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    return res.body.part as { id: string };
  };
  const injectors = await newPart({
    category: 'fuel-injection',
    name: 'Injector set, new nozzles',
    status: 'at-shop',
    shopUserId: c.shop.id,
    sentOutOn: '2026-10-28',
    labourCents: 96_000,
  });
  const otherInjectors = await newPart({
    category: 'fuel-injection',
    name: 'Spare injector set',
    status: 'at-shop',
    shopUserId: shop2.id,
    labourCents: 50_000,
  });
  const downPipe = await newPart({ category: 'exhaust', name: 'Down-pipe', unitPriceCents: 3850 });
  return { ...c, shop2, base, injectors, otherInjectors, downPipe };
}

async function createSheet(user: TestUser, base: string, body: Record<string, unknown>) {
  const res = await user.agent.post(`${base}/bench-sheets`).send(body);
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.sheet as { id: string } & Record<string, unknown>;
}

// ---- who may ---------------------------------------------------------------------------

describe('bench sheets: who may', () => {
  it('lets owner, crew and the shop add sheets; refuses the viewer, a stranger and the signed out', async () => {
    const { owner, crew, shop, viewer, stranger, base, injectors } = await cast();
    const url = `${base}/bench-sheets`;
    for (const user of [owner, crew, shop]) {
      const res = await user.agent.post(url).send(sheetInput(injectors.id));
      expect(res.status, `${user.email}: ${JSON.stringify(res.body)}`).toBe(201);
      expect(res.body.sheet.shopUserId).toBe(user === shop ? shop.id : null);
      expect(res.body.sheet.enteredBy).toEqual({ id: user.id, name: user.displayName });
    }
    expect((await viewer.agent.post(url).send(sheetInput(injectors.id))).status).toBe(403);
    expect((await stranger.agent.post(url).send(sheetInput(injectors.id))).status).toBe(404);
    expect((await app.agent().post(url).send(sheetInput(injectors.id))).status).toBe(401);
    expect((await stranger.agent.get(url)).status).toBe(404);
    expect((await app.agent().get(url)).status).toBe(401);
  });

  it('shows a shop only its own sheets of the parts sent to it; a second shop sees nothing', async () => {
    const { owner, crew, shop, shop2, viewer, base, injectors, otherInjectors } = await cast();
    const byOwner = await createSheet(
      owner,
      base,
      sheetInput(injectors.id, { occasion: 'Before' }),
    );
    const byShop = await createSheet(shop, base, sheetInput(injectors.id));
    const byShop2 = await createSheet(
      shop2,
      base,
      sheetInput(otherInjectors.id, { occasion: 'Spare set' }),
    );

    const ids = async (user: TestUser, query = '') =>
      ((await user.agent.get(`${base}/bench-sheets${query}`)).body.sheets as { id: string }[]).map(
        (s) => s.id,
      );
    expect((await ids(owner)).sort()).toEqual([byOwner.id, byShop.id, byShop2.id].sort());
    expect((await ids(crew)).sort()).toEqual([byOwner.id, byShop.id, byShop2.id].sort());
    expect((await ids(viewer)).length).toBe(3);
    expect(await ids(shop)).toEqual([byShop.id]);
    expect(await ids(shop2)).toEqual([byShop2.id]);
    expect((await ids(owner, `?partId=${injectors.id}`)).sort()).toEqual(
      [byOwner.id, byShop.id].sort(),
    );

    // Another's sheet does not exist for a shop, whatever it tries.
    for (const [user, sheet] of [
      [shop2, byShop],
      [shop, byOwner],
      [shop, byShop2],
    ] as const) {
      const url = `${base}/bench-sheets/${sheet.id}`;
      expect((await user.agent.get(url)).status).toBe(404);
      expect((await user.agent.patch(url).send({ occasion: 'x' })).status).toBe(404);
      expect((await user.agent.delete(url)).status).toBe(404);
      expect((await user.agent.get(`${url}/values.csv`)).status).toBe(404);
      expect((await user.agent.get(`${url}/original`)).status).toBe(404);
    }
    // …nor may it put a sheet on a part it was not sent.
    const onOther = await shop.agent
      .post(`${base}/bench-sheets`)
      .send(sheetInput(otherInjectors.id));
    expect(onOther.status).toBe(400);
    expect(onOther.body.error.fields.partId).toBe('Choose an injector set sent to your shop');
  });

  it('lets crew edit the sheets no shop entered but not a shop’s; only owner and shop delete', async () => {
    const { owner, crew, shop, viewer, base, injectors } = await cast();
    const byCrew = await createSheet(
      crew,
      base,
      sheetInput(injectors.id, { occasion: 'Crew copy' }),
    );
    const byShop = await createSheet(shop, base, sheetInput(injectors.id));
    const url = (s: { id: string }) => `${base}/bench-sheets/${s.id}`;

    const crewEdit = await crew.agent.patch(url(byCrew)).send({ testedBy: 'Teddy' });
    expect(crewEdit.status).toBe(200);
    expect(crewEdit.body.sheet.testedBy).toBe('Teddy');
    expect(crewEdit.body.sheet.updatedBy.id).toBe(crew.id);
    const crewOnShop = await crew.agent.patch(url(byShop)).send({ testedBy: 'Teddy' });
    expect(crewOnShop.status).toBe(403);
    expect(crewOnShop.body.error.message).toMatch(/shop’s bench sheet/);
    expect((await viewer.agent.patch(url(byCrew)).send({ testedBy: 'Jo' })).status).toBe(403);

    expect((await shop.agent.patch(url(byShop)).send({ notes: 'Re-tested #3' })).status).toBe(200);
    expect((await owner.agent.patch(url(byShop)).send({ notes: 'Checked' })).status).toBe(200);

    expect((await crew.agent.delete(url(byCrew))).status).toBe(403);
    expect((await viewer.agent.delete(url(byCrew))).status).toBe(403);
    expect((await shop.agent.delete(url(byShop))).status).toBe(204);
    expect((await owner.agent.get(url(byShop))).status).toBe(404);
    expect((await owner.agent.delete(url(byCrew))).status).toBe(204);
  });

  it('lets the shop keep reading its sheets after the part comes back, not after it goes to another shop', async () => {
    const { owner, shop, shop2, base, injectors } = await cast();
    const sheet = await createSheet(shop, base, sheetInput(injectors.id));
    const url = `${base}/bench-sheets/${sheet.id}`;

    const back = await shop.agent
      .patch(`${base}/parts/${injectors.id}`)
      .send({ status: 'in-hand', backOn: '2026-11-20' });
    expect(back.status, JSON.stringify(back.body)).toBe(200);
    expect((await shop.agent.get(url)).status).toBe(200);
    await owner.agent
      .patch(`${base}/parts/${injectors.id}`)
      .send({ status: 'installed', installedOn: '2026-11-25' });
    expect((await shop.agent.get(url)).status).toBe(200);
    expect((await shop.agent.get(`${base}/bench-sheets`)).body.sheets).toHaveLength(1);

    // Sent on to another shop, the part and its sheets leave the first shop's view.
    await owner.agent.patch(`${base}/parts/${injectors.id}`).send({ shopUserId: shop2.id });
    expect((await shop.agent.get(url)).status).toBe(404);
    expect((await shop.agent.get(`${base}/bench-sheets`)).body.sheets).toEqual([]);
    // And the second shop does not inherit the first shop's sheets.
    expect((await shop2.agent.get(url)).status).toBe(404);
    expect((await owner.agent.get(url)).status).toBe(200);
  });

  it('sends no …Cents key to anyone but the owner, on any bench route', async () => {
    const { owner, crew, shop, viewer, base, injectors } = await cast();
    const before = await createSheet(shop, base, sheetInput(injectors.id));
    const after = await createSheet(
      shop,
      base,
      sheetInput(injectors.id, { occasion: 'After rebuild', testedOn: '2026-11-15' }),
    );
    for (const user of [crew, shop, viewer]) {
      const bodies = [
        (await user.agent.get(`${base}/bench-sheets`)).body,
        (await user.agent.get(`${base}/bench-sheets/${before.id}`)).body,
        (await user.agent.get(`${base}/bench-sheets/compare?before=${before.id}&after=${after.id}`))
          .body,
      ];
      for (const body of bodies) {
        expect(body.error, JSON.stringify(body)).toBeUndefined();
        expect(moneyKeys(body)).toEqual([]);
      }
    }
    // The owner reads the same answers (there is no money in a bench sheet at all).
    expect((await owner.agent.get(`${base}/bench-sheets/${before.id}`)).status).toBe(200);
  });
});

// ---- what a sheet says -----------------------------------------------------------------

describe('bench sheets: what the server works out', () => {
  it('judges the sheet: the worn injector, the low one, statistics per point and the imbalance cost', async () => {
    const { shop, base, injectors } = await cast();
    const res = await shop.agent.post(`${base}/bench-sheets`).send(sheetInput(injectors.id));
    expect(res.status).toBe(201);
    const { sheet, result, imbalance, cylinders, target } = res.body;
    expect(cylinders).toBe(8);
    expect(target).toEqual({ powerHp: 650, basis: 'crank' });
    expect(sheet.points[0].values).toEqual(FULL_LOAD);
    expect(sheet.fluidTemperature).toEqual({ value: 40, unit: 'c' });
    expect(result.status).toBe('out-of-tolerance');
    expect(result.findings[0]).toMatchObject({ kind: 'worn', positions: [3] });
    expect(result.verdict).toMatch(/^Injector 3 is worn/);
    expect(result.points[0].flaggedPositions).toEqual([5]);
    expect(result.points[1].injectors[2].flags).toContain('worn');
    // reference.md formulas: mean of the eight full-load values.
    const mean = FULL_LOAD.reduce((a, b) => a + b, 0) / 8;
    expect(result.points[0].statistics.mean).toBeCloseTo(mean, 10);
    // Rule of thumb: richest excess over the mean as a share of the 650 hp target.
    expect(imbalance.available).toBe(true);
    expect(imbalance.richestPosition).toBe(2);
    expect(imbalance.power.value).toBeCloseTo((650 * (52.3 - mean)) / mean, 9);
    expect(imbalance.power.working.steps.length).toBeGreaterThan(2);
  });

  it('keeps a missing value missing (never a zero) and pads values to the build’s cylinders', async () => {
    const { crew, base, injectors } = await cast();
    const res = await crew.agent.post(`${base}/bench-sheets`).send(
      sheetInput(injectors.id, {
        points: [point('full-load', [52, null, 52.2, 51.9])],
      }),
    );
    expect(res.status).toBe(201);
    expect(res.body.sheet.points[0].values).toEqual([52, null, 52.2, 51.9, null, null, null, null]);
    expect(res.body.result.points[0].statistics).toMatchObject({ n: 3, missing: 5 });
  });

  it('compares two sheets of one part and costs the imbalance before and after', async () => {
    const { shop, crew, base, injectors, otherInjectors, owner } = await cast();
    const before = await createSheet(shop, base, sheetInput(injectors.id));
    const matched = [52.1, 52.2, 52.0, 52.3, 52.1, 52.2, 52.0, 52.1];
    const after = await createSheet(
      shop,
      base,
      sheetInput(injectors.id, {
        occasion: 'After rebuild',
        testedOn: '2026-11-15',
        points: [
          point('full-load', matched),
          point('return-flow', [12, 12.1, 11.9, 12, 12.2, 11.8, 12, 12.1]),
        ],
      }),
    );
    const res = await crew.agent.get(
      `${base}/bench-sheets/compare?before=${before.id}&after=${after.id}`,
    );
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const full = res.body.comparison.points[0];
    expect(full.label).toBe('Full load');
    expect(full.injectors[4]).toMatchObject({ position: 5, before: 50.2, after: 52.1 });
    expect(full.injectors[4].change).toBeCloseTo(1.9, 10);
    expect(full.spreadChange).toBeLessThan(0);
    expect(res.body.recovery.recovered.value).toBeGreaterThan(0);
    expect(res.body.before.status).toBe('out-of-tolerance');
    expect(res.body.after.status).toBe('in-tolerance');

    const other = await createSheet(owner, base, sheetInput(otherInjectors.id));
    const mixed = await owner.agent.get(
      `${base}/bench-sheets/compare?before=${before.id}&after=${other.id}`,
    );
    expect(mixed.status).toBe(400);
    expect(mixed.body.error.fields.after).toMatch(/Injector set, new nozzles/);
    const missing = await owner.agent.get(`${base}/bench-sheets/compare?before=${before.id}`);
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields.after).toBeTruthy();
    const same = await owner.agent.get(
      `${base}/bench-sheets/compare?before=${before.id}&after=${before.id}`,
    );
    expect(same.status).toBe(400);
  });
});

// ---- bad input -------------------------------------------------------------------------

describe('bench sheets: bad input is a 400 naming the field or cell, and nothing is saved', () => {
  it('refuses non-numbers, negatives, positions beyond the cylinders, unknown units and zero tolerances', async () => {
    const { owner, base, injectors } = await cast();
    const url = `${base}/bench-sheets`;
    const cases: [Record<string, unknown>, string][] = [
      [
        sheetInput(injectors.id, { points: [point('full-load', [52, 52.1, 'abc'])] }),
        'points.0.values.2',
      ],
      [sheetInput(injectors.id, { points: [point('full-load', [52, -1])] }), 'points.0.values.1'],
      [
        sheetInput(injectors.id, { points: [point('full-load', [...FULL_LOAD, 52.2])] }),
        'points.0.values.8',
      ],
      [
        sheetInput(injectors.id, {
          points: [point('full-load', FULL_LOAD, { unit: 'cc-per-min' })],
        }),
        'points.0.unit',
      ],
      [
        sheetInput(injectors.id, {
          points: [point('full-load', FULL_LOAD, { tolerance: { type: 'percent', value: 0 } })],
        }),
        'points.0.tolerance.value',
      ],
      [
        sheetInput(injectors.id, {
          points: [point('full-load', FULL_LOAD), point('full-load', FULL_LOAD)],
        }),
        'points.1.label',
      ],
      [sheetInput(injectors.id, { testedOn: '2026-13-01' }), 'testedOn'],
      [sheetInput(injectors.id, { occasion: 'As\u0000received' }), 'occasion'],
      [sheetInput(injectors.id, { points: [] }), 'points'],
      [{ ...sheetInput(injectors.id), colour: 'red' }, 'colour'],
    ];
    for (const [body, field] of cases) {
      const res = await owner.agent.post(url).send(body);
      expect(res.status, `${field}: ${JSON.stringify(res.body)}`).toBe(400);
      expect(Object.keys(res.body.error.fields), field).toContain(field);
    }
    // A sheet of a part that is no injector set of this build.
    const notInjector = await owner.agent.post(url).send(sheetInput((await cast()).injectors.id));
    expect(notInjector.status).toBe(400);
    expect(notInjector.body.error.fields.partId).toBe('Choose an injector set of this build');
    const malformed = await owner.agent
      .post(url)
      .set('Content-Type', 'application/json')
      .send('{"partId": ');
    expect(malformed.status).toBe(400);

    expect((await owner.agent.get(url)).body.sheets).toEqual([]);
  });

  it('refuses a part that is not fuel injection, and an edit that moves values beyond the cylinders', async () => {
    const { owner, base, injectors, downPipe } = await cast();
    const res = await owner.agent.post(`${base}/bench-sheets`).send(sheetInput(downPipe.id));
    expect(res.status).toBe(400);
    expect(res.body.error.fields.partId).toMatch(
      /fuel-injection parts; “Down-pipe” is filed under Exhaust/,
    );

    const sheet = await createSheet(owner, base, sheetInput(injectors.id));
    const url = `${base}/bench-sheets/${sheet.id}`;
    const beyond = await owner.agent
      .patch(url)
      .send({ points: [point('full-load', [...FULL_LOAD, 1, 2])] });
    expect(beyond.status).toBe(400);
    expect(beyond.body.error.fields).toMatchObject({
      'points.0.values.8': "Injector 9 is beyond the build's 8 cylinders",
      'points.0.values.9': "Injector 10 is beyond the build's 8 cylinders",
    });
    const moved = await owner.agent.patch(url).send({ partId: downPipe.id });
    expect(moved.status).toBe(400);
    expect((await owner.agent.patch(url).send({})).status).toBe(400);
    expect((await owner.agent.get(url)).body.sheet.points[0].values).toEqual(FULL_LOAD);
    expect((await owner.agent.get(`${base}/bench-sheets/not-an-id`)).status).toBe(404);
  });
});

// ---- CSV -------------------------------------------------------------------------------

describe('bench sheets: CSV of the values', () => {
  it('exports the values and imports them back, checking every cell before saving', async () => {
    const { shop, owner, base, injectors } = await cast();
    const sheet = await createSheet(shop, base, sheetInput(injectors.id));
    const url = `${base}/bench-sheets/${sheet.id}`;

    const csv = await owner.agent.get(`${url}/values.csv`);
    expect(csv.status).toBe(200);
    expect(csv.headers['content-type']).toMatch(/text\/csv/);
    expect(csv.headers['content-disposition']).toMatch(/attachment/);
    expect(csv.text.split('\r\n')[0]).toBe('Position,Full load,Return flow');
    expect(csv.text.split('\r\n')[3]).toBe('3,51.8,25.6');

    const good = 'Position,Return flow,Full load\n1,12,52.1\n2,12.1,52.2\n3,12.2,52.0\n';
    const dry = await shop.agent
      .post(`${url}/import?dryRun=1`)
      .attach('file', Buffer.from(good), 'sheet.csv');
    expect(dry.status, JSON.stringify(dry.body)).toBe(200);
    expect(dry.body.dryRun).toBe(true);
    expect(dry.body.sheet.points[0].values).toEqual([52.1, 52.2, 52, null, null, null, null, null]);
    expect((await owner.agent.get(url)).body.sheet.points[0].values).toEqual(FULL_LOAD);

    const saved = await shop.agent
      .post(`${url}/import`)
      .attach('file', Buffer.from(good), 'sheet.csv');
    expect(saved.status).toBe(200);
    expect((await owner.agent.get(url)).body.sheet.points[1].values.slice(0, 3)).toEqual([
      12, 12.1, 12.2,
    ]);
  });

  it('names the bad cells of a CSV, refuses wrong columns and non-UTF-8, saving nothing', async () => {
    const { owner, crew, base, injectors } = await cast();
    const sheet = await createSheet(owner, base, sheetInput(injectors.id));
    const url = `${base}/bench-sheets/${sheet.id}`;
    const send = (text: string | Buffer) =>
      crew.agent.post(`${url}/import`).attach('file', Buffer.from(text), 'sheet.csv');

    const bad = await send('Position,Full load,Return flow\n1,52.1,abc\n1,-3,12\n9,52,12\n');
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('invalid_csv');
    expect(bad.body.error.rows).toEqual([
      { row: 2, fields: { 'Return flow': expect.stringMatching(/"abc" is not a number/) } },
      {
        row: 3,
        fields: {
          Position: 'Position 1 is already on row 2',
          'Full load': 'A bench value cannot be negative',
        },
      },
      { row: 4, fields: { Position: "Position 9 is beyond the build's 8 cylinders" } },
    ]);

    const columns = await send('Position,Full load,Idle\n1,52,6\n');
    expect(columns.status).toBe(400);
    expect(columns.body.error.rows[0].fields.Idle).toMatch(/not a test point of this sheet/);
    expect(columns.body.error.rows[0].fields['Return flow']).toBe('No column for "Return flow"');

    const latin1 = await send(
      Buffer.from('Position,Full load,Return flow\n1,52\u00b0,12\n', 'latin1'),
    );
    expect(latin1.status).toBe(400);
    expect(latin1.body.error).toMatchObject({
      code: 'not_utf8',
      fields: { file: 'Not UTF-8 text' },
    });

    const empty = await send('');
    expect(empty.status).toBe(400);
    const none = await crew.agent.post(`${url}/import`).send({});
    expect(none.status).toBe(400);
    expect(none.body.error.code).toBe('no_file');

    expect((await owner.agent.get(url)).body.sheet.points[0].values).toEqual(FULL_LOAD);
  });
});

// ---- the original sheet ----------------------------------------------------------------

describe('bench sheets: the shop’s original sheet', () => {
  it('keeps a PDF as sent and serves it to members only, as a download', async () => {
    const { shop, owner, viewer, stranger, shop2, base, injectors } = await cast();
    const sheet = await createSheet(shop, base, sheetInput(injectors.id));
    const url = `${base}/bench-sheets/${sheet.id}/original`;
    const up = await shop.agent.put(url).attach('file', pdf(), 'Bench sheet 0412.pdf');
    expect(up.status, JSON.stringify(up.body)).toBe(200);
    expect(up.body.original).toMatchObject({
      fileName: 'Bench sheet 0412.pdf',
      format: 'pdf',
      contentType: 'application/pdf',
      bytes: pdf().length,
      webUrl: null,
      thumbUrl: null,
      uploadedBy: { id: shop.id },
    });
    for (const user of [owner, viewer, shop]) {
      const res = await user.agent.get(url).buffer(true);
      expect(res.status).toBe(200);
      expect(res.headers['content-type']).toBe('application/pdf');
      expect(res.headers['content-disposition']).toMatch(
        /^attachment; filename="Bench sheet 0412.pdf"/,
      );
      expect(res.headers['cache-control']).toMatch(/private/);
      expect(Buffer.compare(res.body, pdf())).toBe(0);
    }
    expect((await stranger.agent.get(url)).status).toBe(404);
    expect((await shop2.agent.get(url)).status).toBe(404);
    expect((await app.agent().get(url)).status).toBe(401);
    expect((await owner.agent.get(`${url}/web`)).status).toBe(404);
    expect(
      (await owner.agent.get(`${base}/bench-sheets/${sheet.id}`)).body.sheet.original.url,
    ).toBe(url);
  });

  it('keeps a photo of the sheet at full size without its GPS or camera data, plus a web copy', async () => {
    const { crew, owner, base, injectors } = await cast();
    const sheet = await createSheet(crew, base, sheetInput(injectors.id));
    const url = `${base}/bench-sheets/${sheet.id}/original`;
    const fixture = await gpsPhoto();
    expect((await sharp(fixture).metadata()).exif).toBeDefined();
    const up = await crew.agent.put(url).attach('file', fixture, 'IMG_2231.JPG');
    expect(up.status, JSON.stringify(up.body)).toBe(200);
    expect(up.body.original).toMatchObject({
      fileName: 'IMG_2231.jpg',
      format: 'jpeg',
      contentType: 'image/jpeg',
      width: 2400,
      height: 1800,
    });
    const original = await owner.agent.get(url).buffer(true);
    expect(original.headers['content-disposition']).toMatch(/^attachment/);
    const meta = await sharp(original.body).metadata();
    expect([meta.width, meta.height]).toEqual([2400, 1800]);
    expect(meta.exif).toBeUndefined();
    expect(original.body.includes(Buffer.from('Test camera'))).toBe(false);
    for (const size of ['web', 'thumb'] as const) {
      const copy = await owner.agent.get(`${url}/${size}`).buffer(true);
      expect(copy.status).toBe(200);
      expect(copy.headers['content-type']).toBe('image/jpeg');
      const m = await sharp(copy.body).metadata();
      expect(Math.max(m.width!, m.height!)).toBe(size === 'web' ? 1600 : 320);
      expect(m.exif).toBeUndefined();
    }
    // On disk too, and no temporary file left behind.
    const stored = filesUnder(app.storageDir).filter((f) => f.includes(up.body.original.id));
    expect(stored.map((f) => path.basename(f)).sort()).toEqual([
      'original.jpg',
      'thumb.jpg',
      'web.jpg',
    ]);
    for (const f of stored) expect((await sharp(f).metadata()).exif).toBeUndefined();
    expect(filesUnder(app.uploadTmpDir)).toEqual([]);
  });

  it('refuses a PDF that is not a PDF, a text file, and a file over 20 MB, storing nothing', async () => {
    const { owner, base, injectors } = await cast();
    const sheet = await createSheet(owner, base, sheetInput(injectors.id));
    const url = `${base}/bench-sheets/${sheet.id}/original`;
    const storedBefore = filesUnder(app.storageDir).length;

    const fakePdf = await owner.agent
      .put(url)
      .attach('file', Buffer.from('<html>not a pdf</html>'), {
        filename: 'sheet.pdf',
        contentType: 'application/pdf',
      });
    expect(fakePdf.status).toBe(400);
    expect(fakePdf.body.error).toMatchObject({
      code: 'not_a_pdf',
      fields: { file: 'This file is not a PDF' },
    });

    const text = await owner.agent.put(url).attach('file', Buffer.from('1,2,3\n'), 'sheet.jpg');
    expect(text.status).toBe(400);
    expect(text.body.error.code).toBe('not_an_image');
    expect(text.body.error.message).toMatch(/neither a PDF nor a photo/);

    const big = Buffer.alloc(BENCH_ORIGINAL_MAX_BYTES + 1024, 0x20);
    pdf().copy(big);
    const tooBig = await owner.agent.put(url).attach('file', big, 'scan.pdf');
    expect(tooBig.status).toBe(400);
    expect(tooBig.body.error.code).toBe('file_too_large');

    const none = await owner.agent.put(url).field('note', 'nothing attached');
    expect(none.status).toBe(400);
    expect(none.body.error.code).toBe('no_file');

    expect(
      (await owner.agent.get(`${base}/bench-sheets/${sheet.id}`)).body.sheet.original,
    ).toBeNull();
    expect(filesUnder(app.storageDir)).toHaveLength(storedBefore);
    expect(filesUnder(app.uploadTmpDir)).toEqual([]);
  });

  it('removes the files of a replaced original, of a removed one and of a deleted sheet or part', async () => {
    const { owner, crew, shop, base, injectors } = await cast();
    const sheet = await createSheet(shop, base, sheetInput(injectors.id));
    const url = `${base}/bench-sheets/${sheet.id}/original`;
    const first = (await shop.agent.put(url).attach('file', await gpsPhoto(), 'a.jpg')).body
      .original;
    const on = (id: string) => filesUnder(app.storageDir).filter((f) => f.includes(id));
    expect(on(first.id)).toHaveLength(3);

    const second = (await shop.agent.put(url).attach('file', pdf(), 'b.pdf')).body.original;
    expect(on(first.id)).toEqual([]);
    expect(on(second.id)).toHaveLength(1);

    // Crew may not remove a shop's original; the shop may.
    expect((await crew.agent.delete(url)).status).toBe(403);
    expect((await shop.agent.delete(url)).status).toBe(204);
    expect(on(second.id)).toEqual([]);
    expect((await shop.agent.delete(url)).status).toBe(404);

    const third = (await shop.agent.put(url).attach('file', pdf(), 'c.pdf')).body.original;
    expect((await owner.agent.delete(`${base}/bench-sheets/${sheet.id}`)).status).toBe(204);
    expect(on(third.id)).toEqual([]);

    // A part's deletion takes its sheets and their originals along.
    const again = await createSheet(owner, base, sheetInput(injectors.id));
    const fourth = (
      await owner.agent
        .put(`${base}/bench-sheets/${again.id}/original`)
        .attach('file', pdf(), 'd.pdf')
    ).body.original;
    expect(on(fourth.id)).toHaveLength(1);
    expect((await owner.agent.delete(`${base}/parts/${injectors.id}`)).status).toBe(204);
    expect(on(fourth.id)).toEqual([]);
    expect((await owner.agent.get(`${base}/bench-sheets/${again.id}`)).status).toBe(404);
  });
});

// ---- the owner's notice ----------------------------------------------------------------

describe('bench sheets: the owner hears when a shop adds or changes one', () => {
  it('mails the owner (not crew or viewer) when the shop adds, changes or attaches; not for their own entries', async () => {
    const { owner, crew, viewer, shop, base, injectors } = await cast();
    const sheet = await createSheet(shop, base, sheetInput(injectors.id));
    await app.mail.deliver();
    const added = (await app.mail.to(owner.email)).filter((m) =>
      /Bench sheet/.test(m.subject ?? ''),
    );
    expect(added).toHaveLength(1);
    expect(added[0].subject).toBe('Test hauler: Bench sheet “As received” added by Test shop');
    expect(added[0].textBody).toMatch(
      /Test shop added the bench sheet “As received” \(tested on 2026-11-02\)/,
    );
    expect(added[0].textBody).toMatch(/Injector 3 is worn/);
    expect(added[0].textBody).toContain(`/builds/${sheet.buildId}/bench/sheets/${sheet.id}`);
    expect(added[0].textBody).not.toMatch(/\$|960/);

    await shop.agent.patch(`${base}/bench-sheets/${sheet.id}`).send({ notes: 'Nozzle 3 replaced' });
    await shop.agent
      .put(`${base}/bench-sheets/${sheet.id}/original`)
      .attach('file', pdf(), 'x.pdf');
    // The owner's and crew's own entries send nothing.
    await createSheet(owner, base, sheetInput(injectors.id, { occasion: 'Owner copy' }));
    await createSheet(crew, base, sheetInput(injectors.id, { occasion: 'Crew copy' }));
    await app.mail.deliver();
    const subjects = (await app.mail.to(owner.email))
      .map((m) => m.subject ?? '')
      .filter((s) => /Bench sheet/.test(s));
    expect(subjects.sort()).toEqual([
      'Test hauler: Bench sheet “As received” added by Test shop',
      'Test hauler: Bench sheet “As received” changed by Test shop',
      'Test hauler: Bench sheet “As received” original attached by Test shop',
    ]);
    for (const other of [crew, viewer, shop]) {
      expect(
        (await app.mail.to(other.email)).filter((m) => /Bench sheet/.test(m.subject ?? '')),
      ).toEqual([]);
    }

    // Switched off, the owner hears nothing more.
    const prefs = await owner.agent
      .put(`/api/builds/${sheet.buildId}/notice-preferences`)
      .send({ 'bench-sheet-from-shop': false });
    expect(prefs.status).toBe(200);
    await shop.agent.delete(`${base}/bench-sheets/${sheet.id}`);
    await app.mail.deliver();
    expect((await app.mail.to(owner.email)).filter((m) => /removed/.test(m.subject ?? ''))).toEqual(
      [],
    );
  });
});

// ---- demo data -------------------------------------------------------------------------

describe('bench sheets: demo data', () => {
  it('gives the demo injector set an "as received" sheet with one worn injector and an "after rebuild" sheet matched within 1 %', async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'headroom-bench-seed-'));
    const rollback = new Error('rollback');
    try {
      await app.db.knex
        .transaction(async (trx) => {
          const { buildId, userIds } = await seedDemo(trx, {
            storage: createLocalDiskStorage(dir),
          });
          const owner = { userId: userIds.owner, role: 'owner' as const };
          const shop = { userId: userIds.shop, role: 'shop' as const };
          const sheets = await benchService.list(trx, buildId, shop, {});
          expect(sheets.map((s) => s.occasion)).toEqual(['As received', 'After rebuild']);
          expect(sheets.every((s) => s.partName.startsWith('Injectors, new nozzles'))).toBe(true);

          const before = await benchService.get(trx, buildId, sheets[0].id, owner);
          expect(before.result.findings[0]).toMatchObject({ kind: 'worn', positions: [3] });
          const full = before.result.points.find((p) => p.kind === 'full-load')!;
          expect(full.injectors[2].vsMean).toBe('low');
          expect(before.sheet.original).toMatchObject({ format: 'png' });

          const after = await benchService.get(trx, buildId, sheets[1].id, owner);
          expect(after.result.status).toBe('in-tolerance');
          const matched = after.result.points.find((p) => p.kind === 'full-load')!;
          expect(matched.statistics.maxDeviationPct).toBeLessThanOrEqual(1);

          const compared = await benchService.compare(trx, buildId, owner, {
            before: sheets[0].id,
            after: sheets[1].id,
          });
          expect(compared.recovery.recovered!.value).toBeGreaterThan(0);

          const original = await trx('bench_sheet_originals').where({ build_id: buildId }).first();
          for (const key of [original.original_key, original.web_key, original.thumb_key])
            expect(fs.existsSync(path.join(dir, key))).toBe(true);
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
