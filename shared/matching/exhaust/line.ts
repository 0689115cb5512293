/** The exhaust figures of a whole operating line: boost threshold, peaks, the gate size it needs. */
import { finding } from '../finding';
import type { LineContext } from '../line-context';
import type { OperatingPoint, PointValues } from '../result';
import type { ExhaustLineSummary, ValueAtRpm } from './result';

/** Whether a point's target is above ambient: a line of such points asks the turbine for boost. */
function asksForBoost(v: PointValues): boolean {
  return (v.boostTarget ?? v.boost) > 0;
}

function extreme(points: readonly OperatingPoint[], value: (v: PointValues) => number | null | undefined): ValueAtRpm | null {
  let best: ValueAtRpm | null = null;
  for (const p of points) {
    if (!p.values) continue;
    const x = value(p.values);
    if (typeof x === 'number' && Number.isFinite(x) && (best === null || x > best.value)) best = { value: x, rpm: p.rpm };
  }
  return best;
}

/** The exhaust figures of a line; null when its Plan has no exhaust side or no turbine map. */
function exhaustLineSummary(ctx: LineContext, points: readonly OperatingPoint[]): ExhaustLineSummary | null {
  const ex = ctx.exhaust;
  if (!ex || !ex.turbine) return null;
  const boostAsked = points.some((p) => p.values !== null && asksForBoost(p.values));
  let threshold: number | null = null;
  for (const p of points) {
    // Full boost counts only where the compressor can deliver it: a target held at a point left of
    // surge is boost the engine cannot use.
    if (boostAsked && p.values && p.values.targetHeld === true && asksForBoost(p.values) && p.values.reachable !== false) {
      threshold = p.rpm;
      break;
    }
  }
  const peakPower = extreme(points, (v) => v.brakePower);
  const atPeak = peakPower ? points.find((p) => p.rpm === peakPower.rpm)?.values?.turbineInletPressure : null;
  return {
    boostThresholdRpm: threshold,
    turbineHoldsFromRpm: boostAsked ? (points.find((p) => p.values?.targetHeld === true && asksForBoost(p.values))?.rpm ?? null) : null,
    boostAsked,
    // Below the threshold the manifold is barely boosted and p3/p_man says little: the peak that
    // matters is at the boost the builder asked for.
    peakDrivePressureRatio: extreme(points, (v) => (v.targetHeld === true ? v.drivePressureRatio : null)),
    wastegateDiameterNeeded: extreme(points, (v) => v.wastegateDiameterNeeded),
    wastegateDiameterFitted: ex.input.wastegates.valveDiameter,
    turbineInletPressureAtPeakPower: peakPower && typeof atPeak === 'number' ? { value: atPeak, rpm: peakPower.rpm } : null,
    peakTurbineInletPressure: extreme(points, (v) => v.turbineInletPressure),
  };
}

/** The line-level finding when the turbine holds the target nowhere on the line (at its first solved point). */
export function finishExhaustLine(ctx: LineContext, points: OperatingPoint[]): ExhaustLineSummary | null {
  const summary = exhaustLineSummary(ctx, points);
  if (!summary) return null;
  const computed = points.filter((p) => p.values && p.values.targetHeld !== null && p.values.targetHeld !== undefined);
  if (computed.length > 0 && summary.boostThresholdRpm === null && summary.boostAsked) {
    computed[0].findings.push(
      finding(
        'boost-target-not-held',
        'warning',
        'The turbine holds the boost target at no engine speed of this line: there is no boost threshold.',
        computed[0].rpm,
      ),
    );
  }
  return summary;
}
