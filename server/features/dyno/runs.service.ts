/**
 * Runs (pulls) of a dyno session. Every figure is stored as measured, in its
 * own units; a correction is applied only when a run is read. A curve comes
 * typed in, or from a CSV checked row by row before anything is saved, and
 * goes back out as CSV marked uncorrected, so re-importing it never corrects
 * twice. A run may carry one attachment: the dyno's own file or a photo of
 * its printout, checked by content.
 */
import { randomUUID } from 'node:crypto';
import path from 'node:path';
import {
  correctRunFor,
  curveToCsv,
  runContext,
  runPeaks,
  withCurveBoost,
  type CurveCsvUnits,
} from '@shared/dyno';
import {
  createDynoRunInputSchema,
  defaultRunUnits,
  importDynoRunFieldsSchema,
  mixtureKindLabels,
  type CorrectionChoice,
  type DynoRun,
  type DynoRunInput,
  type RunUnits,
  type UpdateDynoRunInput,
} from '@shared/schemas/dyno';
import {
  convertPower,
  convertPressure,
  convertTemperature,
  convertTorque,
} from '@shared/units/convert';
import {
  AppError,
  ConflictError,
  NotFoundError,
  ValidationError,
  fieldsFromZod,
} from '@server/lib/errors';
import type { Logger } from '@server/lib/logger';
import type { BuildScope } from '@server/lib/scope';
import type { Storage } from '@server/lib/storage';
import { assertNoNul } from '@server/middleware/validate';
import * as files from '@server/features/files';
import { loadRun, loadSession } from './access';
import { checkAttachment } from './attachments';
import { readCurveCsv } from './curve-csv';
import { loadPlan } from './plan';
import * as repo from './runs.repository';
import * as sessionsRepo from './sessions.repository';

export type Store = { storage: Storage; logger: Logger };
export type UploadedFile = { buffer: Buffer; originalname: string; mimetype: string };

/** A checked run as its stored columns. */
function valuesFrom(input: DynoRunInput): repo.RunValues {
  return {
    status: input.status,
    abortReason: input.status === 'aborted' ? (input.abortReason ?? null) : null,
    gear: input.gear ?? '',
    tuneRevision: input.tuneRevision ?? '',
    notes: input.notes ?? '',
    powerUnit: input.powerUnit,
    torqueUnit: input.torqueUnit,
    boostUnit: input.boostUnit,
    egtUnit: input.egtUnit,
    mixtureKind: input.mixtureKind,
    peakPower: input.peakPower ?? null,
    peakPowerRpm: input.peakPowerRpm ?? null,
    peakTorque: input.peakTorque ?? null,
    peakTorqueRpm: input.peakTorqueRpm ?? null,
    boost: input.boost ?? null,
    egt: input.egt ?? null,
    mixture: input.mixture ?? null,
    weather: input.weather ?? null,
    curve: input.curve ?? [],
  };
}

/** A stored run in the shape the create schema checks, to merge an edit onto and check whole. */
function fieldsOf(run: DynoRun) {
  return {
    status: run.status,
    abortReason: run.abortReason,
    gear: run.gear,
    tuneRevision: run.tuneRevision,
    notes: run.notes,
    powerUnit: run.powerUnit,
    torqueUnit: run.torqueUnit,
    boostUnit: run.boostUnit,
    egtUnit: run.egtUnit,
    mixtureKind: run.mixtureKind,
    peakPower: run.peakPower,
    peakPowerRpm: run.peakPowerRpm,
    peakTorque: run.peakTorque,
    peakTorqueRpm: run.peakTorqueRpm,
    boost: run.boost,
    egt: run.egt,
    mixture: run.mixture,
    weather: run.weather,
    curve: run.curve.length ? run.curve : null,
  };
}

