/**
 * The checks on a reading sent late from the offline queue: its device time, and the
 * target it was taken against.
 */
import type { Knex } from 'knex';
import { describeTarget } from '@shared/install-log/torque';
import { idempotencyKeepDays } from '@shared/schemas/idempotency';
import type { CreateReadingInput } from '@shared/schemas/install-log';
import { torqueDefiningFields } from '@shared/schemas/install-log';
import { ConflictError, ValidationError } from '@server/lib/errors';
import * as repo from './fasteners.repository';

/** How far ahead of the server's clock a device's clock may run. */
const takenAtLeewayMs = 2 * 60_000;

/** A device time for a reading sent late: not in the future, not older than a queued write may wait. */
export function checkTakenAt(raw: string | undefined): string | null {
  if (raw === undefined) return null;
  const at = Date.parse(raw);
  const now = Date.now();
  if (at > now + takenAtLeewayMs) {
    throw new ValidationError('The reading is dated in the future', {
      takenAt: "The time taken is ahead of the server's clock: check the phone's clock",
    });
  }
  if (at < now - idempotencyKeepDays * 86_400_000) {
    throw new ValidationError('The reading is too old to send', {
      takenAt: `A reading may wait at most ${idempotencyKeepDays} days to be sent; record it again`,
    });
  }
  return new Date(at).toISOString();
}

/**
 * A reading sent late was taken against the target the device showed; if the owner has
 * changed that target since, the server will not judge it against one the crew never saw.
 */
export async function checkTargetUnchanged(
  trx: Knex.Transaction,
  buildId: string,
  specId: string,
  seen: NonNullable<CreateReadingInput['expectedTarget']>,
) {
  // Read under the step's lock, which every change of a spec also takes.
  const now = (await repo.findSpec(trx, buildId, specId))!;
  const changed = torqueDefiningFields.some((k) => now[k] !== seen[k]);
  if (changed) {
    throw new ConflictError(
      'fastener_spec_changed',
      `The target of ${now.name} changed after this reading was taken (now ${describeTarget(now)}): check the spec and record the reading again`,
    );
  }
}
