import { useEffect, useId, useMemo, useState, type ReactNode } from 'react';
import { CircleCheck, Info } from 'lucide-react';
import { estimate } from '../../../../shared/estimate';
import { parseNumber } from '../../../../shared/numbers';
import {
  estimateRequestSchema,
  type EstimateRequestInput,
  type EstimateResult,
} from '../../../../shared/schemas/estimate';
import {
  partCategoryLabels,
  type PartCategory,
  type RatingUnit,
} from '../../../../shared/schemas/parts';
import { paths } from '../../../config/paths';
import { ButtonLink } from '../../../components/ui/button';
import { cn } from '../../../components/ui/cn';
import { SelectInput } from '../../../components/ui/form-field';
import { NumberInput } from '../../../components/ui/number-input';
import { useStatelessEstimate } from '../api/post-estimate';
import {
  capitalise,
  categoryPhrase,
  formatFigure,
  formatHeadroom,
  formatShortfall,
} from '../format';
import { StatusBadge } from './status-badge';

type PartKey = 'bottomEnd' | 'injectors' | 'turbo' | 'transmission';

const partFields: {
  key: PartKey;
  label: string;
  category: PartCategory;
  unit: RatingUnit;
  suffix: string;
  name: string;
}[] = [
  {
    key: 'bottomEnd',
    label: 'Bottom end',
    category: 'bottom-end',
    unit: 'hp-crank',
    suffix: 'crank hp',
    name: 'Bottom end',
  },
  {
    key: 'injectors',
    label: 'Injectors',
    category: 'fuel-injection',
    unit: 'mm3-per-stroke',
    suffix: 'mm³/stroke',
    name: 'Injectors',
  },
  {
    key: 'turbo',
    label: 'Turbocharger',
    category: 'turbocharger',
    unit: 'lb-per-min',
    suffix: 'lb/min',
    name: 'Turbocharger',
  },
  {
    key: 'transmission',
    label: 'Transmission',
    category: 'transmission',
    unit: 'lbf-ft',
    suffix: 'lbf·ft',
    name: 'Transmission',
  },
];

type Fields = {
  powerHp: string;
  basis: 'crank' | 'wheel';
  cylinders: string;
} & Record<PartKey, string>;

// A common-rail V8 pickup with a stock bottom end: the bottom end is the one to watch.
const initial: Fields = {
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
function toRequest(
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

function useDebounced<T>(value: T, ms: number): T {
  const [debounced, setDebounced] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setDebounced(value), ms);
    return () => clearTimeout(timer);
  }, [value, ms]);
  return debounced;
}

/**
 * The landing page's calculator: a target and four ratings, the weakest link and the most power
 * they support. Worked out in the browser at once by the shared estimator, then confirmed by the
 * open POST /api/estimate.
 */
export function TryItCalculator() {
  const id = useId();
  const [fields, setFields] = useState<Fields>(initial);
  const { request, errors } = useMemo(() => toRequest(fields), [fields]);
  const local = useMemo<EstimateResult | null>(() => {
    if (!request) return null;
    try {
      return estimate(estimateRequestSchema.parse(request));
    } catch {
      return null;
    }
  }, [request]);

  const debounced = useDebounced(request, 600);
  const server = useStatelessEstimate(debounced);
  const confirmed =
    request !== null &&
    debounced !== null &&
    server.isSuccess &&
    !server.isPlaceholderData &&
    JSON.stringify(debounced) === JSON.stringify(request);
  const result = confirmed ? server.data : local;

  const set = (key: keyof Fields) => (e: { target: { value: string } }) =>
    setFields((f) => ({ ...f, [key]: e.target.value }));

  return (
    <section
      aria-labelledby={`${id}-title`}
      className="rounded-xl border border-rule bg-sheet px-4 py-6 sm:px-8 sm:py-8"
    >
      <h2 id={`${id}-title`} className="text-2xl font-bold tracking-tight text-ink">
        Try it: which part gives out first?
      </h2>
      <p className="mt-1 max-w-2xl text-ink-2">
        Enter a target and what your parts are rated for. Leave a box empty if you do not know a
        rating: that part then counts as unknown, not as fine.
      </p>
      <div className="mt-5 grid gap-6 lg:grid-cols-[minmax(0,1fr)_minmax(0,1.1fr)]">
        <form
          className="grid grid-cols-1 content-start gap-4 sm:grid-cols-2"
          onSubmit={(e) => e.preventDefault()}
          noValidate
        >
          <Box
            label="Target power"
            error={errors?.powerHp}
            htmlFor={`${id}-power`}
            className="sm:col-span-2"
          >
            <div className="flex gap-2">
              <div className="min-w-0 flex-1">
                <NumberInput
                  id={`${id}-power`}
                  value={fields.powerHp}
                  onChange={set('powerHp')}
                  aria-invalid={errors?.powerHp ? true : undefined}
                />
              </div>
              <div className="w-32 shrink-0">
                <SelectInput
                  aria-label="Target measured at"
                  value={fields.basis}
                  onChange={set('basis')}
                >
                  <option value="crank">crank hp</option>
                  <option value="wheel">wheel hp</option>
                </SelectInput>
              </div>
            </div>
          </Box>
          <Box label="Cylinders" error={errors?.cylinders} htmlFor={`${id}-cylinders`}>
            <NumberInput
              id={`${id}-cylinders`}
              integer
              value={fields.cylinders}
              onChange={set('cylinders')}
              aria-invalid={errors?.cylinders ? true : undefined}
            />
          </Box>
          {partFields.map((p) => (
            <Box
              key={p.key}
              label={`${p.label} rating`}
              error={errors?.[p.key]}
              htmlFor={`${id}-${p.key}`}
            >
              <NumberInput
                id={`${id}-${p.key}`}
                unit={p.suffix}
                value={fields[p.key]}
                onChange={set(p.key)}
                placeholder="unknown"
                aria-invalid={errors?.[p.key] ? true : undefined}
                className="pr-28"
              />
            </Box>
          ))}
        </form>

        <div aria-live="polite" className="flex min-w-0 flex-col gap-3">
          {result ? (
            <TryItResult result={result} />
          ) : (
            <p className="rounded-md border border-dashed border-rule-strong px-4 py-6 text-center text-muted">
              Fix the boxes marked in red to see the estimate.
            </p>
          )}
          {result && (
            <p className="flex items-center gap-1.5 text-sm text-muted">
              {confirmed ? (
                <>
                  <CircleCheck aria-hidden className="size-4 text-ok" />
                  Worked out in your browser and checked by the Headroom server.
                </>
              ) : server.isError && !server.isFetching ? (
                <>Worked out in your browser (the server could not check it just now).</>
              ) : (
                <>Worked out in your browser…</>
              )}
            </p>
          )}
        </div>
      </div>
      <p className="mt-5 flex gap-2 text-sm text-muted">
        <Info aria-hidden className="mt-0.5 size-4 shrink-0" />
        Estimates are estimates: ratings are their makers’ claims and the formulas are
        simplifications (assumed here: 0.40 lb/(hp·h) brake specific fuel consumption, 18:1 air–fuel
        ratio, 18 % drivetrain loss, peak power at 3000 rpm). A result with no warnings is not a
        guarantee.
      </p>
    </section>
  );
}

