import { useEffect, useId, useMemo, useState, type ReactNode } from 'react';
import { CircleCheck, Info } from 'lucide-react';
import { estimate } from '@shared/estimate';
import { unitLabels } from '@shared/units/labels';
import { estimateRequestSchema, type EstimateResult } from '@shared/schemas/estimate';
import { cn } from '@/components/ui/cn';
import { SelectInput } from '@/components/ui/form-field';
import { NumberInput } from '@/components/ui/number-input';
import { useStatelessEstimate } from '../api/post-estimate';
import { initial, partFields, toRequest, type Fields } from './try-it-request';
import { TryItResult } from './try-it-result';

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
                unit={unitLabels[p.unit]}
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
