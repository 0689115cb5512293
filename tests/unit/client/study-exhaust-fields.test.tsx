import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { studyDocumentSchema } from '#shared/schemas/study';
import type { MapSummary } from '#src/features/maps/api';
import { ExhaustFields } from '#src/features/studies/components/editor/ExhaustFields';
import type { UnitSystem } from '#src/lib/quantities';
import { EditorHost } from './study-editor-host';

afterEach(cleanup);

const compressorDemo = JSON.parse(readFileSync(path.resolve(import.meta.dirname, '../../../data/demo/hillclimb-study.json'), 'utf8')) as Record<
  string,
  unknown
>;

const turbine = (id: string, name: string, housing: 'single' | 'divided', areaRatio: number): MapSummary => ({
  id,
  kind: 'turbine',
  name,
  notes: '',
  builtin: true,
  createdBy: null,
  updatedAt: null,
  summary: { curves: 3, topSpeed: null, maxSpeed: null, housing, areaRatio },
});
const turbineMaps: MapSummary[] = [
  turbine('builtin-turbine-t64-ar064-single', 'T64 0.64 single', 'single', 0.64),
  turbine('builtin-turbine-t64-ar082-divided', 'T64 0.82 divided', 'divided', 0.82),
];

/** The exhaust fields of plan 1 of the compressor demo study, editing a live draft as the study page does. */
function Host({ unitSystem = 'si', onDraft }: { unitSystem?: UnitSystem; onDraft: (draft: Record<string, unknown>) => void }) {
  return (
    <EditorHost start={compressorDemo} unitSystem={unitSystem} onDraft={onDraft}>
      <ExhaustFields planIndex={0} turbineMaps={turbineMaps} turbineMapsError={null} />
    </EditorHost>
  );
}

const plan0 = (draft: Record<string, unknown>) => (draft.plans as Record<string, unknown>[])[0];

describe('the exhaust side of a plan in the study editor', () => {
  it('is off until asked for, and switched on gives a block the study schema accepts', () => {
    let draft: Record<string, unknown> = {};
    render(<Host onDraft={(d) => (draft = d)} />);
    const toggle = screen.getByLabelText('Exhaust side') as HTMLInputElement;
    expect(toggle.checked).toBe(false);
    expect(screen.queryByLabelText('Turbine map')).toBeNull();

    fireEvent.click(toggle);
    expect(plan0(draft).turbineMapId).toBe('builtin-turbine-t64-ar064-single'); // the first map offered
    expect((plan0(draft).exhaust as { housing: string }).housing).toBe('single'); // follows that map's housing
    expect(studyDocumentSchema.safeParse(draft).success).toBe(true);
    expect((screen.getByLabelText('Valve diameter (each gate)') as HTMLInputElement).value).toBe('44'); // 0.044 m starting value, in mm
    expect(screen.queryByLabelText('Pulse-energy factor')).toBeNull(); // a single scroll has no pulse factor

    fireEvent.click(screen.getByLabelText('Exhaust side'));
    expect(plan0(draft).exhaust).toBeUndefined();
    expect(plan0(draft).turbineMapId).toBeUndefined();
    expect(studyDocumentSchema.safeParse(draft).success).toBe(true);
  });

  it('takes the housing and a gate per scroll from a divided map, with the pulse factor explained, and drops the factor again for a single scroll', () => {
    let draft: Record<string, unknown> = {};
    render(<Host onDraft={(d) => (draft = d)} />);
    fireEvent.click(screen.getByLabelText('Exhaust side'));
    fireEvent.change(screen.getByLabelText('Turbine map'), { target: { value: 'builtin-turbine-t64-ar082-divided' } });
    const exhaust = () => plan0(draft).exhaust as { housing: string; wastegates: { count: number }; pulseFactor?: number };
    expect(plan0(draft).turbineMapId).toBe('builtin-turbine-t64-ar082-divided');
    expect(exhaust().housing).toBe('divided');
    expect(exhaust().wastegates.count).toBe(2);
    expect(screen.getByText(/pulses carry energy that mean pressures cannot show/)).toBeTruthy();

    fireEvent.change(screen.getByLabelText('Pulse-energy factor'), { target: { value: '1.1' } });
    expect(exhaust().pulseFactor).toBe(1.1);
    expect(studyDocumentSchema.safeParse(draft).success).toBe(true);

    fireEvent.change(screen.getByLabelText('Turbine housing'), { target: { value: 'single' } });
    expect(exhaust().housing).toBe('single');
    expect(exhaust().pulseFactor).toBeUndefined(); // the schema refuses a pulse factor on a single scroll
    expect(exhaust().wastegates.count).toBe(1);
    expect(studyDocumentSchema.safeParse(draft).success).toBe(true);
    // The map is still the divided one: the form says the map's capacity is used as it is.
    expect(screen.getByText(/measured on a divided housing/)).toBeTruthy();
  });

  it('shows and takes the valve diameter in inches for US units, stored in metres', () => {
    let draft: Record<string, unknown> = {};
    render(<Host unitSystem="us" onDraft={(d) => (draft = d)} />);
    fireEvent.click(screen.getByLabelText('Exhaust side'));
    const valve = screen.getByLabelText('Valve diameter (each gate)') as HTMLInputElement;
    expect(valve.value).toBe('1.7323'); // 44 mm / 25.4 mm per in (NIST SP 811) = 1.73228 in, 5 significant figures
    fireEvent.change(valve, { target: { value: '2' } });
    expect((plan0(draft).exhaust as { wastegates: { valveDiameter: number } }).wastegates.valveDiameter).toBeCloseTo(0.0508, 10); // 2 in = 50.8 mm (NIST SP 811)
  });

  it('says where a value is wrong, beside the field', () => {
    render(<Host onDraft={() => undefined} />);
    fireEvent.click(screen.getByLabelText('Exhaust side'));
    fireEvent.change(screen.getByLabelText('Mechanical efficiency'), { target: { value: '120' } });
    const field = screen.getByLabelText('Mechanical efficiency');
    expect(field.getAttribute('aria-invalid')).toBe('true');
  });
});
