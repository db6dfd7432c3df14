/**
 * Bench results: injector flow-bench sheets of a build's fuel-injection parts,
 * judged, compared and costed by shared/bench (the same functions the client
 * previews with; this is the authority).
 *
 * Who sees what: every member reads the build's sheets, except a shop, which
 * sees only the sheets it entered, of parts that are sent to it — before and
 * after the part comes back. Owner: every sheet. Crew adds and edits sheets but
 * never a shop's own. A shop adds, edits and deletes its sheets. A sheet of
 * something a caller may not see does not exist for them (404).
 */
import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import {
  analyseBenchSheet,
  benchValuesToCsv,
  compareBenchSheets,
  imbalanceCost,
  imbalanceCostRecovered,
  parseBenchCsv,
  type BenchCellError,
} from '@shared/bench';
import { canChangeBenchSheet, canDeleteBenchSheet } from '@shared/permissions';
import {
  benchCylinderIssues,
  type BenchComparisonAnswer,
  type BenchImportRowError,
  type BenchOriginal,
  type BenchPowerTarget,
  type BenchSheet,
  type BenchSheetAnswer,
  type BenchSheetSummary,
  type CreateBenchSheetInput,
  type TestPoint,
  type UpdateBenchSheetInput,
} from '@shared/schemas/bench';
import { partCategoryLabels } from '@shared/schemas/parts';
import { AppError, ForbiddenError, NotFoundError, ValidationError } from '@server/lib/errors';
import type { Logger } from '@server/lib/logger';
import { parseId, type Caller } from '@server/lib/scope';
import type { Storage } from '@server/lib/storage';
import * as builds from '@server/features/builds';
import * as storedFiles from '@server/features/files';
import * as parts from '@server/features/parts';
import { notifyShopSheetChange, type SheetChange } from './bench.notices';
import { cleanFileName, processOriginal, type UploadedFile } from './bench.originals';
import * as repo from './bench.repository';

export type { Caller, UploadedFile };
export type Ctx = { knex: Knex; storage: Storage; logger: Logger };

// ---------------------------------------------------------------- the build and the part

type BuildFacts = { cylinders: number; target: BenchPowerTarget };

async function buildFacts(knex: Knex, buildId: string, caller: Caller): Promise<BuildFacts> {
  const build = await builds.get(knex, buildId, caller.userId);
  return {
    cylinders: build.cylinders,
    target: { powerHp: build.targetPowerHp, basis: build.targetPowerBasis },
  };
}

/**
 * The injector set a sheet is about: a fuel-injection part of this build the
 * caller may see (a shop: one sent to it). Anything else is a 400 on partId;
 * a part the caller may not see reads exactly like one that does not exist.
 */
async function injectorPart(knex: Knex, buildId: string, partId: string, caller: Caller) {
  let part: parts.PartRecord;
  try {
    part = await parts.getVisible(knex, buildId, partId, caller);
  } catch (err) {
    if (!(err instanceof NotFoundError)) throw err;
    throw new ValidationError('Choose the injector set the sheet is for', {
      partId:
        caller.role === 'shop'
          ? 'Choose an injector set sent to your shop'
          : 'Choose an injector set of this build',
    });
  }
  if (part.category !== 'fuel-injection') {
    throw new ValidationError('Bench sheets are for injector sets', {
      partId: `Bench sheets are for fuel-injection parts; “${part.name}” is filed under ${partCategoryLabels[part.category]}`,
    });
  }
  return part;
}

function checkCylinders(
  points: readonly { values: readonly (number | null)[] }[],
  cylinders: number,
) {
  const issues = benchCylinderIssues(points, cylinders);
  if (!issues.length) return;
  const fields: Record<string, string> = Object.create(null);
  for (const issue of issues) fields[issue.path.join('.')] ??= issue.message;
  throw new ValidationError('Some values are beyond the build’s cylinders', fields);
}

// ---------------------------------------------------------------- what leaves the server

const apiBase = (buildId: string, sheetId: string) =>
  `/api/builds/${buildId}/bench-sheets/${sheetId}/original`;

