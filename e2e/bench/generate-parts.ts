import {
  partCategories,
  partStatuses,
  ratingUnits,
  type Part,
  type PartStatus,
} from '@shared/schemas/parts';

/** A small seeded generator, so every run measures the same ledger. */
function mulberry32(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const things = [
  'Injector',
  'Head stud kit',
  'Lift pump',
  'Turbocharger',
  'Intercooler pipe',
  'Down-pipe',
  'Connecting rod',
  'Torque converter',
  'Driveshaft',
  'Coolant hose',
  'Gauge pod',
  'Fuel filter housing',
  'Valve cover gasket',
  'Transmission cooler',
  'Billet input shaft',
  'Exhaust manifold',
];
const qualifiers = [
  'stage 2',
  'billet',
  'stainless',
  'forged',
  'high-flow',
  'new',
  'rebuilt',
  '12-point',
];
const vendors = [
  'Dustline Turbo Works',
  'Quarry Road Diesel',
  'Ridgeback Fuel Lab',
  'Pinion Gap Supply',
  'Northgate Fab',
  'Tallgrass Fasteners',
  'Iron Prairie Driveline',
  'Low Sun Coolers',
];

const day = (offset: number) =>
  new Date(Date.UTC(2026, 9, 1) + offset * 86_400_000).toISOString().slice(0, 10);

/** n invented parts with the shape the API returns to an owner (money included). */
export function generateParts(n: number, seed = 42): Part[] {
  const rnd = mulberry32(seed);
  const pick = <T>(list: readonly T[]) => list[Math.floor(rnd() * list.length)];
  const parts: Part[] = [];
  for (let i = 0; i < n; i++) {
    const status: PartStatus = pick(partStatuses);
    const quantity = 1 + Math.floor(rnd() * 4);
    const unitPriceCents = Math.floor(rnd() * 400_000);
    const labourCents = rnd() < 0.3 ? Math.floor(rnd() * 100_000) : 0;
    const shippingCents = Math.floor(rnd() * 5_000);
    const taxCents = Math.floor(unitPriceCents * 0.07);
    const coreChargeCents = rnd() < 0.1 ? 50_000 : 0;
    const orderedOn = status === 'planned' ? null : day(Math.floor(rnd() * 60));
    const rated = rnd() < 0.2;
    parts.push({
      id: `00000000-0000-4000-8000-${String(i).padStart(12, '0')}`,
      buildId: '00000000-0000-4000-8000-000000000000',
      category: pick(partCategories),
      name: `${pick(things)}, ${pick(qualifiers)} #${i + 1}`,
      vendor: pick(vendors),
      partNumber: `PN-${(i * 7919) % 100000}`,
      quantity,
      status,
      shopUserId: null,
      shopName: status === 'at-shop' ? pick(vendors) : null,
      turnaroundDays: status === 'at-shop' ? 14 : null,
      unitPriceCents,
      labourCents,
      shippingCents,
      taxCents,
      coreChargeCents,
      coreRefundCents: 0,
      totalCents:
        unitPriceCents * quantity + labourCents + shippingCents + taxCents + coreChargeCents,
      orderedOn,
      expectedOn: orderedOn && rnd() < 0.5 ? day(70 + Math.floor(rnd() * 30)) : null,
      receivedOn: null,
      sentOutOn: status === 'at-shop' ? day(62) : null,
      backOn: null,
      installedOn: status === 'installed' ? day(90) : null,
      notes: rnd() < 0.2 ? 'Check fitment against the service manual before ordering.' : '',
      ratingValue: rated ? Math.round(rnd() * 1000) : null,
      ratingUnit: rated ? pick(ratingUnits) : null,
      ratingFor: rated ? "maker's rating" : '',
      sendOut: status === 'at-shop' ? { daysOut: 20, dueOn: day(76), overdue: rnd() < 0.5 } : null,
      createdAt: new Date(Date.UTC(2026, 9, 1) + i * 60_000).toISOString(),
      updatedAt: new Date(Date.UTC(2026, 9, 1) + i * 60_000).toISOString(),
    });
  }
  return parts;
}
