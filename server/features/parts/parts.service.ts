import type { Knex } from 'knex';
import { can } from '@shared/permissions';
import { partTotalCents } from '@shared/ledger/cost';
import { sendOutStatus } from '@shared/ledger/send-out';
import { stampStatusDates } from '@shared/ledger/status-dates';
import { idSchema } from '@shared/schemas/common';
import {
  createPartInputSchema,
  partConsistencyIssues,
  partProgressFields,
  type CreatePartInput,
  type Part,
  type UpdatePartInput,
} from '@shared/schemas/parts';
import {
  AppError,
  ForbiddenError,
  NotFoundError,
  ValidationError,
  fieldsFromZod,
} from '@server/lib/errors';
import type { Logger } from '@server/lib/logger';
import type { Caller } from '@server/lib/scope';
import type { BuildRowJson } from '@server/lib/sessions.repository';
import type { Storage } from '@server/lib/storage';
import * as files from '@server/features/files';
import { csvFileName, parseCsv, partsToCsv } from './parts.csv';
import * as builds from '@server/features/builds';
import { notifyPartProgress } from './parts.notices';
import * as repo from './parts.repository';
import * as moneyRepo from './parts-money.repository';

export type { Caller };

/** The build's today (its time zone's date), by which parts are stamped and judged. */
const today = async (knex: Knex, buildId: string, known?: BuildRowJson) =>
  (await builds.calendar(knex, buildId, new Date(), known)).today;

/** Full part with its total and send-out state; the money filter trims it per role. */
function present(p: repo.PartRecord, now: string): Part {
  return { ...p, totalCents: partTotalCents(p), sendOut: sendOutStatus(p, now) };
}

/** A shop sees only what was sent to it; every other member sees every part. */
export function seesPart(caller: Caller, part: { shopUserId: string | null }) {
  return caller.role !== 'shop' || part.shopUserId === caller.userId;
}

/** seesPart as a query filter. */
function scope(caller: Caller) {
  return caller.role === 'shop' ? { shopUserId: caller.userId } : {};
}

/** `known`: the build's row when the access check brought it (spares the time-zone lookup). */
export async function list(knex: Knex, buildId: string, caller: Caller, known?: BuildRowJson) {
  const parts = await repo.listParts(knex, buildId, scope(caller));
  const now = await today(knex, buildId, known);
  return parts.map((p) => present(p, now));
}

/** A part the caller may see (a shop: only the parts sent to it), or 404. */
export async function getVisible(knex: Knex, buildId: string, rawPartId: string, caller: Caller) {
  const parsed = idSchema.safeParse(rawPartId);
  if (!parsed.success) throw new NotFoundError('Part not found');
  const part = await repo.findPart(knex, buildId, parsed.data);
  // Another shop's part is as invisible as a part that does not exist.
  if (!part || !seesPart(caller, part)) throw new NotFoundError('Part not found');
  return part;
}

export async function get(knex: Knex, buildId: string, rawPartId: string, caller: Caller) {
  return present(await getVisible(knex, buildId, rawPartId, caller), await today(knex, buildId));
}

async function checkShop(knex: Knex, buildId: string, shopUserId: string | null | undefined) {
  if (!shopUserId) return;
  const shops = await repo.shopMembers(knex, buildId);
  if (!shops.some((s) => s.user_id === shopUserId)) {
    throw new ValidationError('That shop is not on this build', {
      shopUserId: 'Choose a shop member of this build',
    });
  }
}

function checkConsistency(merged: Partial<CreatePartInput>) {
  const issues = partConsistencyIssues(merged);
  if (Object.keys(issues).length)
    throw new ValidationError('Some fields contradict each other', issues);
}

export async function create(knex: Knex, buildId: string, rawInput: CreatePartInput) {
  const now = await today(knex, buildId);
  const input = stampStatusDates(null, rawInput, now);
  checkConsistency(input);
  await checkShop(knex, buildId, input.shopUserId);
  const [id] = await repo.insertParts(knex, buildId, [input]);
  return present((await repo.findPart(knex, buildId, id))!, now);
}

