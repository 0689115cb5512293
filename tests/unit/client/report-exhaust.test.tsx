import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { MemoryRouter } from 'react-router';
import { afterEach, describe, expect, it, onTestFinished, vi } from 'vitest';
import { parseMapFile } from '#shared/maps';
import type { SpoolbookMap } from '#shared/maps/types';
import { studyDocumentSchema, type StudyDocument } from '#shared/schemas/study';
import { studyLines } from '#src/components/study/lines';
import { runStudyLive } from '#src/components/study/run';
import { Assumptions } from '#src/features/report/components/Assumptions';
import { ExhaustNotes } from '#src/features/report/components/ExhaustNotes';
import { reportCurveViews } from '#src/features/report/components/ReportCurves';
import { ReadOnlyStudyView } from '#src/features/report/components/ReadOnlyStudyView';
import { StudyInputs } from '#src/features/report/components/StudyInputs';
import { StudyReport } from '#src/features/report/components/StudyReport';
import { mapGroups, turbineMapGroups } from '#src/features/report/study-view';
import { UnitSystemProvider } from '#src/lib/quantities';

// plotly cannot draw under jsdom: every plot frame becomes a labelled stand-in (the browser test draws them).
vi.mock('#src/components/plots/PlotFrame', () => ({
  PlotFrame: ({ label }: { label: string }) => <div data-testid="plot-stand-in">{label}</div>,
}));

afterEach(cleanup);

const root = path.resolve(import.meta.dirname, '../../..');
const readDoc = (file: string) => studyDocumentSchema.parse(JSON.parse(readFileSync(path.join(root, 'data/demo', file), 'utf8')));
const housingStudy = readDoc('turbine-housing-study.json');
const hillclimb = readDoc('hillclimb-study.json');

// The built-in ids as the demo documents name them, read from the demo map files.
const maps: Record<string, SpoolbookMap> = {};
for (const file of ['compressor-s44', 'compressor-m58', 'compressor-l76', 'turbine-t64-ar064-single', 'turbine-t64-ar082-divided']) {
  const parsed = parseMapFile(readFileSync(path.join(root, 'data/maps', `${file}.csv`), 'utf8'));
  if (!parsed.ok) throw new Error(`demo map ${file} does not parse`);
  maps[`builtin-${file}`] = parsed.map;
}

/** The housing study with its first plan judged on the compressor alone. */
function withoutFirstExhaust(doc: StudyDocument): StudyDocument {
  const [first, ...rest] = doc.plans;
  const { exhaust: _exhaust, turbineMapId: _turbine, ...bare } = first;
  return { ...doc, plans: [bare, ...rest] };
}

function exhaustTable() {
  return screen.getByRole('table', { name: 'Exhaust side of each plan' });
}

/** The cells of a row of the exhaust table, by its heading, after the heading. */
function exhaustRow(label: string): string[] {
  const heading = within(exhaustTable()).getByRole('rowheader', { name: label });
  return [...heading.closest('tr')!.querySelectorAll('td')].map((td) => td.textContent ?? '');
}

