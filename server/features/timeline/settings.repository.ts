/** The owner's timeline settings; no row means the defaults. */
import type { Knex } from 'knex';
import { defaultBufferDays } from '@shared/schemas/timeline';

export type TimelineSettings = { bufferDays: number; stepsPerWeek: number | null };

export async function findSettings(knex: Knex, buildId: string): Promise<TimelineSettings> {
  const row: { buffer_days: number; steps_per_week: number | null } | undefined = await knex(
    'timeline_settings',
  )
    .where({ build_id: buildId })
    .first('buffer_days', 'steps_per_week');
  return {
    bufferDays: row?.buffer_days ?? defaultBufferDays,
    stepsPerWeek: row?.steps_per_week ?? null,
  };
}

/** Writes the fields given; the first save creates the row (one upsert, so two cannot collide). */
export async function saveSettings(
  knex: Knex,
  buildId: string,
  change: Partial<TimelineSettings>,
): Promise<void> {
  const row: Record<string, unknown> = {};
  if (change.bufferDays !== undefined) row.buffer_days = change.bufferDays;
  if (change.stepsPerWeek !== undefined) row.steps_per_week = change.stepsPerWeek;
  if (!Object.keys(row).length) return;
  await knex('timeline_settings')
    .insert({ build_id: buildId, ...row })
    .onConflict('build_id')
    .merge({ ...row, updated_at: knex.fn.now() });
}
