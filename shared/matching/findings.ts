/**
 * Findings: what a point's numbers mean for the build, each with a severity. Thresholds are named
 * constants with where they come from; "limit" is reserved for hard limits (surge, overspeed,
 * injector saturation, the builder's own limits).
 */
import { REQUIREMENT_DEFAULTS } from './requirements';
import type { Finding, FindingCode, LineContext, MapRegion, PointValues, Severity } from './types';
import { fmt, kelvin, pct, type WorkingKind } from './working';

/** Injector duty above which a warning is raised, fraction (common practice, no source). */
export const INJECTOR_DUTY_WARNING = 0.8;
/** Injector duty above which the point is at its limit, fraction (common practice, no source). */
export const INJECTOR_DUTY_LIMIT = 0.85;
/** Injector duty at which the injectors are open all the time (saturated), fraction (definition). */
export const INJECTOR_DUTY_SATURATED = 1;
/** Share of the pump's flow above which a warning is raised, fraction (common practice, no source). */
export const FUEL_PUMP_WARNING = 0.9;
/** Usual range of volumetric efficiency referred to manifold density, fraction (common practice, no source). */
export const VOLUMETRIC_EFFICIENCY_RANGE = [0.3, 1.3] as const;
/** Usual range of lambda targets under load (common practice, no source). */
export const LAMBDA_RANGE = [0.6, 1.3] as const;
/** Ambient temperatures engines are usually run in, K: −50 °C to +60 °C (from memory). */
export const AMBIENT_TEMPERATURE_RANGE = [223.15, 333.15] as const;
/** Compressor isentropic efficiency above which a figure is doubtful for an automotive wheel, fraction (from memory). */
export const COMPRESSOR_EFFICIENCY_PLAUSIBLE_MAX = 0.85;
/** Brake thermal efficiency above which a figure is doubtful for a piston engine, fraction (from memory). */
export const BRAKE_THERMAL_EFFICIENCY_PLAUSIBLE_MAX = 0.5;

const severityRank: Record<Severity, number> = { info: 0, warning: 1, limit: 2 };

/** The most severe of some findings, or null when there are none. */
export function worstSeverity(findings: readonly Finding[]): Severity | null {
  let worst: Severity | null = null;
  for (const f of findings) if (worst === null || severityRank[f.severity] > severityRank[worst]) worst = f.severity;
  return worst;
}

function finding(
  code: FindingCode,
  severity: Severity,
  message: string,
  rpm: number,
  quantity?: { value: number; threshold?: number; kind: WorkingKind },
): Finding {
  return quantity ? { code, severity, message, rpm, ...quantity } : { code, severity, message, rpm };
}

const NOT_REACHABLE = 'Not reachable with this compressor: its power, torque and temperatures are not given.';

/** Words on how a margin beyond the choke line's top was measured. */
function chokeEdgeWords(v: PointValues): string {
  return v.marginBasis?.choke === 'top-speed-line' ? ", measured to the top speed line above the choke line's top" : '';
}

/** The finding that says where a point off the map sits and what that means; null on or below the map. */
function regionFinding(region: MapRegion, v: PointValues): Finding | null {
  const rpm = v.rpm;
  const tail = v.reachable ? '' : ` ${NOT_REACHABLE}`;
  switch (region) {
    case 'on-map':
      return null;
    case 'below-map':
      return finding(
        'map-below-map',
        'info',
        'The point is below the map (a low pressure ratio, usual at light load): the wheel turns slower than the lowest speed line.',
        rpm,
      );
    case 'left-of-surge':
      return finding(
        'map-left-of-surge',
        'limit',
        `The point is left of the surge line (surge margin ${pct(v.surgeMargin ?? 0)}): the compressor surges here.${tail}`,
        rpm,
        v.surgeMargin !== null ? { value: v.surgeMargin, threshold: 0, kind: 'fraction' } : undefined,
      );
    case 'past-choke':
      return finding(
        'map-beyond-choke',
        'limit',
        `The point is past choke (choke margin ${pct(v.chokeMargin ?? 0)}${chokeEdgeWords(v)}): the compressor cannot pass this flow at this pressure ratio.${tail}`,
        rpm,
        v.chokeMargin !== null ? { value: v.chokeMargin, threshold: 0, kind: 'fraction' } : undefined,
      );
    case 'over-speed':
      // The overspeed finding says it, with the figures.
      return null;
    case 'above-map':
      return finding(
        'map-above-top-speed',
        'limit',
        `The point is above the top speed line${v.shaftSpeed !== null ? ` (about ${fmt(v.shaftSpeed)} rpm, extrapolated)` : ''}: the map does not show the compressor running there.${tail}`,
        rpm,
      );
    case 'outside-speed-lines':
      return finding(
        'map-off-map',
        'limit',
        `The point is inside the map's outline but outside its speed lines: the map cannot say what the compressor does here.${tail}`,
        rpm,
      );
  }
}