/** Parses a whole run, turning zod's issues into the 400 with one message per field. */
function checkWhole(candidate: unknown): DynoRunInput {
  const parsed = createDynoRunInputSchema.safeParse(candidate);
  if (!parsed.success) {
    throw new ValidationError('Some fields need attention', fieldsFromZod(parsed.error));
  }
  return parsed.data;
}

async function findPresented(scope: BuildScope, runId: string) {
  const run = await repo.findRun(scope.knex, scope.buildId, runId);
  if (!run) throw new NotFoundError('Run not found');
  return repo.present(run);
}

/** Inserts a run under its session's lock, with the next pull number. */
async function insert(scope: BuildScope, sessionId: string, values: repo.RunValues) {
  return scope.knex.transaction(async (trx) => {
    if (!(await sessionsRepo.lockSession(trx, sessionId))) {
      throw new NotFoundError('Dyno session not found');
    }
    const runNumber = await repo.nextRunNumber(trx, sessionId);
    return repo.insertRun(trx, scope.buildId, sessionId, runNumber, values, scope.caller.userId);
  });
}

/** Writes a run's new values, or 404 when it was deleted meanwhile. */
async function save(scope: BuildScope, runId: string, values: repo.RunValues) {
  await scope.knex.transaction(async (trx) => {
    if (!(await repo.lockRun(trx, runId))) throw new NotFoundError('Run not found');
    await repo.updateRun(trx, runId, values);
  });
}

export async function createRun(scope: BuildScope, rawSessionId: string, input: DynoRunInput) {
  const session = await loadSession(scope, rawSessionId);
  const id = await insert(scope, session.id, valuesFrom(input));
  return { run: await findPresented(scope, id) };
}

/** A run as stored, its session, and the run corrected under `choice` (curve included). */
export async function getRun(scope: BuildScope, rawRunId: string, choice: CorrectionChoice) {
  const { run, session } = await loadRun(scope, rawRunId);
  const plan = await loadPlan(scope);
  const shown = repo.present(run);
  return {
    run: shown,
    session,
    plan,
    corrected: correctRunFor(withCurveBoost(shown), choice, runContext(session, plan)),
  };
}

/** An edit merged onto the stored run and checked whole; `weather` and `curve` are replaced whole. */
export async function updateRun(scope: BuildScope, rawRunId: string, input: UpdateDynoRunInput) {
  const { run } = await loadRun(scope, rawRunId);
  const merged = { ...fieldsOf(run), ...input };
  // Marking a run complete drops the reason it was stopped, unless a reason is sent with it.
  if (input.status === 'complete' && input.abortReason === undefined) merged.abortReason = null;
  await save(scope, run.id, valuesFrom(checkWhole(merged)));
  return { run: await findPresented(scope, run.id) };
}

export async function deleteRun(scope: BuildScope, store: Store, rawRunId: string) {
  const { run } = await loadRun(scope, rawRunId);
  await repo.deleteRun(scope.knex, run.id);
  await files.purgeSoon({ knex: scope.knex, ...store });
}

// ---------------------------------------------------------------- CSV

type Quantity = 'power' | 'torque' | 'boost' | 'egt' | 'mixture';
const unitKeys = {
  power: 'powerUnit',
  torque: 'torqueUnit',
  boost: 'boostUnit',
  egt: 'egtUnit',
  mixture: 'mixtureKind',
} as const satisfies Record<Quantity, keyof RunUnits & keyof CurveCsvUnits>;

/** What a dry run answers: the units the file gave, how many rows, whether they were sorted, the peaks. */
function preview(input: DynoRunInput, reordered: boolean) {
  return {
    units: {
      powerUnit: input.powerUnit,
      torqueUnit: input.torqueUnit,
      boostUnit: input.boostUnit,
      egtUnit: input.egtUnit,
      mixtureKind: input.mixtureKind,
    },
    rowCount: input.curve?.length ?? 0,
    reordered,
    peaks: runPeaks(input),
  };
}

