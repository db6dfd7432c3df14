import type { Knex } from 'knex';

/**
 * The cautions a step's author ticked (high-pressure fuel, lifting, critical fastener), as
 * a JSON list of caution ids. Null means nobody has chosen yet: the step then shows the
 * cautions suggested by its linked parts and its words, as before.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('install_steps', (t) => {
    t.jsonb('caution_ids');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('install_steps', (t) => {
    t.dropColumn('caution_ids');
  });
}
