import type { Knex } from 'knex';

// A member's choices of which notices to receive on a build. No row means the
// default (on); leaving the build removes the choices with the membership.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('notice_preferences', (t) => {
    t.uuid('build_id').notNullable();
    t.uuid('user_id').notNullable();
    t.text('kind').notNullable();
    t.boolean('enabled').notNullable();
    t.timestamps(true, true);
    t.primary(['build_id', 'user_id', 'kind']);
    t.foreign(['build_id', 'user_id'])
      .references(['build_id', 'user_id'])
      .inTable('build_members')
      .onDelete('CASCADE');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('notice_preferences');
}
