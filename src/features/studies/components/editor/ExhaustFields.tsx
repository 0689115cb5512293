import { turbineEfficiencyKindMeaning } from '#shared/maps/format';
import { DEFAULT_PULSE_FACTOR, DEFAULT_TURBINE_EFFICIENCY } from '#shared/matching/exhaust/context';
import type { MapSummary } from '#src/features/maps/api';
import type { ExhaustDraft } from '#src/features/studies/lib/draft';
import { useEditor } from './context';
import { ChoiceField, NumberField, ToggleField } from './fields';
import { LossFields } from './LossFields';
import { RpmTableEditor } from './RpmTableEditor';
import { FieldRow, SubHeading } from './Section';
import { formatNumber } from '#src/lib/quantities';

type Housing = NonNullable<ExhaustDraft['housing']>;

/**
 * A new exhaust side's starting values (a user sets every one before trusting a result): one
 * 44 mm gate, discharge coefficient 0.8, 95 % mechanical efficiency, exhaust gas about 850 °C
 * rising to 900 °C, 15 kPa after the turbine (the same at every flow until the user gives the flow
 * it was measured at). Typical of a small petrol engine (from memory).
 */
function startingExhaust(housing: Housing): ExhaustDraft {
  return {
    housing,
    wastegates: { count: housing === 'divided' ? 2 : 1, valveDiameter: housing === 'divided' ? 0.038 : 0.044, dischargeCoefficient: 0.8 },
    mechanicalEfficiency: 0.95,
    turbineInletTemperature: [
      { rpm: 3000, value: 1123.15 },
      { rpm: 6000, value: 1173.15 },
    ],
    downstreamLoss: { pressureLoss: 15_000 },
  };
}

/** What the library says of a turbine map: its housing and A/R, in words. */
export function turbineMapFacts(m: MapSummary): string | null {
  const housing = m.summary.housing === 'divided' ? 'a divided housing' : m.summary.housing === 'single' ? 'a single-scroll housing' : null;
  const ar = typeof m.summary.areaRatio === 'number' ? `A/R ${formatNumber(m.summary.areaRatio, 3)}` : null;
  if (!housing && !ar) return null;
  return `Measured on ${housing ?? 'an unstated housing'}${ar ? `, ${ar}` : ''}.`;
}

/**
 * The exhaust side of one plan: turbine map and housing, wastegates, mechanical efficiency,
 * exhaust gas temperature by rpm and the loss after the turbine. Off by default: a plan without
 * it is judged on the compressor alone.
 */