export async function update(
  knex: Knex,
  buildId: string,
  rawPartId: string,
  caller: Caller,
  rawInput: UpdatePartInput,
) {
  const existing = await getVisible(knex, buildId, rawPartId, caller);
  if (caller.role !== 'owner') {
    const allowed: readonly string[] = partProgressFields;
    const refused = Object.keys(rawInput).filter((k) => !allowed.includes(k));
    if (refused.length) {
      throw new ForbiddenError(
        `Your role may change only a part's status and dates (not ${refused.join(', ')})`,
      );
    }
  }
  // A status change stamps its date here too, so API and CSV changes are dated like the
  // ledger's own (the stamps are dates: crew and shops may set them).
  const now = await today(knex, buildId);
  const input = stampStatusDates(existing, rawInput, now);
  checkConsistency({ ...existing, ...input });
  await checkShop(knex, buildId, input.shopUserId);
  // The change and its notices (part received, back from a shop) commit together.
  await knex.transaction(async (trx) => {
    await repo.updatePart(trx, buildId, existing.id, input);
    await notifyPartProgress(trx, buildId, existing, input, caller.userId);
  });
  return present((await repo.findPart(knex, buildId, existing.id))!, now);
}

/** The part and, by cascade, its photos; their files are queued with the rows and removed after. */
export async function remove(
  knex: Knex,
  buildId: string,
  rawPartId: string,
  caller: Caller,
  ctx: { storage: Storage; logger: Logger },
) {
  const part = await getVisible(knex, buildId, rawPartId, caller);
  await repo.deletePart(knex, buildId, part.id);
  await files.purgeSoon({ knex, ...ctx });
}

/** Every part of the build with its money, for the budget (owner only). */
export async function listAll(knex: Knex, buildId: string) {
  return repo.listParts(knex, buildId);
}

/** Every part's money, stage and dates, for the budget (owner only; the caller checks). */
export async function listMoney(knex: Knex, buildId: string) {
  return moneyRepo.listPartMoney(knex, buildId);
}

/** The ledger as a CSV file, named after the build and the day. */
export async function exportCsv(knex: Knex, buildId: string, caller: Caller) {
  const [build, parts, shops] = await Promise.all([
    builds.get(knex, buildId, caller.userId),
    repo.listParts(knex, buildId, scope(caller)),
    repo.shopMembers(knex, buildId),
  ]);
  const csv = partsToCsv(parts, {
    withMoney: can(caller.role, 'money:read'),
    shopEmails: new Map(shops.map((s) => [s.user_id, s.email])),
  });
  return { fileName: csvFileName(build.name, await today(knex, buildId)), csv };
}

export type ImportRowReport = { row: number; fields: Record<string, string> };

/**
 * Validates every row; saves all of them in one transaction, or none when any
 * row fails. With dryRun, only reports what would be saved.
 */
export async function importCsv(knex: Knex, buildId: string, buffer: Buffer, dryRun: boolean) {
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(buffer);
  } catch {
    throw new AppError(
      400,
      'not_utf8',
      'The file is not UTF-8 text. Save the CSV as UTF-8 and try again.',
    );
  }
  const shops = await repo.shopMembers(knex, buildId);
  const parsed = parseCsv(text, new Map(shops.map((s) => [s.email, s.user_id])));
  if (!parsed.ok) throw new AppError(400, 'bad_csv', parsed.message);

  const valid: CreatePartInput[] = [];
  const failures: ImportRowReport[] = [];
  const now = await today(knex, buildId);
  for (const r of parsed.rows) {
    const result = createPartInputSchema.safeParse(r.input);
    // The CSV reader's own message (it echoes the cell) wins over the schema's general one.
    const fields = {
      ...(result.success ? partConsistencyIssues(result.data) : fieldsFromZod(result.error)),
      ...r.fields,
    };
    if (Object.keys(fields).length) failures.push({ row: r.row, fields });
    else if (result.success) valid.push(stampStatusDates(null, result.data, now));
  }
  if (failures.length) {
    const err = new AppError(
      400,
      'invalid_rows',
      `${failures.length} ${failures.length === 1 ? 'row' : 'rows'} of ${parsed.rows.length} ${
        failures.length === 1 ? 'needs' : 'need'
      } fixing; nothing was saved`,
    );
    Object.assign(err, { rows: failures });
    throw err;
  }
  if (dryRun) return { saved: 0, rows: valid };
  const ids = await knex.transaction((trx) => repo.insertParts(trx, buildId, valid));
  return { saved: ids.length, rows: valid };
}
