import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  airLbPerMinFromFuelKgPerH,
  deliveryFromFuelGPerS,
  estimate,
  fuelGPerSFromDelivery,
  fuelKgPerHFromAirLbPerMin,
  fuelKgPerHFromPowerKw,
  powerKwFromFuelKgPerH,
} from '@shared/estimate';
import {
  estimateRequestSchema,
  assumptionsInputSchema,
  type EstimateRequestInput,
  type EstimateResult,
  type Figure,
} from '@shared/schemas/estimate';
import { ratingUnits, type PartCategory, type RatingUnit } from '@shared/schemas/parts';
import { convertPower } from '@shared/units';
import { formatFigure, formatHeadroom } from '@/features/estimate/format';

// reference.md's full value of lbf·ft → N·m (NIST SP 811 (2008) B.9, from the exact definitions);
// parsed from text because the literal has one more digit than a double holds.
const LBF_FT_NM_REF = Number('1.3558179483314004');
// Typed in from reference.md, never imported from the code under test:
const HP_W_REF = 745.69987158227; // hp (550 ft·lbf/s) → W, NIST SP 811 (2008) B.9
const HP_TORQUE_REF = 5252.113122; // 33000/2π, definition of power P = 2πnT/60 (reference.md)
const G_PER_KWH_PER_LB_PER_HP_H = 608.27739; // lb/(hp·h) → g/kWh, reference.md (derived)
const LB_KG_REF = 0.45359237; // NIST SP 811 (2008) B.8, exact
const GAL_L_REF = 3.785411784; // NIST SP 811 (2008) B.8, exact

/** Every number anywhere in a value, with its path, to check none is NaN, ±Infinity or a JSON null. */
function numbersIn(value: unknown, path = '', out: [string, unknown][] = []): [string, unknown][] {
  if (typeof value === 'number') out.push([path, value]);
  else if (Array.isArray(value)) value.forEach((v, i) => numbersIn(v, `${path}.${i}`, out));
  else if (value && typeof value === 'object')
    for (const [k, v] of Object.entries(value)) numbersIn(v, `${path}.${k}`, out);
  return out;
}

function expectRel(actual: number, expected: number, rel: number) {
  expect(Math.abs(actual - expected), `${actual} vs ${expected}`).toBeLessThanOrEqual(
    rel * Math.abs(expected),
  );
}

/** Parses like the server does (defaults filled in) and runs the estimator. */
function run(req: EstimateRequestInput): EstimateResult {
  return estimate(estimateRequestSchema.parse(req));
}

const part = (
  id: string,
  category: PartCategory,
  ratingValue: number,
  ratingUnit: RatingUnit,
  quantity = 1,
) => ({ id, name: id, category, ratingValue, ratingUnit, quantity });

const comp = (r: EstimateResult, id: string) => r.components.find((c) => c.id === id)!;

describe('fuel from injectors', () => {
  it('8 cyl, 100 mm³, 3000 rpm, 0.85 kg/L, 210 g/kWh → 17.0 g/s, 61.2 kg/h, 291.4286 kW = 390.812 hp', () => {
    // reference.md worked check (fuel from injectors)
    const gPerS = fuelGPerSFromDelivery(100, 0.85, 8, 3000);
    expectRel(gPerS, 17.0, 1e-12);
    expectRel(gPerS * 3.6, 61.2, 1e-12);
    const kw = powerKwFromFuelKgPerH(gPerS * 3.6, 210);
    expect(kw).toBeCloseTo(291.4286, 4); // to the digits reference.md prints
    expect(convertPower(kw, 'kw', 'hp')).toBeCloseTo(390.812, 3);
    expectRel(deliveryFromFuelGPerS(17.0, 0.85, 8, 3000), 100, 1e-12);
  });

  it('6 cyl, 150 mm³, 2800 rpm → 64.26 kg/h, 306.000 kW = 410.353 hp', () => {
    // reference.md worked check (fuel from injectors)
    const kgPerH = fuelGPerSFromDelivery(150, 0.85, 6, 2800) * 3.6;
    expectRel(kgPerH, 64.26, 1e-12);
    const kw = powerKwFromFuelKgPerH(kgPerH, 210);
    expect(kw).toBeCloseTo(306.0, 9);
    expect(convertPower(kw, 'kw', 'hp')).toBeCloseTo(410.353, 3);
    expectRel(fuelKgPerHFromPowerKw(306, 210), 64.26, 1e-12);
  });

  it('the estimator finds the same power for an injector of that size', () => {
    // reference.md worked check, run through the whole estimator: the crank power a
    // 100 mm³/stroke injector supports on 8 cylinders at 3000 rpm, 0.85 kg/L, 210 g/kWh.
    const r = run({
      target: { powerHp: 500, basis: 'crank' },
      assumptions: {
        bsfc: 210,
        bsfcUnit: 'g-per-kwh',
        fuelDensityKgPerL: 0.85,
        peakRpm: 3000,
        cylinders: 8,
      },
      components: [part('inj', 'fuel-injection', 100, 'mm3-per-stroke', 8)],
    });
    expect(comp(r, 'inj').supportedCrankPower.value).toBeCloseTo(390.812, 3);
    const r6 = run({
      target: { powerHp: 500, basis: 'crank' },
      assumptions: {
        bsfc: 210,
        bsfcUnit: 'g-per-kwh',
        fuelDensityKgPerL: 0.85,
        peakRpm: 2800,
        cylinders: 6,
      },
      components: [part('inj', 'fuel-injection', 150, 'mm3-per-stroke', 6)],
    });
    expect(comp(r6, 'inj').supportedCrankPower.value).toBeCloseTo(410.353, 3);
  });
});

