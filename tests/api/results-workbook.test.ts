import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sheetNames } from '#server/services/results-workbook';
import { client, demoDocument as demo, signedUp, startTestApp, teamWithStudy, type TestApp } from './helpers';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

/** A response body as bytes (supertest buffers unknown types only when asked). */
function binary(res: NodeJS.ReadableStream, done: (err: Error | null, body: Buffer) => void) {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => done(null, Buffer.concat(chunks)));
}

describe('GET …/results.xlsx', () => {
  it('has one sheet per plan, each with exactly the CSV’s columns and that plan’s rows and numbers', async () => {
    const { owner, teamId, study } = await teamWithStudy(t);
    const url = `/api/teams/${teamId}/studies/${study.id}`;
    const res = await owner.c.agent
      .get(`${url}/results.xlsx`)
      .buffer(true)
      .parse(binary as never);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/vnd.openxmlformats-officedocument.spreadsheetml.sheet');
    expect(res.headers['content-disposition']).toBe('attachment; filename="study-results-r1.xlsx"');
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load(res.body);
    expect(workbook.worksheets.map((s) => s.name)).toEqual(demo.plans.map((p: { name: string }) => p.name));

    const csv = await owner.c.get(`${url}/results.csv`);
    const [head, ...rows] = Papa.parse<string[]>(csv.text.trim(), { skipEmptyLines: true }).data;
    let total = 0;
    for (const sheet of workbook.worksheets) {
      const values = (r: number) => (sheet.getRow(r).values as unknown[]).slice(1);
      expect(values(1)).toEqual(head);
      const planRows = rows.filter((r) => r[0] === sheet.name);
      // Points: 6 boost rows × 23 rpm points (2500 to 8000 by 250) in the demo study, per plan.
      expect(sheet.rowCount - 1).toBe(6 * 23);
      expect(planRows).toHaveLength(6 * 23);
      total += sheet.rowCount - 1;
      // Every cell as the CSV has it: numbers stay numbers (read back equal), text stays text.
      planRows.forEach((csvRow, i) => {
        const cells = values(i + 2);
        csvRow.forEach((text, c) => {
          const cell = cells[c];
          // An empty CSV cell is an empty cell (no value) or empty text (no findings).
          if (text === '') expect(['', null], `${sheet.name} row ${i + 2} column ${head[c]}`).toContain(cell ?? null);
          else if (typeof cell === 'number') expect(cell).toBe(Number(text));
          else expect(cell).toBe(text);
        });
      });
    }
    expect(total).toBe(rows.length);
  });

  it('writes a name that looks like a formula as text, never as a formula', async () => {
    const { owner, teamId } = await teamWithStudy(t);
    const doc = structuredClone(demo);
    doc.plans[0].name = '=HYPERLINK("http://x")';
    const created = await owner.c.post(`/api/teams/${teamId}/studies`, { title: 'Formula plan', document: doc });
    const res = await owner.c.agent
      .get(`/api/teams/${teamId}/studies/${created.body.study.id}/results.xlsx`)
      .buffer(true)
      .parse(binary as never);
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load(res.body);
    const cell = workbook.worksheets[0].getCell('A2');
    expect(cell.type).toBe(ExcelJS.ValueType.String);
    expect(cell.value).toBe('=HYPERLINK("http://x")');
  });

  it('is refused to anyone outside the team', async () => {
    const { teamId, study } = await teamWithStudy(t);
    const outsider = await signedUp(t, 'xlsx-outsider');
    expect((await outsider.c.get(`/api/teams/${teamId}/studies/${study.id}/results.xlsx`)).status).toBe(404);
    expect((await client(t).get(`/api/teams/${teamId}/studies/${study.id}/results.xlsx`)).status).toBe(401);
  });
});

describe('sheetNames', () => {
  // Excel's limits on a sheet name (Microsoft, "Excel specifications and limits"): 31 characters, none of : \ / ? * [ ].
  it('keeps Excel’s rules: at most 31 characters, no : \\ / ? * [ ], unique regardless of case', () => {
    expect(sheetNames(['L76 race wheel', 'a/b [x]', 'A very long plan name that goes on and on', 'l76 RACE wheel', ''])).toEqual([
      'L76 race wheel',
      'a b  x',
      'A very long plan name that goes',
      'l76 RACE wheel (2)',
      'Plan 5',
    ]);
  });
});
