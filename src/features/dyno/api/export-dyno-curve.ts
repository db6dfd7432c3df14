/** The run's curve as measured (uncorrected) CSV: a plain link the browser downloads. */
export const getDynoCurveCsvHref = (buildId: string, runId: string) =>
  `/api/builds/${encodeURIComponent(buildId)}/dyno-runs/${encodeURIComponent(runId)}/curve.csv`;