describe('fuel from air', () => {
  it('60 lb/min, AFR 20, 210 g/kWh → 81.64663 kg/h fuel, 388.7935 kW = 521.381 hp, λ 1.3793', () => {
    // reference.md worked check (fuel from air)
    // (to the digits reference.md prints)
    const kgPerH = fuelKgPerHFromAirLbPerMin(60, 20);
    expect(kgPerH).toBeCloseTo(81.64663, 5);
    const kw = powerKwFromFuelKgPerH(kgPerH, 210);
    expect(kw).toBeCloseTo(388.7935, 4);
    expect(convertPower(kw, 'kw', 'hp')).toBeCloseTo(521.381, 3);
    expectRel(airLbPerMinFromFuelKgPerH(kgPerH, 20), 60, 1e-12);
  });

  it('the estimator finds the same power for a 60 lb/min turbocharger, and λ against 14.5', () => {
    // reference.md worked check, through the estimator; λ against stoichiometric 14.5 (Heywood 1988 ch. 3 [memory])
    const r = run({
      target: { powerHp: 600, basis: 'crank' },
      assumptions: { bsfc: 210, bsfcUnit: 'g-per-kwh', afr: 20 },
      components: [part('turbo', 'turbocharger', 60, 'lb-per-min')],
    });
    expect(comp(r, 'turbo').supportedCrankPower.value).toBeCloseTo(521.381, 3);
    expect(r.requirements.lambda.value).toBeCloseTo(1.3793, 4);
  });
});

describe('BSFC entered in either unit', () => {
  it('burns the same fuel for 0.40 lb/(hp·h) and 243.311 g/kWh: 280 lb/h at 700 hp', () => {
    // 0.40 lb/(hp·h) × 700 hp = 280 lb/h (definition of BSFC); lb = 0.45359237 kg (NIST SP 811
    // (2008) B.8); 0.40 × 608.27739 = 243.310956 g/kWh (reference.md factor)
    const expected = 280 * LB_KG_REF;
    const lb = run({
      target: { powerHp: 700, basis: 'crank' },
      assumptions: { bsfc: 0.4, bsfcUnit: 'lb-per-hp-h' },
    });
    const g = run({
      target: { powerHp: 700, basis: 'crank' },
      assumptions: { bsfc: 0.4 * G_PER_KWH_PER_LB_PER_HP_H, bsfcUnit: 'g-per-kwh' },
    });
    expectRel(lb.requirements.fuelMassFlow.value, expected, 1e-12);
    expectRel(g.requirements.fuelMassFlow.value, expected, 1e-8);
    expectRel(g.assumptions.bsfcLbPerHpH, 0.4, 1e-8);
  });

  it('burns 0.40 lb/(hp·h) × 700 hp = 280 lb/h of fuel', () => {
    // definition of BSFC; lb = 0.45359237 kg (NIST SP 811 (2008) B.8)
    const r = run({ target: { powerHp: 700, basis: 'crank' } });
    expectRel(r.requirements.fuelMassFlow.value, 280 * 0.45359237, 1e-12);
  });

  it('fills the default in the unit chosen and checks the range in that unit', () => {
    // default 0.40 lb/(hp·h): common practice (reference.md)
    expect(assumptionsInputSchema.parse({}).bsfc).toBe(0.4);
    expectRel(assumptionsInputSchema.parse({ bsfcUnit: 'g-per-kwh' }).bsfc, 243.310955, 1e-8);
    expect(assumptionsInputSchema.safeParse({ bsfc: 210, bsfcUnit: 'g-per-kwh' }).success).toBe(
      true,
    );
    const wrongUnit = assumptionsInputSchema.safeParse({ bsfc: 210 }); // 210 lb/(hp·h) is absurd
    expect(wrongUnit.success).toBe(false);
    expect(wrongUnit.error!.issues[0].path).toEqual(['bsfc']);
    const low = assumptionsInputSchema.safeParse({ bsfc: 0.2 });
    expect(low.error!.issues[0].message).toMatch(/0\.3 and 0\.65 lb/);
  });
});

