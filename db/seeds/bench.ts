/**
 * The demo build's bench results: the injector set out at the invented shop
 * "Ridgeback Fuel Lab" has two sheets entered by the shop. "As received" shows
 * the stock cores with one worn injector (number 3: about 2.2 × the others'
 * return flow, and low at full load); "After rebuild" shows the set with new
 * nozzles, matched within about 0.5 % at full load. Every number is invented
 * for the demo. The first sheet carries its "original": a drawing of a paper
 * sheet made here with sharp.
 */
import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import sharp from 'sharp';
import { createBenchSheetInputSchema } from '@shared/schemas/bench';
import * as bench from '@server/features/bench/bench.repository';
import { processPhoto } from '@server/features/photos/photos.images';
import type { Storage } from '@server/lib/storage';

type Ids = { buildId: string; userIds: Record<string, string>; day: (offset: number) => string };

const conditions = {
  full: '1,600 bar, 1,800 µs',
  part: '1,000 bar, 900 µs',
  idle: '350 bar, 500 µs',
  pilot: '800 bar, 180 µs',
  back: 'measured during the full-load test',
};

function points(values: {
  full: number[];
  part: number[];
  idle: number[];
  pilot: number[];
  back: number[];
  fullNominal?: number;
}) {
  const flow = 'mm3-per-stroke' as const;
  return [
    {
      kind: 'full-load' as const,
      label: 'Full load',
      unit: flow,
      condition: conditions.full,
      nominal: values.fullNominal ?? null,
      tolerance: { type: 'percent' as const, value: 1 },
      values: values.full,
    },
    {
      kind: 'part-load' as const,
      label: 'Part load',
      unit: flow,
      condition: conditions.part,
      tolerance: { type: 'percent' as const, value: 1.5 },
      values: values.part,
    },
    {
      kind: 'idle' as const,
      label: 'Idle',
      unit: flow,
      condition: conditions.idle,
      tolerance: { type: 'absolute' as const, value: 0.5 },
      values: values.idle,
    },
    {
      kind: 'pilot' as const,
      label: 'Pilot',
      unit: flow,
      condition: conditions.pilot,
      tolerance: { type: 'absolute' as const, value: 0.3 },
      values: values.pilot,
    },
    {
      kind: 'return-flow' as const,
      label: 'Return flow',
      unit: flow,
      condition: conditions.back,
      tolerance: { type: 'absolute' as const, value: 2 },
      returnLimit: 20,
      values: values.back,
    },
  ];
}

const asReceived = {
  full: [92.2, 91.9, 89.4, 92.3, 91.8, 92.1, 92.0, 91.7],
  part: [38.2, 38.0, 37.6, 38.3, 38.1, 38.2, 37.9, 38.0],
  idle: [6.1, 6.2, 5.9, 6.0, 6.2, 6.0, 6.3, 6.1],
  pilot: [1.6, 1.5, 1.4, 1.6, 1.6, 1.5, 1.6, 1.5],
  back: [14.2, 15.1, 31.8, 13.9, 14.6, 15.4, 14.0, 14.8],
};

const afterRebuild = {
  full: [249.1, 250.3, 248.7, 251.0, 249.8, 250.6, 248.9, 250.2],
  fullNominal: 250,
  part: [104.2, 104.8, 103.9, 105.1, 104.5, 104.0, 104.6, 104.3],
  idle: [7.1, 7.0, 7.2, 6.9, 7.1, 7.0, 7.2, 7.1],
  pilot: [1.8, 1.9, 1.8, 1.8, 1.9, 1.7, 1.8, 1.9],
  back: [12.6, 12.9, 13.1, 12.4, 12.8, 13.0, 12.7, 12.5],
};

