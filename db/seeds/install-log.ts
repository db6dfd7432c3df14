/**
 * The demo build's install log and photo log. Two jobs that agree with the demo
 * ledger: the down-pipe and EGT probe went on about 80 days ago (done, with a
 * re-torque check still open), and the injector job is under way while the
 * injectors are out at the shop (the stock ones came out as cores).
 *
 * Every torque value here is an invented demo number entered "by the owner";
 * each spec's source says so. Real values come from the maker's service
 * information only. Photos are drawings made here with sharp: shapes and a
 * caption, no vehicles, brands or people.
 */
import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import sharp from 'sharp';
import { processPhoto } from '@server/features/photos/photos.images';
import { insertPhotos, type NewPhoto } from '@server/features/photos/photos.repository';
import type { Storage } from '@server/lib/storage';
import { calibrationDueOn, defaultCalibrationMonths } from '@shared/install-log/wrenches';

const demoSource = (section: string) =>
  `Maker's service manual, ${section} — owner's entry. Demo values only: use your own service information.`;

/** The demo truck's eight cylinders, as the crew names a fastener's positions. */
const cylinders = Array.from({ length: 8 }, (_, i) => `Cyl ${i + 1}`);

/** A calendar date `days` days from today (UTC), YYYY-MM-DD. */
function day(days: number) {
  return new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
}

/** A timestamp `days` days from now at a garage hour (UTC). */
function at(days: number, hour: number, minute = 0) {
  const d = new Date();
  return new Date(
    Date.UTC(d.getUTCFullYear(), d.getUTCMonth(), d.getUTCDate() + days, hour, minute),
  );
}

/** A simple drawing for a step photo: a bench, a part outline, a caption. */
function drawing(title: string, shape: 'bore' | 'pipe' | 'probe' | 'injector', color: string) {
  const shapes = {
    bore: '<circle cx="600" cy="430" r="190" fill="#3b3f45"/><circle cx="600" cy="430" r="120" fill="#9aa3ad"/><circle cx="600" cy="430" r="55" fill="#20242a"/>',
    pipe: '<path d="M250 300 h380 a160 160 0 0 1 160 160 v200" stroke="#9aa3ad" stroke-width="110" fill="none"/><rect x="200" y="230" width="70" height="140" rx="12" fill="#6b7480"/>',
    probe:
      '<rect x="330" y="400" width="520" height="46" rx="23" fill="#9aa3ad"/><rect x="820" y="370" width="110" height="106" rx="10" fill="#6b7480"/><path d="M930 423 C1030 423 1030 600 1100 600" stroke="#d9a441" stroke-width="14" fill="none"/>',
    injector:
      '<rect x="540" y="180" width="120" height="400" rx="30" fill="#9aa3ad"/><rect x="575" y="580" width="50" height="120" fill="#6b7480"/><rect x="520" y="250" width="160" height="40" fill="#d9a441"/>',
  };
  return Buffer.from(
    `<svg xmlns="http://www.w3.org/2000/svg" width="1200" height="900">
      <rect width="1200" height="900" fill="${color}"/>
      <rect y="720" width="1200" height="180" fill="#2b2f36"/>
      ${shapes[shape]}
      <text x="60" y="830" font-family="DejaVu Sans, Liberation Sans, sans-serif" font-size="54" fill="#f4f1ea">${title}</text>
    </svg>`,
  );
}

type Ids = { buildId: string; userIds: Record<string, string> };

