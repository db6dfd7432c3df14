/**
 * The demo scenario: an invented owner-builder, her helper, an injector shop and
 * a friend who follows along. Every person, business and place here is made up;
 * addresses use the reserved example.test domain.
 */
import type { Knex } from 'knex';
import { hashPassword } from '@server/lib/auth';
import { createLocalDiskStorage, type Storage } from '@server/lib/storage';
import { seedBench } from './bench';
import { seedDyno } from './dyno';
import { seedInstallLog } from './install-log';
import { seedTimeline } from './timeline';

export const demoPassword = 'headroom-demo';

export const demoAccounts = [
  { key: 'owner', email: 'owner@example.test', displayName: 'Marisol Okafor' },
  { key: 'crew', email: 'crew@example.test', displayName: 'Teddy Brandt' },
  { key: 'shop', email: 'shop@example.test', displayName: 'Ridgeback Fuel Lab' },
  { key: 'viewer', email: 'viewer@example.test', displayName: 'Jo Whitlock' },
] as const;

/** Dates relative to the day the demo is seeded, so the scenario never goes stale. */
function day(offset: number, from = new Date()) {
  return new Date(Date.UTC(from.getUTCFullYear(), from.getUTCMonth(), from.getUTCDate() + offset))
    .toISOString()
    .slice(0, 10);
}

type DemoPart = {
  category: string;
  name: string;
  vendor?: string;
  part_number?: string;
  quantity?: number;
  status: string;
  unit_price_cents?: number;
  labour_cents?: number;
  shipping_cents?: number;
  tax_cents?: number;
  core_charge_cents?: number;
  core_refund_cents?: number;
  ordered_on?: string;
  expected_on?: string;
  received_on?: string;
  sent_out_on?: string;
  back_on?: string;
  installed_on?: string;
  turnaround_days?: number;
  shop?: boolean;
  rating_value?: number;
  rating_unit?: string;
  rating_for?: string;
  notes?: string;
};

