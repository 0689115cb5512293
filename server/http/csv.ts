import type { Response } from 'express';

/** Answers CSV text as a download saved under `fileName` (a name we made, never one a client sent). */
export function sendCsv(res: Response, fileName: string, csv: string) {
  res.set('Content-Type', 'text/csv; charset=utf-8');
  res.set('Content-Disposition', `attachment; filename="${fileName}"`);
  res.send(csv);
}

/** The file name of a study's results: the revision they were computed from. */
export const resultsFileName = (revision: number) => `study-results-r${revision}.csv`;
