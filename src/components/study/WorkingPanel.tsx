import { useMemo } from 'react';
import { pointWorking } from '#shared/matching/explain-point';
import { mapRegionText } from '#shared/matching/results-table';
import type { OperatingPoint } from '#shared/matching/result';
import type { WorkingStep, WorkingValue } from '#shared/matching/working';
import { math } from '#shared/units';
import { Formula, MathSymbol } from './Formula';
import type { StudyLine } from './lines';
import { formatNumber, formatStudyValue, type StudyQuantity, type UnitSystem, useUnitSystem } from '#src/lib/quantities';

/** Symbols of fuel flows: shown in the fuel trade's units, not as air volume flow. */
const INJECTOR_FLOW_SYMBOLS = new Set(['Q_rated', 'Q_inj_p', 'Q_inj_s']);
const FUEL_FLOW_SYMBOLS = new Set(['Q_f', 'Q_avail', 'Q_pump']);
/** Pressures that are gauge (above the atmosphere) wherever they appear. */
const GAUGE_SYMBOLS = new Set(['boost', 'p_fuel', 'p_rail']);

/** What a Working value measures in the user's units; null when it keeps its own SI unit text. */
export function workingQuantity(step: Pick<WorkingStep, 'id'>, value: WorkingValue): StudyQuantity | null {
  const s = value.symbol;
  switch (value.kind) {
    case 'volumeFlow':
      if (INJECTOR_FLOW_SYMBOLS.has(s)) return 'injectorFlow';
      if (FUEL_FLOW_SYMBOLS.has(s)) return 'fuelFlow';
      return 'volumeFlow';
    case 'pressure':
      // The boost lookup interpolates between table rows (y_0, y_1) that are gauge too.
      return GAUGE_SYMBOLS.has(s) || step.id === 'boost' ? 'pressureGauge' : 'pressure';
    case 'none':
      return value.unit === 'K' ? 'temperatureDifference' : null;
    default:
      return value.kind;
  }
}

/** A Working value as text in the user's units ("98.8 kPa", "5 K", "287.1 J/(kg K)"). */
export function workingValueText(step: Pick<WorkingStep, 'id'>, value: WorkingValue, system: UnitSystem): string {
  const quantity = workingQuantity(step, value);
  if (quantity === null) {
    const shown = formatNumber(value.value, 6);
    return value.unit ? `${shown} ${value.unit.replace('^2', '²').replace(' K', '·K')}` : shown;
  }
  return formatStudyValue(value.value, quantity, system);
}

/**
 * Evaluates the step's formula with mathjs on the SI values: the same number the engine gave, or
 * the panel says they disagree. null when the formula cannot be evaluated here.
 */
export function checkStep(step: WorkingStep): { value: number; agrees: boolean } | null {
  try {
    const scope = new Map<string, number>(step.values.map((v) => [v.symbol, v.value]));
    const got = math.evaluate(step.formula, scope);
    if (typeof got !== 'number' || !Number.isFinite(got)) return null;
    const scale = Math.max(Math.abs(step.result.value), 1e-300);
    return { value: got, agrees: Math.abs(got - step.result.value) / scale <= 1e-6 };
  } catch {
    return null;
  }
}

