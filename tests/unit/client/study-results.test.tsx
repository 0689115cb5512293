import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { studyDocumentSchema } from '#shared/schemas/study';
import { runStudyDocument } from '#shared/study/run';
import { FindingsList, groupFindings, localizeMessage } from '#src/components/study/FindingsList';
import { studyLines } from '#src/components/study/lines';
import { resultTableRows, resultsTsv } from '#src/components/study/result-rows';
import { ResultsTable } from '#src/components/study/ResultsTable';
import { runStudyLive } from '#src/components/study/run';
import { demoDocument, demoMaps } from './demo-study';
import { UnitSystemProvider } from '#src/lib/quantities';

afterEach(cleanup);

const demo = studyDocumentSchema.parse(demoDocument());
const maps = demoMaps();

describe('runStudyLive', () => {
  it('gives exactly what runStudyDocument gives (it only keeps the maps’ models between edits)', () => {
    const live = runStudyLive(demo, maps);
    const reference = runStudyDocument(demo, maps);
    expect(JSON.stringify(live.lines.map((l) => l.points))).toBe(JSON.stringify(reference.lines.map((l) => l.points)));
    // A second run reuses the cached models and still agrees.
    expect(JSON.stringify(runStudyLive(demo, maps).lines.map((l) => l.points))).toBe(JSON.stringify(reference.lines.map((l) => l.points)));
  });
});

const lines = studyLines(runStudyLive(demo, maps), demo.plans);

describe('results table', () => {
  it('has one row per point, units under every column, and selects a row by click', () => {
    const onSelect = vi.fn();
    render(
      <UnitSystemProvider system="us">
        <ResultsTable lines={lines} onSelect={onSelect} />
      </UnitSystemProvider>,
    );
    const table = screen.getByTestId('results-table');
    expect(within(table).getByRole('button', { name: /Corrected mass flow\s*\(lb\/min\)/ })).toBeTruthy();
    expect(within(table).getByRole('button', { name: /^Boost target\s*\(psi gauge\)/ })).toBeTruthy();
    const first = table.querySelector('tbody tr')!;
    fireEvent.click(first);
    expect(onSelect).toHaveBeenCalledWith({ lineKey: 'plan-s44|0|0', rpm: 2500 });
    expect(screen.getByText(`Rows 1–50 of ${resultTableRows(lines).length}`)).toBeTruthy();
  });

  it('sorts by a column when its header is clicked', () => {
    render(<ResultsTable lines={lines} />);
    const table = screen.getByTestId('results-table');
    const header = within(table).getByRole('button', { name: /^Engine speed/ });
    fireEvent.click(header);
    fireEvent.click(header);
    const sortedBy = header.closest('th')!.getAttribute('aria-sort');
    expect(['ascending', 'descending']).toContain(sortedBy);
    const speeds = [...table.querySelectorAll('td[data-column="rpm"]')].map((td) => Number(td.textContent!.replace(/,/g, '')));
    const expected = [...speeds].sort((a, b) => (sortedBy === 'ascending' ? a - b : b - a));
    expect(speeds).toEqual(expected);
  });

  it('copies tab-separated text with units in the header and neutralised formula-like text', () => {
    const rows = resultTableRows(lines).slice(0, 2);
    rows[0] = { ...rows[0], plan: '=HYPERLINK("x")' };
    const tsv = resultsTsv(rows, 'si').split('\n');
    expect(tsv[0].split('\t').slice(0, 5)).toEqual(['Plan', 'Scenario', 'Boost row', 'Engine speed (rpm)', expect.stringMatching(/kPa gauge/)]);
    expect(tsv[1].startsWith(`'=HYPERLINK`)).toBe(true); // OWASP CSV injection: a leading apostrophe keeps it text
    expect(tsv[1].split('\t')[3]).toBe('2500');
  });
});

describe('findings', () => {
  it('groups findings by line and kind, most severe first, and selects the first speed on click', () => {
    const groups = groupFindings(lines);
    expect(groups.length).toBeGreaterThan(0);
    const order = groups.map((g) => ['limit', 'warning', 'info'].indexOf(g.severity));
    expect(order).toEqual([...order].sort((a, b) => a - b));
    const onSelect = vi.fn();
    render(<FindingsList lines={lines} selected={null} onSelect={onSelect} />);
    const firstEntry = screen.getByTestId('findings').querySelector('li button')!;
    fireEvent.click(firstEntry);
    expect(onSelect).toHaveBeenCalledWith({ lineKey: groups[0].line.key, rpm: Math.min(...groups[0].rpms) });
  });

  it('rewrites SI amounts in messages for US customary units', () => {
    expect(localizeMessage('Compressor outlet temperature 478.2 K (205.1 °C) is above 473.2 K (200 °C).', 'us')).toBe(
      'Compressor outlet temperature 401.1 °F is above 392.1 °F.', // °F = K × 1.8 − 459.67 (NIST SP 811), 4 significant figures
    );
    expect(localizeMessage('Manifold pressure 250 kPa is above the stated limit 240 kPa.', 'us')).toBe(
      'Manifold pressure 36.26 psi is above the stated limit 34.81 psi.',
    ); // 1 psi = 6.894757 kPa (NIST SP 811)
    expect(localizeMessage('Each wastegate needs a 25.3 mm valve here; 20.0 mm is fitted.', 'us')).toBe(
      'Each wastegate needs a 0.9961 in valve here; 0.7874 in is fitted.',
    ); // 1 in = 25.4 mm (NIST SP 811), 4 significant figures
    expect(localizeMessage('unchanged 250 kPa', 'si')).toBe('unchanged 250 kPa');
  });
});
