import { aspirationLabels, powerBasisLabels } from '@shared/builds/vocabulary';
import type { Build } from '@shared/schemas/builds';
import { formatNumber } from '@shared/format';

/** "2019 one-ton crew cab", or the description alone when no year was given. */
export function vehicleLine(build: Pick<Build, 'vehicleYear' | 'vehicleDescription'>): string {
  return [build.vehicleYear ?? '', build.vehicleDescription ?? ''].join(' ').trim();
}

/** "750 crank hp" */
export function powerText(hp: number, basis: Build['targetPowerBasis']): string {
  return `${formatNumber(hp, 1)} ${powerBasisLabels[basis] ?? basis}`;
}

/** "6.7 L · 6 cyl · Single turbo" — the engine facts that were filled in. */
export function engineFacts(build: Build): string {
  return [
    build.displacementLiters != null ? `${formatNumber(build.displacementLiters, 2)} L` : null,
    `${build.cylinders} cyl`,
    aspirationLabels[build.aspiration] ?? build.aspiration,
  ]
    .filter(Boolean)
    .join(' · ');
}