function presentOriginal(o: repo.OriginalRecord, buildId: string): BenchOriginal {
  const base = apiBase(buildId, o.sheetId);
  return {
    id: o.id,
    fileName: o.fileName,
    format: o.format,
    contentType: o.contentType,
    bytes: o.bytes,
    width: o.width,
    height: o.height,
    url: base,
    webUrl: o.webKey ? `${base}/web` : null,
    thumbUrl: o.thumbKey ? `${base}/thumb` : null,
    uploadedBy: o.uploadedBy,
    createdAt: o.createdAt,
  };
}

/** Positions judged: the build's cylinders, or more when a stored value sits beyond them. */
function positionsOf(sheet: { points: readonly TestPoint[] }, cylinders: number) {
  return Math.max(cylinders, ...sheet.points.map((p) => p.values.length));
}

function padded(points: readonly TestPoint[], n: number): TestPoint[] {
  return points.map((p) => ({
    ...p,
    values: Array.from({ length: n }, (_, i) => p.values[i] ?? null),
  }));
}

function presentSheet(s: repo.SheetRecord, cylinders: number): BenchSheet {
  return {
    id: s.id,
    buildId: s.buildId,
    partId: s.partId,
    partName: s.partName,
    occasion: s.occasion,
    testedOn: s.testedOn,
    testedBy: s.testedBy,
    fluid: s.fluid,
    fluidTemperature: s.fluidTemperature,
    notes: s.notes,
    points: padded(s.points, positionsOf(s, cylinders)),
    shopUserId: s.shopUserId,
    enteredBy: s.enteredBy,
    updatedBy: s.updatedBy,
    original: s.original ? presentOriginal(s.original, s.buildId) : null,
    createdAt: s.createdAt,
    updatedAt: s.updatedAt,
  };
}

function answer(s: repo.SheetRecord, facts: BuildFacts): BenchSheetAnswer {
  const cylinders = positionsOf(s, facts.cylinders);
  const sheet = presentSheet(s, facts.cylinders);
  return {
    sheet,
    cylinders,
    result: analyseBenchSheet(sheet, { cylinders }),
    imbalance: imbalanceCost(sheet, facts.target, { cylinders }),
    target: facts.target,
  };
}

function summary(s: repo.SheetRecord, cylinders: number): BenchSheetSummary {
  const { points, notes: _notes, ...rest } = presentSheet(s, cylinders);
  const result = analyseBenchSheet({ points }, { cylinders: positionsOf(s, cylinders) });
  return { ...rest, pointCount: points.length, status: result.status, verdict: result.verdict };
}

// ---------------------------------------------------------------- reading

/** A sheet the caller may see, or 404. */
async function loadVisible(knex: Knex, buildId: string, rawSheetId: string, caller: Caller) {
  const sheet = await repo.findSheet(knex, buildId, parseId(rawSheetId, 'Bench sheet'));
  const hidden =
    !sheet ||
    (caller.role === 'shop' &&
      (sheet.shopUserId !== caller.userId || sheet.partShopUserId !== caller.userId));
  if (hidden) throw new NotFoundError('Bench sheet not found');
  return sheet;
}

function assertMayChange(sheet: repo.SheetRecord, caller: Caller) {
  if (!canChangeBenchSheet(caller.role, caller.userId, sheet)) {
    throw new ForbiddenError(
      'A shop’s bench sheet is changed only by that shop or the owner: it is the shop’s record of its work',
    );
  }
}

function assertMayDelete(sheet: repo.SheetRecord, caller: Caller) {
  if (!canDeleteBenchSheet(caller.role, caller.userId, sheet)) {
    throw new ForbiddenError('Only the owner, or the shop that entered it, deletes a bench sheet');
  }
}

export async function list(
  knex: Knex,
  buildId: string,
  caller: Caller,
  filter: { partId?: string },
): Promise<BenchSheetSummary[]> {
  const facts = await buildFacts(knex, buildId, caller);
  const sheets = await repo.listSheets(knex, buildId, {
    partId: filter.partId,
    shopUserId: caller.role === 'shop' ? caller.userId : undefined,
  });
  return sheets.map((s) => summary(s, facts.cylinders));
}

