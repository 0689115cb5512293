import { useId } from 'react';
import type { MapKind } from '#shared/maps/format';
import { MAX_MAP_NAME_LENGTH } from '#shared/maps/format';
import { TRACE_UNIT_CHOICES, type TraceState } from '#shared/tracer/state';
import { inputClass } from '#src/components/TextField';
import { setFlowParameterAxis, setKind } from '../state/edits';
import type { ChangeTrace } from '../state/use-trace-history';
import { ChoiceField, NumberField, settingId, unitOption } from './fields';

/**
 * Step 1: what the picture is a map of, and the header values its file needs: name, flow axis
 * and unit, reference conditions (compressor) or housing (turbine), efficiency scale, speed unit.
 */
export function MapPanel({ state, change, disabled }: { state: TraceState; change: ChangeTrace; disabled: boolean }) {
  const kindName = useId();
  const c = state.compressor;
  const t = state.turbine;
  const flowUnits = c.flowAxis === 'volume' ? TRACE_UNIT_CHOICES.volumeFlow : TRACE_UNIT_CHOICES.correctedMassFlow;
  return (
    <fieldset disabled={disabled} className="space-y-5">
      <legend className="sr-only">The map</legend>
      <div role="radiogroup" aria-labelledby={kindName} className="space-y-2">
        <p id={kindName} className="text-sm font-semibold text-ink">
          The picture shows a
        </p>
        <div className="flex flex-wrap gap-2">
          {(['compressor', 'turbine'] as MapKind[]).map((kind) => (
            <label
              key={kind}
              className={`flex cursor-pointer items-center gap-2 rounded-md border px-3 py-2 text-sm ${state.kind === kind ? 'border-teal bg-teal-light/60 font-semibold' : 'border-ink/20 bg-white/70'}`}
            >
              <input
                type="radio"
                name={`${kindName}-kind`}
                value={kind}
                checked={state.kind === kind}
                onChange={() => change((s) => setKind(s, kind))}
                className="accent-teal"
              />
              {kind === 'compressor' ? 'Compressor map' : 'Turbine map'}
            </label>
          ))}
        </div>
      </div>

      <div className="space-y-1">
        <label htmlFor={settingId('name')} className="block text-sm font-semibold text-ink">
          Map name
        </label>
        <input
          id={settingId('name')}
          className={inputClass}
          value={state.name}
          maxLength={MAX_MAP_NAME_LENGTH}
          onChange={(event) => {
            const name = event.target.value;
            change((s) => ({ ...s, name }), 'name');
          }}
        />
      </div>

      {state.kind === 'compressor' ? (
        <>
          <div className="grid grid-cols-[1fr_8rem] gap-3">
            <ChoiceField
              label="Horizontal axis shows"
              id={settingId('flowAxis')}
              value={c.flowAxis}
              options={[
                { value: 'corrected-mass', label: 'Corrected mass flow' },
                { value: 'volume', label: 'Inlet volume flow' },
              ]}
              onChange={(flowAxis) =>
                change((s) => ({
                  ...s,
                  compressor: {
                    ...s.compressor,
                    flowAxis,
                    flowUnit: (flowAxis === 'volume' ? TRACE_UNIT_CHOICES.volumeFlow : TRACE_UNIT_CHOICES.correctedMassFlow)[0],
                  },
                }))
              }
            />
            <ChoiceField
              label="Flow unit"
              id={settingId('flowUnit')}
              value={c.flowUnit}
              options={flowUnits.map(unitOption)}
              onChange={(flowUnit) => change((s) => ({ ...s, compressor: { ...s.compressor, flowUnit } }))}
            />
          </div>
          <p className="text-sm text-ink-soft">The vertical axis is the pressure ratio (total to total).</p>
          <fieldset className="space-y-3 rounded-md border border-paper-line p-3">
            <legend className="px-1 text-sm font-semibold text-ink">Reference conditions of the map</legend>
            <p className="text-xs text-ink-soft">Printed on the map, usually beside the flow axis title. The map’s corrected flows refer to them.</p>
            <ReferenceCondition
              which="referenceTemperature"
              label="Reference temperature"
              unitLabel="Reference temperature unit"
              choices={TRACE_UNIT_CHOICES.temperature}
              focusKey="refT"
              state={state}
              change={change}
            />
            <ReferenceCondition
              which="referencePressure"
              label="Reference pressure (absolute)"
              unitLabel="Reference pressure unit"
              choices={TRACE_UNIT_CHOICES.pressure}
              focusKey="refP"
              state={state}
              change={change}
            />
          </fieldset>
        </>
      ) : (
        <>
          <div className="grid grid-cols-2 gap-3">
            <ChoiceField
              label="Axes"
              id={settingId('flowParameterAxis')}
              value={t.flowParameterAxis}
              options={[
                { value: 'y', label: 'Expansion ratio across, flow parameter up' },
                { value: 'x', label: 'Flow parameter across, expansion ratio up' },
              ]}
              onChange={(axis) => change((s) => setFlowParameterAxis(s, axis))}
            />
            <ChoiceField
              label="Flow parameter unit"
              id={settingId('flowParameterUnit')}
              value={t.flowParameterUnit}
              options={TRACE_UNIT_CHOICES.flowParameter.map(unitOption)}
              onChange={(flowParameterUnit) => change((s) => ({ ...s, turbine: { ...s.turbine, flowParameterUnit } }))}
            />
            <ChoiceField
              label="Housing"
              id={settingId('housing')}
              value={t.housing}
              options={[
                { value: 'single', label: 'Single scroll' },
                { value: 'divided', label: 'Divided (twin entry)' },
              ]}
              onChange={(housing) => change((s) => ({ ...s, turbine: { ...s.turbine, housing } }))}
            />
            {t.housing === 'divided' && (
              <ChoiceField
                label="Flows measured with"
                id={settingId('scrollFeed')}
                value={t.scrollFeed}
                options={[
                  { value: 'both', label: 'Both scrolls fed' },
                  { value: 'per-scroll', label: 'One scroll (per-scroll flow)' },
                ]}
                onChange={(scrollFeed) => change((s) => ({ ...s, turbine: { ...s.turbine, scrollFeed } }))}
              />
            )}
            <NumberField
              id={settingId('areaRatio')}
              label="A/R (optional)"
              value={t.areaRatio}
              onChange={(areaRatio) => change((s) => ({ ...s, turbine: { ...s.turbine, areaRatio } }), 'ar')}
            />
            <ChoiceField
              label="Efficiency counts"
              id={settingId('efficiencyKind')}
              value={t.efficiencyKind ?? ''}
              options={[
                { value: '', label: 'Not stated (read as aerodynamic only)' },
                { value: 'with-bearing-losses', label: 'The bearings too (total-to-static, gas stand)' },
                { value: 'aerodynamic', label: 'The wheel alone (aerodynamic only)' },
              ]}
              onChange={(kind) => change((s) => ({ ...s, turbine: { ...s.turbine, efficiencyKind: kind === '' ? null : kind } }))}
            />
          </div>
        </>
      )}

      <div className="grid grid-cols-2 gap-3">
        <ChoiceField
          label="Efficiency written in"
          id={settingId('efficiency')}
          value={state.efficiency}
          options={[
            { value: 'percent', label: 'Percent (74)' },
            { value: 'fraction', label: 'Fraction (0.74)' },
          ]}
          onChange={(efficiency) => change((s) => ({ ...s, efficiency }))}
        />
        <ChoiceField
          label="Speeds written in"
          id={settingId('speedUnit')}
          value={state.speedUnit}
          options={TRACE_UNIT_CHOICES.speed.map((unit) => ({ value: unit, label: unit }))}
          onChange={(speedUnit) => change((s) => ({ ...s, speedUnit }))}
        />
        {state.kind === 'compressor' && (
          <NumberField
            id={settingId('maxSpeed')}
            label="Rated speed limit (optional)"
            unit={state.speedUnit}
            value={c.maxSpeed}
            onChange={(maxSpeed) => change((s) => ({ ...s, compressor: { ...s.compressor, maxSpeed } }), 'maxSpeed')}
          />
        )}
      </div>

      <div className="space-y-1">
        <label htmlFor={settingId('notes')} className="block text-sm font-semibold text-ink">
          Notes
        </label>
        <textarea
          id={settingId('notes')}
          className={`${inputClass} min-h-20`}
          value={state.notes}
          onChange={(event) => {
            const notes = event.target.value;
            change((s) => ({ ...s, notes }), 'notes');
          }}
        />
        <p className="text-xs text-ink-soft">Where the picture came from, anything the team should know. Written into the file as note lines.</p>
      </div>
    </fieldset>
  );
}

