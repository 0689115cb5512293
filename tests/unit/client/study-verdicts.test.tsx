import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Finding } from '#shared/matching/finding';
import type { OperatingLine, OperatingPoint, PointValues } from '#shared/matching/result';
import { planVerdicts, reasonText, VERDICT_WORDS } from '#shared/matching/verdict';
import { studyDocumentSchema } from '#shared/schemas/study';
import { compareLines, type ComparableLine } from '#shared/study/compare';
import { runStudyDocument } from '#shared/study/run';
import { compressorMapFigure } from '#src/components/plots/compressor-map-figure';
import { mapLineViews, studyLines, type StudyLine } from '#src/components/study/lines';
import { PlanVerdicts, reasonPoint } from '#src/components/study/PlanVerdicts';
import { ResultsTable } from '#src/components/study/ResultsTable';
import { rpmCurvesFigure, CURVE_VIEWS } from '#src/components/study/rpm-curves-figure';
import type { ChosenLine } from '#src/features/compare/components/CombinationMark';
import { rankByVerdict } from '#src/features/compare/components/CompareView';
import { DifferencesTable } from '#src/features/compare/components/DifferencesTable';
import { firstPointOfInterest } from '#src/features/report/components/ReadOnlyStudyView';
import { demoDocument, demoMaps } from './demo-study';

afterEach(cleanup);

const demo = studyDocumentSchema.parse(demoDocument());
const maps = demoMaps();
const result = runStudyDocument(demo, maps);
const lines = studyLines(result, demo.plans);
const verdicts = planVerdicts(result);

// ——— tiny hand-made lines for the states the demo does not show (fits, warnings, not judged)

function point(rpm: number, findings: Finding[] = [], values: Partial<PointValues> = {}): OperatingPoint {
  return { solved: true, rpm, values: { rpm, reachable: true, ...values } as PointValues, findings };
}
const warning = (rpm: number): Finding => ({
  code: 'surge-margin-thin',
  severity: 'warning',
  message: 'Surge margin 3.0 % is under the 5.0 % the study requires.',
  rpm,
});

function handLine(planIndex: number, name: string, points: OperatingPoint[], hasMap = true): StudyLine {
  const line = {
    planIndex,
    planName: name,
    scenarioIndex: 0,
    scenarioName: 'Sea level',
    rowIndex: 0,
    rowLabel: 'Full load',
    rowKind: 'full-load',
    gear: null,
    context: { hasMap },
    points,
    worstSeverity: null,
  } as unknown as OperatingLine;
  return { key: `p${planIndex}|0|0`, label: `${name} · Sea level · Full load`, planId: `p${planIndex}`, planIndex, scenarioIndex: 0, rowIndex: 0, line };
}

