import { cleanup, render, screen } from '@testing-library/react';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { runStudy } from '#shared/matching';
import { pointWorking } from '#shared/matching/explain-point';
import { studyDocumentSchema, toStudyInput } from '#shared/schemas/study';
import { symbolParts } from '#src/components/study/Formula';
import { studyLines } from '#src/components/study/lines';
import { checkStep, WorkingPanel, workingQuantity } from '#src/components/study/WorkingPanel';
import { UnitSystemProvider } from '#src/lib/quantities';

afterEach(cleanup);

const demo = studyDocumentSchema.parse(JSON.parse(readFileSync(path.resolve(import.meta.dirname, '../../../data/demo/hillclimb-study.json'), 'utf8')));
// Without maps: each plan is judged with its default efficiency, which is enough for the Working's form.
const lines = studyLines(runStudy(toStudyInput(demo)), demo.plans);

describe('symbols of the Working', () => {
  it('reads the ASCII symbols the way they are written by hand', () => {
    expect(symbolParts('m_dot_c_surge')).toEqual({ base: 'm\u0307', sub: 'c,surge' });
    expect(symbolParts('eta_c')).toEqual({ base: 'η', sub: 'c' });
    expect(symbolParts('dP_inj')).toEqual({ base: 'ΔP', sub: 'inj' });
    expect(symbolParts('rho_man')).toEqual({ base: 'ρ', sub: 'man' });
    expect(symbolParts('PR')).toEqual({ base: 'PR', sub: null });
  });

  it('shows fuel flows in the fuel trade’s units and the boost lookup as gauge', () => {
    expect(workingQuantity({ id: 'injector-duty' }, { symbol: 'Q_f', value: 1e-5, kind: 'volumeFlow' })).toBe('fuelFlow');
    expect(workingQuantity({ id: 'injector-flow' }, { symbol: 'Q_rated', value: 1e-5, kind: 'volumeFlow' })).toBe('injectorFlow');
    expect(workingQuantity({ id: 'inlet-volume-flow' }, { symbol: 'Q_1', value: 0.1, kind: 'volumeFlow' })).toBe('volumeFlow');
    expect(workingQuantity({ id: 'boost' }, { symbol: 'y_0', value: 50_000, kind: 'pressure' })).toBe('pressureGauge');
    expect(workingQuantity({ id: 'inlet-temperature' }, { symbol: 'dT_in', value: 5, kind: 'none', unit: 'K' })).toBe('temperatureDifference');
  });
});

describe('WorkingPanel', () => {
  const line = lines[0];
  const point = line.line.points.find((p) => p.rpm === 4500)!;

  it('shows every step of the point with its title, formula check and source', () => {
    render(<WorkingPanel line={line} point={point} />);
    const steps = pointWorking(line.line.context, point);
    expect(steps.length).toBeGreaterThan(15);
    for (const s of steps) expect(screen.getAllByText(s.title).length).toBeGreaterThan(0);
    expect(screen.getByRole('heading', { name: 'Working at 4,500 rpm' })).toBeTruthy();
    // Every formula the panel evaluates agrees with the engine's own result (mathjs on SI values).
    const checks = document.querySelectorAll('[data-step] p.text-xs');
    expect([...checks].some((p) => p.textContent?.startsWith('Check failed'))).toBe(false);
    expect(screen.getAllByText(/^Check: evaluating the formula/).length).toBeGreaterThan(10);
  });

  it('evaluates each step’s formula to the engine’s value', () => {
    for (const s of pointWorking(line.line.context, point)) {
      const check = checkStep(s);
      if (check) expect(check.agrees, `${s.id}: ${s.formula}`).toBe(true);
    }
  });

  it('shows the values in US customary units when asked', () => {
    render(
      <UnitSystemProvider system="us">
        <WorkingPanel line={line} point={point} />
      </UnitSystemProvider>,
    );
    const corrected = document.querySelector('[data-step="corrected-flow"]')!;
    expect(corrected.textContent).toMatch(/lb\/min/);
    expect(corrected.textContent).not.toMatch(/kg\/s/);
  });

  it('asks for a point when none is picked', () => {
    render(<WorkingPanel line={null} point={null} />);
    expect(screen.getByText(/Pick a point/)).toBeTruthy();
  });
});