describe('requirements at the target', () => {
  it('turns a wheel target into crank power with the drivetrain loss', () => {
    // crank = wheel ÷ (1 − loss): 600 ÷ 0.82 (issue 4 formula; 18 % common practice)
    const r = run({ target: { powerHp: 600, basis: 'wheel' } });
    expectRel(r.requirements.crankPower.value, 600 / 0.82, 1e-15);
    expect(r.requirements.wheelPower.value).toBe(600);
  });

  it('takes crank torque at peak-power rpm from P × 5252.113 / rpm', () => {
    // reference.md worked check: 500 lbf·ft at 2000 rpm = 190.39955 hp
    const r = run({
      target: { powerHp: 190.39955, basis: 'crank' },
      assumptions: { peakRpm: 2000 },
    });
    expectRel(r.requirements.crankTorque.value, 500, 1e-6);
    expectRel(r.requirements.crankTorqueNm.value, 500 * LBF_FT_NM_REF, 1e-6); // NIST SP 811 (2008) B.9
  });

  it("uses the owner's torque target when it is above the torque at peak power", () => {
    // 650 hp at 3000 rpm needs 650 × 5252.113122 / 3000 = 1137.96 lbf·ft (definition of power,
    // reference.md), less than the 1400 lbf·ft target, so the target is what parts must hold.
    const r = run({ target: { powerHp: 650, basis: 'crank', torqueLbft: 1400 } });
    expect(r.requirements.crankTorque.value).toBe(1400);
    expectRel(r.requirements.crankTorqueAtPeakPower.value, (650 * HP_TORQUE_REF) / 3000, 1e-9);
    expect(r.requirements.crankTorque.working.inputs[0]).toMatchObject({
      from: 'target',
      ref: 'torqueLbft',
    });
  });

  it('keeps the torque at peak power when the torque target is below it (issue #14)', () => {
    // 800 crank hp at 3200 rpm needs 800 × 5252.113122 / 3200 = 1313.03 lbf·ft (definition of
    // power, reference.md). A 1000 lbf·ft target must not replace that: the larger is used.
    const r = run({
      target: { powerHp: 800, basis: 'crank', torqueLbft: 1000 },
      assumptions: { peakRpm: 3200 },
      components: [
        part('trans', 'transmission', 1200, 'lbf-ft'),
        part('tc', 'torque-converter', 1600, 'n-m'),
      ],
    });
    const needed = (800 * HP_TORQUE_REF) / 3200;
    expectRel(r.requirements.crankTorque.value, needed, 1e-9);
    expectRel(r.requirements.crankTorqueNm.value, needed * LBF_FT_NM_REF, 1e-9);
    const trans = comp(r, 'trans');
    expectRel(trans.requirement.value, needed, 1e-9);
    // 1200 ÷ 1313.03 − 1 = −8.61 %: over, not "+20 %, ok"
    expectRel(trans.headroomPct.value, (1200 / needed - 1) * 100, 1e-9);
    expect(trans.headroomPct.value).toBeCloseTo(-8.61, 2);
    expect(trans.status).toBe('over');
    // 1200 lbf·ft at 3200 rpm = 1200 × 3200 / 5252.113122 = 731.1 hp (definition of power)
    expectRel(trans.supportedCrankPower.value, (1200 * 3200) / HP_TORQUE_REF, 1e-9);
    expect(trans.supportedCrankPower.value).toBeCloseTo(731.1, 1);
    expect(trans.notes).toEqual([]);
    // The N·m part sees the same requirement in N·m (NIST SP 811 (2008) B.9)
    expectRel(comp(r, 'tc').requirement.value, needed * LBF_FT_NM_REF, 1e-9);
    expect(r.warnings.find((w) => w.componentId === 'trans')?.code).toBe('part-over');
  });

  it('says the supported power of a torque-rated part assumes the torque curve scales when the torque target sets the limit', () => {
    // 800 hp at 3200 rpm needs 1313.03 lbf·ft at peak power (definition of power, reference.md);
    // a 1500 lbf·ft target is above it, so a 1400 lbf·ft part is short by 1 − 1400/1500 = 6.67 %
    // and supports 800 × 1400/1500 = 746.7 hp only if the whole curve scales with power.
    const r = run({
      target: { powerHp: 800, basis: 'crank', torqueLbft: 1500 },
      assumptions: { peakRpm: 3200 },
      components: [
        part('trans', 'transmission', 1400, 'lbf-ft'),
        part('be', 'bottom-end', 2000, 'hp-crank'),
      ],
    });
    const trans = comp(r, 'trans');
    expect(trans.requirement.value).toBe(1500);
    expectRel(trans.headroomPct.value, (1400 / 1500 - 1) * 100, 1e-12);
    expectRel(trans.supportedCrankPower.value, (800 * 1400) / 1500, 1e-12);
    expect(trans.notes.map((n) => n.code)).toEqual(['torque-curve-scaled']);
    // At 3200 rpm alone, 1400 lbf·ft would allow 1400 × 3200 / 5252.113122 = 853.0 hp.
    expect(trans.notes[0].message).toMatch(/whole torque curve scales with power/);
    expect(trans.notes[0].message).toContain('about 853 crank hp');
    expect(trans.supportedCrankPower.working.formula).toMatch(/whole torque curve/);
    expect(r.weakestLink!.message).toMatch(/if the whole torque curve scales with power/);
    // A power-rated part is not affected by the torque target.
    expect(comp(r, 'be').notes).toEqual([]);
  });

  it('converts the fuel flow to volume with the density, and per injector per stroke', () => {
    // reference.md chain run backwards: 61.2 kg/h on 8 cyl at 3000 rpm, 0.85 kg/L → 100 mm³/stroke.
    // The crank power burning 61.2 kg/h at 210 g/kWh is 390.812 hp (reference.md worked check).
    const hp = convertPower((61.2 / 210) * 1000, 'kw', 'hp');
    const r = run({
      target: { powerHp: hp, basis: 'crank' },
      assumptions: { bsfc: 210, bsfcUnit: 'g-per-kwh', cylinders: 8, peakRpm: 3000 },
    });
    expectRel(r.requirements.fuelMassFlow.value, 61.2, 1e-12);
    expectRel(r.requirements.fuelVolumeFlow.value, 72, 1e-12);
    expectRel(r.requirements.fuelVolumeFlowGalPerH.value, 72 / GAL_L_REF, 1e-12); // NIST SP 811 (2008) B.8
    expectRel(r.requirements.injectorDelivery.value, 100, 1e-12);
  });
});

