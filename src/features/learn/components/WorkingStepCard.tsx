import type { WorkingStep, WorkingValue } from '#shared/matching/working';
import { fromSI, siUnitOf, type QuantityKind } from '#shared/units';
import { Formula, MathSymbol } from '#src/components/study/Formula';
import { displayUnitOf, formatNumber, formatQuantity, unitLabel, type UnitSystem, useUnitSystem } from '#src/lib/quantities';

function isQuantityKind(kind: string): kind is QuantityKind {
  return Object.prototype.hasOwnProperty.call(siUnitOf, kind);
}

/**
 * A value as the formula uses it (SI, so the reader can redo the sum by hand) and, where the
 * reader's own units differ, in those as well.
 */
export function workingValueText(value: WorkingValue, system: UnitSystem): { si: string; yours: string | null } {
  const { kind } = value;
  if (kind === 'none') return { si: `${formatNumber(value.value, 6)}${value.unit ? ` ${unitText(value.unit)}` : ''}`, yours: null };
  if (kind === 'fraction') return { si: formatNumber(value.value, 4), yours: formatQuantity(value.value, 'fraction', system) };
  if (kind === 'ratio' || kind === 'count') return { si: formatQuantity(value.value, kind, system), yours: null };
  if (kind === 'speed') return { si: formatQuantity(value.value, 'speed', system), yours: null };
  if (isQuantityKind(kind)) {
    const si = `${formatNumber(value.value, 6)} ${unitText(siUnitOf[kind])}`;
    // Heights read in metres or feet, not in the millimetres and inches of part sizes.
    if (kind === 'length') return { si, yours: system === 'us' ? `${formatNumber(fromSI(value.value, 'ft', 'length'), 5)} ft` : null };
    if (displayUnitOf(kind, system) === siUnitOf[kind]) return { si, yours: null };
    return { si, yours: formatQuantity(value.value, kind, system) };
  }
  return { si: formatNumber(value.value, 6), yours: null };
}

/** A unit as people write it, powers as superscripts. */
function unitText(unit: string): string {
  return unitLabel(unit).replace(/\^2/g, '²').replace(/\^3/g, '³');
}

function ValueText({ value }: { value: WorkingValue }) {
  const system = useUnitSystem();
  const text = workingValueText(value, system);
  return (
    <span className="numeric">
      {text.si}
      {text.yours && <span className="text-ink-soft"> ({text.yours})</span>}
    </span>
  );
}

/** One step of the Working, laid out for reading: what it is, the formula, the numbers, the answer, the source. */
export function WorkingStepCard({ step }: { step: WorkingStep }) {
  // A step whose formula is just its own input (a value read from a table or the map) needs no sum.
  const isLookup = step.values.length === 1 && step.formula === step.values[0].symbol;
  return (
    <article className="rounded-md border border-paper-line bg-white/80 p-4" aria-labelledby={`step-${step.id}`}>
      <h4 id={`step-${step.id}`} className="font-semibold text-ink">
        {step.title}
      </h4>
      <p className="mt-1 text-sm text-ink-soft">{step.explanation}</p>
      {!isLookup && (
        <div className="mt-3">
          <p className="overflow-x-auto py-1 text-lg">
            <Formula expression={step.formula} result={step.result.symbol} />
          </p>
          <dl className="mt-2 grid gap-x-4 gap-y-1 text-sm sm:grid-cols-2">
            {step.values.map((v) => (
              <div key={v.symbol} className="flex gap-2">
                <dt className="min-w-12 font-serif">
                  <MathSymbol name={v.symbol} />
                </dt>
                <dd>
                  = <ValueText value={v} />
                </dd>
              </div>
            ))}
          </dl>
        </div>
      )}
      <p className="mt-3 rounded bg-teal-light/40 px-3 py-1.5 text-sm">
        <span className="font-serif">
          <MathSymbol name={step.result.symbol} />
        </span>{' '}
        ={' '}
        <strong className="font-semibold">
          <ValueText value={step.result} />
        </strong>
      </p>
      <p className="mt-2 text-xs text-ink-faint">Source: {step.source}</p>
    </article>
  );
}
