/**
 * The power estimator: from a target, the assumptions and every rated
 * component, what the target requires, each component's headroom in its own
 * unit, the weakest link, the most power the build as planned supports, and
 * warnings. Pure and synchronous: the server runs it as the authority and the
 * client runs the same function for an instant "what if".
 *
 * How ratings are read (the judgement calls, stated once):
 * - A rating is for the part as fitted: a transmission "rated 800 hp", a set of
 *   head studs, a bottom end. Quantity does not multiply power or torque
 *   ratings.
 * - `mm3-per-stroke` is per injector by definition and is compared with the
 *   delivery each injector must make per stroke, so quantity does not multiply
 *   it either (8 injectors do not make one injector 8 times larger).
 * - Flow ratings (`lb-per-min` turbocharger air, `l-per-h` / `gal-per-h` fuel
 *   supply) are per unit, and identical units listed with a quantity above 1
 *   are taken to run in parallel and share the flow: capacity = rating ×
 *   quantity (parallel twin turbos, dual lift pumps). Parts in series
 *   (compound turbos, a filter after a pump) must each pass the whole flow:
 *   list them as separate lines.
 * - `hp-wheel` ratings are compared with the target in wheel hp (crank power ×
 *   (1 − drivetrain loss)); `kw` ratings are crank kW; `hp-crank` crank hp.
 * - Torque ratings are compared with the larger of the crank torque at
 *   peak-power rpm (P × 5252.113 / rpm) and the owner's crank torque target:
 *   a part must hold both, and a torque target below the torque the power
 *   target needs at peak power does not lower what the part sees there.
 * - Headroom and shortfall share one basis, the requirement:
 *   headroom % = (capacity − requirement) ÷ requirement × 100, and a part over
 *   its rating is short by −headroom % of what the target needs.
 * - Every requirement is proportional to crank power at fixed assumptions, so
 *   the crank power a part alone supports is target crank hp × capacity ÷
 *   requirement. Where a torque target above the torque at peak power loads a
 *   torque-rated part, that figure assumes the whole torque curve scales with
 *   power, and the part's result carries a note saying so.
 * - Category does not choose the comparison; the rating unit does. Category
 *   only groups parts, names the bottom end for its warning and marks
 *   categories with no rated part as unknown.
 *
 * Fuel supply is compared with the fuel the engine burns only. A lift pump
 * also feeds the return flow (injector leak-off, the pressure regulator's
 * return to the tank), which no published figure fixes for a build; it is not
 * counted, and each fuel-supply result carries a note that says so.
 *
 * Inputs that cannot give a finite figure are refused (RangeError) or, for a
 * single part's rating, left out of the comparison with a warning, so no NaN,
 * Infinity (null in JSON) ever leaves this function.
 */
import {
  HP_TORQUE_RPM_CONSTANT,
  HP_W,
  LBF_FT_NM,
  LB_PER_HP_H_IN_G_PER_KWH,
  POUND_KG,
  US_GALLON_L,
} from '@shared/units/constants';
import { convertBsfc } from '@shared/units/convert';
import { unitLabels } from '@shared/units/labels';
import {
  STOICHIOMETRIC_AFR_DIESEL,
  assumptionSpecs,
  bsfcSpec,
  defaultBsfc,
  stoichiometricAfrSource,
} from './assumptions';
import {
  FOUR_STROKE_SECONDS_FACTOR,
  airLbPerMinFromFuelKgPerH,
  deliveryFromFuelGPerS,
  fuelKgPerHFromPowerKw,
  lambdaFromAfr,
} from './chains';
import { partCategories, type PartCategory, type RatingUnit } from '@shared/schemas/parts';
import type {
  ComponentNote,
  ComponentResult,
  EstimateComponent,
  EstimateInput,
  EstimateResult,
  EstimateWarning,
  Figure,
  HeadroomStatus,
  RequirementKey,
  WorkingConstant,
  WorkingInput,
} from '@shared/schemas/estimate';

/** Short unit labels for every unit id a figure can carry. */
export const figureUnitLabels: Record<string, string> = {
  ...unitLabels,
  ratio: ':1',
  lambda: 'λ',
  '%': '%',
  cylinders: 'cylinders',
  count: '×',
};