describe('each rated part in its own unit', () => {
  const assumptions = { drivetrainLossPct: 20, tightMarginPct: 10 };
  const target = { powerHp: 800, basis: 'crank' as const };

  it('compares wheel ratings with the target in wheel hp and kW ratings with crank kW', () => {
    const r = run({
      target,
      assumptions,
      components: [
        part('trans', 'transmission', 720, 'hp-wheel'),
        part('tc', 'torque-converter', 600, 'kw'),
      ],
    });
    const trans = comp(r, 'trans');
    expect(trans.comparedWith).toBe('wheelPower');
    expectRel(trans.requirement.value, 640, 1e-15); // 800 × (1 − 0.20)
    expectRel(trans.headroomPct.value, 12.5, 1e-12); // 720 / 640 − 1
    expectRel(trans.supportedCrankPower.value, 900, 1e-12); // 720 ÷ 0.8
    const tc = comp(r, 'tc');
    expectRel(tc.requirement.value, (800 * HP_W_REF) / 1000, 1e-14); // NIST SP 811 (2008) B.9
  });

  it('does not multiply power, torque or per-injector ratings by quantity', () => {
    const r = run({
      target,
      components: [
        part('studs', 'head-and-studs', 1000, 'hp-crank', 16),
        part('inj', 'fuel-injection', 200, 'mm3-per-stroke', 8),
        part('rods', 'bottom-end', 1200, 'lbf-ft', 8),
      ],
    });
    const rated = { studs: 1000, inj: 200, rods: 1200 };
    for (const [id, rating] of Object.entries(rated)) {
      expect(comp(r, id).quantityMultiplies).toBe(false);
      expect(comp(r, id).capacity.value).toBe(rating);
    }
  });

  it('adds up identical flow-rated units in parallel', () => {
    const r = run({
      target,
      components: [
        part('twins', 'turbocharger', 55, 'lb-per-min', 2),
        part('pumps', 'fuel-supply', 100, 'gal-per-h', 2),
      ],
    });
    expect(comp(r, 'twins').quantityMultiplies).toBe(true);
    expect(comp(r, 'twins').capacity.value).toBe(110);
    expect(comp(r, 'pumps').capacity.value).toBe(200);
    expect(comp(r, 'pumps').comparedWith).toBe('fuelVolumeFlowGalPerH');
  });

  it('compares N·m ratings with the crank torque in N·m', () => {
    const r = run({ target, components: [part('trans', 'transmission', 2000, 'n-m')] });
    const t = comp(r, 'trans');
    // 800 hp at 3000 rpm = 800 × 5252.113122 / 3000 lbf·ft (definition of power, reference.md),
    // × 1.3558179483314004 N·m per lbf·ft (NIST SP 811 (2008) B.9)
    expectRel(t.requirement.value, ((800 * HP_TORQUE_REF) / 3000) * LBF_FT_NM_REF, 1e-9);
  });

  it('sets over / tight / ok against the tight margin', () => {
    const r = run({
      target: { powerHp: 1000, basis: 'crank' },
      assumptions: { tightMarginPct: 10 },
      components: [
        part('over', 'transmission', 999, 'hp-crank'),
        part('edge', 'driveline', 1000, 'hp-crank'),
        part('tight', 'exhaust', 1099, 'hp-crank'),
        part('ok', 'tuning', 1100, 'hp-crank'),
      ],
    });
    expect(r.components.map((c) => [c.id, c.status])).toEqual([
      ['over', 'over'],
      ['edge', 'tight'],
      ['tight', 'tight'],
      ['ok', 'ok'],
    ]);
  });
});

describe('weakest link, supported power and unknown categories', () => {
  it('names the part with the least headroom and gives the crank and wheel power the build supports', () => {
    const r = run({
      target: { powerHp: 600, basis: 'wheel' },
      assumptions: { drivetrainLossPct: 18 },
      components: [
        part('Bottom end', 'bottom-end', 700, 'hp-crank'),
        part('Injectors', 'fuel-injection', 250, 'mm3-per-stroke', 8),
        part('Transmission', 'transmission', 1500, 'lbf-ft'),
      ],
    });
    expect(r.weakestLink).toMatchObject({ componentId: 'Bottom end', status: 'over' });
    expect(r.weakestLink!.message).toMatch(/^Weakest link: Bottom end, rated 700 crank hp/);
    expect(r.supported!.limitedBy).toBe('Bottom end');
    expect(r.supported!.crankPower.value).toBe(700);
    expectRel(r.supported!.wheelPower.value, 700 * 0.82, 1e-15);
    expect(r.unknownCategories).toContain('turbocharger');
    expect(r.unknownCategories).toContain('fuel-supply');
    expect(r.unknownCategories).not.toContain('bottom-end');
    expect(r.unknownCategories).not.toContain('other');
    expect(r.categories.find((c) => c.category === 'turbocharger')!.status).toBe('unknown');
    expect(r.categories.find((c) => c.category === 'bottom-end')!.status).toBe('over');
  });

  it('has no weakest link and no supported power when nothing is rated', () => {
    const r = run({ target: { powerHp: 500, basis: 'crank' } });
    expect(r.weakestLink).toBeNull();
    expect(r.supported).toBeNull();
    expect(r.unknownCategories).toHaveLength(12);
  });
});

