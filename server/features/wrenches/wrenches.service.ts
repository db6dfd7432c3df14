/**
 * Torque wrenches: each person keeps their own list, with the date each was last
 * calibrated. They are nobody else's business, so they live under /api/me, and a reading
 * may only name a wrench of the person recording it.
 */
import type { Knex } from 'knex';
import { calibrationOn, type Calibration } from '@shared/install-log/wrenches';
import type { CreateWrenchInput, UpdateWrenchInput } from '@shared/schemas/wrenches';
import { ConflictError, NotFoundError, ValidationError } from '@server/lib/errors';
import { parseId } from '@server/lib/scope';
import * as repo from './wrenches.repository';

const nameTaken = () =>
  new ConflictError('wrench_name_taken', 'You already have a wrench with that name', {
    name: 'You already have a wrench with that name: give this one its own',
  });

function isNameConflict(err: unknown) {
  const e = err as { code?: string; constraint?: string };
  return e.code === '23505' && e.constraint === 'torque_wrenches_user_name';
}

export const list = (knex: Knex, userId: string) => repo.listWrenches(knex, userId);

export async function create(knex: Knex, userId: string, input: CreateWrenchInput) {
  try {
    return await repo.insertWrench(knex, userId, {
      name: input.name,
      calibratedOn: input.calibratedOn ?? null,
    });
  } catch (err) {
    if (isNameConflict(err)) throw nameTaken();
    throw err;
  }
}

async function own(knex: Knex, userId: string, rawId: string) {
  const wrench = await repo.findWrench(knex, userId, parseId(rawId, 'Wrench'));
  // Another person's wrench is as unknown as one that does not exist.
  if (!wrench) throw new NotFoundError('Wrench not found');
  return wrench;
}

export async function update(knex: Knex, userId: string, rawId: string, input: UpdateWrenchInput) {
  const wrench = await own(knex, userId, rawId);
  try {
    await repo.updateWrench(knex, wrench.id, input);
  } catch (err) {
    if (isNameConflict(err)) throw nameTaken();
    throw err;
  }
  return (await repo.findWrench(knex, userId, wrench.id))!;
}

/** Readings taken with it keep its name and calibration; they only lose the link to it. */
export async function remove(knex: Knex, userId: string, rawId: string) {
  const wrench = await own(knex, userId, rawId);
  await repo.deleteWrench(knex, wrench.id);
}

/**
 * The wrench a reading names, with its calibration on `on` under the build's interval.
 * Only the person's own wrenches: anything else is a 400 on the field, not a 404 of the reading.
 */
export async function wrenchForReading(
  knex: Knex,
  p: { buildId: string; userId: string; wrenchId: string; on: string },
): Promise<{ id: string; name: string } & Calibration> {
  const wrench = await repo.findWrench(knex, p.userId, p.wrenchId);
  if (!wrench) {
    throw new ValidationError('That wrench is not one of yours', {
      wrenchId: 'Choose one of your wrenches, or add it first',
    });
  }
  const months = await repo.buildCalibrationMonths(knex, p.buildId);
  return { id: wrench.id, name: wrench.name, ...calibrationOn(wrench.calibratedOn, months, p.on) };
}
