import type { Knex } from 'knex';

// One row per build: the power estimator's assumptions as the owner saved them.
// No row means the defaults. Ranges are enforced by the shared zod schema; the
// checks here only keep physically meaningless values out.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('build_assumptions', (t) => {
    t.uuid('build_id').primary().references('builds.id').onDelete('CASCADE');
    // Stored in lb/(hp·h) whatever the owner typed; bsfc_entry_unit remembers which
    // unit to show it back in.
    t.double('bsfc_lb_per_hp_h').notNullable();
    t.text('bsfc_entry_unit').notNullable().defaultTo('lb-per-hp-h');
    t.double('afr').notNullable();
    t.double('fuel_density_kg_per_l').notNullable();
    t.double('drivetrain_loss_pct').notNullable();
    t.integer('peak_rpm').notNullable();
    t.double('tight_margin_pct').notNullable();
    t.timestamps(true, true);
  });
  await knex.raw(`alter table build_assumptions
    add constraint build_assumptions_bsfc_unit check (bsfc_entry_unit in ('lb-per-hp-h','g-per-kwh')),
    add constraint build_assumptions_positive check (
      bsfc_lb_per_hp_h > 0 and afr > 0 and fuel_density_kg_per_l > 0 and peak_rpm > 0),
    add constraint build_assumptions_percentages check (
      drivetrain_loss_pct >= 0 and drivetrain_loss_pct < 100 and tight_margin_pct >= 0)`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('build_assumptions');
}