const SPEED_WORDS: Record<string, string> = {
  'above-top-speed-line': ' (extrapolated above the top speed line)',
  'surge-edge': ' (taken along the surge line)',
};

/** Warnings for margins that hold but are thinner than the study requires. */
function thinMarginFindings(v: PointValues, ctx: LineContext): Finding[] {
  const req = ctx.requirements ?? REQUIREMENT_DEFAULTS;
  const out: Finding[] = [];
  const thin = (code: FindingCode, what: string, margin: number | null, required: number) => {
    if (margin === null || !(margin >= 0) || !(margin < required)) return;
    out.push(
      finding(code, 'warning', `${what} ${pct(margin)} is under the ${pct(required)} the study requires.`, v.rpm, {
        value: margin,
        threshold: required,
        kind: 'fraction',
      }),
    );
  };
  thin('surge-margin-thin', 'Surge margin', v.surgeMargin, req.minSurgeMargin);
  thin('choke-margin-thin', 'Choke margin', v.chokeMargin, req.minChokeMargin);
  thin('speed-margin-thin', 'Speed margin', v.speedMargin, req.minSpeedMargin);
  return out;
}

/** A lean target under boost: the mixture that burns pistons and valves. */
function leanFindings(v: PointValues, ctx: LineContext): Finding[] {
  const req = ctx.requirements ?? REQUIREMENT_DEFAULTS;
  if (v.lambda === null || !(v.boost >= req.underBoostFrom)) return [];
  const where = `under ${fmt(v.boost / 1000, 3)} kPa of boost`;
  const advice = "keep to the fuel system maker's and the calibrator's targets";
  if (v.lambda > req.lambdaLimitUnderBoost) {
    return [
      finding(
        'lean-under-boost-limit',
        'limit',
        `Lambda ${fmt(v.lambda, 3)} ${where} is leaner than the ${fmt(req.lambdaLimitUnderBoost, 3)} limit: lean mixtures under boost burn pistons and valves; ${advice}.`,
        v.rpm,
        { value: v.lambda, threshold: req.lambdaLimitUnderBoost, kind: 'ratio' },
      ),
    ];
  }
  if (v.lambda > req.lambdaWarningUnderBoost) {
    return [
      finding(
        'lean-under-boost',
        'warning',
        `Lambda ${fmt(v.lambda, 3)} ${where} is leaner than the ${fmt(req.lambdaWarningUnderBoost, 3)} the study accepts; ${advice}.`,
        v.rpm,
        { value: v.lambda, threshold: req.lambdaWarningUnderBoost, kind: 'ratio' },
      ),
    ];
  }
  return [];
}

/**
 * Findings about the line's own inputs (ambient, assumptions): raised once, at the line's first
 * point, so the list does not repeat them at every rpm.
 */
export function lineInputFindings(ctx: LineContext, rpm: number): Finding[] {
  const out: Finding[] = [];
  const t = ctx.ambient.temperature;
  if (t < AMBIENT_TEMPERATURE_RANGE[0] || t > AMBIENT_TEMPERATURE_RANGE[1]) {
    out.push(
      finding('input-out-of-range', 'warning', `Ambient temperature ${kelvin(t)} is outside the usual −50 °C to +60 °C.`, rpm, {
        value: t,
        kind: 'temperature',
      }),
    );
  }
  if (ctx.plan.compressorEfficiency > COMPRESSOR_EFFICIENCY_PLAUSIBLE_MAX) {
    out.push(
      finding(
        'input-out-of-range',
        'warning',
        `Plan compressor efficiency ${pct(ctx.plan.compressorEfficiency)} is above what automotive compressors reach (about ${pct(COMPRESSOR_EFFICIENCY_PLAUSIBLE_MAX)}).`,
        rpm,
        { value: ctx.plan.compressorEfficiency, threshold: COMPRESSOR_EFFICIENCY_PLAUSIBLE_MAX, kind: 'fraction' },
      ),
    );
  }
  if (ctx.power && ctx.power.brakeThermalEfficiency > BRAKE_THERMAL_EFFICIENCY_PLAUSIBLE_MAX) {
    out.push(
      finding(
        'input-out-of-range',
        'warning',
        `Brake thermal efficiency ${pct(ctx.power.brakeThermalEfficiency)} is above what piston engines reach (about ${pct(BRAKE_THERMAL_EFFICIENCY_PLAUSIBLE_MAX)}).`,
        rpm,
        { value: ctx.power.brakeThermalEfficiency, threshold: BRAKE_THERMAL_EFFICIENCY_PLAUSIBLE_MAX, kind: 'fraction' },
      ),
    );
  }
  if (ctx.intercooler.kind === 'fixed' && ctx.intercooler.manifoldTemperature < t) {
    out.push(
      finding(
        'input-out-of-range',
        'warning',
        `Manifold temperature ${kelvin(ctx.intercooler.manifoldTemperature)} is below ambient ${kelvin(t)}: only a refrigerated or iced cooler does that.`,
        rpm,
        { value: ctx.intercooler.manifoldTemperature, threshold: t, kind: 'temperature' },
      ),
    );
  }
  return out;
}