export async function get(knex: Knex, buildId: string, rawSheetId: string, caller: Caller) {
  const sheet = await loadVisible(knex, buildId, rawSheetId, caller);
  return answer(sheet, await buildFacts(knex, buildId, caller));
}

/** Two sheets of one part side by side: each injector's change, the balance, the power won back. */
export async function compare(
  knex: Knex,
  buildId: string,
  caller: Caller,
  ids: { before: string; after: string },
): Promise<BenchComparisonAnswer> {
  const before = await loadVisible(knex, buildId, ids.before, caller);
  const after = await loadVisible(knex, buildId, ids.after, caller);
  if (before.partId !== after.partId) {
    throw new ValidationError('Only two sheets of the same injector set can be compared', {
      after: `Choose a sheet of “${before.partName}”`,
    });
  }
  const facts = await buildFacts(knex, buildId, caller);
  const cylinders = Math.max(
    positionsOf(before, facts.cylinders),
    positionsOf(after, facts.cylinders),
  );
  const b = padded(before.points, cylinders);
  const a = padded(after.points, cylinders);
  return {
    before: summary(before, facts.cylinders),
    after: summary(after, facts.cylinders),
    cylinders,
    comparison: compareBenchSheets({ points: b }, { points: a }, { cylinders }),
    recovery: imbalanceCostRecovered({ points: b }, { points: a }, facts.target, { cylinders }),
    target: facts.target,
  };
}

// ---------------------------------------------------------------- writing

async function notifyIfShop(
  trx: Knex,
  buildId: string,
  caller: Caller,
  change: SheetChange,
  sheetId: string,
  facts: BuildFacts,
) {
  if (caller.role !== 'shop') return;
  const sheet = await repo.findSheet(trx, buildId, sheetId);
  if (!sheet) return;
  await notifyShopSheetChange(trx, {
    buildId,
    sheet,
    change,
    actorUserId: caller.userId,
    verdict: answer(sheet, facts).result.verdict,
  });
}

export async function create(
  knex: Knex,
  buildId: string,
  caller: Caller,
  input: CreateBenchSheetInput,
): Promise<BenchSheetAnswer> {
  const facts = await buildFacts(knex, buildId, caller);
  checkCylinders(input.points, facts.cylinders);
  await injectorPart(knex, buildId, input.partId, caller);
  const id = await knex.transaction(async (trx) => {
    const sheetId = await repo.insertSheet(trx, buildId, input, {
      userId: caller.userId,
      shopUserId: caller.role === 'shop' ? caller.userId : null,
    });
    await repo.replacePoints(trx, sheetId, input.points);
    await notifyIfShop(trx, buildId, caller, 'added', sheetId, facts);
    return sheetId;
  });
  return answer((await repo.findSheet(knex, buildId, id))!, facts);
}

export async function update(
  knex: Knex,
  buildId: string,
  rawSheetId: string,
  caller: Caller,
  input: UpdateBenchSheetInput,
): Promise<BenchSheetAnswer> {
  const sheet = await loadVisible(knex, buildId, rawSheetId, caller);
  assertMayChange(sheet, caller);
  const facts = await buildFacts(knex, buildId, caller);
  if (input.points) checkCylinders(input.points, facts.cylinders);
  if (input.partId !== undefined && input.partId !== sheet.partId) {
    await injectorPart(knex, buildId, input.partId, caller);
  }
  const { points, ...fields } = input;
  await knex.transaction(async (trx) => {
    await repo.updateSheet(trx, sheet.id, fields, caller.userId);
    if (points) await repo.replacePoints(trx, sheet.id, points);
    await notifyIfShop(trx, buildId, caller, 'changed', sheet.id, facts);
  });
  return answer((await repo.findSheet(knex, buildId, sheet.id))!, facts);
}

