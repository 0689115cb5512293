import type { Response } from 'express';

/** Answers CSV text as a download saved under `fileName` (a name we made, never one a client sent). */
export function sendCsv(res: Response, fileName: string, csv: string) {
  res.set('Content-Type', 'text/csv; charset=utf-8');
  res.set('Content-Disposition', `attachment; filename="${fileName}"`);
  res.send(csv);
}

/** The file name of a study's results: the revision they were computed from. */
export const resultsFileName = (revision: number) => `study-results-r${revision}.csv`;

/** Answers an Excel workbook as a download saved under `fileName` (a name we made). */
export function sendXlsx(res: Response, fileName: string, workbook: Buffer) {
  res.set('Content-Type', 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet');
  res.set('Content-Disposition', `attachment; filename="${fileName}"`);
  res.send(workbook);
}
