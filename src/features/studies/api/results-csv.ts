import { studyUrl } from './keys';

/**
 * The study's results as CSV (every point of every operating line, SI, formula-looking cells
 * neutralised by the server). A plain download link: the browser sends the session cookie.
 */
export function resultsCsvHref(teamId: string, studyId: string): string {
  return `${studyUrl(teamId, studyId)}/results.csv`;
}

/** The same results as an Excel workbook: one sheet per plan with the CSV's columns. */
export function resultsXlsxHref(teamId: string, studyId: string): string {
  return `${studyUrl(teamId, studyId)}/results.xlsx`;
}
