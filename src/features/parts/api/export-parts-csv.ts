/**
 * The ledger as a CSV download. A plain link: the browser saves the file with the session
 * cookie, and the server leaves the money columns out for roles that may not see money.
 */
export function getPartsCsvHref(buildId: string): string {
  return `/api/builds/${encodeURIComponent(buildId)}/parts.csv`;
}