/** Which requirement each rating unit is compared with. */
export const requirementForUnit: Record<RatingUnit, RequirementKey> = {
  'hp-crank': 'crankPower',
  'hp-wheel': 'wheelPower',
  kw: 'crankPowerKw',
  'lbf-ft': 'crankTorque',
  'n-m': 'crankTorqueNm',
  'mm3-per-stroke': 'injectorDelivery',
  'lb-per-min': 'airMassFlow',
  'l-per-h': 'fuelVolumeFlow',
  'gal-per-h': 'fuelVolumeFlowGalPerH',
};

/** Rating units where identical units listed with a quantity share the load (see the module note). */
export const quantityMultipliedUnits: ReadonlySet<RatingUnit> = new Set([
  'lb-per-min',
  'l-per-h',
  'gal-per-h',
]);

/** Categories whose lack of a rating is reported as unknown ('other' only when it has one). */
export const estimatedCategories: readonly PartCategory[] = partCategories.filter(
  (c) => c !== 'other',
);

const constants = {
  hpW: {
    name: 'W per hp (550 ft·lbf/s)',
    value: HP_W,
    unit: 'W/hp',
    source: 'NIST SP 811 (2008) B.9, from ft = 0.3048 m, lb = 0.45359237 kg, g_n = 9.80665 m/s²',
  },
  hpTorque: {
    name: '33000 / 2π',
    value: HP_TORQUE_RPM_CONSTANT,
    unit: 'lbf·ft·rpm/hp',
    source: 'definition of power P = 2πnT/60 with 1 hp = 33 000 ft·lbf/min',
  },
  lbftNm: {
    name: 'N·m per lbf·ft',
    value: LBF_FT_NM,
    unit: 'N·m/(lbf·ft)',
    source: 'NIST SP 811 (2008) B.9, from ft = 0.3048 m, lb = 0.45359237 kg, g_n = 9.80665 m/s²',
  },
  bsfc: {
    name: 'g/kWh per lb/(hp·h)',
    value: LB_PER_HP_H_IN_G_PER_KWH,
    unit: '(g/kWh)/(lb/(hp·h))',
    source: 'derived from lb = 0.45359237 kg and hp = 745.69987 W (NIST SP 811 (2008) B.8/B.9)',
  },
  poundKg: {
    name: 'kg per lb',
    value: POUND_KG,
    unit: 'kg/lb',
    source: 'NIST SP 811 (2008) B.8 (exact)',
  },
  gallonL: {
    name: 'L per US gal',
    value: US_GALLON_L,
    unit: 'L/gal',
    source: 'NIST SP 811 (2008) B.8 (exact, 231 in³)',
  },
  fourStroke: {
    name: 'seconds per minute × revolutions per injection',
    value: FOUR_STROKE_SECONDS_FACTOR,
    unit: 's·rev/min',
    source: 'four-stroke cycle: one injection per cylinder every two revolutions (60 × 2)',
  },
  stoich: {
    name: 'stoichiometric air–fuel ratio of diesel',
    value: STOICHIOMETRIC_AFR_DIESEL,
    unit: 'ratio',
    source: stoichiometricAfrSource,
  },
} satisfies Record<string, WorkingConstant>;

function figure(
  label: string,
  value: number,
  unit: string,
  formula: string,
  inputs: WorkingInput[],
  usedConstants: WorkingConstant[] = [],
): Figure {
  return { label, value, unit, working: { formula, inputs, constants: usedConstants } };
}

function fromFigure(f: Figure, ref: string): WorkingInput {
  return { name: f.label, value: f.value, unit: f.unit, from: 'figure', ref };
}

const messageFormats = [1, 2, 3].map(
  (digits) => new Intl.NumberFormat('en-US', { maximumFractionDigits: digits }),
);

/**
 * Rounds for a sentence, digits grouped as on the pages (US English): 1,400.6, 731.7, 12.35,
 * 0.345. Figures themselves are never rounded.
 */
export function formatForMessage(x: number): string {
  const abs = Math.abs(x);
  const digits = abs >= 100 ? 1 : abs >= 1 ? 2 : 3;
  return messageFormats[digits - 1].format(x);
}

function unitText(unit: string) {
  return figureUnitLabels[unit] ?? unit;
}