describe('report inputs: the exhaust side', () => {
  it('gives every plan’s exhaust inputs in SI, one column per plan', () => {
    render(<StudyInputs data={{ document: housingStudy, mapsById: maps }} />);
    expect(screen.getByRole('heading', { name: 'Exhaust side', level: 3 })).toBeTruthy();
    const columns = within(exhaustTable())
      .getAllByRole('columnheader')
      .map((th) => th.textContent);
    // Plan names hand-read from data/demo/turbine-housing-study.json.
    expect(columns).toEqual(['0.64 A/R single scroll, one gate', '0.82 A/R divided, two gates']);
    // No library names given: the maps' own names (the "name:" lines of data/maps/turbine-t64-*.csv).
    expect(exhaustRow('Turbine map')).toEqual(['Spoolbook demo turbine T64, A/R 0.64, single scroll', expect.stringContaining('A/R 0.82')]);
    expect(exhaustRow('Turbine housing')).toEqual(['Single scroll', 'Divided (two scrolls)']);
    // valveDiameter 0.044 m and 0.038 m in the fixture: 44 mm and 38 mm (1 mm = 0.001 m, SI).
    expect(exhaustRow('Wastegates')).toEqual(['1 × 44 mm valve', '2 × 38 mm valve']);
    // dischargeCoefficient 0.8 and mechanicalEfficiency 0.95 in both plans (hand-read from the fixture).
    expect(exhaustRow('Valve discharge coefficient')).toEqual(['0.8', '0.8']);
    expect(exhaustRow('Mechanical efficiency')).toEqual(['95 %', '95 %']);
    // The divided plan states 1.1; a single scroll has none (fixture).
    expect(exhaustRow('Pulse-energy factor')).toEqual(['— (single scroll)', '1.1']);
    // Neither plan states a turbine efficiency: DEFAULT_TURBINE_EFFICIENCY = 0.65 (shared/matching/exhaust.ts, "from memory" there).
    expect(exhaustRow('Turbine efficiency off the map')).toEqual(['65 % (default)', '65 % (default)']);
    // downstreamLoss 15000 Pa = 15 kPa at 0.38 kg/s and 0.29 kg/m³ (the demo document's own values; SI prefix).
    expect(exhaustRow('Pressure loss after the turbine')).toEqual(['15 kPa at 0.38 kg/s and 0.29 kg/m³', '15 kPa at 0.38 kg/s and 0.29 kg/m³']);
    expect(screen.queryByText('Compressor only')).toBeNull();
  });

  it('prints each plan’s turbine inlet temperatures by rpm in the user’s unit', () => {
    render(<StudyInputs data={{ document: housingStudy, mapsById: maps }} />);
    const table = screen.getByRole('table', { name: 'Turbine inlet temperature: 0.64 A/R single scroll, one gate' });
    const cells = [...table.querySelectorAll('td')].map((td) => td.textContent);
    // Fixture: 2500, 5000, 8000 rpm at 1003.15, 1133.15, 1183.15 K; °C = K − 273.15 (ITS-90), 4 significant figures.
    expect(cells).toEqual(['2,500', '5,000', '8,000', '730', '860', '910']);
    expect(within(table).getByRole('rowheader', { name: 'Turbine inlet temperature (°C)' })).toBeTruthy();
    expect(screen.getByRole('table', { name: 'Turbine inlet temperature: 0.82 A/R divided, two gates' })).toBeTruthy();
  });

  it('gives valve sizes in inches and the loss in psi in US units', () => {
    render(
      <UnitSystemProvider system="us">
        <StudyInputs data={{ document: housingStudy, mapsById: maps }} />
      </UnitSystemProvider>,
    );
    // 0.044 m / 0.0254 m/in = 1.732 in; 0.038 / 0.0254 = 1.496 in (1 in = 25.4 mm exactly, NIST SP 811 B.8).
    expect(exhaustRow('Wastegates')).toEqual(['1 × 1.732 in valve', '2 × 1.496 in valve']);
    // 15000 Pa / 6894.757 Pa/psi = 2.176 psi; 0.38 kg/s × 60/0.45359237 = 50.27 lb/min; 0.29 kg/m³ × 0.0624280 = 0.0181 lb/ft³ (NIST SP 811 B.8).
    expect(exhaustRow('Pressure loss after the turbine')).toEqual([
      '2.176 psi at 50.27 lb/min and 0.0181 lb/ft³',
      '2.176 psi at 50.27 lb/min and 0.0181 lb/ft³',
    ]);
  });

  it('says "Compressor only" for a plan without an exhaust block, and "1.0 (default)" for a divided plan with no pulse factor', () => {
    const doc = withoutFirstExhaust(housingStudy);
    const second = doc.plans[1];
    const { pulseFactor: _pulse, ...exhaust } = second.exhaust!;
    doc.plans[1] = { ...second, exhaust };
    render(<StudyInputs data={{ document: doc, mapsById: maps }} />);
    const compressorOnly = within(exhaustTable()).getByText('Compressor only');
    // One cell spans the whole column of the plan without an exhaust side.
    expect(compressorOnly.closest('td')!.getAttribute('rowspan')).toBe('8');
    // The spanning cell sits in the first row; the rows under it hold the divided plan's cells alone.
    expect(exhaustRow('Turbine map')).toEqual(['Compressor only', expect.stringContaining('A/R 0.82')]);
    expect(exhaustRow('Turbine housing')).toEqual(['Divided (two scrolls)']);
    expect(exhaustRow('Wastegates')).toEqual(['2 × 38 mm valve']);
    expect(exhaustRow('Pulse-energy factor')).toEqual(['1.0 (default)']);
    expect(screen.queryByRole('table', { name: /^Turbine inlet temperature: 0\.64/ })).toBeNull();
  });

  it('continues in a second table past four plans, so the columns fit across a page', () => {
    const plans = Array.from({ length: 5 }, (_, i) => ({ ...housingStudy.plans[i % 2], id: `plan-${i}`, name: `Plan ${i + 1}` }));
    render(<StudyInputs data={{ document: { ...housingStudy, plans }, mapsById: maps }} />);
    const first = screen.getByRole('table', { name: 'Exhaust side of each plan' });
    const second = screen.getByRole('table', { name: 'Exhaust side of each plan (continued)' });
    // Four plan columns per table (PLAN_COLUMNS_PER_TABLE, our page layout, no source), the fifth under them.
    expect(
      within(first)
        .getAllByRole('columnheader')
        .map((th) => th.textContent),
    ).toEqual(['Plan 1', 'Plan 2', 'Plan 3', 'Plan 4']);
    expect(
      within(second)
        .getAllByRole('columnheader')
        .map((th) => th.textContent),
    ).toEqual(['Plan 5']);
  });

  it('shows no exhaust block for a study judged on the compressor alone', () => {
    render(<StudyInputs data={{ document: hillclimb, mapsById: maps }} />);
    // The compressor plans are still listed (first plan of data/demo/hillclimb-study.json).
    expect(screen.getByText(hillclimb.plans[0].name)).toBeTruthy();
    expect(screen.queryByRole('heading', { name: 'Exhaust side' })).toBeNull();
    expect(screen.queryByRole('table', { name: 'Exhaust side of each plan' })).toBeNull();
    expect(screen.queryByText('Compressor only')).toBeNull();
    expect(screen.queryByText(/Turbine inlet temperature/)).toBeNull();
  });
});