function parseRunField(raw: unknown): unknown {
  if (raw === undefined || raw === '') return {};
  if (typeof raw !== 'string') {
    throw new ValidationError('Send the run’s fields once, as JSON', {
      run: 'Send one JSON object',
    });
  }
  try {
    return JSON.parse(raw);
  } catch {
    throw new ValidationError('The run’s fields are not valid JSON', {
      run: 'Send the run’s fields as a JSON object',
    });
  }
}

/**
 * A new run from a curve CSV and the fields sent beside it (`run`, JSON). The
 * file's columns decide the units; a unit sent beside it must agree. With
 * dryRun nothing is saved and the answer says what would be.
 */
export async function importRun(
  scope: BuildScope,
  rawSessionId: string,
  file: Buffer,
  rawFields: unknown,
  dryRun: boolean,
) {
  const session = await loadSession(scope, rawSessionId);
  const fieldsJson = parseRunField(rawFields);
  assertNoNul(fieldsJson);
  const parsedFields = importDynoRunFieldsSchema.safeParse(fieldsJson);
  if (!parsedFields.success) {
    throw new ValidationError('Some fields need attention', fieldsFromZod(parsedFields.error));
  }
  const fields = parsedFields.data;
  const csv = readCurveCsv(file);
  const conflicts: Record<string, string> = {};
  const units = { ...defaultRunUnits };
  for (const q of Object.keys(unitKeys) as Quantity[]) {
    const key = unitKeys[q];
    const fromFile = csv.units[key];
    const sent = fields[key];
    if (fromFile && sent && fromFile !== sent) {
      conflicts[key] = `The file's ${q} column is in ${fromFile}, not ${sent}`;
    }
    Object.assign(units, { [key]: fromFile ?? sent ?? defaultRunUnits[key] });
  }
  if (Object.keys(conflicts).length) {
    throw new ValidationError('The units sent do not match the file’s columns', conflicts);
  }
  const input = checkWhole({
    ...fields,
    status: fields.status ?? 'complete',
    ...units,
    curve: csv.rows,
  });
  if (dryRun) return { dryRun: true as const, preview: preview(input, csv.reordered) };
  const id = await insert(scope, session.id, valuesFrom(input));
  return { dryRun: false as const, run: await findPresented(scope, id), reordered: csv.reordered };
}

/**
 * A run's figures in the units a new curve file uses: typed-in peaks, boost
 * and EGT are converted (NIST SP 811 factors); a mixture written the other way
 * (AFR against λ) is not guessed at — the owner changes it first.
 */
function adoptUnits(run: DynoRun, file: CurveCsvUnits) {
  const next = fieldsOf(run);
  if (file.powerUnit && file.powerUnit !== run.powerUnit) {
    const to = file.powerUnit;
    next.peakPower = run.peakPower == null ? null : convertPower(run.peakPower, run.powerUnit, to);
    next.powerUnit = to;
  }
  if (file.torqueUnit && file.torqueUnit !== run.torqueUnit) {
    const to = file.torqueUnit;
    next.peakTorque =
      run.peakTorque == null ? null : convertTorque(run.peakTorque, run.torqueUnit, to);
    next.torqueUnit = to;
  }
  if (file.boostUnit && file.boostUnit !== run.boostUnit) {
    const to = file.boostUnit;
    next.boost = run.boost == null ? null : convertPressure(run.boost, run.boostUnit, to);
    next.boostUnit = to;
  }
  if (file.egtUnit && file.egtUnit !== run.egtUnit) {
    const to = file.egtUnit;
    next.egt = run.egt == null ? null : convertTemperature(run.egt, run.egtUnit, to);
    next.egtUnit = to;
  }
  if (file.mixtureKind && file.mixtureKind !== run.mixtureKind) {
    if (run.mixture != null) {
      throw new ValidationError('The file writes the mixture another way', {
        file: `This run's mixture is written as ${mixtureKindLabels[run.mixtureKind].toLowerCase()} and the file's as ${mixtureKindLabels[file.mixtureKind].toLowerCase()}: change the run's mixture first, or export the file the same way`,
      });
    }
    next.mixtureKind = file.mixtureKind;
  }
  return next;
}