export function ExhaustFields({
  planIndex,
  turbineMaps,
  turbineMapsError,
}: {
  planIndex: number;
  turbineMaps: MapSummary[] | undefined;
  turbineMapsError: string | null;
}) {
  const editor = useEditor();
  const base = ['plans', planIndex];
  const plan = editor.draft.plans?.[planIndex];
  const exhaust = plan?.exhaust;
  const turbineMapId = plan?.turbineMapId ?? null;
  const known = new Set((turbineMaps ?? []).map((m) => m.id));
  const chosen = turbineMaps?.find((m) => m.id === turbineMapId);

  function toggle(on: boolean) {
    if (on) {
      const first = turbineMaps?.[0];
      const housing: Housing = first?.summary.housing === 'divided' ? 'divided' : 'single';
      editor.update([...base, 'exhaust'], startingExhaust(housing));
      editor.update([...base, 'turbineMapId'], first?.id ?? null);
    } else {
      editor.update([...base, 'exhaust'], undefined);
      editor.update([...base, 'turbineMapId'], undefined);
    }
  }

  function chooseHousing(housing: Housing) {
    if (!exhaust || exhaust.housing === housing) return;
    const { pulseFactor: _pulse, ...rest } = exhaust;
    editor.update([...base, 'exhaust'], {
      ...rest,
      housing,
      // A divided housing usually has a gate per scroll; a single scroll one gate.
      wastegates: { ...exhaust.wastegates, count: housing === 'divided' ? 2 : 1 },
    });
  }

  function chooseMap(id: string) {
    editor.update([...base, 'turbineMapId'], id === '' ? null : id);
    // The housing follows the map's, so the two agree unless the user says otherwise afterwards.
    const map = turbineMaps?.find((m) => m.id === id);
    const housing = map?.summary.housing;
    if (housing === 'single' || housing === 'divided') chooseHousing(housing);
  }

  const mapOptions = [
    { value: '', label: 'No turbine map: the exhaust side is not computed' },
    ...(turbineMaps ?? []).map((m) => ({ value: m.id, label: m.builtin ? `${m.name} (built-in demo)` : m.name })),
    ...(turbineMapId && !known.has(turbineMapId)
      ? [{ value: turbineMapId, label: turbineMaps ? `${turbineMapId} (not in the library)` : 'Loading the map library…' }]
      : []),
  ];
  const mapHousing = chosen?.summary.housing;

  return (
    <div className="space-y-3 rounded-md border border-dashed border-ink/20 bg-paper/40 p-3" data-testid={`plan-${planIndex}-exhaust`}>
      <ToggleField
        label="Exhaust side"
        checked={exhaust !== undefined}
        onChange={toggle}
        hint="Turbine, wastegates and back-pressure: whether the turbine can hold the boost target, where full boost arrives, and the gate size it takes."
      />
      {exhaust && (
        <>
          {turbineMapsError && <p className="text-sm text-copper-ink">The turbine maps could not be loaded: {turbineMapsError}</p>}
          <ChoiceField path={[...base, 'turbineMapId']} label="Turbine map" value={turbineMapId ?? ''} options={mapOptions} onChoose={chooseMap} />
          {turbineMapId === null && <p className="text-sm text-copper-ink">Choose a turbine map: without one the exhaust side is not computed.</p>}
          {chosen && turbineMapFacts(chosen) && <p className="-mt-2 text-xs text-ink-soft">{turbineMapFacts(chosen)}</p>}
          {chosen && (
            <p className="-mt-2 text-xs text-ink-soft" data-testid={`plan-${planIndex}-turbine-efficiency-kind`}>
              The map&apos;s turbine efficiency: {turbineEfficiencyKindMeaning(chosen.summary.efficiencyKind)}.
            </p>
          )}
          <ChoiceField
            path={[...base, 'exhaust', 'housing']}
            label="Turbine housing"
            options={[
              { value: 'single', label: 'Single scroll' },
              { value: 'divided', label: 'Divided (twin scroll, divided manifold)' },
            ]}
            onChoose={chooseHousing}
          />
          {(mapHousing === 'single' || mapHousing === 'divided') && mapHousing !== exhaust.housing && (
            <p className="text-sm text-copper-ink">
              The turbine map was measured on a {mapHousing === 'divided' ? 'divided' : 'single-scroll'} housing; its capacity is used as it is.
            </p>
          )}
          {exhaust.housing === 'divided' && (
            <div className="space-y-1">
              <NumberField
                path={[...base, 'exhaust', 'pulseFactor']}
                label="Pulse-energy factor"
                quantity="ratio"
                optional
                placeholder={formatNumber(DEFAULT_PULSE_FACTOR)}
                hint={
                  <>
                    An assumption, empty means {formatNumber(DEFAULT_PULSE_FACTOR)}: no gain. This model works with mean pressures and steady flow. A divided
                    manifold keeps each cylinder’s exhaust pulse apart from the others, and those pulses carry energy that mean pressures cannot show. The
                    factor multiplies turbine energy to stand for that gain. Set it from your own back-to-back tests, not from hope.
                  </>
                }
              />
            </div>
          )}
          <SubHeading>Wastegates</SubHeading>
          <ChoiceField
            path={[...base, 'exhaust', 'wastegates', 'count']}
            label="Gates"
            options={[
              { value: 1, label: 'One gate' },
              { value: 2, label: exhaust.housing === 'divided' ? 'Two gates, one per scroll' : 'Two gates' },
            ]}
          />
          <FieldRow>
            <NumberField path={[...base, 'exhaust', 'wastegates', 'valveDiameter']} label="Valve diameter (each gate)" quantity="diameter" />
            <NumberField
              path={[...base, 'exhaust', 'wastegates', 'dischargeCoefficient']}
              label="Discharge coefficient"
              quantity="ratio"
              hint="An assumption: a real valve passes less than an ideal nozzle (1.0)."
            />
          </FieldRow>
          <SubHeading>Turbine</SubHeading>
          <FieldRow>
            <NumberField
              path={[...base, 'exhaust', 'mechanicalEfficiency']}
              label="Mechanical efficiency"
              quantity="fraction"
              hint={
                chosen?.summary.efficiencyKind === 'with-bearing-losses'
                  ? "Not applied with this map: its efficiency already counts the bearings' losses."
                  : 'Share of turbine power that reaches the compressor past the bearings.'
              }
            />
            <NumberField
              path={[...base, 'exhaust', 'turbineEfficiency']}
              label="Default turbine efficiency"
              quantity="fraction"
              optional
              placeholder={formatNumber(DEFAULT_TURBINE_EFFICIENCY * 100)}
              hint={`Used where the turbine map gives none; empty: ${formatNumber(DEFAULT_TURBINE_EFFICIENCY * 100)} %.`}
            />
          </FieldRow>
          <LossFields
            path={[...base, 'exhaust', 'downstreamLoss']}
            loss={exhaust.downstreamLoss}
            label="Pressure loss after the turbine"
            hint="Downpipe, catalyst and silencers: the turbine outlet sits this far above ambient."
            flow="exhaust"
            testId={`plan-${planIndex}-downstream-loss`}
          />
          <RpmTableEditor
            path={[...base, 'exhaust', 'turbineInletTemperature']}
            rows={exhaust.turbineInletTemperature}
            title="Exhaust gas temperature at the turbine by rpm"
            valueLabel="Temperature"
            quantity="temperature"
            defaultValue={1123.15}
            testId={`plan-${planIndex}-turbine-inlet-temperature`}
          />
          <p className="text-xs text-ink-soft">
            Measure exhaust gas temperature before the turbine where you can. Keep it within the turbocharger and valve makers’ stated limits: too hot cracks
            housings and burns valves and pistons.
          </p>
        </>
      )}
    </div>
  );
}
