import { useId } from 'react';
import { fromSI, toSI, type QuantityKind } from '#shared/units';
import { Button } from '#src/components/Button';
import { DEFAULT_LESSON, LESSON_ENGINE, type LessonInputs } from '../lesson';
import { formatNumber, unitLabel, type UnitSystem, useUnitSystem } from '#src/lib/quantities';

interface SliderSpec {
  key: keyof LessonInputs;
  label: string;
  kind: QuantityKind;
  /** Extra words after the unit, e.g. "gauge". */
  note?: string;
  units: Record<UnitSystem, { unit: string; min: number; max: number; step: number }>;
}

// Ranges in the reader's own units, so each step of a slider is a round number in them.
const SLIDERS: SliderSpec[] = [
  {
    key: 'rpm',
    label: 'Engine speed',
    kind: 'speed',
    units: { si: { unit: 'rpm', min: 2000, max: 8000, step: 250 }, us: { unit: 'rpm', min: 2000, max: 8000, step: 250 } },
  },
  {
    key: 'boost',
    label: 'Boost',
    kind: 'pressure',
    note: 'gauge: above the outside air',
    units: { si: { unit: 'kPa', min: 0, max: 200, step: 5 }, us: { unit: 'psi', min: 0, max: 29, step: 0.5 } },
  },
  {
    key: 'altitude',
    label: 'Altitude',
    kind: 'length',
    units: { si: { unit: 'm', min: 0, max: 3500, step: 50 }, us: { unit: 'ft', min: 0, max: 11500, step: 100 } },
  },
  {
    key: 'ambientTemperature',
    label: 'Outside air temperature',
    kind: 'temperature',
    units: { si: { unit: 'degC', min: -10, max: 45, step: 1 }, us: { unit: 'degF', min: 14, max: 113, step: 1 } },
  },
];

function Slider({ spec, value, onChange }: { spec: SliderSpec; value: number; onChange: (si: number) => void }) {
  const system = useUnitSystem();
  const id = useId();
  const u = spec.units[system];
  const shown = fromSI(value, u.unit, spec.kind);
  // Snap to the slider's grid so the thumb and the number agree after a unit switch.
  const snapped = Math.min(u.max, Math.max(u.min, Math.round((shown - u.min) / u.step) * u.step + u.min));
  return (
    <div className="space-y-1">
      <div className="flex items-baseline justify-between gap-3">
        <label htmlFor={id} className="text-sm font-semibold text-ink">
          {spec.label}
        </label>
        <output htmlFor={id} className="numeric text-sm font-semibold text-teal-dark">
          {formatNumber(shown, 4)} {unitLabel(u.unit)}
        </output>
      </div>
      <input
        id={id}
        type="range"
        min={u.min}
        max={u.max}
        step={u.step}
        value={snapped}
        onChange={(e) => onChange(toSI(Number(e.target.value), u.unit, spec.kind))}
        className="w-full accent-teal"
        aria-valuetext={`${formatNumber(shown, 4)} ${unitLabel(u.unit)}`}
      />
      {spec.note && <p className="text-xs text-ink-faint">{spec.note}</p>}
    </div>
  );
}

/** The four things the reader moves, and what stays fixed in the example. */
export function LessonControls({ inputs, onChange }: { inputs: LessonInputs; onChange: (next: LessonInputs) => void }) {
  const system = useUnitSystem();
  const e = LESSON_ENGINE;
  const kPaOrPsi = (pa: number) => (system === 'us' ? `${formatNumber(fromSI(pa, 'psi', 'pressure'), 3)} psi` : `${formatNumber(pa / 1000, 3)} kPa`);
  const approach = system === 'us' ? `${formatNumber(e.intercoolerApproach * 1.8, 3)} °F` : `${formatNumber(e.intercoolerApproach, 3)} °C`;
  return (
    <div className="space-y-5">
      <fieldset className="space-y-4">
        <legend className="mb-2 text-base font-semibold text-ink">Move these</legend>
        {SLIDERS.map((spec) => (
          <Slider key={spec.key} spec={spec} value={inputs[spec.key]} onChange={(si) => onChange({ ...inputs, [spec.key]: si })} />
        ))}
      </fieldset>
      <Button variant="quiet" onClick={() => onChange(DEFAULT_LESSON)}>
        Back to the starting values
      </Button>
      <div className="space-y-1 border-t border-paper-line pt-4 text-sm text-ink-soft">
        <p className="font-semibold text-ink">Fixed in this example</p>
        <ul className="list-disc space-y-0.5 pl-5">
          <li>
            A {system === 'us' ? `${formatNumber(fromSI(e.displacement, 'cuin', 'volume'), 3)} in³` : `${formatNumber(e.displacement * 1000, 2)} L`}{' '}
            four-cylinder, four-stroke engine
          </li>
          <li>Volumetric efficiency {formatNumber(e.volumetricEfficiency * 100, 3)} %</li>
          <li>
            Air filter and intake lose {kPaOrPsi(e.inletLoss)}; intercooler and pipes lose {kPaOrPsi(e.chargeCoolerLoss)}
          </li>
          <li>The intercooler leaves the charge {approach} warmer than the outside air</li>
          <li>One turbocharger with the built-in demo compressor M58</li>
        </ul>
      </div>
    </div>
  );
}