/** The sheet, its points and its original go together; the original's files are queued with it. */
export async function remove(ctx: Ctx, buildId: string, rawSheetId: string, caller: Caller) {
  const sheet = await loadVisible(ctx.knex, buildId, rawSheetId, caller);
  assertMayDelete(sheet, caller);
  await ctx.knex.transaction(async (trx) => {
    if (caller.role === 'shop') {
      await notifyShopSheetChange(trx, {
        buildId,
        sheet,
        change: 'removed',
        actorUserId: caller.userId,
      });
    }
    await repo.deleteSheet(trx, sheet.id);
  });
  await storedFiles.purgeSoon(ctx);
}

// ---------------------------------------------------------------- CSV

export async function exportCsv(knex: Knex, buildId: string, rawSheetId: string, caller: Caller) {
  const sheet = await loadVisible(knex, buildId, rawSheetId, caller);
  const facts = await buildFacts(knex, buildId, caller);
  return {
    sheet,
    csv: benchValuesToCsv(sheet.points, positionsOf(sheet, facts.cylinders)),
  };
}

/** Refused cells as the import answers them: per row, the column's heading and the message. */
function rowsOf(errors: BenchCellError[]) {
  const fields: Record<string, string> = Object.create(null);
  const byRow = new Map<number, Record<string, string>>();
  for (const e of errors) {
    if (e.row === null) {
      fields.file ??= e.message;
      continue;
    }
    const row = byRow.get(e.row) ?? Object.create(null);
    const column = e.columnName || (e.column ? `column ${e.column}` : 'row');
    row[column] ??= e.message;
    byRow.set(e.row, row);
  }
  const rows: BenchImportRowError[] = [...byRow.entries()]
    .sort(([a], [b]) => a - b)
    .map(([row, f]) => ({ row, fields: f }));
  return { fields, rows };
}

/**
 * Replaces the values of every point of a sheet from a CSV (one row per
 * injector position, one column per point, headed by the points' labels).
 * Every cell is checked first; one bad cell and nothing is saved. With dryRun
 * the answer shows the sheet as it would be, unsaved.
 */
export async function importCsv(
  knex: Knex,
  buildId: string,
  rawSheetId: string,
  caller: Caller,
  buffer: Buffer,
  dryRun: boolean,
) {
  const sheet = await loadVisible(knex, buildId, rawSheetId, caller);
  assertMayChange(sheet, caller);
  const facts = await buildFacts(knex, buildId, caller);
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(buffer);
  } catch {
    throw new AppError(
      400,
      'not_utf8',
      'The file is not UTF-8 text. Save the CSV as UTF-8 and try again.',
      { file: 'Not UTF-8 text' },
    );
  }
  const parsed = parseBenchCsv(text, { points: sheet.points, cylinders: facts.cylinders });
  if (!parsed.ok) {
    const { fields, rows } = rowsOf(parsed.errors);
    const cells = parsed.errors.length;
    const err = new AppError(
      400,
      'invalid_csv',
      `${cells} ${cells === 1 ? 'cell needs' : 'cells need'} fixing; nothing was saved`,
      Object.keys(fields).length ? fields : undefined,
    );
    throw Object.assign(err, { rows });
  }
  const points = sheet.points.map((p, i) => ({ ...p, values: parsed.values[i]! }));
  if (dryRun) {
    return { dryRun, positions: parsed.positions, ...answer({ ...sheet, points }, facts) };
  }
  await knex.transaction(async (trx) => {
    await repo.updateSheet(trx, sheet.id, {}, caller.userId);
    await repo.replacePoints(trx, sheet.id, points);
    await notifyIfShop(trx, buildId, caller, 'changed', sheet.id, facts);
  });
  return {
    dryRun,
    positions: parsed.positions,
    ...answer((await repo.findSheet(knex, buildId, sheet.id))!, facts),
  };
}

// ---------------------------------------------------------------- the original sheet

/**
 * Attaches (or replaces) the shop's original sheet. The file is checked and
 * prepared before anything is stored; a failure part-way leaves nothing behind.
 */
