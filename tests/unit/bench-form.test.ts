import { describe, expect, it } from 'vitest';
import { analyseBenchSheet } from '@shared/bench';
import { canChangeBenchSheet, canDeleteBenchSheet, roles } from '@shared/permissions';
import {
  emptySheetForm,
  previewPoints,
  sheetIssues,
  sheetResolver,
  toInput,
  withKind,
  type SheetForm,
} from '@/features/bench/lib/sheet-form';

const partId = '5b0c7f0e-3c1a-4a52-9d4b-1f2e3d4c5b6a';

/** A new sheet for six injectors with the first point (full load) typed in as `full`. */
function typed(full: string[], extra: Partial<SheetForm> = {}): SheetForm {
  const form = emptySheetForm(6, partId, '2026-11-02');
  form.occasion = 'As received';
  form.points[0]!.values = full;
  return { ...form, ...extra };
}

describe('the entry form’s sheet', () => {
  it('turns typed cells into numbers, empty cells into “not measured”, a decimal comma into a point', () => {
    const { input, issues } = toInput(typed(['52.0', '52,3', '', '51.8', ' 52.1 ', '']));
    expect(issues).toEqual({});
    // Trailing empty cells are not measured; the list simply ends.
    expect(input.points[0]!.values).toEqual([52, 52.3, null, 51.8, 52.1]);
    expect(input.points[1]!.values).toEqual([]);
    expect(input.fluidTemperature).toBeNull();
  });

  it('names each cell that cannot be read, and the schema’s problems by the same paths as the API', async () => {
    const form = typed(['52.0', 'abc', '-1', '52.2', '52.1', '52.4']);
    form.points[1]!.tolerance.value = '0';
    form.occasion = '';
    const issues = sheetIssues(form, 6);
    expect(issues['points.0.values.1']).toMatch(/"abc" is not a number/);
    expect(issues['points.0.values.2']).toBe('A bench value cannot be negative');
    expect(issues['points.1.tolerance.value']).toBe('A tolerance is above zero');
    expect(issues.occasion).toMatch(/Say when the test was run/);

    const resolved = await sheetResolver(6)(form, undefined, {
      fields: {},
      shouldUseNativeValidation: false,
    });
    expect(resolved.values).toEqual({});
    expect(
      (resolved.errors as { points?: { values?: { message?: string }[] }[] }).points?.[0]
        ?.values?.[1]?.message,
    ).toMatch(/not a number/);
  });

  it('gives the server’s input for a good sheet', async () => {
    const form = typed(['52.0', '52.3', '51.8', '52.1', '50.2', '52.2']);
    const resolved = await sheetResolver(6)(form, undefined, {
      fields: {},
      shouldUseNativeValidation: false,
    });
    expect(resolved.errors).toEqual({});
    expect(resolved.values).toMatchObject({
      partId,
      occasion: 'As received',
      testedOn: '2026-11-02',
      points: [{ kind: 'full-load', values: [52, 52.3, 51.8, 52.1, 50.2, 52.2] }, {}, {}, {}, {}],
    });
  });

  it('previews what the values say, leaving out a point whose settings are unfinished', () => {
    const form = typed(['52.0', '52.3', '51.8', '52.1', '50.2', '52.2']);
    form.points[4]!.values = ['12', '12.1', '25.6', '12.4', '11.9', '12.2'];
    form.points[2]!.tolerance.value = '';
    const usable = previewPoints(form);
    expect(usable.map((u) => u.index)).toEqual([0, 1, 3, 4]);
    const result = analyseBenchSheet({ points: usable.map((u) => u.point) }, { cylinders: 6 });
    expect(result.verdict).toMatch(/^Injector 3 is worn/);
  });

  it('gives a point changed to another kind that kind’s unit and default tolerance', () => {
    const form = typed([]);
    const pressure = withKind(form.points[0]!, 'opening-pressure');
    expect(pressure).toMatchObject({
      kind: 'opening-pressure',
      label: 'Opening pressure',
      unit: 'bar',
      tolerance: { type: 'absolute', value: '10' },
    });
    const named = withKind({ ...form.points[0]!, label: 'NOP 1' }, 'opening-pressure');
    expect(named.label).toBe('NOP 1');
  });
});

describe('who may change a bench sheet', () => {
  const shop = 'shop-user';
  const byShop = { shopUserId: shop };
  const byGarage = { shopUserId: null };

  it('lets the owner change and delete any sheet', () => {
    expect(canChangeBenchSheet('owner', 'o', byShop)).toBe(true);
    expect(canDeleteBenchSheet('owner', 'o', byShop)).toBe(true);
  });

  it('lets crew change the garage’s sheets but never a shop’s, and delete none', () => {
    expect(canChangeBenchSheet('crew', 'c', byGarage)).toBe(true);
    expect(canChangeBenchSheet('crew', 'c', byShop)).toBe(false);
    expect(canDeleteBenchSheet('crew', 'c', byGarage)).toBe(false);
  });

  it('lets a shop change and delete only its own sheets, and a viewer nothing', () => {
    expect(canChangeBenchSheet('shop', shop, byShop)).toBe(true);
    expect(canDeleteBenchSheet('shop', shop, byShop)).toBe(true);
    expect(canChangeBenchSheet('shop', 'another-shop', byShop)).toBe(false);
    expect(canChangeBenchSheet('shop', shop, byGarage)).toBe(false);
    for (const sheet of [byShop, byGarage]) {
      expect(canChangeBenchSheet('viewer', 'v', sheet)).toBe(false);
      expect(canDeleteBenchSheet('viewer', 'v', sheet)).toBe(false);
    }
    expect(roles.filter((r) => canChangeBenchSheet(r, 'x', byGarage))).toEqual(['owner', 'crew']);
  });
});
