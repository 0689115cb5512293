import { cleanup, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import type { ExhaustLineSummary } from '#shared/matching/exhaust/result';
import type { OperatingPoint, PointValues } from '#shared/matching/result';
import { compareLines, type ComparableLine } from '#shared/study/compare';
import { DifferencesTable, rowUnit, rowValueText } from '#src/features/compare/components/DifferencesTable';

afterEach(cleanup);

// Two tiny synthetic lines: compareLines reads only the exhaust summaries and targetHeld here, so
// the points carry just those; every expected text below is hand-read from these values.
function point(rpm: number, targetHeld: boolean): OperatingPoint {
  return { solved: true, rpm, values: { rpm, targetHeld } as PointValues, findings: [] };
}

const summary: ExhaustLineSummary = {
  boostThresholdRpm: 3500,
  peakDrivePressureRatio: { value: 1.25, rpm: 6000 },
  wastegateDiameterNeeded: { value: 0.032, rpm: 7000 },
  wastegateDiameterFitted: 0.038,
  turbineInletPressureAtPeakPower: { value: 250_000, rpm: 6000 },
  peakTurbineInletPressure: { value: 260_000, rpm: 7000 },
};
const early: ComparableLine = { points: [point(2500, false), point(3500, true)], exhaust: summary };
const never: ComparableLine = {
  points: [point(2500, false), point(3500, false)],
  exhaust: { ...summary, boostThresholdRpm: null, peakDrivePressureRatio: { value: 0.95, rpm: 7000 } },
};
const noExhaust: ComparableLine = { points: [point(2500, false)], exhaust: null };

const chosen = ['A', 'B', 'C'].map((name, index) => ({ key: name, index, planName: `Plan ${name}`, scenarioName: 'Sea level', rowLabel: 'Full load' }));

function rowOf(key: string): HTMLElement {
  const tr = screen.getByTestId('differences-table').querySelector<HTMLElement>(`tr[data-row="${key}"]`);
  if (!tr) throw new Error(`no row ${key}`);
  return tr;
}

describe('DifferencesTable with an exhaust side', () => {
  it('shows the drive pressure ratio with its own symbols and words, the lowest marked best', () => {
    render(<DifferencesTable rows={compareLines([early, never, noExhaust])} chosen={chosen} />);
    const tr = rowOf('peakDrivePressureRatio');
    expect(within(tr).getByText('Peak drive pressure ratio')).toBeTruthy();
    // Symbols of the physics note §5: drive pressure ratio p3/p_man.
    expect(within(tr).getByText('p₃/p_man (ratio)')).toBeTruthy();
    expect(within(tr).getByText('exhaust over intake manifold')).toBeTruthy();
    const cells = tr.querySelectorAll('td.numeric');
    expect(cells[0].textContent).toContain('1.25'); // hand-read from the summary above
    expect(cells[0].textContent).toContain('at 6,000 rpm');
    expect(cells[1].textContent).toContain('0.95');
    expect(cells[1].getAttribute('data-best')).toBe('true'); // lowest of 1.25 and 0.95 (hand-read)
    expect(cells[2].textContent).toContain('no exhaust side');
  });

  it('says "not reached" for a line that never holds its target and "no exhaust side" for a compressor-only line', () => {
    render(<DifferencesTable rows={compareLines([early, never, noExhaust])} chosen={chosen} />);
    const cells = rowOf('boostThresholdRpm').querySelectorAll('td.numeric');
    expect(cells[0].textContent).toContain('3,500'); // hand-read threshold
    expect(cells[0].textContent).not.toContain('at '); // the value is itself an engine speed
    expect(cells[0].getAttribute('data-best')).toBe('true'); // reaching beats never reaching (definition of the row)
    expect(cells[1].textContent).toContain('not reached');
    expect(cells[1].textContent).not.toContain('not computed');
    expect(cells[2].textContent).toContain('no exhaust side');
  });

  it('shows the wastegate valves as diameters and the turbine inlet pressure as absolute, in both unit systems', () => {
    const rows = compareLines([early, noExhaust]);
    const needed = rows.find((r) => r.key === 'wastegateDiameterNeeded')!;
    const p3 = rows.find((r) => r.key === 'turbineInletPressureAtPeakPower')!;
    expect(rowUnit(needed, 'si')).toBe('mm');
    expect(rowValueText(needed, 0.032, 'si')).toBe('32'); // 0.032 m = 32 mm, definition
    expect(rowUnit(needed, 'us')).toBe('in');
    expect(rowValueText(needed, 0.0381, 'us')).toBe('1.5'); // 1 in = 25.4 mm exactly (NIST SP 811): 38.1 mm = 1.5 in
    expect(rowUnit(p3, 'si')).toBe('kPa abs.');
    expect(rowValueText(p3, 250_000, 'si')).toBe('250'); // 250 000 Pa = 250 kPa, definition
    expect(rowUnit(p3, 'us')).toBe('psi abs.');
  });

  it('shows no exhaust row for compressor-only lines', () => {
    render(<DifferencesTable rows={compareLines([noExhaust, noExhaust])} chosen={chosen.slice(0, 2)} />);
    expect(screen.getByTestId('differences-table').querySelector('tr[data-row="boostThresholdRpm"]')).toBeNull();
    expect(screen.queryByText('no exhaust side')).toBeNull();
  });
});