export async function attachOriginal(
  ctx: Ctx,
  buildId: string,
  rawSheetId: string,
  caller: Caller,
  file: UploadedFile | undefined,
): Promise<BenchOriginal> {
  const sheet = await loadVisible(ctx.knex, buildId, rawSheetId, caller);
  assertMayChange(sheet, caller);
  if (!file) {
    throw new AppError(400, 'no_file', 'Attach the sheet as a PDF or a photo in the "file" field', {
      file: 'Choose a PDF or a photo of the sheet',
    });
  }
  const processed = await processOriginal(file);
  const id = randomUUID();
  const prefix = `builds/${buildId}/bench/${sheet.id}/${id}`;
  const row: repo.NewOriginal = {
    id,
    buildId,
    sheetId: sheet.id,
    fileName: cleanFileName(file.originalname, processed.extension),
    format: processed.format,
    contentType: processed.contentType,
    bytes: processed.original.length,
    width: processed.width,
    height: processed.height,
    originalKey: `${prefix}/original.${processed.extension}`,
    webKey: processed.web ? `${prefix}/web.jpg` : null,
    thumbKey: processed.thumb ? `${prefix}/thumb.jpg` : null,
    uploadedBy: caller.userId,
  };
  const facts = await buildFacts(ctx.knex, buildId, caller);
  const written: string[] = [];
  try {
    await ctx.storage.put(row.originalKey, processed.original, row.contentType);
    written.push(row.originalKey);
    if (row.webKey && processed.web) {
      await ctx.storage.put(row.webKey, processed.web.data, 'image/jpeg');
      written.push(row.webKey);
    }
    if (row.thumbKey && processed.thumb) {
      await ctx.storage.put(row.thumbKey, processed.thumb.data, 'image/jpeg');
      written.push(row.thumbKey);
    }
    await ctx.knex.transaction(async (trx) => {
      // The earlier original's files are queued by the trigger with its row.
      await repo.replaceOriginal(trx, row);
      await repo.touchSheet(trx, sheet.id, caller.userId);
      await notifyIfShop(trx, buildId, caller, 'original-attached', sheet.id, facts);
    });
  } catch (err) {
    await storedFiles.discard(ctx, written);
    throw err;
  }
  await storedFiles.purgeSoon(ctx);
  const stored = await repo.findSheet(ctx.knex, buildId, sheet.id);
  return presentOriginal(stored!.original!, buildId);
}

export async function removeOriginal(
  ctx: Ctx,
  buildId: string,
  rawSheetId: string,
  caller: Caller,
) {
  const sheet = await loadVisible(ctx.knex, buildId, rawSheetId, caller);
  assertMayDelete(sheet, caller);
  if (!sheet.original) throw new NotFoundError('This sheet has no original attached');
  const facts = await buildFacts(ctx.knex, buildId, caller);
  await ctx.knex.transaction(async (trx) => {
    await repo.deleteOriginal(trx, sheet.id);
    await repo.touchSheet(trx, sheet.id, caller.userId);
    await notifyIfShop(trx, buildId, caller, 'original-removed', sheet.id, facts);
  });
  await storedFiles.purgeSoon(ctx);
}

export type OriginalSize = 'original' | 'web' | 'thumb';

/** Where the original or one of its copies is kept, for the members-only download routes. */
export async function originalFile(
  knex: Knex,
  buildId: string,
  rawSheetId: string,
  caller: Caller,
  size: OriginalSize,
) {
  const sheet = await loadVisible(knex, buildId, rawSheetId, caller);
  const o = sheet.original;
  if (!o) throw new NotFoundError('This sheet has no original attached');
  const key = size === 'original' ? o.originalKey : size === 'web' ? o.webKey : o.thumbKey;
  if (!key) throw new NotFoundError('A PDF has no picture copies: download the original');
  const fileName =
    size === 'original' ? o.fileName : `${o.fileName.replace(/\.[a-z]+$/, '')}-${size}.jpg`;
  return {
    sheetId: sheet.id,
    key,
    contentType: size === 'original' ? o.contentType : 'image/jpeg',
    fileName,
  };
}
