import { describe, expect, it } from 'vitest';
import { cautionsForStep, suggestCautions } from '@shared/install-log/cautions';
import { cylinderNames, positionLabel, positionList } from '@shared/install-log/positions';
import { signOffBlockers } from '@shared/install-log/sign-off';
import { calibrationDueOn, calibrationOn } from '@shared/install-log/wrenches';
import { fastenerSpecIssues } from '@shared/schemas/install-log';

const step = { title: 'Fit', description: '', partCategories: [] as string[] };
const ids = (s: Partial<typeof step>) => suggestCautions({ ...step, ...s }).map((c) => c.id);

describe('caution suggestions', () => {
  it('catch the wording the garage uses for high-pressure fuel work', () => {
    for (const title of [
      'Replacing the high-pressure pump',
      'Replace the high pressure fuel pump',
      'Swap the injection pump',
      'New injection lines',
      'Torque the injector lines',
      'Bleed the fuel rail',
      'Install the HP pump',
    ]) {
      expect(ids({ title }), title).toEqual(['high-pressure-fuel']);
    }
    // The low-pressure side is not the high-pressure caution.
    expect(ids({ title: 'Swap the lift pump', partCategories: ['fuel-supply'] })).toEqual([]);
  });

  it('catch pulling the cab and putting the truck on a lift, but not a lift pump', () => {
    for (const title of [
      'Pulling the cab',
      'Pull the cab off',
      'Cab-off head stud job prep',
      'Put the truck on a lift',
      'Put it on the two-post lift',
      'Jack up the front',
      'Set it on jack stands',
    ]) {
      expect(ids({ title }), title).toContain('lifting');
    }
    expect(ids({ description: 'Prime with the lift pump' })).toEqual([]);
  });

  it('suggest critical fasteners from head and bottom-end parts and words', () => {
    expect(ids({ partCategories: ['head-and-studs'] })).toEqual(['critical-fastener']);
    expect(ids({ title: 'Torque the rod bolts' })).toEqual(['critical-fastener']);
    expect(ids({ title: 'Flexplate to converter' })).toEqual(['critical-fastener']);
  });

  it('say why each caution is suggested', () => {
    const [s] = suggestCautions({
      ...step,
      title: 'New injection lines',
      partCategories: ['fuel-injection'],
    });
    expect(s.reasons).toEqual(['Linked part in Fuel injection', 'Says “injection lines”']);
  });
});

describe('cautions shown', () => {
  const base = { ...step, liftsVehicle: false, fastenerCount: 0 };
  it('are the ticked ones, whatever the words, once the author has chosen', () => {
    expect(
      cautionsForStep({ ...base, title: 'Wipe down', chosen: ['high-pressure-fuel'] }).map(
        (c) => c.id,
      ),
    ).toEqual(['high-pressure-fuel']);
    expect(
      cautionsForStep({ ...base, title: 'Seat the injectors', chosen: [] }).map((c) => c.id),
    ).toEqual([]);
  });

  it('are the suggested ones while nobody has chosen, and service information with a spec', () => {
    expect(
      cautionsForStep({ ...base, title: 'Pull the cab', fastenerCount: 1 }).map((c) => c.id),
    ).toEqual(['lifting', 'service-information']);
    const critical = cautionsForStep({ ...base, chosen: ['critical-fastener'] })[0];
    expect(critical.text).toMatch(/maker's service information/);
  });
});

describe('position names', () => {
  it('name positions when the spec has names, and number them otherwise', () => {
    expect(positionLabel([], 3)).toBe('#3');
    expect(positionLabel(cylinderNames(8), 3)).toBe('Cyl 3');
    expect(positionList(['Cyl 1', 'Cyl 2', 'Cyl 3'], [1, 3])).toBe('Cyl 1, Cyl 3');
  });

  it('are used in the sign-off blockers', () => {
    const blockers = signOffBlockers({
      fasteners: [
        {
          id: 'f',
          name: 'Injector hold-downs',
          count: 2,
          positionNames: ['Cyl 1', 'Cyl 2'],
          positions: [
            { position: 1, current: { verdict: 'over', value: 40, unit: 'lbf-ft' } },
            { position: 2, current: null },
          ],
        },
      ],
      checklist: [],
    });
    expect(blockers.map((b) => b.message)).toEqual([
      'Injector hold-downs Cyl 1: over spec (40 lbf·ft)',
      'Injector hold-downs: no reading for Cyl 2',
    ]);
  });

  it('must name every position once, or none', () => {
    expect(fastenerSpecIssues({ count: 3, positionNames: ['Cyl 1', 'Cyl 2'] })).toEqual({
      positionNames: 'Give 3 names, one per position, or none',
    });
    expect(fastenerSpecIssues({ count: 2, positionNames: ['Cyl 1', 'cyl 1'] })).toEqual({
      positionNames: 'Give each position its own name',
    });
    expect(fastenerSpecIssues({ count: 2, positionNames: [] })).toEqual({});
  });
});

describe('wrench calibration', () => {
  it('falls due the same day some months later, or the last day of a shorter month', () => {
    expect(calibrationDueOn('2025-03-14', 12)).toBe('2026-03-14');
    expect(calibrationDueOn('2025-08-31', 6)).toBe('2026-02-28');
    expect(calibrationDueOn('2023-08-31', 6)).toBe('2024-02-29');
    expect(calibrationDueOn('2025-11-30', 3)).toBe('2026-02-28');
  });

  it('is overdue only after the due day, and unknown without a date', () => {
    expect(calibrationOn('2025-03-14', 12, '2026-03-14').overdue).toBe(false);
    expect(calibrationOn('2025-03-14', 12, '2026-03-15')).toEqual({
      calibratedOn: '2025-03-14',
      dueOn: '2026-03-14',
      overdue: true,
    });
    expect(calibrationOn(null, 12, '2026-03-15')).toEqual({
      calibratedOn: null,
      dueOn: null,
      overdue: false,
    });
  });
});
