/**
 * The demo scenario: an invented owner-builder, her helper, an injector shop and
 * a friend who follows along. Every person, business and place here is made up;
 * addresses use the reserved example.test domain.
 */
import type { Knex } from 'knex';
import { hashPassword } from '../../server/lib/auth';

export const demoPassword = 'headroom-demo';

export const demoAccounts = [
  { key: 'owner', email: 'owner@example.test', displayName: 'Marisol Okafor' },
  { key: 'crew', email: 'crew@example.test', displayName: 'Teddy Brandt' },
  { key: 'shop', email: 'shop@example.test', displayName: 'Ridgeback Fuel Lab' },
  { key: 'viewer', email: 'viewer@example.test', displayName: 'Jo Whitlock' },
] as const;

export async function seedDemo(knex: Knex) {
  const passwordHash = await hashPassword(demoPassword);
  const ids: Record<string, string> = {};
  for (const a of demoAccounts) {
    const [row] = await knex('users')
      .insert({ email: a.email, display_name: a.displayName, password_hash: passwordHash })
      .returning('id');
    ids[a.key] = row.id;
  }

  const [build] = await knex('builds')
    .insert({
      name: 'Gravel Hauler',
      vehicle_year: 2006,
      vehicle_description: 'Three-quarter-ton crew-cab pickup, 4×4, long bed',
      engine_description: '6.6 L V8 common-rail turbodiesel, stock bottom end',
      displacement_liters: 6.6,
      cylinders: 8,
      aspiration: 'single-turbo',
      transmission: '6-speed automatic, built, with a triple-disc torque converter',
      stock_power_hp: 360,
      stock_power_basis: 'crank',
      target_power_hp: 600,
      target_power_basis: 'wheel',
      target_torque_lbft: null,
      target_date: '2027-05-22',
      target_event: 'Coyote Flats spring dyno day',
      budget_cents: 1_850_000,
      currency: 'USD',
    })
    .returning('id');

  await knex('build_members').insert([
    { build_id: build.id, user_id: ids.owner, role: 'owner' },
    { build_id: build.id, user_id: ids.crew, role: 'crew' },
    { build_id: build.id, user_id: ids.shop, role: 'shop' },
    { build_id: build.id, user_id: ids.viewer, role: 'viewer' },
  ]);
  return { buildId: build.id as string, userIds: ids };
}
