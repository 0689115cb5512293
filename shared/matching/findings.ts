/**
 * Findings: what a point's numbers mean for the build, each with a severity. Thresholds are named
 * constants with where they come from; "limit" is reserved for hard limits (surge, overspeed,
 * injector saturation, the builder's own limits).
 */
import type { MapLocation } from './compressor-model';
import type { Finding, FindingCode, LineContext, PointValues, Severity } from './types';
import { fmt, kelvin, pct, type WorkingKind } from './working';

/** Injector duty above which a warning is raised, fraction (common practice, no source). */
export const INJECTOR_DUTY_WARNING = 0.8;
/** Injector duty above which the point is at its limit, fraction (common practice, no source). */
export const INJECTOR_DUTY_LIMIT = 0.85;
/** Injector duty at which the injectors are open all the time (saturated), fraction (definition). */
export const INJECTOR_DUTY_SATURATED = 1;
/** Compressor outlet temperature above which a warning is raised, K: 200 °C (from memory: where oils and couplers start to suffer). */
export const COMPRESSOR_OUTLET_TEMPERATURE_WARNING = 473.15;
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

const locationFindings: Record<Exclude<MapLocation, 'inside'>, { code: FindingCode; severity: Severity; words: string }> = {
  'left-of-surge': { code: 'map-left-of-surge', severity: 'limit', words: 'left of the surge line' },
  'beyond-choke': { code: 'map-beyond-choke', severity: 'warning', words: 'beyond the choke limit' },
  'above-top-speed': { code: 'map-above-top-speed', severity: 'limit', words: 'above the top speed line' },
  'below-map': { code: 'map-below-map', severity: 'info', words: 'below the map (low pressure ratio; usual at light load)' },
  'off-map': { code: 'map-off-map', severity: 'warning', words: 'off the map' },
};

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
      finding('throttled', 'info', 'Manifold pressure is below compressor inlet pressure: the throttle takes the drop and the compressor is taken at pressure ratio 1.', rpm),
    );
  }
  if (!v.converged) {
    out.push(
      finding('not-converged', 'warning', `The manifold temperature did not settle in ${v.iterations} passes; the last pass is shown.`, rpm),
    );
  }
  if (ctx.hasMap && v.efficiencySource === 'plan') {
    out.push(
      finding(
        'efficiency-off-map',
        'warning',
        `The map gives no efficiency here; the Plan's ${pct(v.compressorEfficiency)} is used instead.`,
        rpm,
        { value: v.compressorEfficiency, kind: 'fraction' },
      ),
    );
  }
  if (v.mapLocation !== null && v.mapLocation !== 'inside') {
    const l = locationFindings[v.mapLocation];
    out.push(finding(l.code, l.severity, `The point is ${l.words}.`, rpm));
  }
  if (v.shaftSpeed !== null && v.maxShaftSpeed !== null && v.shaftSpeed > v.maxShaftSpeed) {
    out.push(
      finding(
        'overspeed',
        'limit',
        `Shaft speed ${fmt(v.shaftSpeed)} rpm is over the limit ${fmt(v.maxShaftSpeed)} rpm.`,
        rpm,
        { value: v.shaftSpeed, threshold: v.maxShaftSpeed, kind: 'speed' },
      ),
    );
  }
  const t2Limit = limits.maxCompressorOutletTemperature;
  if (t2Limit !== undefined && v.compressorOutletTemperature > t2Limit) {
    out.push(
      finding(
        'compressor-outlet-temperature-limit',
        'limit',
        `Compressor outlet temperature ${kelvin(v.compressorOutletTemperature)} is above the stated limit ${kelvin(t2Limit)}.`,
        rpm,
        { value: v.compressorOutletTemperature, threshold: t2Limit, kind: 'temperature' },
      ),
    );
  } else if (v.compressorOutletTemperature > COMPRESSOR_OUTLET_TEMPERATURE_WARNING) {
    out.push(
      finding(
        'compressor-outlet-temperature-high',
        'warning',
        `Compressor outlet temperature ${kelvin(v.compressorOutletTemperature)} is above ${kelvin(COMPRESSOR_OUTLET_TEMPERATURE_WARNING)}.`,
        rpm,
        { value: v.compressorOutletTemperature, threshold: COMPRESSOR_OUTLET_TEMPERATURE_WARNING, kind: 'temperature' },
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
      out.push(finding('injector-saturated', 'limit', `Injector duty ${pct(duty)}: the injectors are saturated and cannot deliver the fuel.`, rpm, dutyQuantity(duty, INJECTOR_DUTY_SATURATED)));
    } else if (duty > INJECTOR_DUTY_LIMIT) {
      out.push(finding('injector-duty-limit', 'limit', `Injector duty ${pct(duty)} is over the ${pct(INJECTOR_DUTY_LIMIT)} limit (common practice).`, rpm, dutyQuantity(duty, INJECTOR_DUTY_LIMIT)));
    } else if (duty > INJECTOR_DUTY_WARNING) {
      out.push(finding('injector-duty-high', 'warning', `Injector duty ${pct(duty)} is over the usual ${pct(INJECTOR_DUTY_WARNING)} (common practice).`, rpm, dutyQuantity(duty, INJECTOR_DUTY_WARNING)));
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