/** The ledger of the demo build: invented vendors, believable prices, a few rated parts. */
function demoParts(): DemoPart[] {
  return [
    {
      category: 'fuel-injection',
      name: 'Injectors, new nozzles, flowed and matched (set of 8)',
      vendor: 'Ridgeback Fuel Lab',
      part_number: 'RFL-N60-M8',
      quantity: 1,
      status: 'at-shop',
      labour_cents: 96_000,
      unit_price_cents: 184_000,
      shipping_cents: 6_500,
      tax_cents: 0,
      core_charge_cents: 120_000,
      ordered_on: day(-24),
      sent_out_on: day(-20),
      turnaround_days: 21,
      shop: true,
      rating_value: 250,
      rating_unit: 'mm3-per-stroke',
      rating_for: "per injector at full rail pressure, per the shop's bench sheet",
      notes: 'Our own stock injectors sent as cores; shop fits new nozzles and matches the set.',
    },
    {
      category: 'fuel-injection',
      name: 'Injector line set, high-pressure, new',
      vendor: 'Quarry Road Diesel',
      part_number: 'QRD-HPL-8',
      status: 'in-hand',
      unit_price_cents: 38_900,
      shipping_cents: 1_800,
      tax_cents: 2_723,
      ordered_on: day(-30),
      received_on: day(-22),
    },
    {
      category: 'fuel-injection',
      name: 'Injector seal and crush washer kit',
      vendor: 'Quarry Road Diesel',
      part_number: 'QRD-SK-8',
      status: 'in-hand',
      unit_price_cents: 6_450,
      tax_cents: 452,
      ordered_on: day(-30),
      received_on: day(-22),
    },
    {
      category: 'fuel-injection',
      name: 'High-pressure pump, 12 mm stroker',
      vendor: 'Dustline Turbo Works',
      part_number: 'DTW-CP12',
      status: 'ordered',
      unit_price_cents: 214_500,
      shipping_cents: 4_500,
      tax_cents: 15_015,
      core_charge_cents: 35_000,
      ordered_on: day(-8),
      expected_on: day(12),
    },
    {
      category: 'fuel-supply',
      name: 'Lift pump, 220 L/h',
      vendor: 'Pinion Gap Supply',
      part_number: 'PGS-LP220',
      status: 'installed',
      unit_price_cents: 64_900,
      tax_cents: 4_543,
      ordered_on: day(-70),
      received_on: day(-62),
      installed_on: day(-55),
      rating_value: 220,
      rating_unit: 'l-per-h',
      rating_for: 'free flow at 12 V',
    },
    {
      category: 'fuel-supply',
      name: 'Fuel filter housing and 2 µm elements',
      vendor: 'Pinion Gap Supply',
      part_number: 'PGS-FF2',
      status: 'installed',
      unit_price_cents: 18_900,
      tax_cents: 1_323,
      ordered_on: day(-70),
      received_on: day(-62),
      installed_on: day(-55),
    },
    {
      category: 'fuel-supply',
      name: '1/2 in. suction line and fittings',
      vendor: 'Pinion Gap Supply',
      status: 'installed',
      unit_price_cents: 9_850,
      ordered_on: day(-70),
      received_on: day(-62),
      installed_on: day(-55),
    },
    {
      category: 'turbocharger',
      name: 'Drop-in turbocharger, 66 mm inducer',
      vendor: 'Dustline Turbo Works',
      part_number: 'DTW-66B',
      status: 'ordered',
      unit_price_cents: 289_000,
      shipping_cents: 9_500,
      tax_cents: 20_230,
      core_charge_cents: 50_000,
      ordered_on: day(-12),
      expected_on: day(30),
      rating_value: 105,
      rating_unit: 'lb-per-min',
      rating_for: "air flow at the compressor map's peak-efficiency island",
    },
    {
      category: 'turbocharger',
      name: 'Turbo oil feed line, braided',
      vendor: 'Dustline Turbo Works',
      status: 'ordered',
      unit_price_cents: 8_900,
      ordered_on: day(-12),
      expected_on: day(30),
    },
    {
      category: 'air-intake',
      name: 'Intake elbow, 4 in., cast',
      vendor: 'Northgate Fab',
      part_number: 'NGF-IE4',
      status: 'in-hand',
      unit_price_cents: 42_500,
      tax_cents: 2_975,
      ordered_on: day(-40),
      received_on: day(-33),
    },
    {
      category: 'air-intake',
      name: 'Intercooler pipes, 3.5 in. with clamps',
      vendor: 'Northgate Fab',
      status: 'planned',
      unit_price_cents: 54_000,
    },
    {
      // The demo's one real threat on the timeline: due two days before the dyno day.
      category: 'air-intake',
      name: 'Front-mount intercooler, bar-and-plate',
      vendor: 'Low Sun Coolers',
      part_number: 'LSC-FMIC-35',
      status: 'ordered',
      unit_price_cents: 124_900,
      shipping_cents: 8_500,
      tax_cents: 8_743,
      ordered_on: day(-5),
      expected_on: day(169),
      notes: "Backordered at the maker. The vendor's new date is two days before the dyno day.",
    },
    {
      category: 'air-intake',
      name: 'Cold-air box and filter',
      vendor: 'Northgate Fab',
      status: 'installed',
      unit_price_cents: 31_900,
      ordered_on: day(-90),
      received_on: day(-84),
      installed_on: day(-80),
    },
    {
      category: 'exhaust',
      name: 'Down-pipe, 4 in. stainless',
      vendor: 'Northgate Fab',
      status: 'installed',
      unit_price_cents: 38_500,
      ordered_on: day(-90),
      received_on: day(-84),
      installed_on: day(-80),
    },
    {
      category: 'exhaust',
      name: 'Exhaust gas temperature probe and gauge',
      vendor: 'Lantern Gauge Works',
      status: 'installed',
      unit_price_cents: 21_900,
      ordered_on: day(-90),
      received_on: day(-84),
      installed_on: day(-80),
      notes: 'Probe pre-turbo. Watch EGT on every dyno pull.',
    },
    {
      category: 'head-and-studs',
      name: 'Head studs, 12-point',
      vendor: 'Tallgrass Fasteners',
      part_number: 'TGF-HS12',
      status: 'in-hand',
      unit_price_cents: 78_500,
      tax_cents: 5_495,
      ordered_on: day(-35),
      received_on: day(-28),
      rating_value: 1000,
      rating_unit: 'hp-crank',
      rating_for: 'clamp load the maker quotes for this engine family',
    },
    {
      category: 'head-and-studs',
      name: 'Head gaskets, multi-layer steel (pair)',
      vendor: 'Tallgrass Fasteners',
      quantity: 2,
      status: 'in-hand',
      unit_price_cents: 14_900,
      tax_cents: 2_086,
      ordered_on: day(-35),
      received_on: day(-28),
    },
    {
      category: 'bottom-end',
      name: 'Stock bottom end (crank, rods, block) — as is',
      vendor: '',
      status: 'installed',
      installed_on: day(-400),
      rating_value: 760,
      rating_unit: 'hp-crank',
      rating_for: "the rebuilder's limit for stock rods at 3200 rpm",
      notes: 'No money: came with the truck. The number to beat before spending on forged rods.',
    },
    {
      category: 'bottom-end',
      name: 'Forged connecting rods (set of 8)',
      vendor: 'Sagebrush Machine & Balance',
      quantity: 1,
      status: 'planned',
      unit_price_cents: 248_000,
      labour_cents: 180_000,
      notes: 'Only if the estimate says the stock rods are the limit.',
    },
    {
      category: 'transmission',
      name: 'Transmission rebuild, billet input and intermediate shafts',
      vendor: 'Iron Prairie Driveline',
      status: 'at-shop',
      labour_cents: 320_000,
      unit_price_cents: 268_000,
      sent_out_on: day(-10),
      turnaround_days: 35,
      ordered_on: day(-10),
      rating_value: 1500,
      rating_unit: 'lbf-ft',
      rating_for: "input torque, builder's rating",
    },
    {
      category: 'transmission',
      name: 'Transmission cooler, stacked-plate',
      vendor: 'Low Sun Coolers',
      status: 'ordered',
      unit_price_cents: 29_900,
      shipping_cents: 2_500,
      ordered_on: day(-6),
      expected_on: day(4),
    },
    {
      category: 'torque-converter',
      name: 'Triple-disc torque converter, 1800 stall',
      vendor: 'Iron Prairie Driveline',
      status: 'ordered',
      unit_price_cents: 189_500,
      core_charge_cents: 30_000,
      ordered_on: day(-10),
      expected_on: day(25),
      rating_value: 1600,
      rating_unit: 'lbf-ft',
      rating_for: 'holding torque',
    },
    {
      category: 'driveline',
      name: 'Rear driveshaft, 1410 joints',
      vendor: 'Iron Prairie Driveline',
      status: 'planned',
      unit_price_cents: 86_000,
    },
    {
      category: 'driveline',
      name: 'U-joints, front shaft',
      vendor: 'Iron Prairie Driveline',
      quantity: 2,
      status: 'in-hand',
      unit_price_cents: 4_900,
      ordered_on: day(-20),
      received_on: day(-15),
    },
    {
      category: 'cooling',
      name: 'Coolant hoses, silicone set',
      vendor: 'Low Sun Coolers',
      status: 'installed',
      unit_price_cents: 24_500,
      ordered_on: day(-60),
      received_on: day(-54),
      installed_on: day(-50),
    },
    {
      category: 'cooling',
      name: 'Thermostats, 180 °F (pair)',
      vendor: 'Low Sun Coolers',
      quantity: 2,
      status: 'returned',
      unit_price_cents: 3_900,
      ordered_on: day(-60),
      received_on: day(-54),
      notes: 'Wrong flange; sent back for refund.',
    },
    {
      category: 'tuning',
      name: 'Custom tune, 3 revisions plus dyno session',
      vendor: 'Cinderline Calibration',
      status: 'planned',
      unit_price_cents: 120_000,
      labour_cents: 45_000,
    },
    {
      category: 'tuning',
      name: 'Boost and rail-pressure gauges, pillar pod',
      vendor: 'Lantern Gauge Works',
      status: 'in-hand',
      unit_price_cents: 36_800,
      tax_cents: 2_576,
      ordered_on: day(-25),
      received_on: day(-18),
    },
    {
      category: 'other',
      name: 'Valve cover gaskets and shop consumables',
      vendor: 'Quarry Road Diesel',
      status: 'in-hand',
      unit_price_cents: 11_200,
      ordered_on: day(-30),
      received_on: day(-22),
    },
    {
      category: 'other',
      name: 'Fluids: oil, coolant, transmission fluid',
      vendor: 'Quarry Road Diesel',
      status: 'planned',
      unit_price_cents: 27_500,
    },
  ];
}

