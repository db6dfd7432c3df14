import { describe, expect, it } from 'vitest';
import { defaultTestPoints, testPointPreset } from '@shared/bench';
import {
  benchCylinderIssues,
  benchSheetInputSchemaFor,
  createBenchSheetInputSchema,
  testPointSchema,
  updateBenchSheetInputSchema,
  updateBenchSheetInputSchemaFor,
} from '@shared/schemas/bench';
import { fieldsFromZod } from '@server/lib/errors';
import { nulMessage } from '@shared/schemas/common';

const partId = '6f1c1f0e-8a4b-4c55-9d7e-2f0a1b2c3d4e';

function sheet(overrides: Record<string, unknown> = {}) {
  const points = defaultTestPoints(['full-load', 'idle']);
  points[0]!.values = [52.0, 53.5, null, 51.2];
  points[1]!.values = [6.1, 6.0, 5.9, 6.2];
  return {
    partId,
    occasion: 'as received',
    testedOn: '2026-03-01',
    testedBy: 'Shop down the road',
    fluid: 'calibration fluid to ISO 4113',
    fluidTemperature: { value: 40, unit: 'c' },
    points,
    ...overrides,
  };
}

/** The field messages the API would answer with. */
function fieldsOf(schema: { safeParse: (v: unknown) => unknown }, value: unknown) {
  const r = schema.safeParse(value) as { success: boolean; error?: never };
  expect(r.success).toBe(false);
  return fieldsFromZod(r.error!);
}

