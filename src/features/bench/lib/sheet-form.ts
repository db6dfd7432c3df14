/**
 * The entry form's model: the sheet as typed (every number still a string, so
 * a bad cell keeps what was typed and can be named), and its conversion to the
 * API's input, checked by the same schema the server uses. Error paths are the
 * API's (`points.2.values.4`), so server errors land on the same cells.
 */
import type { FieldErrors, Resolver } from 'react-hook-form';
import { readNumber } from '@shared/numbers';
import {
  defaultTestPoints,
  defaultToleranceFor,
  defaultUnitOfKind,
  readBenchCell,
  testPointKindLabels,
  testPointPreset,
  type BenchUnit,
  type TestPointKind,
  type ToleranceType,
} from '@shared/bench';
import {
  benchSheetInputSchemaFor,
  type BenchSheet,
  type CreateBenchSheetInput,
  type FluidTemperatureUnit,
  type TestPointInput,
} from '@shared/schemas/bench';

export type PointForm = {
  kind: TestPointKind;
  label: string;
  unit: BenchUnit;
  strokesPerMin: string;
  condition: string;
  nominal: string;
  tolerance: { type: ToleranceType; value: string };
  returnLimit: string;
  /** One per injector position, as typed. */
  values: string[];
};

export type SheetForm = {
  partId: string;
  occasion: string;
  testedOn: string;
  testedBy: string;
  fluid: string;
  fluidTemperature: { value: string; unit: FluidTemperatureUnit };
  notes: string;
  points: PointForm[];
};

const text = (n: number | null | undefined) => (n === null || n === undefined ? '' : String(n));

function pointForm(p: TestPointInput, cylinders: number): PointForm {
  return {
    kind: p.kind,
    label: p.label,
    unit: p.unit,
    strokesPerMin: text(p.strokesPerMin),
    condition: p.condition ?? '',
    nominal: text(p.nominal),
    tolerance: { type: p.tolerance.type, value: text(p.tolerance.value) },
    returnLimit: text(p.returnLimit),
    values: Array.from({ length: cylinders }, (_, i) => text(p.values[i])),
  };
}

/** A new point of a kind with Headroom's defaults, its cells empty. */
export function newPointForm(kind: TestPointKind, cylinders: number): PointForm {
  return pointForm(testPointPreset(kind), cylinders);
}

/** A point changed to another kind: its defaults, keeping a label the person typed. */
export function withKind(point: PointForm, kind: TestPointKind): PointForm {
  const preset = testPointPreset(kind);
  const typedLabel = !Object.values(testPointKindLabels).includes(point.label.trim());
  const tolerance = defaultToleranceFor(kind, { unit: defaultUnitOfKind[kind] })!;
  return {
    ...point,
    kind,
    label: typedLabel && point.label.trim() ? point.label : preset.label,
    unit: defaultUnitOfKind[kind],
    nominal: kind === 'return-flow' ? '' : point.nominal,
    returnLimit: kind === 'return-flow' ? point.returnLimit : '',
    tolerance: { type: tolerance.type, value: String(tolerance.value) },
  };
}

export function emptySheetForm(cylinders: number, partId = '', today = ''): SheetForm {
  return {
    partId,
    occasion: '',
    testedOn: today,
    testedBy: '',
    fluid: '',
    fluidTemperature: { value: '', unit: 'c' },
    notes: '',
    points: defaultTestPoints().map((p) => pointForm(p, cylinders)),
  };
}

export function sheetFormFrom(sheet: BenchSheet, cylinders: number): SheetForm {
  return {
    partId: sheet.partId,
    occasion: sheet.occasion,
    testedOn: sheet.testedOn,
    testedBy: sheet.testedBy,
    fluid: sheet.fluid,
    fluidTemperature: sheet.fluidTemperature
      ? { value: String(sheet.fluidTemperature.value), unit: sheet.fluidTemperature.unit }
      : { value: '', unit: 'c' },
    notes: sheet.notes,
    points: sheet.points.map((p) => pointForm(p, cylinders)),
  };
}

type Issues = Record<string, string>;

