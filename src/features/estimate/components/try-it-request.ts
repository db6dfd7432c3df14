import { parseNumber } from '@shared/numbers';
import { estimateRequestSchema, type EstimateRequestInput } from '@shared/schemas/estimate';
import type { PartCategory, RatingUnit } from '@shared/schemas/parts';

/* The landing calculator's boxes and the estimate request they make. */

export type PartKey = 'bottomEnd' | 'injectors' | 'turbo' | 'transmission';

export const partFields: {
  key: PartKey;
  label: string;
  category: PartCategory;
  unit: RatingUnit;
  name: string;
}[] = [
  {
    key: 'bottomEnd',
    label: 'Bottom end',
    category: 'bottom-end',
    unit: 'hp-crank',
    name: 'Bottom end',
  },
  {
    key: 'injectors',
    label: 'Injectors',
    category: 'fuel-injection',
    unit: 'mm3-per-stroke',
    name: 'Injectors',
  },
  {
    key: 'turbo',
    label: 'Turbocharger',
    category: 'turbocharger',
    unit: 'lb-per-min',
    name: 'Turbocharger',
  },
  {
    key: 'transmission',
    label: 'Transmission',
    category: 'transmission',
    unit: 'lbf-ft',
    name: 'Transmission',
  },
];

export type Fields = {
  powerHp: string;
  basis: 'crank' | 'wheel';
  cylinders: string;
} & Record<PartKey, string>;

// A common-rail V8 pickup with a stock bottom end: the bottom end is the one to watch.
export const initial: Fields = {
  powerHp: '600',
  basis: 'wheel',
  cylinders: '8',
  bottomEnd: '760',
  injectors: '250',
  turbo: '105',
  transmission: '1500',
};

/** Empty is NaN here too: the schema then says the box needs a number. */
const num = (text: string): number => parseNumber(text) ?? Number.NaN;

/** The request the boxes make, or the field messages that stop it. Empty part boxes are left out. */
export function toRequest(
  f: Fields,
):
  | { request: EstimateRequestInput; errors: null }
  | { request: null; errors: Record<string, string> } {
  const request: EstimateRequestInput = {
    target: { powerHp: num(f.powerHp), basis: f.basis },
    assumptions: { cylinders: num(f.cylinders) },
    components: partFields
      .filter((p) => f[p.key].trim() !== '')
      .map((p) => ({
        id: p.key,
        name: p.name,
        category: p.category,
        ratingValue: num(f[p.key]),
        ratingUnit: p.unit,
      })),
  };
  const parsed = estimateRequestSchema.safeParse(request);
  if (parsed.success) return { request, errors: null };
  const errors: Record<string, string> = {};
  for (const issue of parsed.error.issues) {
    const [head, second, third] = issue.path;
    const field =
      head === 'target'
        ? 'powerHp'
        : head === 'assumptions'
          ? 'cylinders'
          : head === 'components' && typeof second === 'number' && third === 'ratingValue'
            ? (request.components?.[second]?.id ?? '')
            : '';
    if (field) errors[field] ??= issue.message;
  }
  return { request: null, errors };
}