function StepView({ step, index }: { step: WorkingStep; index: number }) {
  const system = useUnitSystem();
  const check = checkStep(step);
  // A step whose formula is one symbol just states a value: no formula line and no list.
  const isFormula = !/^[A-Za-z_][A-Za-z0-9_]*$/.test(step.formula.trim());
  const given = isFormula ? step.values : [];
  return (
    <li className="relative border-l-2 border-teal/30 pb-5 pl-5 last:pb-0" data-step={step.id}>
      <span
        aria-hidden="true"
        className="absolute -left-[13px] top-0 flex size-6 items-center justify-center rounded-full border border-teal/40 bg-paper text-xs font-semibold text-teal-dark"
      >
        {index + 1}
      </span>
      <h4 className="font-semibold text-ink">{step.title}</h4>
      <p className="mt-0.5 text-sm text-ink-soft">{step.explanation}</p>
      {isFormula && (
        <p className="mt-2 overflow-x-auto py-1">
          <Formula expression={step.formula} result={step.result.symbol} />
        </p>
      )}
      {given.length > 0 && (
        <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-sm">
          {given.map((v) => (
            <div key={v.symbol} className="contents">
              <dt className="font-serif">
                <MathSymbol name={v.symbol} />
              </dt>
              <dd className="numeric text-ink-soft">{workingValueText(step, v, system)}</dd>
            </div>
          ))}
        </dl>
      )}
      <p className="mt-2 text-sm">
        <span className="font-serif">
          <MathSymbol name={step.result.symbol} />
        </span>{' '}
        = <strong className="numeric font-semibold text-ink">{workingValueText(step, step.result, system)}</strong>
      </p>
      {isFormula && check && (
        <p className={`mt-1 text-xs ${check.agrees ? 'text-teal-dark' : 'font-semibold text-limit'}`}>
          {check.agrees
            ? `Check: evaluating the formula with these values gives ${workingValueText(step, { ...step.result, value: check.value }, system)}, the same.`
            : `Check failed: evaluating the formula gives ${workingValueText(step, { ...step.result, value: check.value }, system)}, not the result above.`}
        </p>
      )}
      <p className="mt-1 text-xs text-ink-faint">Source: {step.source}</p>
    </li>
  );
}

/**
 * The Working of one point: every step from the inputs to the point on the map, with its
 * formula, the values it uses in the user's units, the result and its source. The steps come
 * from the engine (`pointWorking`), so they always agree with the plots and the table.
 */
export function WorkingPanel({ line, point, onClose }: { line: StudyLine | null; point: OperatingPoint | null; onClose?: () => void }) {
  const steps = useMemo(() => (line && point ? pointWorking(line.line.context, point) : []), [line, point]);
  if (!line || !point) {
    return (
      <section aria-label="Working" className="rounded-lg border border-dashed border-paper-line bg-white/50 p-5 text-sm text-ink-soft">
        <h3 className="mb-1 text-base font-semibold text-ink">Working</h3>
        Pick a point (a finding, a row of the results or a point on the map) to follow every step from the inputs to that point on the map.
      </section>
    );
  }
  return (
    <section aria-label="Working" className="rounded-lg border border-paper-line bg-white/75 p-5 shadow-sm" data-testid="working-panel">
      <header className="mb-4 flex flex-wrap items-start justify-between gap-2">
        <div>
          <h3 className="text-lg font-semibold text-ink">Working at {formatNumber(point.rpm, 21)} rpm</h3>
          <p className="text-sm text-ink-soft">{line.label}</p>
        </div>
        {onClose && (
          <button type="button" onClick={onClose} className="rounded px-2 py-1 text-sm font-semibold text-teal-dark hover:underline">
            Close
          </button>
        )}
      </header>
      {!point.solved && (
        <p className="mb-3 rounded-md border border-limit/40 bg-limit-light/50 px-3 py-2 text-sm text-ink">
          This point has no solution: {point.findings.map((f) => f.message).join(' ')}
        </p>
      )}
      {point.values?.reachable === false && (
        <p className="mb-3 rounded-md border border-limit/40 bg-limit-light/50 px-3 py-2 text-sm text-ink" data-testid="working-not-reachable">
          <strong className="font-semibold">Not reachable with this compressor</strong> ({mapRegionText(point.values)}): the steps place the point on the map
          where the engine asks to be; its efficiency, temperatures, power and fuel are not given.
        </p>
      )}
      {point.values?.offMapAssumed && (
        <p className="mb-3 rounded-md border border-copper/50 bg-copper-light/50 px-3 py-2 text-sm text-ink">
          Computed on the plan’s off-map efficiency assumption ({mapRegionText(point.values)}): the map does not show the compressor running here.
        </p>
      )}
      <ol className="max-h-[42rem] overflow-y-auto pl-4 pr-2 pt-1">
        {steps.map((s, i) => (
          <StepView key={`${s.id}-${i}`} step={s} index={i} />
        ))}
      </ol>
    </section>
  );
}
