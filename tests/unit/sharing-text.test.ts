import { describe, expect, it } from 'vitest';
import type { ViewDynoBest, ViewFastener } from '@shared/schemas/sharing';
import {
  dynoPower,
  dynoTorque,
  headroomText,
  percent,
  readingsText,
} from '@/features/sharing/components/view-text';

const fastener = (over: Partial<ViewFastener>): ViewFastener => ({
  name: 'Head stud nuts',
  count: 8,
  target: { value: 100, unit: 'lbf·ft' },
  tolerance: '± 5 %',
  threadCondition: 'Oiled',
  finalAngleDeg: null,
  recorded: 0,
  inSpec: 0,
  outOfSpec: 0,
  outOfSpecPositions: [],
  retorque: { asked: false, description: null, closed: false },
  ...over,
});

describe('the shared page and build sheet put numbers into words', () => {
  it('signs headroom and rounds it to one decimal, with a true minus', () => {
    expect(headroomText(3.94)).toBe('+3.9 %');
    expect(headroomText(-4.25)).toBe('−4.3 %');
    expect(headroomText(0.01)).toBe('0 %');
  });

  it('says how many torque readings are in spec and which positions are out', () => {
    expect(readingsText(fastener({}))).toBe('Not read yet');
    expect(readingsText(fastener({ recorded: 8, inSpec: 8 }))).toBe('8 of 8 in spec');
    expect(
      readingsText(fastener({ recorded: 5, inSpec: 3, outOfSpec: 2, outOfSpecPositions: [2, 7] })),
    ).toBe('3 of 8 in spec; 2 out of spec (#2, #7)');
  });

  it('never rounds progress up to a whole that is not there', () => {
    expect(percent(199, 200)).toBe(99);
    expect(percent(0, 0)).toBe(0);
  });

  it('reads a dyno best with its basis and rpm', () => {
    const best: ViewDynoBest = {
      basis: 'wheel',
      peakPower: 582.4,
      powerUnit: 'hp',
      peakPowerRpm: 2950,
      peakTorque: 1135.2,
      torqueUnit: 'lbf-ft',
      peakTorqueRpm: 2250,
    };
    expect(dynoPower(best)).toBe('582 wheel hp at 2,950 rpm');
    expect(dynoTorque(best)).toBe('1,135 lbf·ft at 2,250 rpm');
    expect(dynoPower({ ...best, powerUnit: 'kw', peakPower: 434 })).toBe(
      '434 kW (wheel) at 2,950 rpm',
    );
  });
});