/** A figure of the point's settings, read by the one number reader: empty is "none". */
function figure(raw: string, path: string, issues: Issues, signed = false): number | null {
  const reading = readNumber(raw);
  if (reading.ok && (signed || reading.value === null || reading.value >= 0)) return reading.value;
  issues[path] = signed ? 'Enter a number' : 'Enter a number of zero or more';
  return null;
}

/**
 * The typed sheet as the API's input. Every cell is read with the bench's own
 * cell reader; what cannot be read is an issue at its path and the value is
 * left out (null), so the rest still converts.
 */
export function toInput(form: SheetForm): { input: CreateBenchSheetInput; issues: Issues } {
  const issues: Issues = {};
  const temperature = figure(form.fluidTemperature.value, 'fluidTemperature.value', issues, true);
  const points = form.points.map((p, i) => {
    const at = `points.${i}`;
    const values = p.values.map((raw, j) => {
      const reading = readBenchCell(raw);
      if (reading.ok) return reading.value;
      issues[`${at}.values.${j}`] = reading.message;
      return null;
    });
    // Trailing empty cells are simply not measured.
    while (values.length && values[values.length - 1] === null) values.pop();
    const tolerance = figure(p.tolerance.value, `${at}.tolerance.value`, issues);
    const point = {
      kind: p.kind,
      label: p.label,
      unit: p.unit,
      strokesPerMin: figure(p.strokesPerMin, `${at}.strokesPerMin`, issues),
      condition: p.condition,
      nominal: p.kind === 'return-flow' ? null : figure(p.nominal, `${at}.nominal`, issues),
      tolerance: { type: p.tolerance.type, value: tolerance ?? Number.NaN },
      returnLimit:
        p.kind === 'return-flow' ? figure(p.returnLimit, `${at}.returnLimit`, issues) : null,
      values,
    };
    return point;
  });
  const input = {
    partId: form.partId,
    occasion: form.occasion,
    testedOn: form.testedOn,
    testedBy: form.testedBy,
    fluid: form.fluid,
    fluidTemperature:
      temperature === null ? null : { value: temperature, unit: form.fluidTemperature.unit },
    notes: form.notes,
    points,
  } as CreateBenchSheetInput;
  return { input, issues };
}

/** The form's paths (as the API names them) mapped to react-hook-form's nested errors. */
function nest(issues: Issues): FieldErrors<SheetForm> {
  const out: Record<string, unknown> = {};
  for (const [path, message] of Object.entries(issues)) {
    const keys = path.split('.');
    let node = out;
    keys.forEach((key, i) => {
      if (i === keys.length - 1) node[key] = { type: 'validate', message };
      else node = (node[key] ??= {}) as Record<string, unknown>;
    });
  }
  return out as FieldErrors<SheetForm>;
}

/** Every issue of a typed sheet: unreadable cells first, then the shared schema for the build. */
export function sheetIssues(form: SheetForm, cylinders: number): Issues {
  const { input, issues } = toInput(form);
  const parsed = benchSheetInputSchemaFor(cylinders).safeParse(input);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const path = issue.path.join('.') || 'root';
      // A cell already named as unreadable keeps that message.
      issues[path] ??= issue.message;
    }
  }
  return issues;
}

/** The resolver: the shared schema for this build's cylinders, on the converted sheet. */
export function sheetResolver(
  cylinders: number,
): Resolver<SheetForm, unknown, CreateBenchSheetInput> {
  return async (values) => {
    const { input } = toInput(values);
    const issues = sheetIssues(values, cylinders);
    if (Object.keys(issues).length) return { values: {}, errors: nest(issues) };
    return { values: benchSheetInputSchemaFor(cylinders).parse(input), errors: {} };
  };
}

/**
 * What the grid can preview while typing: the points whose settings are
 * complete, with the cells that read as numbers (bad cells count as empty).
 */
export function previewPoints(form: SheetForm) {
  const { input, issues } = toInput(form);
  return input.points
    .map((p, index) => ({ point: p, index }))
    .filter(
      ({ point, index }) =>
        Number.isFinite(point.tolerance.value) &&
        point.tolerance.value > 0 &&
        point.label.trim() !== '' &&
        !Object.keys(issues).some(
          (k) => k.startsWith(`points.${index}.`) && !k.includes('.values.'),
        ),
    );
}
