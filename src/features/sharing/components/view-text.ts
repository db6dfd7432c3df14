/** Words and numbers of a shared build, rounded for reading. */
import { aspirationLabels, powerBasisLabels } from '@shared/builds/vocabulary';
import { formatIsoDate, formatNumber } from '@shared/format';
import type { BuildView, ViewDynoBest, ViewFastener } from '@shared/schemas/sharing';
import { unitLabels } from '@shared/units/labels';

type Summary = NonNullable<BuildView['summary']>;

export const basisLabel = (basis: 'crank' | 'wheel') => powerBasisLabels[basis];

/** "2006 Three-quarter-ton crew-cab pickup" */
export function vehicleLine(s: Summary): string {
  return [s.vehicleYear ?? '', s.vehicleDescription].join(' ').trim();
}

/** "6.6 L · 8 cyl · Single turbo" */
export function engineFacts(s: Summary): string {
  return [
    s.displacementLiters != null ? `${formatNumber(s.displacementLiters, 2)} L` : null,
    `${s.cylinders} cyl`,
    aspirationLabels[s.aspiration] ?? s.aspiration,
  ]
    .filter(Boolean)
    .join(' · ');
}

/** "600 wheel hp" — power is read to the whole horsepower. */
export const powerText = (hp: number, basis: 'crank' | 'wheel') =>
  `${formatNumber(hp, 0)} ${basisLabel(basis)}`;

export const dateText = (iso: string) => formatIsoDate(iso, 'en-US');

const unitLabel = (unit: string) => (unitLabels as Record<string, string>)[unit] ?? unit;

/** "512 wheel hp at 3,050 rpm" (hp keeps its basis; kW and PS say it after). */
export function dynoPower(b: ViewDynoBest): string {
  if (b.peakPower === null) return '—';
  const unit =
    b.powerUnit === 'hp' ? basisLabel(b.basis) : `${unitLabel(b.powerUnit)} (${b.basis})`;
  const rpm = b.peakPowerRpm !== null ? ` at ${formatNumber(b.peakPowerRpm, 0)} rpm` : '';
  return `${formatNumber(b.peakPower, 0)} ${unit}${rpm}`;
}

export function dynoTorque(b: ViewDynoBest): string {
  if (b.peakTorque === null) return '—';
  const rpm = b.peakTorqueRpm !== null ? ` at ${formatNumber(b.peakTorqueRpm, 0)} rpm` : '';
  return `${formatNumber(b.peakTorque, 0)} ${unitLabel(b.torqueUnit)}${rpm}`;
}

export const standardLabels: Record<string, string> = {
  uncorrected: 'uncorrected',
  'sae-j1349': 'SAE J1349',
  'ece-r85': 'ECE R85',
  'sae-j607': 'SAE J607',
  'din-70020': 'DIN 70020',
};

/** Headroom with its sign, one decimal: "+12.5 %", "−4.2 %". */
export function headroomText(pct: number): string {
  const n = formatNumber(Math.abs(pct), 1);
  if (n === '0') return '0 %';
  return `${pct < 0 ? '−' : '+'}${n} %`;
}

/** "100 lbf·ft ± 5 %" */
export const torqueSpecText = (f: ViewFastener) =>
  `${formatNumber(f.target.value, 1)} ${f.target.unit} ${f.tolerance}`;

/** "3 of 8 in spec", or "not read yet". */
export function readingsText(f: ViewFastener): string {
  if (f.recorded === 0) return 'Not read yet';
  const out =
    f.outOfSpec > 0
      ? `; ${f.outOfSpec} out of spec (${f.outOfSpecPositions.map((p) => `#${p}`).join(', ')})`
      : '';
  return `${f.inSpec} of ${f.count} in spec${out}`;
}

export const percent = (part: number, whole: number) =>
  whole > 0 ? Math.floor((part / whole) * 100) : 0;

export const stepStatusLabels = {
  'not-started': 'Not started',
  'under-way': 'Under way',
  'signed-off': 'Signed off',
} as const;

export const roleNames: Record<string, string> = {
  owner: 'Owner',
  crew: 'Crew',
  shop: 'Shop',
  viewer: 'Follower',
};
