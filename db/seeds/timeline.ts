/**
 * The demo build's timeline: its time zone, a one-week buffer and the pace the
 * owner keeps in the garage, and the milestones she set on the way to the dyno
 * day. Dates are relative to the seed day, like the rest of the demo. With the
 * demo ledger this gives one real threat: the backordered intercooler, due after
 * the parts cut-off.
 */
import type { Knex } from 'knex';

export async function seedTimeline(
  knex: Knex,
  ctx: { buildId: string; userIds: Record<string, string>; day: (offset: number) => string },
) {
  const { buildId, userIds, day } = ctx;
  await knex('timeline_settings').insert({
    build_id: buildId,
    buffer_days: 7,
    steps_per_week: 3,
  });
  const milestones: [string, number, boolean][] = [
    ['Dyno slot booked at Coyote Flats', -15, true],
    ['Rebuilt injectors fitted and the engine started', 10, false],
    ['Transmission and converter back in the truck', 40, false],
    ['Turbo on, first drive with the new parts', 50, false],
    ['First street tune revision', 110, false],
    ['Final tune and a shakedown run', 150, false],
  ];
  await knex('milestones').insert(
    milestones.map(([title, offset, done]) => ({
      build_id: buildId,
      title,
      due_on: day(offset),
      done,
      created_by: userIds.owner,
    })),
  );
}
