import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { ReactNode } from 'react';
import { afterEach, describe, expect, it } from 'vitest';
import { studyDocumentSchema } from '#shared/schemas/study';
import type { MapSummary } from '#src/features/maps/api';
import { AssumptionsSection } from '#src/features/studies/components/editor/AssumptionsSection';
import { EngineSection } from '#src/features/studies/components/editor/EngineSection';
import { ExhaustFields } from '#src/features/studies/components/editor/ExhaustFields';
import { FuelSection } from '#src/features/studies/components/editor/FuelSection';
import { ScenariosSection } from '#src/features/studies/components/editor/ScenariosSection';
import type { UnitSystem } from '#src/lib/quantities';
import { EditorHost } from './study-editor-host';

afterEach(cleanup);

const root = path.resolve(import.meta.dirname, '../../..');
const demo = (file: string) => JSON.parse(readFileSync(path.join(root, 'data/demo', file), 'utf8')) as Record<string, unknown>;

/** A section of the study editor over a live draft, as the study page has it. */
function Host({
  start,
  unitSystem = 'si',
  onDraft,
  children,
}: {
  start: Record<string, unknown>;
  unitSystem?: UnitSystem;
  onDraft: (d: Record<string, unknown>) => void;
  children: ReactNode;
}) {
  return (
    <EditorHost start={start} unitSystem={unitSystem} onDraft={onDraft}>
      {children}
    </EditorHost>
  );
}

const type = (input: HTMLElement, text: string) => fireEvent.change(input, { target: { value: text } });
const valid = (draft: Record<string, unknown>) => studyDocumentSchema.safeParse(draft).success;

