/**
 * Wheel and crank power. A chassis dyno measures at the wheels, an engine
 * dyno at the crank; between them is the drivetrain loss, a fraction of
 * crank power: wheel = crank × (1 − loss). No standard fixes the loss — about
 * 15–25 % for an automatic 4WD pickup is common practice (reference.md, "Fuel,
 * air and power") — so every conversion names the loss it used. Losses are
 * percentages here, as the estimator's `drivetrainLossPct`.
 */
import { convertPower } from '@shared/units/convert';
import type { DynoFigure, DynoPowerUnit, PowerBasis } from '@shared/schemas/dyno';
import { assertFinite, dynoFigure, fmt, step, withUnit, working } from './working';

/** A power with its unit and where it was measured or meant. */
export type PowerAt = { value: number; unit: DynoPowerUnit; basis: PowerBasis };

export const drivetrainLossSource =
  'common practice: about 15–25 % for an automatic 4WD pickup (no standard exists)';

function assertLoss(lossPct: number) {
  if (!(Number.isFinite(lossPct) && lossPct >= 0 && lossPct < 100)) {
    throw new RangeError(`drivetrainLossPct must be at least 0 and below 100 (got ${lossPct})`);
  }
}

/**
 * A power moved to another basis, in the same unit: wheel = crank × (1 − loss),
 * crank = wheel ÷ (1 − loss). The same basis comes back unchanged (loss not used).
 */
export function convertBasis(
  power: PowerAt,
  to: PowerBasis,
  drivetrainLossPct: number,
): DynoFigure {
  assertFinite('power', power.value);
  const label = to === 'crank' ? 'Crank power' : 'Wheel power';
  const input = {
    name: `${power.basis === 'crank' ? 'Crank' : 'Wheel'} power`,
    value: power.value,
    unit: power.unit,
    from: 'figure' as const,
  };
  if (power.basis === to) {
    return dynoFigure(label, power.value, power.unit, working(`${to} power as given`, [input]));
  }
  assertLoss(drivetrainLossPct);
  const keep = 1 - drivetrainLossPct / 100;
  const value = to === 'wheel' ? power.value * keep : power.value / keep;
  const lossInput = {
    name: 'Drivetrain loss',
    value: drivetrainLossPct,
    unit: '%',
    from: 'assumption' as const,
    ref: 'drivetrainLossPct',
  };
  return dynoFigure(
    label,
    value,
    power.unit,
    working(
      to === 'wheel'
        ? 'wheel = crank × (1 − loss), loss as a fraction of crank power'
        : 'crank = wheel ÷ (1 − loss), loss as a fraction of crank power',
      [input, lossInput],
      [
        {
          name: 'Drivetrain loss',
          value: drivetrainLossPct,
          unit: '%',
          source: drivetrainLossSource,
        },
      ],
      [
        step(
          label,
          to === 'wheel'
            ? `${withUnit(power.value, power.unit)} × (1 − ${fmt(drivetrainLossPct)} %) = ${withUnit(value, power.unit)}`
            : `${withUnit(power.value, power.unit)} ÷ (1 − ${fmt(drivetrainLossPct)} %) = ${withUnit(value, power.unit)}`,
          value,
          power.unit,
        ),
      ],
    ),
  );
}

/**
 * The drivetrain loss a crank figure and a wheel figure imply:
 * loss = 1 − wheel ÷ crank, as a percentage. Both should be corrected the same
 * way (and ideally from the same day). A negative loss means the wheel figure
 * is above the crank figure — they cannot both be right — and `message` says so.
 */
export function impliedDrivetrainLoss(
  crank: { value: number; unit: DynoPowerUnit },
  wheel: { value: number; unit: DynoPowerUnit },
): { loss: DynoFigure; message: string | null } {
  assertFinite('crank power', crank.value, { positive: true });
  assertFinite('wheel power', wheel.value);
  const wheelInCrankUnit = convertPower(wheel.value, wheel.unit, crank.unit);
  const lossPct = (1 - wheelInCrankUnit / crank.value) * 100;
  const steps = [];
  if (wheel.unit !== crank.unit) {
    steps.push(
      step(
        `Wheel power in ${crank.unit}`,
        `${withUnit(wheel.value, wheel.unit)} = ${withUnit(wheelInCrankUnit, crank.unit)}`,
        wheelInCrankUnit,
        crank.unit,
      ),
    );
  }
  steps.push(
    step(
      'Drivetrain loss',
      `(1 − ${fmt(wheelInCrankUnit)} ÷ ${fmt(crank.value)}) × 100 = ${fmt(lossPct)} %`,
      lossPct,
      '%',
    ),
  );
  return {
    loss: dynoFigure(
      'Drivetrain loss implied by the crank and wheel figures',
      lossPct,
      '%',
      working(
        'loss = 1 − wheel ÷ crank',
        [
          { name: 'Crank power', value: crank.value, unit: crank.unit, from: 'figure' },
          { name: 'Wheel power', value: wheel.value, unit: wheel.unit, from: 'figure' },
        ],
        [],
        steps,
      ),
    ),
    message:
      lossPct < 0
        ? 'The wheel figure is higher than the crank figure, so they cannot both be right: check they were corrected the same way and measure the same engine.'
        : null,
  };
}