function dutyQuantity(value: number, threshold: number): { value: number; threshold: number; kind: WorkingKind } {
  return { value, threshold, kind: 'fraction' };
}

/** Findings of one solved point. */
export function pointFindings(v: PointValues, ctx: LineContext): Finding[] {
  const out: Finding[] = [];
  const rpm = v.rpm;
  const limits = ctx.engine.limits;

  if (v.volumetricEfficiency < VOLUMETRIC_EFFICIENCY_RANGE[0] || v.volumetricEfficiency > VOLUMETRIC_EFFICIENCY_RANGE[1]) {
    out.push(
      finding('input-out-of-range', 'warning', `Volumetric efficiency ${pct(v.volumetricEfficiency)} is outside the usual 30–130 %.`, rpm, {
        value: v.volumetricEfficiency,
        kind: 'fraction',
      }),
    );
  }
  if (v.lambda !== null && (v.lambda < LAMBDA_RANGE[0] || v.lambda > LAMBDA_RANGE[1])) {
    out.push(
      finding('input-out-of-range', 'warning', `Lambda target ${fmt(v.lambda, 3)} is outside the usual 0.6–1.3.`, rpm, {
        value: v.lambda,
        kind: 'ratio',
      }),
    );
  }
  if (limits.maxRpm !== undefined && rpm > limits.maxRpm) {
    out.push(
      finding('rpm-limit', 'limit', `Engine speed ${fmt(rpm)} rpm is above the stated limit ${fmt(limits.maxRpm)} rpm.`, rpm, {
        value: rpm,
        threshold: limits.maxRpm,
        kind: 'speed',
      }),
    );
  }
  if (limits.maxManifoldPressure !== undefined && v.manifoldPressure > limits.maxManifoldPressure) {
    out.push(
      finding(
        'manifold-pressure-limit',
        'limit',
        `Manifold pressure ${fmt(v.manifoldPressure / 1000)} kPa is above the stated limit ${fmt(limits.maxManifoldPressure / 1000)} kPa.`,
        rpm,
        { value: v.manifoldPressure, threshold: limits.maxManifoldPressure, kind: 'pressure' },
      ),
    );
  }
  if (v.throttled) {
    out.push(
      finding(
        'throttled',
        'info',
        'Manifold pressure is below compressor inlet pressure: the throttle takes the drop and the compressor is taken at pressure ratio 1.',
        rpm,
      ),
    );
  }
  if (!v.converged) {
    out.push(finding('not-converged', 'warning', `The manifold temperature did not settle in ${v.iterations} passes; the last pass is shown.`, rpm));
  }
  const reachable = v.reachable !== false;
  if (ctx.hasMap && reachable && v.efficiencySource === 'plan' && v.compressorEfficiency !== null) {
    const below = v.mapRegion === 'below-map';
    out.push(
      finding(
        'efficiency-off-map',
        below ? 'info' : 'warning',
        below
          ? `Below the map the efficiency is not given; the Plan's ${pct(v.compressorEfficiency)} is used (at a low pressure ratio it changes little).`
          : `The map gives no efficiency here; the Plan's ${pct(v.compressorEfficiency)} is used instead.`,
        rpm,
        { value: v.compressorEfficiency, kind: 'fraction' },
      ),
    );
  }
  if (v.offMapAssumed && v.compressorEfficiency !== null) {
    out.push(
      finding(
        'off-map-assumption',
        'warning',
        `Computed on the Plan's off-map efficiency assumption of ${pct(v.compressorEfficiency)}: the map does not reach this point.`,
        rpm,
        { value: v.compressorEfficiency, kind: 'fraction' },
      ),
    );
  }
  const region = v.mapRegion ?? null;
  const regionNote = region !== null ? regionFinding(region, v) : null;
  if (regionNote) out.push(regionNote);
  if (v.speedMargin !== null && v.speedMargin < 0 && v.shaftSpeed !== null && v.maxShaftSpeed !== null) {
    out.push(
      finding(
        'overspeed',
        'limit',
        `Shaft speed ${fmt(v.shaftSpeed)} rpm${SPEED_WORDS[v.marginBasis?.speed ?? ''] ?? ''} is over the limit ${fmt(v.maxShaftSpeed)} rpm (speed margin ${pct(v.speedMargin)}).${v.reachable === false && region === 'over-speed' ? ` ${NOT_REACHABLE}` : ''}`,
        rpm,
        { value: v.shaftSpeed, threshold: v.maxShaftSpeed, kind: 'speed' },
      ),
    );
  }
  out.push(...thinMarginFindings(v, ctx), ...leanFindings(v, ctx));
  if (!reachable) return out;
  const t2 = v.compressorOutletTemperature;
  const t2Limit = limits.maxCompressorOutletTemperature;
  const t2Accepted = (ctx.requirements ?? REQUIREMENT_DEFAULTS).maxCompressorOutletTemperature;
  if (t2 !== null && t2Limit !== undefined && t2 > t2Limit) {
    out.push(
      finding(
        'compressor-outlet-temperature-limit',
        'limit',
        `Compressor outlet temperature ${kelvin(t2)} is above the stated limit ${kelvin(t2Limit)}.`,
        rpm,
        { value: t2, threshold: t2Limit, kind: 'temperature' },
      ),
    );
  } else if (t2 !== null && t2 > t2Accepted) {
    out.push(
      finding(
        'compressor-outlet-temperature-high',
        'warning',
        `Compressor outlet temperature ${kelvin(t2)} is above the ${kelvin(t2Accepted)} the study accepts.`,
        rpm,
        { value: t2, threshold: t2Accepted, kind: 'temperature' },
      ),
    );
  }
  if (ctx.injectors && v.injectorPressureDifference !== null && v.injectorDuty === null) {
    out.push(
      finding(
        'injector-no-flow',
        'limit',
        `Boost has reached the fixed rail pressure: no pressure difference is left across the injectors (${fmt(v.injectorPressureDifference / 1000)} kPa).`,
        rpm,
        { value: v.injectorPressureDifference, threshold: 0, kind: 'pressure' },
      ),
    );
  }
  if (v.injectorDuty !== null) {
    const duty = v.injectorDuty;
    if (duty >= INJECTOR_DUTY_SATURATED) {
      out.push(
        finding(
          'injector-saturated',
          'limit',
          `Injector duty ${pct(duty)}: the injectors are saturated and cannot deliver the fuel.`,
          rpm,
          dutyQuantity(duty, INJECTOR_DUTY_SATURATED),
        ),
      );
    } else if (duty > INJECTOR_DUTY_LIMIT) {
      out.push(
        finding(
          'injector-duty-limit',
          'limit',
          `Injector duty ${pct(duty)} is over the ${pct(INJECTOR_DUTY_LIMIT)} limit (common practice).`,
          rpm,
          dutyQuantity(duty, INJECTOR_DUTY_LIMIT),
        ),
      );
    } else if (duty > INJECTOR_DUTY_WARNING) {
      out.push(
        finding(
          'injector-duty-high',
          'warning',
          `Injector duty ${pct(duty)} is over the usual ${pct(INJECTOR_DUTY_WARNING)} (common practice).`,
          rpm,
          dutyQuantity(duty, INJECTOR_DUTY_WARNING),
        ),
      );
    }
  }
  if (ctx.pumpFlowAvailable !== null && v.pumpFlowRequired !== null) {
    const share = v.pumpFlowRequired / ctx.pumpFlowAvailable;
    if (share > 1) {
      out.push(
        finding('fuel-pump-short', 'limit', `The engine needs ${pct(share)} of the pump's flow: the pump is too small.`, rpm, {
          value: v.pumpFlowRequired,
          threshold: ctx.pumpFlowAvailable,
          kind: 'volumeFlow',
        }),
      );
    } else if (share > FUEL_PUMP_WARNING) {
      out.push(
        finding('fuel-pump-near-limit', 'warning', `The engine needs ${pct(share)} of the pump's flow.`, rpm, {
          value: v.pumpFlowRequired,
          threshold: ctx.pumpFlowAvailable * FUEL_PUMP_WARNING,
          kind: 'volumeFlow',
        }),
      );
    }
  }
  return out;
}

/** The finding of a point that cannot be solved. */
export function unsolvableFinding(rpm: number, reason: string): Finding {
  return finding('unsolvable', 'limit', reason, rpm);
}
