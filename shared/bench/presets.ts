/** Ready-made test points for a new sheet (they need the sheet schema's types, so they live apart from points.ts). */
import type { TestPointInput } from '@shared/schemas/bench';
import {
  defaultToleranceFor,
  defaultUnitOfKind,
  testPointKindLabels,
  type TestPointKind,
} from './points';

/** A new test point of a kind, with Headroom's default label, unit and tolerance and no values. */
export function testPointPreset(kind: TestPointKind): TestPointInput {
  const unit = defaultUnitOfKind[kind];
  const tolerance = defaultToleranceFor(kind, { unit })!;
  return {
    kind,
    label: testPointKindLabels[kind],
    unit,
    tolerance: { type: tolerance.type, value: tolerance.value },
    values: [],
  };
}

/** The points a new sheet starts with: the usual common-rail test plan. */
export const defaultPresetKinds: readonly TestPointKind[] = [
  'full-load',
  'part-load',
  'idle',
  'pilot',
  'return-flow',
];

/**
 * A preset list of test points for a new sheet (fresh objects each call):
 * full load, part load, idle, pilot and return flow in mm³/stroke with the
 * default tolerances above. Pass other kinds, e.g. `['opening-pressure',
 * 'full-load']` for a mechanical injector.
 */
export function defaultTestPoints(
  kinds: readonly TestPointKind[] = defaultPresetKinds,
): TestPointInput[] {
  return kinds.map(testPointPreset);
}
