import { describe, expect, it } from 'vitest';
import { cautionsForStep } from '@shared/install-log/cautions';
import {
  describeRetorque,
  openReadingKind,
  readingKindRefusal,
  retorqueState,
} from '@shared/install-log/retorque';
import { signOffBlockers } from '@shared/install-log/sign-off';
import { fastenerSpecIssues } from '@shared/schemas/install-log';

describe('sign-off blockers', () => {
  const fastener = (positions: ({ verdict: 'in-spec' | 'under' | 'over' } | null)[]) => ({
    id: 'f1',
    name: 'Hold-down bolts',
    count: positions.length,
    positions: positions.map((p, i) => ({
      position: i + 1,
      current: p ? { ...p, value: 20, unit: 'n-m' as const } : null,
    })),
  });

  it('has none when every position reads in spec and every check is ticked', () => {
    expect(
      signOffBlockers({
        fasteners: [fastener([{ verdict: 'in-spec' }, { verdict: 'in-spec' }])],
        checklist: [{ id: 'c', label: 'Seals new', done: true }],
      }),
    ).toEqual([]);
  });

  it('names out-of-spec positions, positions without a reading and unticked checks', () => {
    const blockers = signOffBlockers({
      fasteners: [fastener([{ verdict: 'in-spec' }, { verdict: 'under' }, null, null])],
      checklist: [{ id: 'c1', label: 'Crush washer replaced', done: false }],
    });
    expect(blockers.map((b) => b.kind)).toEqual(['out-of-spec', 'missing-readings', 'unticked']);
    expect(blockers[0]).toMatchObject({ position: 2, verdict: 'under' });
    expect(blockers[1]).toMatchObject({ positions: [3, 4] });
    expect(blockers[0].message).toMatch(/#2: under spec \(20 N·m\)/);
  });
});

describe('re-torque checks', () => {
  it('waits for sign-off, is open until every position reads in spec, then done', () => {
    expect(
      retorqueState({ signedOff: false, closed: false, count: 2, currentRetorque: [null, null] }),
    ).toBe('waiting');
    expect(
      retorqueState({
        signedOff: true,
        closed: false,
        count: 2,
        currentRetorque: ['in-spec', null],
      }),
    ).toBe('open');
    expect(
      retorqueState({
        signedOff: true,
        closed: false,
        count: 2,
        currentRetorque: ['in-spec', 'under'],
      }),
    ).toBe('open');
    expect(
      retorqueState({
        signedOff: true,
        closed: false,
        count: 2,
        currentRetorque: ['in-spec', 'in-spec'],
      }),
    ).toBe('done');
    expect(
      retorqueState({ signedOff: true, closed: true, count: 2, currentRetorque: [null, null] }),
    ).toBe('done');
  });

  it('says when the check is due', () => {
    expect(describeRetorque({ retorqueAfterHeatCycles: 3, retorqueAfterMiles: null })).toBe(
      'after 3 heat cycles',
    );
    expect(describeRetorque({ retorqueAfterHeatCycles: 1, retorqueAfterMiles: 500 })).toBe(
      'after 1 heat cycle or 500 miles, whichever comes first',
    );
  });
});

describe('cautions', () => {
  const step = {
    title: 'Fit',
    description: '',
    partCategories: [] as string[],
    liftsVehicle: false,
    fastenerCount: 0,
  };

  it('shows the high-pressure fuel caution for fuel-injection parts or injector work', () => {
    expect(
      cautionsForStep({ ...step, partCategories: ['fuel-injection'] }).map((c) => c.id),
    ).toEqual(['high-pressure-fuel']);
    expect(cautionsForStep({ ...step, title: 'Seat the injectors' }).map((c) => c.id)).toEqual([
      'high-pressure-fuel',
    ]);
    expect(
      cautionsForStep({ ...step, title: 'Swap the lift pump', partCategories: ['fuel-supply'] }),
    ).toEqual([]);
  });

  it('shows the stands caution when the truck or cab is raised, not for a lift pump', () => {
    expect(cautionsForStep({ ...step, liftsVehicle: true }).map((c) => c.id)).toEqual(['lifting']);
    expect(
      cautionsForStep({ ...step, description: 'Lift the cab about 4 in.' }).map((c) => c.id),
    ).toEqual(['lifting']);
    expect(cautionsForStep({ ...step, description: 'Prime with the lift pump' })).toEqual([]);
  });

  it('shows the service-information caution on any step with a torque spec', () => {
    const c = cautionsForStep({ ...step, fastenerCount: 1 });
    expect(c.map((x) => x.id)).toEqual(['service-information']);
    expect(c[0].text).toMatch(/maker's service information/);
  });
});

describe('fastener spec consistency', () => {
  it('refuses a tolerance as large as the target and stages above the final torque', () => {
    expect(
      fastenerSpecIssues({ targetValue: 10, toleranceType: 'value', toleranceValue: 10 }),
    ).toHaveProperty('toleranceValue');
    expect(
      fastenerSpecIssues({ targetValue: 10, toleranceType: 'percent', toleranceValue: 100 }),
    ).toHaveProperty('toleranceValue');
    expect(fastenerSpecIssues({ targetValue: 50, stages: [20, 60] })).toHaveProperty('stages');
    expect(
      fastenerSpecIssues({
        targetValue: 50,
        toleranceType: 'percent',
        toleranceValue: 5,
        stages: [20, 40],
      }),
    ).toEqual({});
  });
});

// The reading-kind rule the fastener service enforces and the step page follows.
describe('which reading a fastener takes', () => {
  it('takes fitting readings while the step is open, whether or not a re-check is asked', () => {
    expect(openReadingKind({ signedOff: false, retorqueAsked: true })).toBe('install');
    expect(openReadingKind({ signedOff: false, retorqueAsked: false })).toBe('install');
    expect(readingKindRefusal('retorque', { signedOff: false, retorqueAsked: true })).toBe(
      'step-not-signed-off',
    );
  });

  it('takes only re-torque checks once signed off, and only when the spec asks for one', () => {
    expect(openReadingKind({ signedOff: true, retorqueAsked: true })).toBe('retorque');
    expect(readingKindRefusal('install', { signedOff: true, retorqueAsked: true })).toBe(
      'step-signed-off',
    );
    expect(openReadingKind({ signedOff: true, retorqueAsked: false })).toBeNull();
    expect(readingKindRefusal('retorque', { signedOff: true, retorqueAsked: false })).toBe(
      'no-retorque',
    );
  });
});