/** `storage` is where demo photos go: by default the local store in STORAGE_DIR (.data/uploads). */
export async function seedDemo(knex: Knex, opts: { storage?: Storage } = {}) {
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
      target_date: day(171),
      target_event: 'Coyote Flats spring dyno day',
      budget_cents: 2_950_000,
      currency: 'USD',
      time_zone: 'America/Denver',
    })
    .returning('id');

  await knex('build_members').insert([
    { build_id: build.id, user_id: ids.owner, role: 'owner' },
    { build_id: build.id, user_id: ids.crew, role: 'crew' },
    { build_id: build.id, user_id: ids.shop, role: 'shop' },
    { build_id: build.id, user_id: ids.viewer, role: 'viewer' },
  ]);
  await knex('parts').insert(
    demoParts().map(({ shop, ...p }) => ({
      ...p,
      build_id: build.id,
      shop_user_id: shop ? ids.shop : null,
    })),
  );
  const storage =
    opts.storage ?? createLocalDiskStorage(process.env.STORAGE_DIR ?? '.data/uploads');
  await seedInstallLog(knex, { buildId: build.id, userIds: ids }, storage);
  await seedBench(knex, { buildId: build.id, userIds: ids, day }, storage);
  await seedDyno(knex, { buildId: build.id, userIds: ids }, storage);
  await seedTimeline(knex, { buildId: build.id, userIds: ids, day });
  return { buildId: build.id as string, userIds: ids };
}
