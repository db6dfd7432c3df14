/**
 * The demo build's dyno day: an invented chassis-dyno session nine days ago,
 * three pulls on the second tune revision (the last stopped early), the
 * weather in the cell, a curve for each pull and a photo of the printout of
 * the best one. The best pull corrects to a little short of the 600 wheel hp
 * target. Every place, person and figure here is made up; the curves are
 * smooth shapes with a little ripple, not a real engine's.
 */
import type { Knex } from 'knex';
import sharp from 'sharp';
import type { CurveRow } from '@shared/schemas/dyno';
import * as runs from '@server/features/dyno/runs.repository';
import * as sessions from '@server/features/dyno/sessions.repository';
import type { Storage } from '@server/lib/storage';

type Ids = { buildId: string; userIds: Record<string, string> };

function day(offset: number) {
  const d = new Date();
  return new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth(), d.getUTCDate() + offset))
    .toISOString()
    .slice(0, 10);
}

const round = (x: number, digits: number) => Math.round(x * 10 ** digits) / 10 ** digits;

/**
 * A pull from 1600 rpm to `toRpm` in 50 rpm steps, as the dyno logs it: wheel torque
 * (lbf·ft) rising to its peak near 2300 rpm and falling away, power from
 * P = T × rpm / 5252.113122, boost (psi), EGT (°F) and air–fuel ratio.
 */
function pull(scale: number, toRpm: number, ripplePhase: number): CurveRow[] {
  const rows: CurveRow[] = [];
  for (let rpm = 1600; rpm <= toRpm; rpm += 50) {
    const ripple = 1 + 0.004 * Math.sin(rpm / 90 + ripplePhase);
    const torque = (1110 - 0.00022 * (rpm - 2300) ** 2) * scale * ripple;
    rows.push({
      rpm,
      power: round((torque * rpm) / 5252.113122, 1),
      torque: round(torque, 1),
      boost: round(Math.min(38, 18 + (rpm - 1600) / 60), 1),
      egt: Math.round(950 + (rpm - 1600) * 0.22 + (scale - 0.97) * 900),
      mixture: round(22 - (rpm - 1600) / 520, 1),
    });
  }
  return rows;
}

/** A drawing of the printout: boxes and invented numbers, no brand or layout of any real dyno. */
function printout(peakHp: number, peakLbft: number) {
  return Buffer.from(
    `<svg xmlns="http://www.w3.org/2000/svg" width="1000" height="1300">
      <rect width="1000" height="1300" fill="#f7f5ef"/>
      <text x="60" y="110" font-family="DejaVu Sans Mono, monospace" font-size="40" fill="#222">DYNO RUN SHEET — RUN 2</text>
      <text x="60" y="170" font-family="DejaVu Sans Mono, monospace" font-size="28" fill="#444">Demo printout for Headroom (invented)</text>
      <rect x="60" y="220" width="880" height="620" fill="none" stroke="#333" stroke-width="3"/>
      <path d="M80 800 C 300 420, 520 300, 700 330 S 900 420, 920 460" fill="none" stroke="#333" stroke-width="5"/>
      <path d="M80 520 C 260 300, 420 280, 600 360 S 860 560, 920 600" fill="none" stroke="#777" stroke-width="4" stroke-dasharray="14 10"/>
      <text x="60" y="920" font-family="DejaVu Sans Mono, monospace" font-size="34" fill="#222">PEAK POWER  ${peakHp.toFixed(1)} HP (WHEEL, UNCORRECTED)</text>
      <text x="60" y="980" font-family="DejaVu Sans Mono, monospace" font-size="34" fill="#222">PEAK TORQUE ${peakLbft.toFixed(1)} LB-FT</text>
      <text x="60" y="1060" font-family="DejaVu Sans Mono, monospace" font-size="28" fill="#444">AIR 78 F  BARO 29.12 INHG  RH 34 %</text>
    </svg>`,
  );
}

export async function seedDyno(knex: Knex, { buildId, userIds }: Ids, storage: Storage) {
  const { owner, crew } = userIds;
  const sessionId = await sessions.insertSession(knex, buildId, {
    date: day(-9),
    place: 'Coyote Flats Diesel, dyno cell 2',
    dynoKind: 'chassis',
    runBy: 'Dale Renfrow (operator)',
    notes:
      'Check-up day on tune revision R2 before the rebuilt injectors go in. 4th gear (1:1), lock-up on, straps checked before each pull.',
    weather: {
      temperature: 78,
      temperatureUnit: 'f',
      pressure: 29.12,
      pressureUnit: 'inhg',
      relativeHumidityPct: 34,
      dewPoint: null,
    },
    shopUserId: null,
    createdBy: owner,
  });

  const units = {
    powerUnit: 'hp',
    torqueUnit: 'lbf-ft',
    boostUnit: 'psi',
    egtUnit: 'f',
    mixtureKind: 'afr',
  } as const;
  const base = {
    ...units,
    gear: '4th',
    tuneRevision: 'R2',
    peakPower: null,
    peakPowerRpm: null,
    peakTorque: null,
    peakTorqueRpm: null,
    egt: null,
    mixture: null,
    weather: null,
  };
  const pulls: (runs.RunValues & { by: string })[] = [
    {
      ...base,
      status: 'complete',
      abortReason: null,
      notes: 'First pull of the day; converter slipped a little below 2000 rpm.',
      boost: null,
      curve: pull(0.975, 3400, 0.3),
      by: crew,
    },
    {
      ...base,
      status: 'complete',
      abortReason: null,
      notes: 'Cleanest pull. Printout photographed.',
      boost: null,
      curve: pull(1.0, 3400, 1.7),
      by: crew,
    },
    {
      ...base,
      status: 'aborted',
      abortReason: 'Operator lifted at 2,750 rpm: a rear strap shifted on the rollers.',
      notes: 'Straps re-set afterwards; no damage.',
      boost: null,
      curve: pull(0.99, 2750, 2.9),
      by: owner,
    },
  ];
  const ids: string[] = [];
  for (const [i, { by, ...values }] of pulls.entries()) {
    ids.push(await runs.insertRun(knex as Knex.Transaction, buildId, sessionId, i + 1, values, by));
  }

  // The printout of the best pull, as a photo would be kept: a JPEG without metadata.
  const best = pulls[1].curve;
  const peak = best.reduce((a, r) => ((r.power ?? 0) > (a.power ?? 0) ? r : a));
  const peakTorque = best.reduce((a, r) => ((r.torque ?? 0) > (a.torque ?? 0) ? r : a));
  const jpeg = await sharp(printout(peak.power ?? 0, peakTorque.torque ?? 0))
    .jpeg({ quality: 85 })
    .toBuffer();
  const key = `builds/${buildId}/dyno-runs/${ids[1]}/printout-demo.jpg`;
  await storage.put(key, jpeg, 'image/jpeg');
  await runs.setAttachment(knex, ids[1], {
    key,
    name: 'run-2-printout.jpg',
    kind: 'image',
    contentType: 'image/jpeg',
    bytes: jpeg.length,
  });
  return { sessionId, runIds: ids };
}