export async function seedInstallLog(knex: Knex, { buildId, userIds }: Ids, storage: Storage) {
  const { owner, crew } = userIds;
  const partId = async (name: string) =>
    ((await knex('parts').where({ build_id: buildId, name }).first('id')) as { id: string }).id;
  const injectors = await partId('Injectors, new nozzles, flowed and matched (set of 8)');
  const lines = await partId('Injector line set, high-pressure, new');
  const seals = await partId('Injector seal and crush washer kit');
  const downPipe = await partId('Down-pipe, 4 in. stainless');
  const egt = await partId('Exhaust gas temperature probe and gauge');

  const job = async (position: number, title: string, notes: string, created: Date) =>
    (
      (await knex('install_jobs')
        .insert({
          build_id: buildId,
          position,
          title,
          notes,
          created_by: owner,
          created_at: created,
          updated_at: created,
        })
        .returning('id')) as { id: string }[]
    )[0].id;

  type StepSeed = {
    title: string;
    description: string;
    parts: string[];
    liftsVehicle?: boolean;
    /** The cautions the author ticked; left out, the step shows the suggested ones. */
    cautions?: string[];
    /** An override: the owner signed off over the unticked checks, giving this reason. */
    signedOff?: { by: string; at: Date; overrideReason?: string };
    underWay?: boolean;
    checklist: [string, Date | null][];
  };
  const step = async (jobId: string, position: number, s: StepSeed) => {
    const [row] = (await knex('install_steps')
      .insert({
        build_id: buildId,
        job_id: jobId,
        position,
        title: s.title,
        description: s.description,
        lifts_vehicle: s.liftsVehicle ?? false,
        caution_ids: s.cautions ? JSON.stringify(s.cautions) : null,
        status: s.signedOff ? 'signed-off' : s.underWay ? 'under-way' : 'not-started',
        signed_off_by: s.signedOff?.by ?? null,
        signed_off_at: s.signedOff?.at ?? null,
        override_reason: s.signedOff?.overrideReason ?? null,
      })
      .returning('id')) as { id: string }[];
    if (s.parts.length)
      await knex('install_step_parts').insert(
        s.parts.map((part_id) => ({ step_id: row.id, part_id })),
      );
    if (s.checklist.length) {
      const items = (await knex('install_checklist_items')
        .insert(
          s.checklist.map(([label, done], i) => ({
            step_id: row.id,
            position: i + 1,
            label,
            done_by: done ? crew : null,
            done_at: done,
          })),
        )
        .returning(['id', 'label', 'done_at'])) as { id: string; label: string; done_at: Date }[];
      if (s.signedOff?.overrideReason) {
        // What the sign-off overrode, as the sign-off route records it.
        const blockers = items
          .filter((i) => !i.done_at)
          .map((i) => ({
            kind: 'unticked',
            itemId: i.id,
            label: i.label,
            message: `Not ticked: ${i.label}`,
          }));
        await knex('install_steps')
          .where({ id: row.id })
          .update({ override_blockers: JSON.stringify(blockers) });
      }
    }
    return row.id;
  };

  type SpecSeed = {
    name: string;
    count: number;
    target: [number, 'lbf-ft' | 'lbf-in' | 'n-m'];
    tolerance: ['value' | 'percent', number];
    stages?: number[];
    finalAngleDeg?: number;
    thread: 'dry' | 'oiled' | 'anti-seize' | 'sealant';
    sequence?: string;
    /** "Cyl 1" … when the positions have names. */
    positionNames?: string[];
    source: string;
    retorqueHeatCycles?: number;
  };
  const spec = async (stepId: string, position: number, s: SpecSeed) =>
    (
      (await knex('fastener_specs')
        .insert({
          step_id: stepId,
          position,
          name: s.name,
          count: s.count,
          target_value: s.target[0],
          target_unit: s.target[1],
          tolerance_type: s.tolerance[0],
          tolerance_value: s.tolerance[1],
          stages: JSON.stringify(s.stages ?? []),
          final_angle_deg: s.finalAngleDeg ?? null,
          thread_condition: s.thread,
          sequence_note: s.sequence ?? '',
          position_names: JSON.stringify(s.positionNames ?? []),
          spec_source: s.source,
          retorque_after_heat_cycles: s.retorqueHeatCycles ?? null,
        })
        .returning('id')) as { id: string }[]
    )[0].id;

  // Teddy's wrenches, each with the date it was last calibrated. The small one is past the
  // usual 12 months, so the readings taken with it show the calibration warning.
  const wrenches = [
    { user_id: crew, name: '3/8 in. click wrench, 10–80 lbf·ft', calibrated_on: day(-240) },
    { user_id: crew, name: '1/4 in. click wrench, 2–25 N·m', calibrated_on: day(-460) },
  ];
  // The dates as written, not as read back: a connection without the server's DATE parser
  // (the e2e demo's) returns Date objects.
  const wrenchRows = (
    (await knex('torque_wrenches').insert(wrenches).returning(['id', 'name'])) as {
      id: string;
      name: string;
    }[]
  ).map((w) => ({ ...w, calibrated_on: wrenches.find((x) => x.name === w.name)!.calibrated_on }));
  const wrenchByName = new Map(wrenchRows.map((w) => [w.name, w]));
  /** Calibration due after the build's default interval. */
  const dueAfterYear = (date: string) => calibrationDueOn(date, defaultCalibrationMonths);

  /** Readings in order; a later one for the same position, kind and stage supersedes the earlier. */
  const readings = async (
    specId: string,
    list: {
      position: number;
      value: number;
      unit: string;
      at: Date;
      wrench: string;
      note?: string;
      kind?: 'retorque';
      stage?: number;
    }[],
  ) => {
    const current = new Map<string, { id: string }>();
    for (const r of list) {
      const key = `${r.kind ?? 'install'}:${r.position}:${r.stage ?? 0}`;
      const w = wrenchByName.get(r.wrench);
      const previous = current.get(key);
      if (previous)
        await knex('torque_readings').where({ id: previous.id }).update({ superseded_at: r.at });
      const [row] = (await knex('torque_readings')
        .insert({
          spec_id: specId,
          position: r.position,
          kind: r.kind ?? 'install',
          value: r.value,
          unit: r.unit,
          stage: r.stage ?? null,
          wrench: r.wrench,
          wrench_id: w?.id ?? null,
          wrench_calibrated_on: w?.calibrated_on ?? null,
          wrench_calibration_due_on: w ? dueAfterYear(w.calibrated_on) : null,
          note: r.note ?? '',
          recorded_by: crew,
          recorded_at: r.at,
        })
        .returning('id')) as { id: string }[];
      if (previous)
        await knex('torque_readings')
          .where({ id: previous.id })
          .update({ superseded_by_id: row.id });
      current.set(key, row);
    }
  };

  // ---- Job 1: done about 80 days ago ------------------------------------------------
  const exhaust = await job(
    1,
    'Fit the down-pipe and EGT probe',
    'Done over one weekend. Re-check the clamps after a few heat cycles.',
    at(-82, 15),
  );
  await step(exhaust, 1, {
    title: 'Raise the truck and set it on stands',
    description:
      'Front on rated stands under the frame rails, rear wheels chocked. Shake-test before going under.',
    parts: [],
    liftsVehicle: true,
    cautions: ['lifting'],
    signedOff: { by: crew, at: at(-80, 9, 10) },
    checklist: [
      ['Stands rated for the truck, on level concrete', at(-80, 9, 0)],
      ['Rear wheels chocked both sides', at(-80, 9, 2)],
      ['Shake-tested before going under', at(-80, 9, 5)],
    ],
  });
  const pipeStep = await step(exhaust, 2, {
    title: 'Fit the down-pipe',
    description:
      'Anti-seize on the flange studs. V-band clamp snug first, then the flange, then final torque on the clamp.',
    parts: [downPipe],
    signedOff: { by: crew, at: at(-80, 12, 40) },
    checklist: [
      ['Old gasket out, faces cleaned', at(-80, 10, 15)],
      ['New gasket fitted', at(-80, 10, 30)],
      ['Clearance to the steering shaft checked', at(-80, 12, 20)],
    ],
  });
  const vband = await spec(pipeStep, 1, {
    name: 'Turbo outlet V-band clamp',
    count: 1,
    target: [11, 'n-m'],
    tolerance: ['percent', 10],
    thread: 'anti-seize',
    sequence: 'Tap round the clamp with a soft mallet between passes.',
    source: demoSource('exhaust system, turbocharger outlet'),
    retorqueHeatCycles: 3,
  });
  const flange = await spec(pipeStep, 2, {
    name: 'Down-pipe flange nuts',
    count: 3,
    target: [30, 'lbf-ft'],
    tolerance: ['value', 2],
    stages: [15],
    thread: 'anti-seize',
    sequence: 'Cross pattern, all to stage 1 first.',
    source: demoSource('exhaust system, down-pipe'),
    retorqueHeatCycles: 3,
  });
  const wrench = '3/8 in. click wrench, 10–80 lbf·ft';
  await readings(vband, [
    {
      position: 1,
      value: 11.2,
      unit: 'n-m',
      at: at(-80, 12, 5),
      wrench: '1/4 in. click wrench, 2–25 N·m',
    },
    {
      position: 1,
      value: 11.0,
      unit: 'n-m',
      at: at(-52, 17, 30),
      wrench: '1/4 in. click wrench, 2–25 N·m',
      kind: 'retorque',
      note: 'After 4 heat cycles',
    },
  ]);
  await readings(flange, [
    { position: 1, value: 15, unit: 'lbf-ft', at: at(-80, 11, 40), wrench, stage: 1 },
    { position: 2, value: 15.5, unit: 'lbf-ft', at: at(-80, 11, 42), wrench, stage: 1 },
    { position: 3, value: 14.5, unit: 'lbf-ft', at: at(-80, 11, 44), wrench, stage: 1 },
    { position: 1, value: 30, unit: 'lbf-ft', at: at(-80, 11, 50), wrench },
    // Teddy's first pass on #2 clicked early; the correction supersedes it.
    { position: 2, value: 26, unit: 'lbf-ft', at: at(-80, 11, 52), wrench },
    { position: 3, value: 31, unit: 'lbf-ft', at: at(-80, 11, 54), wrench },
    {
      position: 2,
      value: 30.5,
      unit: 'lbf-ft',
      at: at(-80, 12, 1),
      wrench,
      note: 'Re-done: the wrench was still set to stage 1',
    },
  ]);
  const probeStep = await step(exhaust, 3, {
    title: 'Fit the EGT probe before the turbo',
    description: 'Probe tip centered in the gas flow. Route the lead clear of the manifold.',
    parts: [egt],
    signedOff: { by: crew, at: at(-80, 14, 10) },
    checklist: [
      ['Bung thread chased and clean', at(-80, 13, 20)],
      ['Lead tied back, 2 in. from hot parts', at(-80, 14, 0)],
    ],
  });
  const probe = await spec(probeStep, 1, {
    name: 'EGT probe compression nut',
    count: 1,
    target: [180, 'lbf-in'],
    tolerance: ['percent', 10],
    thread: 'anti-seize',
    source: demoSource("gauge maker's fitting instructions"),
  });
  // Read with a metric wrench: 20.5 N·m is 181.4 lbf·in.
  await readings(probe, [
    {
      position: 1,
      value: 20.5,
      unit: 'n-m',
      at: at(-80, 13, 45),
      wrench: '1/4 in. click wrench, 2–25 N·m',
    },
  ]);

  // ---- Job 2: under way while the injectors are at the shop --------------------------
  const inj = await job(
    2,
    'Fit the rebuilt injectors',
    'Stock injectors went to Ridgeback as cores. Fit the set as soon as it is back.',
    at(-22, 18),
  );
  const pull = await step(inj, 1, {
    title: 'Relieve rail pressure and pull the stock injectors',
    description:
      'Engine cold. Relieve pressure before opening any line. Cap every bore and line straight away.',
    parts: [injectors],
    cautions: ['high-pressure-fuel'],
    // Marisol signed this one off with a check still open, and said why.
    signedOff: {
      by: owner,
      at: at(-21, 16, 30),
      overrideReason:
        "The shop photographed each injector's cylinder tag at intake; their photos stand in for ours.",
    },
    checklist: [
      ['Engine cold, batteries disconnected', at(-21, 9, 0)],
      ['Rail pressure relieved as the service manual says', at(-21, 9, 15)],
      ['Bores and lines capped', at(-21, 15, 50)],
      ['Injectors bagged and labelled by cylinder for the shop', at(-21, 16, 20)],
      ["Photo of each injector's cylinder tag", null],
    ],
  });
  const bores = await step(inj, 2, {
    title: 'Clean the injector bores and fit new seals',
    description: 'Bore brush and lint-free swabs only. No compressed air into open bores.',
    parts: [seals],
    underWay: true,
    checklist: [
      ['Old copper washers out — all 8 counted', at(-20, 10, 0)],
      ['Bores cleaned and inspected', at(-20, 11, 30)],
      ['New seals lubricated as the service manual says', null],
    ],
  });
  const seat = await step(inj, 3, {
    title: 'Seat the injectors and torque the hold-downs',
    description: "Match each injector to its cylinder from the shop's bench sheet.",
    parts: [injectors, seals],
    checklist: [
      ['Injector fitted to the cylinder the bench sheet gives', null],
      ['New crush washer on every injector', null],
    ],
  });
  await spec(seat, 1, {
    name: 'Injector hold-down bolts',
    count: 8,
    target: [37, 'lbf-ft'],
    tolerance: ['value', 2],
    stages: [10],
    thread: 'oiled',
    sequence: 'Each injector: stage 1, then final, before the line goes on.',
    positionNames: cylinders,
    source: demoSource('fuel system, injector installation'),
  });
  const hp = await step(inj, 4, {
    title: 'Fit the high-pressure lines and prime',
    description:
      'New lines only. Prime with the lift pump and check for leaks with a card, never a hand.',
    parts: [lines],
    checklist: [
      ['Line ends inspected, caps off just before fitting', null],
      ['Leak check with a card at idle', null],
    ],
  });
  await spec(hp, 1, {
    name: 'High-pressure line nuts, injector end',
    count: 8,
    target: [40, 'n-m'],
    tolerance: ['percent', 5],
    thread: 'dry',
    sequence: 'Start by hand; a cross-threaded nut is a new line.',
    positionNames: cylinders,
    source: demoSource('fuel system, high-pressure lines'),
    retorqueHeatCycles: 1,
  });

  // ---- Photos: drawn here, processed and stored like an upload ------------------------
  const photos: { stepId: string; caption: string; svg: Buffer; at: Date }[] = [
    {
      stepId: pipeStep,
      caption: 'Step 2: down-pipe fitted, clamp at the turbo',
      svg: drawing('Step 2: down-pipe fitted', 'pipe', '#4d6b7a'),
      at: at(-80, 12, 45),
    },
    {
      stepId: probeStep,
      caption: 'Probe in, lead tied back',
      svg: drawing('Step 3: EGT probe in', 'probe', '#5b5a7a'),
      at: at(-80, 14, 12),
    },
    {
      stepId: pull,
      caption: 'Bores capped after the injectors came out',
      svg: drawing('Step 1: bores capped', 'bore', '#6a5a4a'),
      at: at(-21, 16, 0),
    },
    {
      stepId: bores,
      caption: 'Cylinder 3 bore after cleaning',
      svg: drawing('Step 2: bore cleaned', 'bore', '#3f6a55'),
      at: at(-20, 11, 40),
    },
    {
      stepId: seat,
      caption: 'How the injector sits in the bore (sketch)',
      svg: drawing('Step 3: injector seated', 'injector', '#6a4a5a'),
      at: at(-20, 12, 0),
    },
  ];
  const rows: (NewPhoto & { at: Date })[] = [];
  for (const p of photos) {
    const png = await sharp(p.svg).png().toBuffer();
    const processed = await processPhoto(png, 'drawing.png', png.length);
    const id = randomUUID();
    const prefix = `builds/${buildId}/photos/${id}`;
    await storage.put(`${prefix}/web.jpg`, processed.web.data, processed.contentType);
    await storage.put(`${prefix}/thumb.jpg`, processed.thumb.data, processed.contentType);
    rows.push({
      id,
      buildId,
      stepId: p.stepId,
      partId: null,
      caption: p.caption,
      originalFormat: processed.format,
      originalWidth: processed.width,
      originalHeight: processed.height,
      originalBytes: processed.bytes,
      contentType: processed.contentType,
      webKey: `${prefix}/web.jpg`,
      webWidth: processed.web.width,
      webHeight: processed.web.height,
      thumbKey: `${prefix}/thumb.jpg`,
      thumbWidth: processed.thumb.width,
      thumbHeight: processed.thumb.height,
      uploadedBy: crew,
      at: p.at,
    });
  }
  await insertPhotos(knex, rows);
  for (const r of rows)
    await knex('photos').where({ id: r.id }).update({ created_at: r.at, updated_at: r.at });
  return { jobIds: [exhaust, inj], photoKeys: rows.flatMap((r) => [r.webKey, r.thumbKey]) };
}
