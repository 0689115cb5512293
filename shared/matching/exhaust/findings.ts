/**
 * Findings of the exhaust side, with their thresholds and where each comes from.
 */
import { finding, type Finding } from '../finding';
import type { LineContext } from '../line-context';
import type { PointValues } from '../result';
import { fmt, pct } from '../working';
import { exhaustProblems } from './context';

/**
 * Drive pressure ratio (exhaust over intake manifold pressure) above which a warning is raised
 * (common practice, no source: builders aim for about 1.5 or less for power, and treat 2 as high,
 * since the engine then pumps against its own exhaust and holds more hot residual gas).
 */
export const DRIVE_PRESSURE_RATIO_WARNING = 2.0;

// Fixed decimals rather than significant figures: these run at many points of a study, and toFixed is cheap.
const mm = (m: number) => `${(m * 1000).toFixed(1)} mm`;
const kpa = (pa: number) => `${(pa / 1000).toFixed(1)} kPa`;
const ratio = (x: number) => x.toFixed(3);

/**
 * Findings of one point's exhaust values. `heldBefore`: an earlier (lower) engine speed of the
 * line held the target, so losing it here is a warning; before the boost threshold not holding
 * it is the spool-up, an info.
 */
export function exhaustPointFindings(v: PointValues, heldBefore: boolean, efficiencyAssumed: boolean): Finding[] {
  const out: Finding[] = [];
  const rpm = v.rpm;
  if (v.targetHeld === false && v.boostTarget !== undefined) {
    out.push(
      finding(
        'boost-target-not-held',
        heldBefore ? 'warning' : 'info',
        heldBefore
          ? `The turbine cannot hold the boost target ${kpa(v.boostTarget)} here; with the gates shut it holds ${kpa(v.boost)}.`
          : `Below the boost threshold: the turbine holds ${kpa(v.boost)} of the ${kpa(v.boostTarget)} target, with the gates shut.`,
        rpm,
        { value: v.boost, threshold: v.boostTarget, kind: 'pressure' },
      ),
    );
  }
  const need = v.wastegateDiameterNeeded;
  const fitted = v.wastegateDiameterFitted;
  if (need != null && fitted != null && need > fitted) {
    out.push(
      finding(
        'wastegate-too-small',
        'warning',
        `Each wastegate needs a ${mm(need)} valve here; ${mm(fitted)} is fitted. The gates cannot pass what the turbine does not need, so boost will creep above target.`,
        rpm,
        { value: need, threshold: fitted, kind: 'length' },
      ),
    );
  }
  const dpr = v.drivePressureRatio;
  // Where no boost is asked the throttle sets the manifold, and p3/p_man of a throttled engine is no warning.
  if (dpr != null && dpr > DRIVE_PRESSURE_RATIO_WARNING && (v.boostTarget ?? v.boost) > 0) {
    out.push(
      finding(
        'drive-pressure-ratio-high',
        'warning',
        `Drive pressure ratio ${ratio(dpr)}: the exhaust manifold is at ${ratio(dpr)} times the intake manifold pressure, above ${fmt(DRIVE_PRESSURE_RATIO_WARNING, 2)} (common practice, no source).`,
        rpm,
        { value: dpr, threshold: DRIVE_PRESSURE_RATIO_WARNING, kind: 'ratio' },
      ),
    );
  }
  if (v.turbineMapLocation === 'below-map' && v.expansionRatio != null) {
    out.push(
      finding(
        'turbine-off-map',
        'info',
        `Expansion ratio ${ratio(v.expansionRatio)} is below the turbine map: flow taken as the nozzle through the map's first point, efficiency held at its edge.`,
        rpm,
        { value: v.expansionRatio, kind: 'ratio' },
      ),
    );
  } else if (v.turbineMapLocation === 'above-map' && v.expansionRatio != null) {
    out.push(
      finding(
        'turbine-off-map',
        'warning',
        `Expansion ratio ${ratio(v.expansionRatio)} is beyond the turbine map: flow parameter and efficiency held at its last point.`,
        rpm,
        { value: v.expansionRatio, kind: 'ratio' },
      ),
    );
  }
  if (efficiencyAssumed && v.turbineEfficiency != null) {
    out.push(
      finding('turbine-efficiency-assumed', 'warning', `The turbine map gives no efficiency; ${pct(v.turbineEfficiency)} is assumed.`, rpm, {
        value: v.turbineEfficiency,
        kind: 'fraction',
      }),
    );
  }
  const speed = v.turbineSpeedReading;
  if (speed && (speed.basis === 'held-at-lowest-line' || speed.basis === 'held-at-top-line') && speed.shaftSpeed !== null && speed.lowerSpeed !== null) {
    out.push(
      finding(
        'turbine-speed-outside-lines',
        'info',
        `The shaft turns at ${Math.round(speed.shaftSpeed)} rpm, ${speed.basis === 'held-at-lowest-line' ? 'below the lowest' : 'above the top'} speed line of the turbine map: the turbine is read on its ${Math.round(speed.lowerSpeed)} rpm line, held.`,
        rpm,
        { value: speed.shaftSpeed, threshold: speed.lowerSpeed, kind: 'speed' },
      ),
    );
  }
  if (v.exhaustCase === 'no-power-needed' && !v.throttled) {
    out.push(
      finding(
        'throttle-sets-boost',
        'info',
        'The compressor needs no power at this boost: the gates are taken wide open and the throttle sets the boost.',
        rpm,
      ),
    );
  }
  return out;
}