describe('the study editor’s new inputs', () => {
  it('gives each loss the flow and density it was measured at, in the user’s units, and clears the density with the flow', () => {
    let draft: Record<string, unknown> = {};
    render(
      <Host start={demo('hillclimb-study.json')} unitSystem="us" onDraft={(d) => (draft = d)}>
        <AssumptionsSection />
      </Host>,
    );
    const inlet = within(screen.getByTestId('loss-inlet'));
    // 0.34 kg/s × 60/0.45359237 = 44.974 lb/min (NIST SP 811 pound); the demo's own reference flow.
    expect((inlet.getByLabelText('At engine air flow') as HTMLInputElement).value).toBe('44.974');
    type(inlet.getByLabelText('At engine air flow'), '40');
    expect((draft.losses as { inlet: { referenceMassFlow: number } }).inlet.referenceMassFlow).toBeCloseTo((40 * 0.45359237) / 60, 12); // lb/min → kg/s
    type(inlet.getByLabelText('At engine air flow'), '');
    expect((draft.losses as { inlet: unknown }).inlet).toEqual({ pressureLoss: 2500 }); // the same loss at every flow, density gone too
    expect(inlet.queryByLabelText('Density of the air then')).toBeNull();
    expect(valid(draft)).toBe(true);
  });

  it('takes a relative humidity per scenario, and keeps it when the ambient pressure’s source changes', () => {
    let draft: Record<string, unknown> = {};
    render(
      <Host start={demo('hillclimb-study.json')} onDraft={(d) => (draft = d)}>
        <ScenariosSection />
      </Host>,
    );
    const first = within(screen.getByTestId('scenario-0'));
    type(first.getByLabelText('Relative humidity'), '55');
    const ambient = () => (draft.scenarios as { ambient: { relativeHumidity?: number; altitude?: number } }[])[0].ambient;
    expect(ambient().relativeHumidity).toBeCloseTo(0.55, 12); // percent in the box, fraction stored
    fireEvent.change(first.getByLabelText('Ambient pressure from'), { target: { value: 'altitude' } });
    expect(ambient()).toMatchObject({ altitude: 0, relativeHumidity: 0.55 });
    expect(valid(draft)).toBe(true);
  });

  it('asks a two-stroke for its trapping efficiency, and drops it for a four-stroke', () => {
    let draft: Record<string, unknown> = {};
    render(
      <Host start={demo('hillclimb-study.json')} onDraft={(d) => (draft = d)}>
        <EngineSection />
      </Host>,
    );
    expect(screen.queryByLabelText('Trapping efficiency')).toBeNull();
    fireEvent.change(screen.getByLabelText('Cycle'), { target: { value: '2' } });
    type(screen.getByLabelText('Trapping efficiency'), '72');
    expect((draft.engine as { trappingEfficiency: number }).trappingEfficiency).toBeCloseTo(0.72, 12);
    expect(valid(draft)).toBe(true);
    fireEvent.change(screen.getByLabelText('Cycle'), { target: { value: '4' } });
    expect((draft.engine as { trappingEfficiency?: number }).trappingEfficiency).toBeUndefined();
    expect(valid(draft)).toBe(true);
  });

  it('takes an injector’s rating fluid density and its dead time at a battery voltage', () => {
    let draft: Record<string, unknown> = {};
    render(
      <Host start={demo('hillclimb-study.json')} onDraft={(d) => (draft = d)}>
        <FuelSection />
      </Host>,
    );
    const [primaryDead] = screen.getAllByLabelText('Dead time');
    type(primaryDead, '0.85');
    const primary = () => (draft.fuelSystem as { injectors: { primary: Record<string, unknown> } }).injectors.primary;
    expect(primary().deadTime).toEqual({ time: 0.00085, voltage: 14 }); // ms in the box, s stored; 14 V until stated
    type(screen.getAllByLabelText('Dead time measured at')[0], '13.2');
    expect((primary().deadTime as { voltage: number }).voltage).toBe(13.2);
    type(screen.getAllByLabelText('Rating fluid density')[0], '700');
    expect(primary().ratingFluidDensity).toBe(700);
    expect(valid(draft)).toBe(true);
    type(primaryDead, '');
    expect(primary().deadTime).toBeUndefined();
  });

  it('shows what the turbine map’s efficiency counts in the plan’s exhaust block', () => {
    const turbine = (
      id: string,
      name: string,
      builtin: boolean,
      summary: Pick<MapSummary['summary'], 'housing' | 'areaRatio' | 'efficiencyKind'>,
    ): MapSummary => ({
      id,
      kind: 'turbine',
      name,
      notes: '',
      builtin,
      createdBy: null,
      updatedAt: null,
      summary: { curves: 3, topSpeed: null, maxSpeed: null, ...summary },
    });
    const maps: MapSummary[] = [
      turbine('builtin-turbine-t64-ar064-single', 'T64 0.64 single', true, { housing: 'single', areaRatio: 0.64, efficiencyKind: 'with-bearing-losses' }),
      turbine('team-map', 'Our own', false, { housing: 'single', areaRatio: 0.7, efficiencyKind: null }),
    ];
    let draft: Record<string, unknown> = {};
    render(
      <Host start={demo('hillclimb-study.json')} onDraft={(d) => (draft = d)}>
        <ExhaustFields planIndex={0} turbineMaps={maps} turbineMapsError={null} />
      </Host>,
    );
    fireEvent.click(screen.getByLabelText('Exhaust side'));
    expect(screen.getByTestId('plan-0-turbine-efficiency-kind').textContent).toMatch(/total-to-static, with bearing losses.*not applied again/);
    expect(screen.getByText(/Not applied with this map/)).toBeTruthy();
    fireEvent.change(screen.getByLabelText('Turbine map'), { target: { value: 'team-map' } });
    expect(screen.getByTestId('plan-0-turbine-efficiency-kind').textContent).toMatch(/not stated, read as aerodynamic only/);
    const loss = within(screen.getByTestId('plan-0-downstream-loss'));
    type(loss.getByLabelText('At engine exhaust flow'), '0.3');
    type(loss.getByLabelText('Density of the exhaust gas then'), '0.3');
    expect((draft.plans as { exhaust: { downstreamLoss: unknown } }[])[0].exhaust.downstreamLoss).toEqual({
      pressureLoss: 15_000,
      referenceMassFlow: 0.3,
      referenceDensity: 0.3,
    });
    expect(valid(draft)).toBe(true);
  });
});