describe('report: turbine maps, curves and notes', () => {
  const lines = studyLines(runStudyLive(housingStudy, maps), housingStudy.plans);

  it('draws each plan on its own turbine map, with every line of the plan', () => {
    const groups = turbineMapGroups(housingStudy, lines, maps);
    // Two plans on two different turbine maps (fixture), two scenarios × one boost row each.
    expect(groups.map((g) => g.mapId)).toEqual(['builtin-turbine-t64-ar064-single', 'builtin-turbine-t64-ar082-divided']);
    expect(groups.map((g) => g.planNames)).toEqual([['0.64 A/R single scroll, one gate'], ['0.82 A/R divided, two gates']]);
    expect(groups.map((g) => g.lines.length)).toEqual([2, 2]);
    expect(groups.every((g) => g.map?.kind === 'turbine')).toBe(true);
    // The library's name wins over the map's own, like for compressor maps.
    expect(turbineMapGroups(housingStudy, lines, maps, { 'builtin-turbine-t64-ar064-single': 'T64 small' })[0].title).toBe('T64 small');
  });

  it('keeps plans whose turbine map is missing apart, with no map to draw', () => {
    const { 'builtin-turbine-t64-ar082-divided': _gone, ...fewer } = maps;
    const partial = studyLines(runStudyLive(housingStudy, fewer), housingStudy.plans);
    const groups = turbineMapGroups(housingStudy, partial, fewer);
    expect(groups.map((g) => [g.map === null, g.planNames])).toEqual([
      [false, ['0.64 A/R single scroll, one gate']],
      [true, ['0.82 A/R divided, two gates']],
    ]);
  });

  it('prints the exhaust curves only when some plan has its exhaust side computed', () => {
    const ids = reportCurveViews(lines).map((v) => v.id);
    for (const id of ['boost', 'exhaust-pressure', 'turbine-power', 'wastegate']) expect(ids).toContain(id);
    const compressorOnly = studyLines(runStudyLive(hillclimb, maps), hillclimb.plans);
    const plain = reportCurveViews(compressorOnly).map((v) => v.id);
    expect(plain).toContain('boost');
    for (const id of ['exhaust-pressure', 'turbine-power', 'wastegate']) expect(plain).not.toContain(id);
    expect(turbineMapGroups(hillclimb, compressorOnly, maps)).toEqual([]);
  });

  it('says the pulse-energy factor is the user’s assumption and cautions on exhaust heat', () => {
    render(<ExhaustNotes document={housingStudy} />);
    const note = screen.getByTestId('pulse-factor-note').textContent!;
    // The divided plan's factor, 1.1 (fixture).
    expect(note).toContain('0.82 A/R divided, two gates: 1.1');
    expect(note).toContain('the model cannot check it');
    const caution = screen.getByRole('complementary', { name: 'Exhaust heat caution' }).textContent!;
    expect(caution).toContain('exhaust gas temperature');
    expect(caution).toMatch(/turbocharger maker/);
    cleanup();
    // Only single-scroll plans: no pulse factor to speak of, the heat caution stays.
    render(<ExhaustNotes document={{ ...housingStudy, plans: [housingStudy.plans[0]] }} />);
    expect(screen.queryByTestId('pulse-factor-note')).toBeNull();
    expect(screen.getByTestId('exhaust-caution')).toBeTruthy();
  });

  it('adds the exhaust side to the assumptions only for a study that has one', () => {
    render(<Assumptions document={housingStudy} groups={mapGroups(housingStudy, lines, maps)} />);
    expect(screen.getByText('Exhaust side.')).toBeTruthy();
    expect(screen.getByText('Pulse energy.')).toBeTruthy();
    cleanup();
    const plain = studyLines(runStudyLive(hillclimb, maps), hillclimb.plans);
    render(<Assumptions document={hillclimb} groups={mapGroups(hillclimb, plain, maps)} />);
    expect(screen.queryByText('Exhaust side.')).toBeNull();
    expect(screen.queryByText('Pulse energy.')).toBeNull();
  });
});

