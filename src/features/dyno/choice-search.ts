import type { CorrectionChoice } from '@shared/schemas/dyno';

/** The correction as a query string, for the API and for links between dyno pages. */
export function choiceSearch(choice: CorrectionChoice): string {
  const params = new URLSearchParams({ standard: choice.standard });
  if (choice.aspiration) params.set('aspiration', choice.aspiration);
  if (choice.engineFactor != null) params.set('engineFactor', String(choice.engineFactor));
  return `?${params.toString()}`;
}