describe('bench sheet schemas', () => {
  it('accepts a sheet with missing values and trims its text', () => {
    const r = createBenchSheetInputSchema.parse(sheet({ occasion: '  after rebuild ' }));
    expect(r.occasion).toBe('after rebuild');
    expect(r.points[0]!.values).toEqual([52.0, 53.5, null, 51.2]);
  });

  it('names the cell of a bad value', () => {
    const s = sheet();
    (s.points[0]!.values as unknown[])[2] = -1;
    (s.points[1]!.values as unknown[])[0] = '6.1';
    const fields = fieldsOf(createBenchSheetInputSchema, s);
    expect(fields['points.0.values.2']).toBe('A bench value cannot be negative');
    expect(fields['points.1.values.0']).toBe('Enter a number, or leave the cell empty');
  });

  it('refuses numbers that are not finite', () => {
    const s = sheet();
    (s.points[0]!.values as unknown[])[0] = Infinity;
    expect(fieldsOf(createBenchSheetInputSchema, s)['points.0.values.0']).toBeTruthy();
  });

  it('refuses the NUL character in any text', () => {
    const s = sheet({ notes: 'ok\u0000' });
    s.points[0]!.label = 'Full\u0000load';
    const fields = fieldsOf(createBenchSheetInputSchema, s);
    expect(fields.notes).toBe(nulMessage);
    expect(fields['points.0.label']).toBe(nulMessage);
  });

  it('bounds the test date to 1900-01-01 … 2100-12-31', () => {
    const ok = (d: string) => createBenchSheetInputSchema.safeParse(sheet({ testedOn: d })).success;
    expect(ok('1900-01-01')).toBe(true);
    expect(ok('2100-12-31')).toBe(true);
    expect(ok('1899-12-31')).toBe(false);
    expect(ok('2101-01-01')).toBe(false);
    expect(ok('2026-02-30')).toBe(false);
    expect(fieldsOf(createBenchSheetInputSchema, sheet({ testedOn: '1899-12-31' })).testedOn).toBe(
      'Use a date between 1900-01-01 and 2100-12-31',
    );
  });

  it('limits text lengths with a plain message', () => {
    const fields = fieldsOf(createBenchSheetInputSchema, sheet({ occasion: 'x'.repeat(121) }));
    expect(fields.occasion).toBe('Occasion must be at most 120 characters');
    expect(fieldsOf(createBenchSheetInputSchema, sheet({ occasion: '  ' })).occasion).toContain(
      'Say when the test was run',
    );
  });

  it('checks the fluid temperature in either unit', () => {
    const ok = (value: number, unit: string) =>
      createBenchSheetInputSchema.safeParse(sheet({ fluidTemperature: { value, unit } })).success;
    expect(ok(104, 'f')).toBe(true); // 40 °C
    expect(ok(104, 'c')).toBe(true);
    expect(ok(320, 'f')).toBe(false); // 160 °C
    expect(ok(40, 'k')).toBe(false);
    expect(createBenchSheetInputSchema.safeParse(sheet({ fluidTemperature: null })).success).toBe(
      true,
    );
  });

  it('needs a tolerance above zero and a known unit', () => {
    const s = sheet();
    s.points[0]!.tolerance = { type: 'percent', value: 0 };
    (s.points[1] as { unit: string }).unit = 'cc';
    const fields = fieldsOf(createBenchSheetInputSchema, s);
    expect(fields['points.0.tolerance.value']).toBe('A tolerance is above zero');
    expect(fields['points.1.unit']).toBe('Choose a unit from the list');
  });

  it('keeps each kind of point in its own units and rules', () => {
    const parse = (p: object) =>
      testPointSchema.safeParse({ ...testPointPreset('full-load'), ...p });
    const issues = (p: object) => {
      const r = parse(p);
      return r.success ? {} : fieldsFromZod(r.error);
    };
    expect(issues({ kind: 'opening-pressure', unit: 'mm3-per-stroke' }).unit).toContain(
      'pressure unit',
    );
    expect(issues({ unit: 'bar' }).unit).toContain('flow unit');
    expect(issues({ unit: 'ml-per-min' }).strokesPerMin).toBe(
      'Enter the stroke rate the ml/min were measured at',
    );
    expect(parse({ unit: 'ml-per-min', strokesPerMin: 1000 }).success).toBe(true);
    expect(issues({ returnLimit: 20 }).returnLimit).toBe(
      "Only a return-flow point has a maker's limit",
    );
    const ret = testPointPreset('return-flow');
    const retIssues = (p: object) => {
      const r = testPointSchema.safeParse({ ...ret, ...p });
      return r.success ? {} : fieldsFromZod(r.error);
    };
    expect(retIssues({ tolerance: { type: 'percent', value: 5 } })['tolerance.type']).toBeTruthy();
    expect(retIssues({ nominal: 10 }).nominal).toContain("maker's limit");
    expect(retIssues({ returnLimit: 20 })).toEqual({});
    expect(issues({ tolerance: { type: 'percent', value: 101 } })['tolerance.value']).toBeTruthy();
    expect(issues({ kind: 'custom', unit: 'psi' })).toEqual({});
  });

  it('wants a label for each point, different from the others', () => {
    const s = sheet();
    s.points[1]!.label = ' full  LOAD ';
    expect(fieldsOf(createBenchSheetInputSchema, s)['points.1.label']).toBe(
      'Point 1 already has this label; give each point its own',
    );
    expect(fieldsOf(createBenchSheetInputSchema, sheet({ points: [] })).points).toBe(
      'Add at least one test point',
    );
  });

  it('refuses unknown fields', () => {
    expect(fieldsOf(createBenchSheetInputSchema, sheet({ bogus: 1 })).bogus).toBe('Unknown field');
  });

  it('holds positions to the build’s cylinders, naming each cell beyond', () => {
    const s = sheet();
    s.points[1]!.values = [6.1, 6.0, 5.9, 6.2, 6.3, null];
    const fields = fieldsOf(benchSheetInputSchemaFor(4), s);
    expect(fields['points.1.values.4']).toBe("Injector 5 is beyond the build's 4 cylinders");
    expect(fields['points.1.values.5']).toBe("Injector 6 is beyond the build's 4 cylinders");
    expect(benchSheetInputSchemaFor(6).safeParse(s).success).toBe(true);
    expect(benchCylinderIssues(s.points, 6)).toEqual([]);
    expect(() => benchSheetInputSchemaFor(0)).toThrow(RangeError);
    expect(() => benchSheetInputSchemaFor(17)).toThrow(RangeError);
  });

  it('an edit sends only what changed', () => {
    expect(updateBenchSheetInputSchema.parse({ notes: 'retested' })).toEqual({ notes: 'retested' });
    expect(updateBenchSheetInputSchema.safeParse({}).success).toBe(false);
    const points = defaultTestPoints(['full-load']);
    points[0]!.values = [1, 2, 3];
    expect(updateBenchSheetInputSchemaFor(2).safeParse({ points }).success).toBe(false);
    expect(updateBenchSheetInputSchemaFor(3).safeParse({ points }).success).toBe(true);
  });
});