describe('the verdict of each plan', () => {
  it('shows every plan of the demo study with the verdict, first reason and points the engine gives', () => {
    render(<PlanVerdicts lines={lines} onSelect={() => undefined} />);
    expect(verdicts.length).toBe(demo.plans.length);
    for (const v of verdicts) {
      const row = screen.getByTestId(`verdict-plan-${v.planIndex}`);
      expect(row.getAttribute('data-verdict')).toBe(v.status);
      expect(within(row).getByText(v.planName)).toBeTruthy();
      expect(row.textContent).toContain(VERDICT_WORDS[v.status]);
      expect(within(row).getByTestId('verdict-reason').textContent).toBe(reasonText(v.reasons[0]));
      expect(row.textContent).toContain(`${v.pointsAtLimit.toLocaleString('en-US')} of`);
    }
  });

  it('selects the first point of a reason on click, and folds the other reasons open on demand', () => {
    const onSelect = vi.fn();
    render(<PlanVerdicts lines={lines} onSelect={onSelect} />);
    const s44 = verdicts[0];
    const row = screen.getByTestId('verdict-plan-0');
    fireEvent.click(within(row).getByRole('button', { name: reasonText(s44.reasons[0]) }));
    const expected = reasonPoint(lines, 0, s44.reasons[0])!;
    expect(onSelect).toHaveBeenLastCalledWith(expected);
    // The point named is on the right line, at the reason's first speed, and carries that finding.
    const line = lines.find((l) => l.key === expected.lineKey)!;
    expect(line.planIndex).toBe(0);
    expect(line.line.scenarioName).toBe(s44.reasons[0].scenarioName);
    expect(line.line.points.find((p) => p.rpm === expected.rpm)!.findings.some((f) => f.code === s44.reasons[0].code)).toBe(true);

    const more = within(row).getByText(`${s44.reasons.length - 1} more reasons`);
    fireEvent.click(more);
    const buttons = within(row).getAllByRole('button');
    expect(buttons.map((b) => b.textContent)).toEqual(s44.reasons.map(reasonText));
    fireEvent.click(buttons[buttons.length - 1]);
    expect(onSelect).toHaveBeenLastCalledWith(reasonPoint(lines, 0, s44.reasons[s44.reasons.length - 1]));
  });

  it('opens the shared view on the point the first plan that does not fit names first', () => {
    expect(verdicts[0].status).toBe('does-not-fit'); // S44, the engine run above
    expect(firstPointOfInterest(lines)).toEqual(reasonPoint(lines, 0, verdicts[0].reasons[0]));
  });

  it('on paper gives the first reason alone, no buttons, and counts the rest', () => {
    render(<PlanVerdicts lines={lines} />);
    expect(screen.queryAllByRole('button')).toHaveLength(0);
    expect(screen.getByTestId('verdict-plan-0').textContent).toContain(`and ${verdicts[0].reasons.length - 1} more reasons`);
  });

  it('keeps red for a plan that does not fit: teal when it fits, copper with warnings, grey when not judged', () => {
    const study = [
      handLine(0, 'Fits', [point(3000), point(4000)]),
      handLine(1, 'Thin', [point(3000, [warning(3000)]), point(4000)]),
      handLine(2, 'No map', [point(3000)], false),
    ];
    render(<PlanVerdicts lines={study} onSelect={() => undefined} />);
    const stamp = (i: number) => screen.getByTestId(`verdict-plan-${i}`).querySelector('span[data-verdict]')!;
    expect(screen.getByTestId('verdict-plan-0').getAttribute('data-verdict')).toBe('fits');
    expect(stamp(0).className).toContain('text-teal-dark');
    expect(screen.getByTestId('verdict-plan-0').textContent).toContain('every point on the map with the margins the study requires');
    expect(screen.getByTestId('verdict-plan-1').getAttribute('data-verdict')).toBe('fits-with-warnings');
    expect(stamp(1).className).toContain('text-copper-ink');
    expect(screen.getByTestId('verdict-plan-1').textContent).toContain('1 of 2 points with warnings');
    expect(screen.getByTestId('verdict-plan-2').getAttribute('data-verdict')).toBe('not-judged');
    expect(screen.getByTestId('verdict-plan-2').textContent).toContain('no compressor map');
    for (const i of [0, 1, 2]) expect(stamp(i).className).not.toContain('limit');
  });
});