/** The finding of a root that was not found (the point keeps the last bracket's safe end). */
export function exhaustNotConvergedFinding(rpm: number, what: string, reason: string): Finding {
  return finding('exhaust-not-converged', 'warning', `${what} did not converge (${reason}); the nearest safe value is shown.`, rpm);
}

/** Findings about the line's exhaust inputs: raised once, at the line's first point. */
export function exhaustLineFindings(ctx: LineContext, rpm: number): Finding[] {
  const ex = ctx.exhaust;
  if (!ex) return [];
  const out: Finding[] = [];
  const problems = exhaustProblems(ex);
  if (problems.length > 0) {
    out.push(finding('input-out-of-range', 'warning', `The exhaust side is not computed: ${problems.join('; ')}.`, rpm));
    return out;
  }
  if (!ex.turbine) {
    out.push(finding('turbine-map-missing', 'warning', 'The Plan has an exhaust side but no turbine map: the exhaust side is not computed.', rpm));
    return out;
  }
  const t = ex.turbine;
  if (t.housing !== ex.input.housing) {
    const mapWords =
      t.housing === 'divided' ? `a divided housing${t.scrollFeed === 'per-scroll' ? ' (flow per scroll, doubled)' : ''}` : 'a single-scroll housing';
    out.push(
      finding(
        'turbine-housing-mismatch',
        'warning',
        `The turbine map is for ${mapWords}, the Plan's housing is ${ex.input.housing === 'divided' ? 'divided' : 'single-scroll'}: the map's capacity is used as it is.`,
        rpm,
      ),
    );
  }
  if (t.efficiencyKind === 'with-bearing-losses' && ex.input.mechanicalEfficiency !== 1) {
    out.push(
      finding(
        'mechanical-efficiency-in-map',
        'info',
        `The turbine map's efficiency is total-to-static with the bearings' losses in it, so the Plan's mechanical efficiency of ${fmt(ex.input.mechanicalEfficiency * 100, 3)} % is not applied again.`,
        rpm,
        { value: ex.input.mechanicalEfficiency, kind: 'fraction' },
      ),
    );
  }
  if (ex.input.pulseFactor !== 1) {
    out.push(
      finding(
        'input-out-of-range',
        'info',
        `A pulse-energy factor of ${fmt(ex.input.pulseFactor, 3)} multiplies the turbine's energy: an assumption for what the steady model cannot see of a divided manifold's pulses.`,
        rpm,
        { value: ex.input.pulseFactor, kind: 'ratio' },
      ),
    );
  }
  return out;
}