function statusFor(headroomPct: number, tightMarginPct: number): HeadroomStatus {
  if (headroomPct < 0) return 'over';
  if (headroomPct < tightMarginPct) return 'tight';
  return 'ok';
}

const statusRank: Record<HeadroomStatus, number> = { over: 0, tight: 1, ok: 2 };

function assertPositiveFinite(name: string, value: number) {
  if (!Number.isFinite(value) || value <= 0) {
    throw new RangeError(`${name} must be a finite number above zero (got ${value})`);
  }
}

function assertInRange(name: string, value: number, min: number, maxExclusive: number) {
  if (!Number.isFinite(value) || value < min || value >= maxExclusive) {
    throw new RangeError(
      `${name} must be a finite number from ${min} up to ${maxExclusive} (got ${value})`,
    );
  }
}

/** Why a part's stored rating cannot be compared, or null when it can. */
function unusableRating(c: EstimateComponent): string | null {
  if (!Number.isFinite(c.ratingValue)) return 'its rating is not a number';
  if (c.ratingValue <= 0)
    return `its rating is ${formatForMessage(c.ratingValue)} ${unitText(c.ratingUnit)}`;
  if (!Number.isInteger(c.quantity) || c.quantity < 1) return `its quantity is ${c.quantity}`;
  return null;
}

/** Where the estimate's cylinder count comes from: the build (a stored build's estimate) or the request. */
export type EstimateOptions = { cylindersFrom?: 'build' | 'assumption' };

/**
 * Runs the estimate. `input` is the output of `estimateRequestSchema` (every
 * default filled in); values outside the schema's ranges still compute where
 * they can, but a target, rpm, density, BSFC, AFR or cylinder count that is not
 * a finite number above zero, a drivetrain loss outside 0–100 %, a negative or
 * non-finite torque target or tight margin throws a RangeError rather than
 * return NaN or Infinity. A torque target of 0 means none. A part whose rating
 * is not a finite number above zero (or whose quantity is not a whole number
 * from 1) is left out of the comparison and named in a `rating-unusable`
 * warning, so one bad stored rating does not stop the build's estimate.
 */