function Box({
  label,
  error,
  htmlFor,
  className,
  children,
}: {
  label: string;
  error?: string;
  htmlFor: string;
  className?: string;
  children: ReactNode;
}) {
  return (
    <div className={cn('flex min-w-0 flex-col gap-1', className)}>
      <label htmlFor={htmlFor} className="text-[15px] font-semibold text-ink">
        {label}
      </label>
      {children}
      {error && <p className="text-sm font-semibold text-over">{error}</p>}
    </div>
  );
}

function TryItResult({ result }: { result: EstimateResult }) {
  const weakest = result.weakestLink;
  const part = weakest ? result.components.find((c) => c.id === weakest.componentId) : undefined;
  const bottomEnd = result.warnings.find((w) => w.code === 'target-exceeds-bottom-end');
  return (
    <div className="flex flex-col gap-3">
      {bottomEnd?.shortfall && (
        <div
          role="alert"
          className="rounded-md border-2 border-over bg-over-soft px-3.5 py-3 text-[#7d1f17]"
        >
          <p className="font-bold">
            The target is past the bottom-end rating by {formatShortfall(bottomEnd.shortfall)}.
          </p>
        </div>
      )}
      {part && result.supported ? (
        <div className="rounded-md border border-rule bg-paper/60 px-4 py-3">
          <p className="text-sm font-semibold tracking-wide text-muted uppercase">Weakest link</p>
          <p className="text-xl leading-snug font-bold text-ink">
            {capitalise(categoryPhrase(part.category) ?? part.name)}{' '}
            {part.status === 'over' ? 'gives out before the target' : 'gives out first'}:{' '}
            {formatHeadroom(part.headroomPct.value)} headroom at{' '}
            {formatFigure(result.requirements.crankPower.value, 'hp-crank')}
          </p>
          <p className="mt-2 text-ink-2">
            The parts you rated support about{' '}
            <strong className="text-ink">
              {formatFigure(result.supported.crankPower.value, 'hp-crank')}
            </strong>{' '}
            ({formatFigure(result.supported.wheelPower.value, 'hp-wheel')}).
          </p>
        </div>
      ) : (
        <p className="rounded-md border border-dashed border-rule-strong px-4 py-4 text-muted">
          Enter at least one rating to find the weakest link.
        </p>
      )}
      <ul className="flex flex-col divide-y divide-rule rounded-md border border-rule">
        {partFields.map((p) => {
          const c = result.components.find((r) => r.id === p.key);
          return (
            <li key={p.key} className="flex flex-wrap items-center justify-between gap-2 px-3 py-2">
              <span className="min-w-0">
                <span className="font-semibold text-ink">{partCategoryLabels[p.category]}</span>
                {c && (
                  <span className="block text-sm text-ink-2 tabular-nums">
                    rated {formatFigure(c.capacity.value, c.capacity.unit)}, needs{' '}
                    {formatFigure(c.requirement.value, c.requirement.unit)} (
                    {formatHeadroom(c.headroomPct.value)})
                  </span>
                )}
              </span>
              <StatusBadge status={c ? c.status : 'unknown'} />
            </li>
          );
        })}
      </ul>
      <ButtonLink to={paths.auth.signUp.getHref()} variant="secondary" className="self-start">
        Keep a whole build’s ratings: create an account
      </ButtonLink>
    </div>
  );
}
