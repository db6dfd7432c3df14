/** The bench API's URLs, built in one place. */
export const benchSheetsUrl = (buildId: string) =>
  `/api/builds/${encodeURIComponent(buildId)}/bench-sheets`;

export const benchSheetUrl = (buildId: string, sheetId: string) =>
  `${benchSheetsUrl(buildId)}/${encodeURIComponent(sheetId)}`;

/** A sheet's values as a CSV download (a plain link: the session cookie rides along). */
export const getBenchCsvHref = (buildId: string, sheetId: string) =>
  `${benchSheetUrl(buildId, sheetId)}/values.csv`;
