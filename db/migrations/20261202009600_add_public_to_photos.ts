import type { Knex } from 'knex';

// A photo shows on the build's public page only when the owner marks it public; every
// photo taken before (and every new one) stays private until then.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('photos', (t) => {
    t.boolean('is_public').notNullable().defaultTo(false);
  });
  await knex.raw('create index photos_public on photos (build_id) where is_public');
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('drop index if exists photos_public');
  await knex.schema.alterTable('photos', (t) => {
    t.dropColumn('is_public');
  });
}
