import { useCallback, useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import {
  DEFAULT_CORRECTION_STANDARD,
  correctionQuerySchema,
  type CorrectionChoice,
} from '@shared/schemas/dyno';
import { choiceSearch } from './choice-search';

/** A choice read from the address: anything unreadable falls back to the default standard. */
export function choiceFrom(params: URLSearchParams): CorrectionChoice {
  const parsed = correctionQuerySchema.safeParse(Object.fromEntries(params));
  if (parsed.success) return parsed.data;
  const standard = correctionQuerySchema.shape.standard.safeParse(
    params.get('standard') ?? undefined,
  );
  return { standard: standard.success ? standard.data : DEFAULT_CORRECTION_STANDARD };
}

/**
 * The standard the dyno pages show, kept in the address (`?standard=…`) so a link, a reload
 * or the way back shows the same figures.
 */
export function useCorrectionChoice() {
  const [params, setParams] = useSearchParams();
  const key = params.toString();
  // eslint-disable-next-line react-hooks/exhaustive-deps
  const choice = useMemo(() => choiceFrom(params), [key]);
  const setChoice = useCallback(
    (next: CorrectionChoice) => {
      setParams(new URLSearchParams(choiceSearch(next).slice(1)), { replace: true });
    },
    [setParams],
  );
  return [choice, setChoice] as const;
}