describe('points the compressor cannot deliver', () => {
  // The demo's S44 plan passes choke at sea level from some speed on (the engine, run above).
  const s44 = lines.find((l) => l.key === 'plan-s44|0|0')!;
  const unreachable = s44.line.points.find((p) => p.values?.reachable === false && p.values.mapRegion === 'past-choke')!;

  it('read "not reachable" in the result cells, with the region and "no" beside the engine speed', () => {
    render(<ResultsTable lines={[s44]} />);
    const row = screen.getByTestId('results-table').querySelector<HTMLElement>(`tr[data-row="${s44.key}@${unreachable.rpm}"]`)!;
    const cell = (column: string) => row.querySelector(`td[data-column="${column}"]`)!.textContent;
    expect(cell('mapRegion')).toBe('past choke');
    expect(cell('reachable')).toBe('no');
    for (const column of ['compressorEfficiency', 'compressorOutletTemperature', 'compressorPower', 'brakePower', 'torque', 'injectorDuty'])
      expect(cell(column)).toBe('not reachable');
    // Where the point is and what the engine asks of it stay numbers.
    expect(cell('pressureRatio')).not.toBe('not reachable');
    expect(cell('chokeMargin')).toMatch(/^-/); // past choke: a negative margin, not a blank
    // The exhaust columns of a plan without an exhaust side stay plain dashes.
    expect(cell('turbinePower')).toBe('—');
  });

  it('say why a margin is missing', () => {
    // A light-load point below the map, whose surge line does not reach down that far (hand-made).
    const below = handLine(0, 'Light load', [
      point(2500, [], {
        mapRegion: 'below-map',
        surgeMargin: null,
        chokeMargin: 0.3,
        speedMargin: null,
        marginBasis: { surge: 'below-surge-line', choke: 'choke-line', speed: 'below-map' },
      }),
    ]);
    render(<ResultsTable lines={[below]} />);
    const row = screen.getByTestId('results-table').querySelector(`tr[data-row="${below.key}@2500"]`)!;
    const why = (column: string) => row.querySelector(`td[data-column="${column}"] [title]`)?.getAttribute('title');
    expect(why('surgeMargin')).toBe("No surge margin: the point is below the surge line's lowest pressure ratio, where the map draws no surge line.");
    expect(why('speedMargin')).toMatch(/^No speed margin: the wheel turns slower than the lowest speed line/);
    expect(why('chokeMargin')).toBeUndefined(); // 30 %: there
    expect(row.querySelector('td[data-column="mapRegion"]')!.textContent).toBe('below the map');
    expect(row.querySelector('td[data-column="reachable"]')!.textContent).toBe('yes');
  });

  it('are hollow on the map with a cross keyed "not reachable", and the hover gives region, reachable and all three margins', () => {
    const figure = compressorMapFigure({ map: maps['builtin-compressor-s44'] as never, lines: mapLineViews([s44]), unitSystem: 'si', height: 400 });
    const trace = figure.data.find((t) => (t as { name?: string }).name === s44.label && (t as { customdata?: unknown }).customdata) as {
      marker: { symbol: string[] };
      customdata: [string, number][];
      text: string[];
      showlegend?: boolean;
    };
    const i = trace.customdata.findIndex((c) => c[1] === unreachable.rpm);
    expect(trace.marker.symbol[i]).toBe('circle-open');
    expect(trace.marker.symbol[trace.customdata.findIndex((c) => c[1] === 4000)]).toBe('circle'); // 4,000 rpm sits on the map (the run above)
    expect(trace.text[i]).toContain('Where: past choke');
    expect(trace.text[i]).toContain('Reachable: no');
    expect(trace.text[i]).toMatch(/Surge margin: [\d.]+ %/);
    expect(trace.text[i]).toMatch(/Choke margin: -[\d.]+ %/);
    expect(trace.text[i]).toContain('Speed margin: ');
    expect(trace.text[i]).toContain('Compressor efficiency: not reachable');
    expect(trace.text[i]).toContain('Crank power: not reachable');
    const crosses = figure.data.find((t) => (t as { legendgroup?: string }).legendgroup === 'not-reachable') as { name: string; x: number[] };
    expect(crosses.name).toMatch(/^Not reachable/);
    expect(crosses.x.length).toBe(s44.line.points.filter((p) => p.values?.reachable === false).length);
    // The line's key keeps the plan's filled marker.
    expect(
      figure.data.some((t) => (t as { name?: string; showlegend?: boolean }).name === s44.label && (t as { showlegend?: boolean }).showlegend !== false),
    ).toBe(true);
  });

  it('leave gaps in the curves against rpm, never a 0, and say so in the hover', () => {
    const power = CURVE_VIEWS.find((v) => v.id === 'power')!;
    const figure = rpmCurvesFigure({ lines: [s44], view: power, unitSystem: 'si', highlight: null, height: 300 });
    const crank = figure.data[0] as { x: number[]; y: (number | null)[]; text: string[] };
    const i = crank.x.indexOf(unreachable.rpm);
    expect(crank.y[i]).toBeNull();
    expect(crank.y.filter((y) => y === 0)).toHaveLength(0);
    expect(crank.text.some((t) => t.includes('Not reachable with this compressor at'))).toBe(true);
  });
});

