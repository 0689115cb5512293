import { cleanup, render, screen, within } from '@testing-library/react';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { parseMapFile } from '#shared/maps';
import type { SpoolbookMap } from '#shared/maps/types';
import { studyDocumentSchema } from '#shared/schemas/study';
import { runStudyDocument } from '#shared/study/run';
import { ExhaustSummary } from '#src/components/study/ExhaustSummary';
import { studyLines, type StudyLine } from '#src/components/study/lines';
import { UnitSystemProvider } from '#src/lib/quantities';

afterEach(cleanup);

const root = path.resolve(import.meta.dirname, '../../..');
const maps: Record<string, SpoolbookMap> = {};
for (const file of ['compressor-m58', 'turbine-t64-ar064-single', 'turbine-t64-ar082-divided']) {
  const parsed = parseMapFile(readFileSync(path.join(root, 'data', 'maps', `${file}.csv`), 'utf8'));
  if (!parsed.ok) throw new Error(`${file} does not parse`);
  maps[`builtin-${file}`] = parsed.map;
}
const doc = studyDocumentSchema.parse(JSON.parse(readFileSync(path.join(root, 'data', 'demo', 'turbine-housing-study.json'), 'utf8')));
const lines = studyLines(runStudyDocument(doc, maps), doc.plans);

/** A line with its exhaust summary changed (the rest as the engine gave it). */
function withSummary(line: StudyLine, change: Partial<NonNullable<StudyLine['line']['exhaust']>>): StudyLine {
  return { ...line, line: { ...line.line, exhaust: { ...line.line.exhaust!, ...change } } };
}

describe('the exhaust summary of a study', () => {
  it('lists each line with the exhaust side, with the figures the engine gave, in the user’s units', () => {
    render(<ExhaustSummary lines={lines} />);
    const table = screen.getByTestId('exhaust-summary');
    expect(within(table).getAllByRole('row')).toHaveLength(1 + lines.length); // header + one row per line (2 plans × 2 scenarios)
    const first = lines[0].line.exhaust!;
    const row = within(table).getAllByRole('row')[1];
    expect(row.textContent).toContain(`${first.boostThresholdRpm!.toLocaleString('en-US')} rpm`); // the engine's own threshold, shown as is
    expect(row.textContent).toContain(`${(first.wastegateDiameterFitted * 1000).toLocaleString('en-US')} mm`); // m → mm (definition)
    expect(row.textContent).toContain('kPa abs.');
  });

  it('says when the target is never reached and when a gate is too small, and shows inches for US units', () => {
    const never = withSummary(lines[0], { boostThresholdRpm: null });
    const small = withSummary(lines[1], { wastegateDiameterNeeded: { value: 0.05, rpm: 8000 }, wastegateDiameterFitted: 0.0254 });
    render(
      <UnitSystemProvider system="us">
        <ExhaustSummary lines={[never, small]} />
      </UnitSystemProvider>,
    );
    const rows = within(screen.getByTestId('exhaust-summary')).getAllByRole('row');
    expect(rows[1].textContent).toContain('not reached');
    expect(rows[2].textContent).toContain('1.97 in / 1 in'); // 50 mm and 25.4 mm at 1 in = 25.4 mm (NIST SP 811), 3 significant figures
    expect(rows[2].textContent).toContain('too small');
  });

  it('shows nothing for a study without the exhaust side', () => {
    const { container } = render(<ExhaustSummary lines={lines.map((l) => ({ ...l, line: { ...l.line, exhaust: null } }))} />);
    expect(container.textContent).toBe('');
  });
});