/** A drawing of the shop's printed sheet, legible at full size: a heading and the values. */
function paperSheet(testedOn: string) {
  const rows = asReceived.full.map((_, i) =>
    [
      i + 1,
      asReceived.full[i],
      asReceived.part[i],
      asReceived.idle[i],
      asReceived.pilot[i],
      asReceived.back[i],
    ]
      .map((v, c) => `<text x="${90 + c * 190}" y="${420 + i * 64}">${v}</text>`)
      .join(''),
  );
  const heads = ['Inj.', 'Full', 'Part', 'Idle', 'Pilot', 'Return']
    .map((h, c) => `<text x="${90 + c * 190}" y="350" font-weight="bold">${h}</text>`)
    .join('');
  return Buffer.from(
    `<svg xmlns="http://www.w3.org/2000/svg" width="1300" height="1000">
      <rect width="1300" height="1000" fill="#f3efe4"/>
      <g font-family="DejaVu Sans Mono, Liberation Mono, monospace" fill="#23262b" font-size="34">
        <text x="90" y="110" font-size="46" font-weight="bold">RIDGEBACK FUEL LAB — FLOW TEST</text>
        <text x="90" y="170">Set of 8, as received · ${testedOn}</text>
        <text x="90" y="220">ISO 4113 fluid at 40 °C · mm³/stroke</text>
        <text x="90" y="270">Return flow measured during the full-load test</text>
        <line x1="80" y1="375" x2="1220" y2="375" stroke="#23262b" stroke-width="3"/>
        ${heads}${rows.join('')}
        <text x="90" y="960" font-size="30">Inj. 3: high leak-off — replace body. Signed: bench 2</text>
      </g>
    </svg>`,
  );
}

export async function seedBench(knex: Knex, { buildId, userIds, day }: Ids, storage: Storage) {
  const shop = userIds.shop;
  const part = (await knex('parts')
    .where({ build_id: buildId, category: 'fuel-injection', shop_user_id: shop })
    .first('id')) as { id: string };

  const sheet = async (fields: Record<string, unknown>, created: string) => {
    const input = createBenchSheetInputSchema.parse({
      partId: part.id,
      testedBy: 'Ridgeback Fuel Lab, bench 2',
      fluid: 'Calibration fluid to ISO 4113',
      fluidTemperature: { value: 40, unit: 'c' },
      ...fields,
    });
    const id = await bench.insertSheet(knex, buildId, input, { userId: shop, shopUserId: shop });
    await bench.replacePoints(knex, id, input.points);
    const at = new Date(`${created}T16:30:00Z`);
    await knex('bench_sheets').where({ id }).update({ created_at: at, updated_at: at });
    return id;
  };

  const received = await sheet(
    {
      occasion: 'As received',
      testedOn: day(-18),
      notes:
        'Cores as they came out of the truck. Injector 3 leaks off about twice the others and falls short at full load: its body is replaced with the new nozzles.',
      points: points(asReceived),
    },
    day(-18),
  );
  await sheet(
    {
      occasion: 'After rebuild',
      testedOn: day(-4),
      notes: 'New nozzles in all eight, injector 3 with a new body. Matched at full load.',
      points: points(afterRebuild),
    },
    day(-4),
  );

  const png = await sharp(paperSheet(day(-18)))
    .png()
    .toBuffer();
  const processed = await processPhoto(png, 'as-received.png', png.length);
  const id = randomUUID();
  const prefix = `builds/${buildId}/bench/${received}/${id}`;
  await storage.put(`${prefix}/original.png`, png, 'image/png');
  await storage.put(`${prefix}/web.jpg`, processed.web.data, 'image/jpeg');
  await storage.put(`${prefix}/thumb.jpg`, processed.thumb.data, 'image/jpeg');
  await bench.replaceOriginal(knex, {
    id,
    buildId,
    sheetId: received,
    fileName: 'ridgeback-flow-test-as-received.png',
    format: 'png',
    contentType: 'image/png',
    bytes: png.length,
    width: processed.width,
    height: processed.height,
    originalKey: `${prefix}/original.png`,
    webKey: `${prefix}/web.jpg`,
    thumbKey: `${prefix}/thumb.jpg`,
    uploadedBy: shop,
  });
  const at = new Date(`${day(-18)}T16:40:00Z`);
  await knex('bench_sheet_originals').where({ id }).update({ created_at: at, updated_at: at });
}