describe('Side by side with verdicts', () => {
  const chosen = (index: number, name: string, status: 'fits' | 'fits-with-warnings' | 'does-not-fit'): ChosenLine => ({
    key: name,
    index,
    planName: name,
    scenarioName: 'Sea level',
    rowLabel: 'Full load',
    verdict: {
      planIndex: index,
      planName: name,
      status,
      reasons: [],
      pointsAtLimit: 0,
      pointsWithWarnings: 0,
      headline: `${VERDICT_WORDS[status]}: hand-made`,
    },
  });

  it('ranks what fits first and keeps the chosen order within one verdict', () => {
    const ranked = rankByVerdict([
      chosen(0, 'A', 'does-not-fit'),
      chosen(1, 'B', 'fits-with-warnings'),
      chosen(2, 'C', 'fits'),
      chosen(3, 'D', 'fits-with-warnings'),
    ]);
    expect(ranked.map((c) => c.planName)).toEqual(['C', 'B', 'D', 'A']); // VERDICT_RANK: fits, with warnings, (not judged), does not fit
  });

  it('shows the verdict row first and marks no best on a plan that does not fit, however good its value', () => {
    const fits: ComparableLine = { points: [point(4000, [], { brakePower: 200_000, surgeMargin: 0.2 })], planVerdict: 'fits' };
    const unfit: ComparableLine = { points: [point(4000, [], { brakePower: 300_000, surgeMargin: 0.3 })], planVerdict: 'does-not-fit' };
    const alsoFits: ComparableLine = { points: [point(4000, [], { brakePower: 250_000, surgeMargin: -0.1, reachable: false })], planVerdict: 'fits' };
    const rows = compareLines([fits, alsoFits, unfit]);
    render(<DifferencesTable rows={rows} chosen={[chosen(0, 'Fits', 'fits'), chosen(1, 'Also', 'fits'), chosen(2, 'Unfit', 'does-not-fit')]} />);
    const table = screen.getByTestId('differences-table');
    const first = table.querySelector('tbody tr')!;
    expect(first.getAttribute('data-row')).toBe('planVerdict');
    expect([...first.querySelectorAll('td[data-verdict]')].map((td) => td.getAttribute('data-verdict'))).toEqual(['fits', 'fits', 'does-not-fit']);
    // Hand-read: the unfit plan has the highest power (300 kW) and surge margin (30 %), yet no best anywhere in its column.
    expect(table.querySelectorAll('tr td:nth-child(6)[data-best]')).toHaveLength(0);
    const power = table.querySelector('tr[data-row="peakBrakePower"]')!.querySelectorAll('td.numeric');
    expect(power[0].getAttribute('data-best')).toBe('true'); // 200 kW: "Also"'s 250 kW is at a point it cannot deliver, so left out (hand-read)
    expect(power[2].textContent).toContain('300'); // shown plainly
    const surge = table.querySelector('tr[data-row="minSurgeMargin"]')!.querySelectorAll('td.numeric');
    expect(surge[1].textContent).toContain('past a limit'); // −10 %: negative, past the surge line
    expect(surge[0].textContent).not.toContain('past a limit');
  });

  it('says "no boost asked" for a line that never asks for boost', () => {
    const summary = {
      boostThresholdRpm: null,
      boostAsked: false,
      peakDrivePressureRatio: null,
      wastegateDiameterNeeded: null,
      wastegateDiameterFitted: 0.038,
      turbineInletPressureAtPeakPower: null,
      peakTurbineInletPressure: null,
    };
    const rows = compareLines([
      { points: [point(3000)], exhaust: summary },
      { points: [point(3000)], exhaust: null },
    ]);
    render(<DifferencesTable rows={rows} chosen={[chosen(0, 'Part throttle', 'fits'), chosen(1, 'Other', 'fits')]} />);
    const cells = screen.getByTestId('differences-table').querySelectorAll('tr[data-row="boostThresholdRpm"] td.numeric');
    expect(cells[0].textContent).toContain('no boost asked');
  });
});