describe('warnings, one scenario each', () => {
  const codes = (r: EstimateResult) => r.warnings.map((w) => w.code);

  it('target-exceeds-bottom-end: says by how much, in the rating unit, in % and in crank hp', () => {
    const r = run({
      target: { powerHp: 700, basis: 'crank' },
      components: [part('be', 'bottom-end', 650, 'hp-crank')],
    });
    const w = r.warnings.find((x) => x.code === 'target-exceeds-bottom-end')!;
    expect(w).toMatchObject({ severity: 'danger', componentId: 'be', category: 'bottom-end' });
    expect(w.shortfall!.value).toBe(50);
    expect(w.shortfall!.unit).toBe('hp-crank');
    expect(w.shortfall!.crankHp).toBe(50);
    expect(w.message).toMatch(/exceeds the bottom-end rating/);
    expect(r.warnings[0].code).toBe('target-exceeds-bottom-end');
    expect(codes(r)).not.toContain('part-over'); // the bottom end gets its own warning, not both
  });

  it('states the shortfall on the basis headroom uses, so one page never shows two percentages (issue #14)', () => {
    // 650 hp rated, 700 hp needed: headroom 650/700 − 1 = −7.14 %; short by 50/700 = 7.14 % of
    // what the target needs, not 50/650 = 7.69 % of the rating.
    const r = run({
      target: { powerHp: 700, basis: 'crank' },
      components: [
        part('be', 'bottom-end', 650, 'hp-crank'),
        part('trans', 'transmission', 600, 'hp-crank'),
      ],
    });
    for (const id of ['be', 'trans']) {
      const c = comp(r, id);
      const w = r.warnings.find((x) => x.componentId === id)!;
      expectRel(w.shortfall!.pct, -c.headroomPct.value, 1e-12);
    }
    const be = r.warnings.find((x) => x.componentId === 'be')!;
    expectRel(be.shortfall!.pct, (50 / 700) * 100, 1e-12);
    expect(be.message).toContain('50 crank hp past its rating (−7.1 % headroom)');
    const trans = r.warnings.find((x) => x.componentId === 'trans')!;
    expectRel(trans.shortfall!.pct, (100 / 700) * 100, 1e-12);
    expect(trans.message).toContain('100 crank hp more (−14.3 % headroom)');
    // Percentages in sentences to one decimal, as the pages show them.
    expect(r.weakestLink!.message).toContain('(−14.3 % headroom)');
  });

  it('target-exceeds-bottom-end also for a torque-rated bottom end', () => {
    const r = run({
      target: { powerHp: 700, basis: 'crank' },
      assumptions: { peakRpm: 3000 },
      components: [part('rods', 'bottom-end', 1100, 'lbf-ft')],
    });
    // 700 hp at 3000 rpm = 700 × 5252.113 / 3000 = 1225.49 lbf·ft (definition of power, reference.md)
    const w = r.warnings.find((x) => x.code === 'target-exceeds-bottom-end')!;
    expectRel(w.shortfall!.value, (700 * 5252.113122) / 3000 - 1100, 1e-9);
    expect(w.shortfall!.unit).toBe('lbf-ft');
  });

  it('part-over: a part short of the requirement', () => {
    const r = run({
      target: { powerHp: 700, basis: 'crank' },
      components: [
        part('be', 'bottom-end', 1000, 'hp-crank'),
        part('trans', 'transmission', 600, 'hp-crank'),
      ],
    });
    expect(codes(r)).toEqual(['part-over']);
    expect(r.warnings[0]).toMatchObject({ componentId: 'trans', severity: 'danger' });
    expect(r.warnings[0].message).toMatch(
      /^Over its rating: trans, rated 600 crank hp; the target needs 700 crank hp/,
    );
  });

  it('part-tight: headroom under the margin', () => {
    const r = run({
      target: { powerHp: 700, basis: 'crank' },
      assumptions: { tightMarginPct: 10 },
      components: [
        part('be', 'bottom-end', 1000, 'hp-crank'),
        part('tc', 'torque-converter', 735, 'hp-crank'),
      ],
    });
    expect(codes(r)).toEqual(['part-tight']);
    expect(r.warnings[0]).toMatchObject({ componentId: 'tc', severity: 'warning' });
    expect(r.warnings[0].message).toMatch(
      /^Tight: tc has \+5 % headroom, less than the 10 % margin/,
    );
  });

  it('no-bottom-end-rating: nothing rated in the bottom end', () => {
    const r = run({
      target: { powerHp: 700, basis: 'crank' },
      components: [part('trans', 'transmission', 1000, 'hp-crank')],
    });
    expect(codes(r)).toEqual(['no-bottom-end-rating']);
    expect(r.unknownCategories).toContain('bottom-end');
  });

  it('no-rated-parts: nothing rated at all', () => {
    const r = run({ target: { powerHp: 700, basis: 'crank' } });
    expect(codes(r)).toEqual(['no-bottom-end-rating', 'no-rated-parts']);
  });

  it('no warnings when every part has room and the bottom end is rated', () => {
    const r = run({
      target: { powerHp: 700, basis: 'crank' },
      components: [
        part('be', 'bottom-end', 1000, 'hp-crank'),
        part('trans', 'transmission', 900, 'hp-crank'),
      ],
    });
    expect(r.warnings).toEqual([]);
  });
});

describe('the working', () => {
  function figures(r: EstimateResult): Figure[] {
    const out: Figure[] = Object.values(r.requirements);
    for (const c of r.components)
      out.push(c.capacity, c.requirement, c.headroomPct, c.supportedCrankPower);
    if (r.supported) out.push(r.supported.crankPower, r.supported.wheelPower);
    return out;
  }

  it('carries a formula, inputs and the source of every constant on every figure', () => {
    const r = run({
      target: { powerHp: 600, basis: 'wheel' },
      components: ratingUnits.map((u, i) => part(`p${i}`, 'other', 100, u)),
    });
    const all = figures(r);
    expect(all.length).toBe(12 + 4 * ratingUnits.length + 2);
    for (const f of all) {
      expect(f.working.formula.length, f.label).toBeGreaterThan(5);
      expect(f.working.inputs.length, f.label).toBeGreaterThan(0);
      expect(Number.isFinite(f.value), f.label).toBe(true);
      for (const c of f.working.constants) expect(c.source.length, c.name).toBeGreaterThan(5);
    }
    // the hp constant is cited to NIST and the stoichiometric AFR marked as recalled
    expect(r.requirements.crankPowerKw.working.constants[0].source).toMatch(/NIST SP 811/);
    expect(r.requirements.lambda.working.constants[0].source).toMatch(/Heywood.*\[memory\]/);
    for (const a of r.assumptionDetails) expect(a.source.length, a.key).toBeGreaterThan(5);
  });

  it("labels a build's own cylinder count as the build's, not an assumption (issue #14)", () => {
    const input = estimateRequestSchema.parse({
      target: { powerHp: 600, basis: 'crank' },
      assumptions: { cylinders: 6 },
    });
    const cylindersIn = (r: EstimateResult) =>
      r.requirements.injectorDelivery.working.inputs.find((i) => i.ref === 'cylinders')!;
    const fromBuild = estimate(input, { cylindersFrom: 'build' });
    expect(cylindersIn(fromBuild)).toMatchObject({ value: 6, from: 'build' });
    expect(fromBuild.assumptions.cylindersFrom).toBe('build');
    expect(fromBuild.assumptionDetails.find((d) => d.key === 'cylinders')!.source).toMatch(
      /the build/,
    );
    // A stateless request's cylinder count is one of its assumptions.
    expect(cylindersIn(estimate(input))).toMatchObject({ value: 6, from: 'assumption' });
  });
});