/** Replaces a run's curve with a CSV's (the run takes the file's units). dryRun: check only. */
export async function replaceCurve(
  scope: BuildScope,
  rawRunId: string,
  file: Buffer,
  dryRun: boolean,
) {
  const { run } = await loadRun(scope, rawRunId);
  const csv = readCurveCsv(file);
  const input = checkWhole({ ...adoptUnits(repo.present(run), csv.units), curve: csv.rows });
  if (dryRun) return { dryRun: true as const, preview: preview(input, csv.reordered) };
  await save(scope, run.id, valuesFrom(input));
  return {
    dryRun: false as const,
    run: await findPresented(scope, run.id),
    reordered: csv.reordered,
  };
}

/** The curve as measured, as CSV marked uncorrected (see shared/dyno/csv.ts). */
export async function exportCurve(scope: BuildScope, rawRunId: string) {
  const { run, session } = await loadRun(scope, rawRunId);
  if (run.curve.length === 0) {
    throw new ConflictError('no_curve', 'This run has no curve to export');
  }
  return {
    fileName: `dyno-${session.date}-run-${run.runNumber}-uncorrected.csv`,
    csv: curveToCsv(run.curve, run),
  };
}

// ---------------------------------------------------------------- attachment

/** A name for a download: the file's own, without folders or control characters. */
function cleanName(name: string, extension: string) {
  const base = path
    .basename(name.replace(/\\/g, '/'))
    // eslint-disable-next-line no-control-regex
    .replace(/[\u0000-\u001F\u007F]/g, '')
    .trim();
  const cut = base.slice(0, 200);
  return cut || `dyno-file.${extension}`;
}

/** Stores a checked attachment and puts it on the run; the one it replaces is removed after. */
export async function putAttachment(
  scope: BuildScope,
  store: Store,
  rawRunId: string,
  file: UploadedFile | undefined,
) {
  const { run } = await loadRun(scope, rawRunId);
  if (!file) {
    throw new AppError(400, 'no_file', 'Attach the file in the "file" field', {
      file: 'Choose a file',
    });
  }
  const checked = await checkAttachment(file.buffer, file.originalname, file.mimetype);
  const key = `builds/${scope.buildId}/dyno-runs/${run.id}/${randomUUID()}.${checked.extension}`;
  const ctx = { knex: scope.knex, ...store };
  await store.storage.put(key, checked.data, checked.contentType);
  try {
    await scope.knex.transaction(async (trx) => {
      if (!(await repo.lockRun(trx, run.id))) throw new NotFoundError('Run not found');
      await repo.setAttachment(trx, run.id, {
        key,
        name: cleanName(file.originalname, checked.extension),
        kind: checked.kind,
        contentType: checked.contentType,
        bytes: checked.data.length,
      });
    });
  } catch (err) {
    await files.discard(ctx, [key]);
    throw err;
  }
  await files.purgeSoon(ctx);
  return { run: await findPresented(scope, run.id) };
}

export async function getAttachment(scope: BuildScope, rawRunId: string) {
  const { run } = await loadRun(scope, rawRunId);
  if (!run.attachmentKey || !run.attachment) {
    throw new NotFoundError('This run has no attachment');
  }
  return { key: run.attachmentKey, attachment: run.attachment, runId: run.id };
}

export async function deleteAttachment(scope: BuildScope, store: Store, rawRunId: string) {
  const { run } = await loadRun(scope, rawRunId);
  if (!run.attachmentKey) throw new NotFoundError('This run has no attachment');
  await repo.setAttachment(scope.knex, run.id, null);
  await files.purgeSoon({ knex: scope.knex, ...store });
  return { run: await findPresented(scope, run.id) };
}