type ReferenceKey = 'referenceTemperature' | 'referencePressure';

/** One reference condition of a compressor map: its value and its unit, side by side. */
function ReferenceCondition<K extends ReferenceKey>({
  which,
  label,
  unitLabel,
  choices,
  focusKey,
  state,
  change,
}: {
  which: K;
  label: string;
  unitLabel: string;
  choices: readonly TraceState['compressor'][K]['unit'][];
  focusKey: string;
  state: TraceState;
  change: ChangeTrace;
}) {
  const quantity = state.compressor[which];
  const set = (patch: Partial<TraceState['compressor'][K]>, key?: string) =>
    change((s) => ({ ...s, compressor: { ...s.compressor, [which]: { ...s.compressor[which], ...patch } } }), key);
  return (
    <div className="grid grid-cols-[1fr_7rem] items-end gap-2">
      <NumberField
        id={settingId(which)}
        label={label}
        value={quantity.value}
        onChange={(value) => set({ value } as Partial<TraceState['compressor'][K]>, focusKey)}
      />
      <ChoiceField
        label={<span className="sr-only">{unitLabel}</span>}
        value={quantity.unit}
        options={choices.map(unitOption)}
        onChange={(unit) => set({ unit } as Partial<TraceState['compressor'][K]>)}
      />
    </div>
  );
}