export function estimate(input: EstimateInput, options: EstimateOptions = {}): EstimateResult {
  const { target, assumptions: a } = input;
  const cylindersFrom = options.cylindersFrom ?? 'assumption';
  assertPositiveFinite('target.powerHp', target.powerHp);
  for (const key of ['bsfc', 'afr', 'fuelDensityKgPerL', 'peakRpm', 'cylinders'] as const) {
    assertPositiveFinite(`assumptions.${key}`, a[key]);
  }
  assertInRange('assumptions.drivetrainLossPct', a.drivetrainLossPct, 0, 100);
  assertInRange('assumptions.tightMarginPct', a.tightMarginPct, 0, Number.POSITIVE_INFINITY);
  const torqueInput = target.torqueLbft ?? null;
  if (torqueInput !== null)
    assertInRange('target.torqueLbft', torqueInput, 0, Number.POSITIVE_INFINITY);
  // A stored 0 is no target: it can never be the larger torque.
  const torqueTarget = torqueInput !== null && torqueInput > 0 ? torqueInput : null;

  const usable: EstimateComponent[] = [];
  const unusable: { component: EstimateComponent; why: string }[] = [];
  for (const c of input.components) {
    const why = unusableRating(c);
    if (why) unusable.push({ component: c, why });
    else usable.push(c);
  }

  const bsfcGPerKwh = convertBsfc(a.bsfc, a.bsfcUnit, 'g-per-kwh');
  const bsfcLbPerHpH = convertBsfc(a.bsfc, a.bsfcUnit, 'lb-per-hp-h');
  const keep = 1 - a.drivetrainLossPct / 100;

  // ---- inputs as they appear in the working
  const inTarget: WorkingInput = {
    name: `Target (${target.basis})`,
    value: target.powerHp,
    unit: target.basis === 'crank' ? 'hp-crank' : 'hp-wheel',
    from: 'target',
    ref: 'powerHp',
  };
  const inLoss: WorkingInput = {
    name: 'Drivetrain loss',
    value: a.drivetrainLossPct,
    unit: '%',
    from: 'assumption',
    ref: 'drivetrainLossPct',
  };
  const inRpm: WorkingInput = {
    name: 'Engine speed at peak power',
    value: a.peakRpm,
    unit: 'rpm',
    from: 'assumption',
    ref: 'peakRpm',
  };
  const inBsfc: WorkingInput = {
    name: 'Brake specific fuel consumption',
    value: a.bsfc,
    unit: a.bsfcUnit,
    from: 'assumption',
    ref: 'bsfc',
  };
  const inDensity: WorkingInput = {
    name: 'Fuel density',
    value: a.fuelDensityKgPerL,
    unit: 'kg-per-l',
    from: 'assumption',
    ref: 'fuelDensityKgPerL',
  };
  const inCyl: WorkingInput = {
    name: cylindersFrom === 'build' ? 'Cylinders (the build’s engine)' : 'Cylinders',
    value: a.cylinders,
    unit: 'cylinders',
    from: cylindersFrom,
    ref: 'cylinders',
  };
  const inAfr: WorkingInput = {
    name: 'Air–fuel ratio',
    value: a.afr,
    unit: 'ratio',
    from: 'assumption',
    ref: 'afr',
  };

  // ---- requirements at the target
  const crankHp = target.basis === 'crank' ? target.powerHp : target.powerHp / keep;
  const wheelHp = target.basis === 'wheel' ? target.powerHp : target.powerHp * keep;
  const crankPower =
    target.basis === 'crank'
      ? figure(
          'Crank power at the target',
          crankHp,
          'hp-crank',
          'crank hp = target (a crank target)',
          [inTarget],
        )
      : figure(
          'Crank power at the target',
          crankHp,
          'hp-crank',
          'crank hp = wheel hp ÷ (1 − drivetrain loss ÷ 100)',
          [inTarget, inLoss],
        );
  const wheelPower =
    target.basis === 'wheel'
      ? figure(
          'Wheel power at the target',
          wheelHp,
          'hp-wheel',
          'wheel hp = target (a wheel target)',
          [inTarget],
        )
      : figure(
          'Wheel power at the target',
          wheelHp,
          'hp-wheel',
          'wheel hp = crank hp × (1 − drivetrain loss ÷ 100)',
          [inTarget, inLoss],
        );
  const crankKw = (crankHp * HP_W) / 1000;
  const crankPowerKw = figure(
    'Crank power at the target',
    crankKw,
    'kw',
    'kW = crank hp × 745.69987 W/hp ÷ 1000',
    [fromFigure(crankPower, 'crankPower')],
    [constants.hpW],
  );
  const torqueAtPeakLbft = (crankHp * HP_TORQUE_RPM_CONSTANT) / a.peakRpm;
  const crankTorqueAtPeakPower = figure(
    'Crank torque at peak power',
    torqueAtPeakLbft,
    'lbf-ft',
    'T[lbf·ft] = crank hp × 5252.113 ÷ rpm',
    [fromFigure(crankPower, 'crankPower'), inRpm],
    [constants.hpTorque],
  );
  // The torque target governs only when it asks for more than peak power does.
  const torqueTargetGoverns = torqueTarget !== null && torqueTarget > torqueAtPeakLbft;
  const torqueLbft = torqueTargetGoverns ? torqueTarget : torqueAtPeakLbft;
  const crankTorque =
    torqueTarget === null
      ? { ...crankTorqueAtPeakPower }
      : figure(
          'Crank torque the target needs',
          torqueLbft,
          'lbf-ft',
          'crank torque = the larger of the torque target and the torque at peak power',
          [
            {
              name: 'Torque target (crank)',
              value: torqueTarget,
              unit: 'lbf-ft',
              from: 'target',
              ref: 'torqueLbft',
            },
            fromFigure(crankTorqueAtPeakPower, 'crankTorqueAtPeakPower'),
          ],
        );
  const crankTorqueNm = figure(
    crankTorque.label,
    torqueLbft * LBF_FT_NM,
    'n-m',
    'T[N·m] = T[lbf·ft] × 1.3558179',
    [fromFigure(crankTorque, 'crankTorque')],
    [constants.lbftNm],
  );
  const fuelKgPerH = fuelKgPerHFromPowerKw(crankKw, bsfcGPerKwh);
  const fuelMassFlow = figure(
    'Fuel burned at the target',
    fuelKgPerH,
    'kg-per-h',
    a.bsfcUnit === 'g-per-kwh'
      ? 'fuel[kg/h] = crank kW × BSFC[g/kWh] ÷ 1000'
      : 'fuel[kg/h] = crank kW × BSFC[lb/(hp·h)] × 608.27739 ÷ 1000',
    [fromFigure(crankPowerKw, 'crankPowerKw'), inBsfc],
    a.bsfcUnit === 'g-per-kwh' ? [] : [constants.bsfc],
  );
  const fuelLPerH = fuelKgPerH / a.fuelDensityKgPerL;
  const fuelVolumeFlow = figure(
    'Fuel burned at the target, by volume',
    fuelLPerH,
    'l-per-h',
    'fuel[L/h] = fuel[kg/h] ÷ density[kg/L] (fuel burned only; return flow to the tank not counted)',
    [fromFigure(fuelMassFlow, 'fuelMassFlow'), inDensity],
  );
  const fuelVolumeFlowGalPerH = figure(
    'Fuel burned at the target, by volume',
    fuelLPerH / US_GALLON_L,
    'gal-per-h',
    'fuel[gal/h] = fuel[L/h] ÷ 3.785411784 (fuel burned only; return flow to the tank not counted)',
    [fromFigure(fuelVolumeFlow, 'fuelVolumeFlow')],
    [constants.gallonL],
  );
  const deliveryMm3 = deliveryFromFuelGPerS(
    fuelKgPerH / 3.6,
    a.fuelDensityKgPerL,
    a.cylinders,
    a.peakRpm,
  );
  const injectorDelivery = figure(
    'Delivery per injector per stroke',
    deliveryMm3,
    'mm3-per-stroke',
    'V[mm³/stroke] = fuel[kg/h] ÷ 3.6 × 1000 ÷ density[kg/L] ÷ (cylinders × rpm ÷ 120)',
    [fromFigure(fuelMassFlow, 'fuelMassFlow'), inDensity, inCyl, inRpm],
    [constants.fourStroke],
  );
  const airLbPerMin = airLbPerMinFromFuelKgPerH(fuelKgPerH, a.afr);
  const airMassFlow = figure(
    'Turbocharger air flow at the target',
    airLbPerMin,
    'lb-per-min',
    'air[lb/min] = fuel[kg/h] × AFR ÷ 0.45359237 ÷ 60',
    [fromFigure(fuelMassFlow, 'fuelMassFlow'), inAfr],
    [constants.poundKg],
  );
  const lambda = figure(
    'Excess-air ratio λ',
    lambdaFromAfr(a.afr, STOICHIOMETRIC_AFR_DIESEL),
    'lambda',
    'λ = AFR ÷ 14.5',
    [inAfr],
    [constants.stoich],
  );
  const requirements: Record<RequirementKey, Figure> = {
    crankPower,
    wheelPower,
    crankPowerKw,
    crankTorque,
    crankTorqueNm,
    crankTorqueAtPeakPower,
    fuelMassFlow,
    fuelVolumeFlow,
    fuelVolumeFlowGalPerH,
    injectorDelivery,
    airMassFlow,
    lambda,
  };

  // ---- each component against its requirement
  const results: ComponentResult[] = usable.map((c) => {
    const key = requirementForUnit[c.ratingUnit];
    const req = requirements[key];
    const multiplies = quantityMultipliedUnits.has(c.ratingUnit) && c.quantity > 1;
    const torqueRated = key === 'crankTorque' || key === 'crankTorqueNm';
    const curveScaled = torqueRated && torqueTargetGoverns;
    const inRating: WorkingInput = {
      name: `${c.name} rating`,
      value: c.ratingValue,
      unit: c.ratingUnit,
      from: 'part',
      ref: c.id,
    };
    const capacityValue = multiplies ? c.ratingValue * c.quantity : c.ratingValue;
    const capacity = multiplies
      ? figure(
          `${c.name} capacity`,
          capacityValue,
          c.ratingUnit,
          'capacity = rating × quantity (identical units in parallel share the flow)',
          [
            inRating,
            { name: 'Quantity', value: c.quantity, unit: 'count', from: 'part', ref: c.id },
          ],
        )
      : figure(
          `${c.name} capacity`,
          capacityValue,
          c.ratingUnit,
          c.ratingUnit === 'mm3-per-stroke'
            ? 'capacity = rating (per injector)'
            : 'capacity = rating (for the part as fitted)',
          [inRating],
        );
    const requirement: Figure = { ...req, label: `${req.label} (${c.name})` };
    const ratio = capacityValue / req.value;
    const headroom = (ratio - 1) * 100;
    const headroomPct = figure(
      `${c.name} headroom`,
      headroom,
      '%',
      'headroom % = (capacity ÷ requirement − 1) × 100',
      [fromFigure(capacity, c.id), fromFigure(req, key)],
    );
    const supportedCrankPower = figure(
      `Crank power ${c.name} supports`,
      crankHp * ratio,
      'hp-crank',
      curveScaled
        ? 'supported crank hp = target crank hp × capacity ÷ requirement (assumes the whole torque curve, torque target and peak power alike, scales with power)'
        : 'supported crank hp = target crank hp × capacity ÷ requirement (every requirement is proportional to crank power)',
      [fromFigure(crankPower, 'crankPower'), fromFigure(capacity, c.id), fromFigure(req, key)],
    );
    const notes: ComponentNote[] = [];
    if (curveScaled) {
      // What the rating alone would allow at peak-power rpm, were the torque target not there.
      const atPeakInUnit = key === 'crankTorque' ? torqueAtPeakLbft : torqueAtPeakLbft * LBF_FT_NM;
      const atPeakRpmOnly = (crankHp * capacityValue) / atPeakInUnit;
      notes.push({
        code: 'torque-curve-scaled',
        message: `The torque target, ${formatForMessage(torqueLbft)} lbf·ft, is above the ${formatForMessage(
          torqueAtPeakLbft,
        )} lbf·ft the power target needs at peak power (${formatForMessage(a.peakRpm)} rpm), so it is what this part must hold. The power it supports assumes the whole torque curve scales with power; at ${formatForMessage(
          a.peakRpm,
        )} rpm alone its rating would allow about ${formatForMessage(atPeakRpmOnly)} crank hp.`,
      });
    }
    if (key === 'fuelVolumeFlow' || key === 'fuelVolumeFlowGalPerH') {
      notes.push({
        code: 'return-flow-not-counted',
        message:
          'Compared with the fuel the engine burns only. The return flow (injector leak-off and the pressure regulator’s return to the tank) is not counted, and a lift pump must supply it too: leave room for it.',
      });
    }
    return {
      id: c.id,
      name: c.name,
      category: c.category,
      quantity: c.quantity,
      ratingValue: c.ratingValue,
      ratingUnit: c.ratingUnit,
      ...(c.ratingFor ? { ratingFor: c.ratingFor } : {}),
      quantityMultiplies: multiplies,
      comparedWith: key,
      capacity,
      requirement,
      headroomPct,
      status: statusFor(headroom, a.tightMarginPct),
      supportedCrankPower,
      notes,
      ...(c.anonymised ? { anonymised: true } : {}),
    };
  });

  // ---- weakest link and what the build supports
  let weakest: ComponentResult | null = null;
  for (const r of results) {
    if (!weakest || r.headroomPct.value < weakest.headroomPct.value) weakest = r;
  }
  const scaledNote = (r: ComponentResult) =>
    r.notes.some((n) => n.code === 'torque-curve-scaled')
      ? ' (if the whole torque curve scales with power)'
      : '';
  const weakestLink = weakest
    ? {
        componentId: weakest.id,
        name: weakest.name,
        category: weakest.category,
        headroomPct: weakest.headroomPct.value,
        status: weakest.status,
        message: `Weakest link: ${weakest.name}, rated ${formatForMessage(weakest.capacity.value)} ${unitText(
          weakest.capacity.unit,
        )} against ${formatForMessage(weakest.requirement.value)} ${unitText(weakest.requirement.unit)} needed (${formatHeadroomForMessage(
          weakest.headroomPct.value,
        )} headroom); it supports about ${formatForMessage(
          weakest.supportedCrankPower.value,
        )} crank hp${scaledNote(weakest)}.`,
      }
    : null;

  const supported = weakest
    ? (() => {
        const crank = figure(
          'Greatest crank power the rated parts support',
          weakest.supportedCrankPower.value,
          'hp-crank',
          `least supported crank power of the ${results.length} rated part${results.length === 1 ? '' : 's'} (categories with no rating are not counted)`,
          [fromFigure(weakest.supportedCrankPower, weakest.id)],
        );
        const wheel = figure(
          'Greatest wheel power the rated parts support',
          weakest.supportedCrankPower.value * keep,
          'hp-wheel',
          'wheel hp = crank hp × (1 − drivetrain loss ÷ 100)',
          [fromFigure(crank, 'supported.crankPower'), inLoss],
        );
        return { crankPower: crank, wheelPower: wheel, limitedBy: weakest.id };
      })()
    : null;

  // ---- categories
  const categories = partCategories
    .map((category) => {
      const rated = results.filter((r) => r.category === category);
      const status: HeadroomStatus | 'unknown' = rated.length
        ? rated.reduce<HeadroomStatus>(
            (worst, r) => (statusRank[r.status] < statusRank[worst] ? r.status : worst),
            'ok',
          )
        : 'unknown';
      return { category, status, componentIds: rated.map((r) => r.id) };
    })
    .filter((c) => c.componentIds.length > 0 || estimatedCategories.includes(c.category));
  const unknownCategories = categories.filter((c) => c.status === 'unknown').map((c) => c.category);

  // ---- warnings: danger first, then warning, then info; within a level, least headroom first
  const warnings: EstimateWarning[] = [];
  const byHeadroom = [...results].sort((x, y) => x.headroomPct.value - y.headroomPct.value);
  for (const r of byHeadroom) {
    if (r.status !== 'over' || r.category !== 'bottom-end') continue;
    const short = shortfall(r, crankHp);
    warnings.push({
      code: 'target-exceeds-bottom-end',
      severity: 'danger',
      componentId: r.id,
      category: r.category,
      shortfall: short,
      message: `The target exceeds the bottom-end rating: ${r.name} is rated ${formatForMessage(r.capacity.value)} ${unitText(
        r.capacity.unit,
      )} and the target needs ${formatForMessage(r.requirement.value)} ${unitText(r.requirement.unit)}, ${formatForMessage(
        short.value,
      )} ${unitText(short.unit)} past its rating (${formatHeadroomForMessage(r.headroomPct.value)} headroom). It supports about ${formatForMessage(
        r.supportedCrankPower.value,
      )} crank hp${scaledNote(r)}, ${formatForMessage(short.crankHp)} hp short of the target.`,
    });
  }
  for (const r of byHeadroom) {
    if (r.status !== 'over' || r.category === 'bottom-end') continue;
    const short = shortfall(r, crankHp);
    warnings.push({
      code: 'part-over',
      severity: 'danger',
      componentId: r.id,
      category: r.category,
      shortfall: short,
      message: `Over its rating: ${r.name}, rated ${formatForMessage(r.capacity.value)} ${unitText(
        r.capacity.unit,
      )}; the target needs ${formatForMessage(r.requirement.value)} ${unitText(r.requirement.unit)}, ${formatForMessage(
        short.value,
      )} ${unitText(short.unit)} more (${formatHeadroomForMessage(r.headroomPct.value)} headroom). It supports about ${formatForMessage(
        r.supportedCrankPower.value,
      )} crank hp${scaledNote(r)}.`,
    });
  }
  for (const { component: c, why } of unusable) {
    warnings.push({
      code: 'rating-unusable',
      severity: 'warning',
      componentId: c.id,
      category: c.category,
      message: `${c.name} is not checked: ${why}. A rating must be a number above zero; enter the maker’s figure in the parts ledger.`,
    });
  }
  if (!results.some((r) => r.category === 'bottom-end')) {
    warnings.push({
      code: 'no-bottom-end-rating',
      severity: 'warning',
      category: 'bottom-end',
      message:
        'No bottom-end part has a rating, so the target is not checked against the crank, rods and block, often the weakest link. Enter the bottom end with its rating.',
    });
  }
  for (const r of byHeadroom) {
    if (r.status !== 'tight') continue;
    warnings.push({
      code: 'part-tight',
      severity: 'warning',
      componentId: r.id,
      category: r.category,
      message: `Tight: ${r.name} has ${formatHeadroomForMessage(r.headroomPct.value)} headroom, less than the ${formatPctForMessage(
        a.tightMarginPct,
      )} % margin (rated ${formatForMessage(r.capacity.value)} ${unitText(r.capacity.unit)}, needs ${formatForMessage(
        r.requirement.value,
      )} ${unitText(r.requirement.unit)}).`,
    });
  }
  if (results.length === 0) {
    warnings.push({
      code: 'no-rated-parts',
      severity: 'info',
      message:
        'No part has a rating yet, so nothing is checked against the target. Enter the ratings makers give for the parts.',
    });
  }

  const result: EstimateResult = {
    target: { powerHp: target.powerHp, basis: target.basis, torqueLbft: torqueTarget },
    assumptions: {
      bsfc: a.bsfc,
      bsfcUnit: a.bsfcUnit,
      bsfcLbPerHpH,
      bsfcGPerKwh,
      afr: a.afr,
      fuelDensityKgPerL: a.fuelDensityKgPerL,
      drivetrainLossPct: a.drivetrainLossPct,
      peakRpm: a.peakRpm,
      cylinders: a.cylinders,
      cylindersFrom,
      tightMarginPct: a.tightMarginPct,
    },
    assumptionDetails: [
      {
        key: 'bsfc',
        label: bsfcSpec.label,
        value: a.bsfc,
        unit: a.bsfcUnit,
        default: defaultBsfc(a.bsfcUnit),
        min: convertBsfc(bsfcSpec.min, 'lb-per-hp-h', a.bsfcUnit),
        max: convertBsfc(bsfcSpec.max, 'lb-per-hp-h', a.bsfcUnit),
        isDefault: Math.abs(bsfcLbPerHpH - bsfcSpec.default) < 1e-9,
        source: bsfcSpec.source,
      },
      ...(
        Object.entries(assumptionSpecs) as [
          keyof typeof assumptionSpecs,
          (typeof assumptionSpecs)[keyof typeof assumptionSpecs],
        ][]
      ).map(([key, spec]) => ({
        key,
        label: spec.label,
        value: a[key],
        unit: spec.unit,
        default: spec.default,
        min: spec.min,
        max: spec.max,
        isDefault: a[key] === spec.default,
        source:
          key === 'cylinders' && cylindersFrom === 'build' ? 'the build’s engine' : spec.source,
      })),
    ],
    requirements,
    components: results,
    weakestLink,
    supported,
    categories,
    unknownCategories,
    warnings,
  };
  assertFiniteFigures(result);
  return result;
}