describe('the whole report and the shared view with the exhaust side', () => {
  const viewData = (document: StudyDocument) => ({ title: 'Housing study', revision: 3, updatedAt: '2025-05-01T10:00:00.000Z', document, mapsById: maps });

  function renderReport(document: StudyDocument) {
    render(
      <MemoryRouter>
        <StudyReport data={viewData(document)} backHref="/" backLabel="Back" />
      </MemoryRouter>,
    );
  }

  it('gives the turbine maps a section of their own, the sections after it one number on', () => {
    renderReport(housingStudy);
    const headings = screen.getAllByRole('heading', { level: 2 }).map((h) => h.textContent);
    expect(headings).toEqual([
      // The verdicts come first, on the first page, before the numbered sections.
      'Verdict by plan',
      '1. Inputs',
      '2. Assumptions',
      '3. Compressor maps with every operating line',
      '4. Turbine maps with every operating line',
      '5. Curves against engine speed',
      '6. Findings',
      '7. Results by operating point',
    ]);
    const plots = screen.getAllByTestId('plot-stand-in').map((p) => p.textContent);
    // One compressor map (both plans on M58), the two turbine maps (fixture), and the exhaust curve views.
    expect(plots.filter((p) => p!.startsWith('Turbine map: '))).toEqual([
      'Turbine map: Spoolbook demo turbine T64, A/R 0.64, single scroll',
      expect.stringContaining('A/R 0.82'),
    ]);
    expect(plots).toContain('Wastegate against engine speed');
    expect(plots).toContain('Exhaust pressure against engine speed');
    expect(screen.getByTestId('exhaust-caution')).toBeTruthy();
    expect(screen.getByTestId('pulse-factor-note')).toBeTruthy();
  });

  it('keeps the compressor-only report as it was', () => {
    renderReport(hillclimb);
    const headings = screen.getAllByRole('heading', { level: 2 }).map((h) => h.textContent);
    expect(headings).toEqual([
      // The verdicts come first, on the first page, before the numbered sections.
      'Verdict by plan',
      '1. Inputs',
      '2. Assumptions',
      '3. Compressor maps with every operating line',
      '4. Curves against engine speed',
      '5. Findings',
      '6. Results by operating point',
    ]);
    expect(screen.queryAllByTestId('plot-stand-in').filter((p) => p.textContent!.startsWith('Turbine map'))).toEqual([]);
    expect(screen.queryByText('Wastegate against engine speed')).toBeNull();
    expect(screen.queryByTestId('exhaust-caution')).toBeNull();
  });

  it('shows a turbine map in the shared view, with a choice between the two', () => {
    // jsdom lays nothing out, so it has no scrollIntoView (the results table scrolls to the selected row).
    const proto = Element.prototype as { scrollIntoView?: unknown };
    const had = 'scrollIntoView' in proto;
    if (!had) proto.scrollIntoView = () => {};
    onTestFinished(() => {
      if (!had) delete proto.scrollIntoView;
    });
    render(<ReadOnlyStudyView data={viewData(housingStudy)} />);
    const card = screen.getByTestId('read-only-turbine-map');
    const choices = within(card).getAllByRole('radio');
    // The two plans' turbine maps (fixture); choosing one draws it.
    expect(choices.map((r) => r.textContent)).toEqual([expect.stringContaining('A/R 0.64'), expect.stringContaining('A/R 0.82')]);
    for (const [i, size] of [
      [1, 'A/R 0.82'],
      [0, 'A/R 0.64'],
    ] as const) {
      fireEvent.click(choices[i]);
      expect(choices[i].getAttribute('aria-checked')).toBe('true');
      expect(within(card).getByTestId('plot-stand-in').textContent).toContain(size);
    }
    expect(within(card).getByTestId('exhaust-caution')).toBeTruthy();
    cleanup();
    render(<ReadOnlyStudyView data={viewData(hillclimb)} />);
    expect(screen.queryByTestId('read-only-turbine-map')).toBeNull();
  });
});
