import { readFileSync } from 'node:fs';
import path from 'node:path';
import fc from 'fast-check';
import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { FORMULA_START, csvLine, writeCsv, type CsvCell } from '#shared/csv';
import { parseMapFile, writeMapFile } from '#shared/maps';
import type { SpoolbookMap } from '#shared/maps/types';
import { buildTrace } from '#shared/tracer/build';
import { newTraceState } from '#shared/tracer/state';
import { builtinMaps } from '#server/services/builtin-maps';
import { demoStudyDocument, resultsCsv } from '#server/services/study-documents';

// OWASP ASVS 5.0 1.2.10 (OWASP "CSV Injection"): no cell of any CSV Spoolbook serves may begin
// with = + - @ tab or CR unless it is a number. Every writer is checked the way a spreadsheet
// reads the file: split into cells by a CSV reader, then each cell looked at.

/** Text a hostile user could type: formula starts, commas, quotes, line breaks, tabs. */
const hostileText = fc.oneof(
  fc.string({ maxLength: 40 }),
  fc.constantFrom('=HYPERLINK("http://x.test","a")', '+1+1', '-2+3', '@SUM(A1)', '\t=1', '\r=1', 'Map,=1+1', 'a"b,=c', "=cmd|' /C calc'!A0", 'x\n=1'),
  fc.tuple(fc.constantFrom('=', '+', '-', '@', '\t', '\r', ',', '"', 'a'), fc.string({ maxLength: 20 })).map(([a, b]) => a + b),
);

/** Every cell of a CSV text as a spreadsheet would split it. */
function cellsOf(text: string): string[] {
  return Papa.parse<string[]>(text, { header: false, skipEmptyLines: false, delimiter: ',' }).data.flat();
}

/** A dangerous cell is allowed only when it is a number as a spreadsheet reads one. */
function dangerous(cell: string): boolean {
  return FORMULA_START.test(cell) && !/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(cell.trim());
}

function expectNoFormula(text: string) {
  const bad = cellsOf(text).filter(dangerous);
  expect(bad, `cells a spreadsheet would run: ${JSON.stringify(bad)}`).toEqual([]);
}

describe('the one CSV writer', () => {
  it('neutralises text cells that start a formula, keeps numbers and reads back cell for cell', () => {
    const cell: fc.Arbitrary<CsvCell> = fc.oneof(hostileText, fc.double({ noNaN: true, noDefaultInfinity: true }), fc.constant(null));
    fc.assert(
      fc.property(fc.array(fc.array(cell, { minLength: 2, maxLength: 2 }), { maxLength: 6 }), (rows) => {
        const text = writeCsv(['a', 'b'], rows);
        expectNoFormula(text);
        const back = Papa.parse<string[]>(text, { header: false, delimiter: ',' }).data.slice(1);
        rows.forEach((row, r) =>
          row.forEach((value, c) => {
            const read = back[r][c];
            if (typeof value === 'number') expect(Number(read)).toBe(value === 0 ? 0 : value);
            else if (value === null) expect(read).toBe('');
            else expect(read).toBe(FORMULA_START.test(value as string) ? `'${value}` : value);
          }),
        );
      }),
    );
  });

  it('writes a header line so that no piece of it starts a formula', () => {
    // The attack from the security test: a map named `Map,=HYPERLINK("...")`.
    expect(csvLine('# name: Map,=HYPERLINK("x")')).toBe('"# name: Map,=HYPERLINK(""x"")"');
    expect(csvLine('# name: Plain')).toBe('# name: Plain');
    expect(csvLine('# flow: corrected mass, kg/s')).toBe('# flow: corrected mass, kg/s');
    expect(csvLine('# note: a, -b')).toBe('"# note: a, -b"');
    fc.assert(
      fc.property(hostileText, (t) => {
        const line = csvLine(`# note: ${t}`);
        expectNoFormula(line);
        if (line.startsWith('"')) expect(cellsOf(line)).toHaveLength(1);
      }),
    );
  });
});

const fixture = parseMapFile(readFileSync(path.resolve(import.meta.dirname, '..', '..', 'fixtures', 'maps', 'good', 'compressor-minimal.csv'), 'utf8'));
if (!fixture.ok) throw new Error('fixture should read');
const baseMap = fixture.map as SpoolbookMap;

describe('every CSV the product serves', () => {
  it('map files: names, notes and labels never become formulas, and a safe name reads back', () => {
    fc.assert(
      fc.property(hostileText, fc.array(hostileText, { maxLength: 3 }), hostileText, (name, notes, label) => {
        const map = { ...baseMap, name, notes, curves: baseMap.curves.map((c) => (c.kind === 'island' ? { ...c, label } : c)) } as SpoolbookMap;
        const text = writeMapFile(map);
        expectNoFormula(text);
        const safeName = name.replace(/[\u0000-\u001f\u007f]+/g, ' ').trim();
        if (safeName && !FORMULA_START.test(safeName) && safeName.length <= 120 && !FORMULA_START.test(label) && label.length <= 40) {
          const back = parseMapFile(text);
          if (back.ok) expect(back.map.name).toBe(safeName);
        }
      }),
      { numRuns: 150 },
    );
  });

  it('built-in map downloads', () => {
    for (const b of builtinMaps()) expectNoFormula(writeMapFile(b.map));
  });

  it('study results.csv: plan, scenario and boost row names never become formulas', () => {
    const maps = Object.fromEntries(builtinMaps().map((b) => [b.id, b.map]));
    const doc = demoStudyDocument();
    fc.assert(
      fc.property(
        hostileText.filter((t) => t.trim().length > 0),
        hostileText.filter((t) => t.trim().length > 0),
        (plan, scenario) => {
          const hostile = {
            ...doc,
            plans: doc.plans.map((p, i) => ({ ...p, name: `${plan}${i}`.slice(0, 80) })),
            scenarios: doc.scenarios.map((s) => ({ ...s, name: scenario.slice(0, 80) })),
          };
          expectNoFormula(resultsCsv(hostile, maps));
        },
      ),
      { numRuns: 15 },
    );
  });

  it("the Tracer's map file", () => {
    fc.assert(
      fc.property(hostileText, (name) => {
        expectNoFormula(buildTrace(newTraceState(name)).text);
      }),
      { numRuns: 100 },
    );
  });
});