describe('fuel supply and return flow', () => {
  it('says a lift pump is compared with fuel burned only, in its notes and in the working (issue #14)', () => {
    const r = run({
      target: { powerHp: 700, basis: 'crank' },
      components: [
        part('pump', 'fuel-supply', 200, 'l-per-h'),
        part('pump2', 'fuel-supply', 50, 'gal-per-h'),
        part('turbo', 'turbocharger', 100, 'lb-per-min'),
      ],
    });
    for (const id of ['pump', 'pump2']) {
      expect(comp(r, id).notes.map((n) => n.code)).toEqual(['return-flow-not-counted']);
      expect(comp(r, id).notes[0].message).toMatch(/return flow .* is not counted/);
      expect(comp(r, id).requirement.working.formula).toMatch(/return flow .* not counted/);
    }
    expect(comp(r, 'turbo').notes).toEqual([]);
    // The figure itself is still fuel burned: 700 hp × 0.40 lb/(hp·h) = 280 lb/h (definition of
    // BSFC), ÷ 0.85 kg/L (Chevron 2007 default) → L/h; lb = 0.45359237 kg (NIST SP 811 B.8).
    expectRel(comp(r, 'pump').requirement.value, (280 * LB_KG_REF) / 0.85, 1e-12);
  });
});

describe('inputs that cannot give a finite figure (issue #14)', () => {
  const base = () =>
    estimateRequestSchema.parse({
      target: { powerHp: 700, basis: 'crank' },
      components: [part('be', 'bottom-end', 900, 'hp-crank')],
    });
  const withPart = (c: Partial<ReturnType<typeof part>>) => {
    const input = base();
    input.components.push({ ...part('bad', 'transmission', 1, 'lbf-ft'), ...c });
    return input;
  };
  const allFinite = (r: EstimateResult) => {
    for (const [path, n] of numbersIn(JSON.parse(JSON.stringify(r))))
      expect(Number.isFinite(n), path).toBe(true);
    expect(JSON.stringify(r)).not.toMatch(/Infinity|NaN/);
  };

  it('leaves a part rated 0, NaN or Infinity out of the comparison and warns instead', () => {
    for (const ratingValue of [0, -3, Number.NaN, Number.POSITIVE_INFINITY]) {
      const r = estimate(withPart({ ratingValue }));
      expect(r.components.map((c) => c.id)).toEqual(['be']);
      const w = r.warnings.find((x) => x.code === 'rating-unusable')!;
      expect(w).toMatchObject({ componentId: 'bad', severity: 'warning' });
      expect(w.message).toMatch(/^bad is not checked/);
      expectRel(r.supported!.crankPower.value, 900, 1e-12);
      allFinite(r);
    }
    const zero = estimate(withPart({ ratingValue: 0 })).warnings.find(
      (x) => x.code === 'rating-unusable',
    )!;
    expect(zero.message).toContain('its rating is 0 lbf·ft');
    // Only an unusable part: nothing rated, so nothing supported, and still no NaN.
    const input = base();
    input.components = [{ ...part('bad', 'transmission', 0, 'lbf-ft') }];
    const only = estimate(input);
    expect(only.supported).toBeNull();
    allFinite(only);
  });

  it('leaves out a part with a quantity below 1', () => {
    const r = estimate(withPart({ ratingValue: 100, ratingUnit: 'lb-per-min', quantity: 0 }));
    expect(r.components.map((c) => c.id)).toEqual(['be']);
    expect(r.warnings.map((w) => w.code)).toContain('rating-unusable');
  });

  it('treats a torque target of 0 as none, and refuses a negative or non-finite one', () => {
    const input = base();
    input.target.torqueLbft = 0;
    input.components.push(part('trans', 'transmission', 1500, 'lbf-ft'));
    const r = estimate(input);
    expect(r.target.torqueLbft).toBeNull();
    // 700 hp at 3000 rpm = 700 × 5252.113122 / 3000 lbf·ft (definition of power, reference.md)
    expectRel(r.requirements.crankTorque.value, (700 * HP_TORQUE_REF) / 3000, 1e-9);
    expectRel(comp(r, 'trans').supportedCrankPower.value, (1500 * 3000) / HP_TORQUE_REF, 1e-9);
    allFinite(r);
    for (const bad of [-1, Number.NaN, Number.POSITIVE_INFINITY]) {
      input.target.torqueLbft = bad;
      expect(() => estimate(input)).toThrow(RangeError);
    }
  });

  it('refuses a target, rpm or drivetrain loss it cannot work with', () => {
    for (const powerHp of [0, -1, Number.NaN, Number.POSITIVE_INFINITY]) {
      const input = base();
      input.target.powerHp = powerHp;
      expect(() => estimate(input), String(powerHp)).toThrow(RangeError);
    }
    const loss = base();
    loss.assumptions.drivetrainLossPct = 100; // a wheel target would need infinite crank power
    expect(() => estimate(loss)).toThrow(RangeError);
    const rpm = base();
    rpm.assumptions.peakRpm = 0;
    expect(() => estimate(rpm)).toThrow(RangeError);
  });

  it('refuses rather than answer Infinity for a target so small every ratio overflows', () => {
    const input = base();
    input.target.powerHp = 1e-310; // a subnormal double: 900 ÷ it is Infinity
    expect(() => estimate(input)).toThrow(/not a finite number/);
  });

  it('the request schema refuses a target under 0.1 hp, the least a build can store', () => {
    const res = estimateRequestSchema.safeParse({ target: { powerHp: 0.04, basis: 'crank' } });
    expect(res.success).toBe(false);
    expect(res.error!.issues[0].path).toEqual(['target', 'powerHp']);
  });

  it('gives only finite figures for any request the schema accepts', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.1, max: 5000, noNaN: true }),
        fc.constantFrom('crank' as const, 'wheel' as const),
        fc.option(fc.double({ min: Number.MIN_VALUE, max: 10_000, noNaN: true }), { nil: null }),
        fc.double({ min: 0, max: 40, noNaN: true }),
        fc.constantFrom(...ratingUnits),
        fc.double({ min: Number.MIN_VALUE, max: 100_000, noNaN: true }),
        fc.integer({ min: 1, max: 10_000 }),
        (powerHp, basis, torqueLbft, drivetrainLossPct, ratingUnit, ratingValue, quantity) => {
          const input = estimateRequestSchema.parse({
            target: { powerHp, basis, torqueLbft },
            assumptions: { drivetrainLossPct },
            components: [
              { id: 'x', name: 'x', category: 'other', ratingValue, ratingUnit, quantity },
            ],
          });
          const r = estimate(input);
          return numbersIn(JSON.parse(JSON.stringify(r))).every(([, n]) => Number.isFinite(n));
        },
      ),
    );
  });
});