/** A percentage for a sentence, to one decimal as the pages show it: 3.9, 12.5. */
function formatPctForMessage(pct: number): string {
  return String(Number(pct.toFixed(1)));
}

/** "+3.9 %", "−6.7 %": a headroom with its sign, for a sentence. */
function formatHeadroomForMessage(pct: number): string {
  return `${pct < 0 ? '−' : '+'}${formatPctForMessage(Math.abs(pct))} %`;
}

/**
 * The last guard: inputs inside the checks above always give finite figures, but one that
 * does not (a target of 1e-310 hp, say) must fail here rather than reach a page as Infinity
 * or a JSON null.
 */
function assertFiniteFigures(r: EstimateResult) {
  const figures: Figure[] = [...Object.values(r.requirements)];
  for (const c of r.components)
    figures.push(c.capacity, c.requirement, c.headroomPct, c.supportedCrankPower);
  if (r.supported) figures.push(r.supported.crankPower, r.supported.wheelPower);
  for (const f of figures) {
    if (!Number.isFinite(f.value)) {
      throw new RangeError(
        `${f.label} is not a finite number (${f.value}); the inputs are out of range`,
      );
    }
  }
  for (const w of r.warnings) {
    const s = w.shortfall;
    if (s && ![s.value, s.pct, s.crankHp].every(Number.isFinite)) {
      throw new RangeError(
        `The shortfall of ${w.componentId} is not finite; the inputs are out of range`,
      );
    }
  }
}

/**
 * How far a part over its rating falls short, on the basis headroom uses: the requirement.
 * pct = (requirement − capacity) ÷ requirement × 100 = −headroom %.
 */
function shortfall(r: ComponentResult, crankHp: number) {
  return {
    value: r.requirement.value - r.capacity.value,
    unit: r.capacity.unit,
    pct: ((r.requirement.value - r.capacity.value) / r.requirement.value) * 100,
    crankHp: crankHp - r.supportedCrankPower.value,
  };
}
