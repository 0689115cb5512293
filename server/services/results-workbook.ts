/**
 * The results of a study as an Excel workbook (exceljs): one sheet per plan, each with exactly
 * the columns of results.csv (SI, units in the headers) and that plan's rows in the same order.
 * Text cells are written as text, never as formulas, so nothing in a name can run in a spreadsheet.
 */
import ExcelJS from 'exceljs';
import type { SpoolbookMap } from '#shared/maps/types';
import { resultRecords } from '#shared/matching/results-table';
import type { StudyDocument } from '#shared/schemas/study';
import { runStudyDocument } from '#shared/study/run';

/** Excel's rules for a sheet name: at most 31 characters, none of : \ / ? * [ ], not blank, unique. */
export function sheetNames(planNames: readonly string[]): string[] {
  const used = new Set<string>();
  return planNames.map((name, i) => {
    const clean =
      name
        .replace(/[:\\/?*[\]]/g, ' ')
        .replace(/^'+|'+$/g, '')
        .trim() || `Plan ${i + 1}`;
    let candidate = clean.slice(0, 31);
    for (let n = 2; used.has(candidate.toLowerCase()); n++) candidate = `${clean.slice(0, 31 - ` (${n})`.length)} (${n})`;
    used.add(candidate.toLowerCase());
    return candidate;
  });
}

/** The workbook's bytes. */
export async function resultsWorkbook(doc: StudyDocument, mapsById: Record<string, SpoolbookMap>): Promise<Buffer> {
  const { fields, data, planIndexes } = resultRecords(runStudyDocument(doc, mapsById));
  const workbook = new ExcelJS.Workbook();
  workbook.creator = 'Spoolbook';
  const names = sheetNames(doc.plans.map((p) => p.name));
  doc.plans.forEach((_plan, planIndex) => {
    const sheet = workbook.addWorksheet(names[planIndex], { views: [{ state: 'frozen', ySplit: 1, xSplit: 3 }] });
    sheet.addRow(fields).font = { bold: true };
    data.forEach((row, i) => {
      if (planIndexes[i] === planIndex) sheet.addRow(row.map((cell) => (cell === null ? null : cell)));
    });
    sheet.columns.forEach((column, c) => (column.width = c < 3 ? 24 : Math.min(40, Math.max(12, fields[c].length * 0.6))));
  });
  return Buffer.from(await workbook.xlsx.writeBuffer());
}