describe('properties', () => {
  const unit = fc.constantFrom(...ratingUnits);
  const targetHp = fc.double({ min: 50, max: 5000, noNaN: true });
  const rating = fc.double({ min: 1, max: 100_000, noNaN: true });
  const basis = fc.constantFrom('crank' as const, 'wheel' as const);
  const headroomOf = (powerHp: number, b: 'crank' | 'wheel', u: RatingUnit, value: number) =>
    run({ target: { powerHp, basis: b }, components: [part('x', 'other', value, u)] }).components[0]
      .headroomPct.value;

  it('headroom rises with capacity', () => {
    fc.assert(
      fc.property(targetHp, basis, unit, rating, rating, (hp, b, u, r1, r2) => {
        // ratings a few ulps apart can round to the same headroom
        fc.pre(Math.abs(r1 - r2) > 1e-9 * Math.max(r1, r2));
        const [lo, hi] = r1 < r2 ? [r1, r2] : [r2, r1];
        return headroomOf(hp, b, u, lo) < headroomOf(hp, b, u, hi);
      }),
    );
  });

  it('headroom falls as the target rises', () => {
    fc.assert(
      fc.property(targetHp, targetHp, basis, unit, rating, (t1, t2, b, u, r) => {
        fc.pre(Math.abs(t1 - t2) > 1e-9 * Math.max(t1, t2));
        const [lo, hi] = t1 < t2 ? [t1, t2] : [t2, t1];
        return headroomOf(hi, b, u, r) < headroomOf(lo, b, u, r);
      }),
    );
  });

  /**
   * What the target asks of a part in each rating unit, worked out here from reference.md's
   * formulas and constants (never from the estimator): crank = wheel ÷ (1 − loss);
   * hp = T × rpm / 5252.113122; P[kW] = hp × 745.69987158227 / 1000 (NIST SP 811 B.9);
   * fuel[kg/h] = kW × BSFC[g/kWh] / 1000 with 608.27739 g/kWh per lb/(hp·h);
   * V[mm³] = ṁ[g/s] × 1000 / ρ / (cyl × rpm / 120); air[lb/min] = fuel × AFR / 0.45359237 / 60.
   */
  function handRequirement(
    u: RatingUnit,
    t: { powerHp: number; basis: 'crank' | 'wheel' },
    a: { lossPct: number; rpm: number; cylinders: number },
  ): { crankHp: number; value: number } {
    const keep = 1 - a.lossPct / 100;
    const crankHp = t.basis === 'crank' ? t.powerHp : t.powerHp / keep;
    const kw = (crankHp * HP_W_REF) / 1000;
    const torque = (crankHp * HP_TORQUE_REF) / a.rpm;
    const fuelKgPerH = (kw * 0.4 * G_PER_KWH_PER_LB_PER_HP_H) / 1000; // default 0.40 lb/(hp·h), common practice
    const density = 0.85; // default, Chevron (2007)
    const afr = 18; // default, common practice
    const values: Record<RatingUnit, number> = {
      'hp-crank': crankHp,
      'hp-wheel': crankHp * keep,
      kw,
      'lbf-ft': torque,
      'n-m': torque * LBF_FT_NM_REF,
      'mm3-per-stroke': ((fuelKgPerH / 3.6) * 1000) / density / ((a.cylinders * a.rpm) / 120),
      'lb-per-min': (fuelKgPerH * afr) / LB_KG_REF / 60,
      'l-per-h': fuelKgPerH / density,
      'gal-per-h': fuelKgPerH / density / GAL_L_REF,
    };
    return { crankHp, value: values[u] };
  }

  it('matches the requirement worked out by hand from reference.md, for every unit', () => {
    fc.assert(
      fc.property(
        targetHp,
        basis,
        unit,
        fc.double({ min: 0, max: 40, noNaN: true }),
        fc.integer({ min: 1000, max: 6000 }),
        fc.integer({ min: 1, max: 16 }),
        rating,
        (hp, b, u, loss, rpm, cylinders, value) => {
          const hand = handRequirement(
            u,
            { powerHp: hp, basis: b },
            { lossPct: loss, rpm, cylinders },
          );
          const r = run({
            target: { powerHp: hp, basis: b },
            assumptions: { drivetrainLossPct: loss, peakRpm: rpm, cylinders },
            components: [part('x', 'other', value, u)],
          });
          const c = r.components[0];
          // 608.27739 is printed to 8 digits, hence 1e-7 rather than 1e-12.
          expectRel(c.requirement.value, hand.value, 1e-7);
          expectRel(c.headroomPct.value / 100 + 1, value / hand.value, 1e-7);
          expectRel(c.supportedCrankPower.value, (hand.crankHp * value) / hand.value, 1e-7);
        },
      ),
    );
  });

  it('a part rated exactly at the hand-worked requirement has zero headroom and supports the target', () => {
    fc.assert(
      fc.property(
        targetHp,
        basis,
        unit,
        fc.double({ min: 0, max: 40, noNaN: true }),
        fc.integer({ min: 1000, max: 6000 }),
        fc.integer({ min: 1, max: 16 }),
        (hp, b, u, loss, rpm, cylinders) => {
          const hand = handRequirement(
            u,
            { powerHp: hp, basis: b },
            { lossPct: loss, rpm, cylinders },
          );
          fc.pre(hand.value <= 100_000);
          const r = run({
            target: { powerHp: hp, basis: b },
            assumptions: { drivetrainLossPct: loss, peakRpm: rpm, cylinders },
            components: [part('x', 'other', hand.value, u)],
          });
          expect(Math.abs(r.components[0].headroomPct.value)).toBeLessThan(1e-5);
          expectRel(r.supported!.crankPower.value, hand.crankHp, 1e-7);
        },
      ),
    );
  });
});

describe('request schema', () => {
  const ok = { target: { powerHp: 600, basis: 'crank' } };
  const fieldsOf = (body: unknown) => {
    const res = estimateRequestSchema.safeParse(body);
    expect(res.success).toBe(false);
    return res.error!.issues.map((i) => i.path.join('.'));
  };

  it('fills every assumption with its default', () => {
    // defaults from issue 4 and reference.md (common practice; Chevron 2007 for density)
    expect(estimateRequestSchema.parse(ok).assumptions).toEqual({
      bsfc: 0.4,
      bsfcUnit: 'lb-per-hp-h',
      afr: 18,
      fuelDensityKgPerL: 0.85,
      drivetrainLossPct: 18,
      peakRpm: 3000,
      cylinders: 8,
      tightMarginPct: 10,
    });
  });

  it('refuses zero, negative, NaN, infinite and absurd values with the field named', () => {
    expect(fieldsOf({ target: { powerHp: 0, basis: 'crank' } })).toEqual(['target.powerHp']);
    expect(fieldsOf({ target: { powerHp: -5, basis: 'crank' } })).toEqual(['target.powerHp']);
    expect(fieldsOf({ target: { powerHp: Number.NaN, basis: 'crank' } })).toEqual([
      'target.powerHp',
    ]);
    expect(fieldsOf({ target: { powerHp: Infinity, basis: 'crank' } })).toEqual(['target.powerHp']);
    expect(fieldsOf({ target: { powerHp: 1e12, basis: 'crank' } })).toEqual(['target.powerHp']);
    expect(fieldsOf({ ...ok, assumptions: { drivetrainLossPct: 100 } })).toEqual([
      'assumptions.drivetrainLossPct',
    ]);
    expect(fieldsOf({ ...ok, assumptions: { peakRpm: 2500.5 } })).toEqual(['assumptions.peakRpm']);
    expect(
      fieldsOf({
        ...ok,
        components: [{ ...part('a', 'other', 1, 'hp-crank'), ratingUnit: 'furlongs' }],
      }),
    ).toEqual(['components.0.ratingUnit']);
  });

  it('refuses duplicate component ids, unknown keys and more than 500 components', () => {
    const a = part('a', 'other', 1, 'hp-crank');
    expect(fieldsOf({ ...ok, components: [a, a] })).toEqual(['components.1.id']);
    expect(fieldsOf({ ...ok, horsepower: 5 })).toEqual(['']);
    const many = Array.from({ length: 501 }, (_, i) => part(`p${i}`, 'other', 1, 'hp-crank'));
    expect(fieldsOf({ ...ok, components: many })).toEqual(['components']);
  });
});

describe('figures as the pages show them (issue #14)', () => {
  it('rounds a percentage to one decimal in the working as on the cards: 3.87 % reads 3.9 %', () => {
    // 760 ÷ 731.7 − 1 = 3.87 %: the card said +3.9 %, the working 3.87 %.
    expect(formatFigure(3.8666, '%')).toBe('3.9 %');
    expect(formatHeadroom(3.8666)).toBe('+3.9 %');
    expect(formatFigure(15.2466, '%')).toBe('15.2 %');
    // Other units keep their own digits; the API keeps every digit.
    expect(formatFigure(216.926, 'mm3-per-stroke')).toBe('216.9 mm³/stroke');
    expect(formatFigure(0.85, 'kg-per-l')).toBe('0.85 kg/L');
  });
});
