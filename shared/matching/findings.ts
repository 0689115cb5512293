/**
 * Findings: what a point's numbers mean for the build, each with a severity. Thresholds are named
 * constants with where they come from; "limit" is reserved for hard limits (surge, overspeed,
 * injector saturation, the builder's own limits). The compressor's own findings are in
 * compressor/findings.ts, the exhaust side's in exhaust/findings.ts.
 */
import { compressorFindings, outletTemperatureFindings } from './compressor/findings';
import { finding, type Finding } from './finding';
import { REQUIREMENT_DEFAULTS } from './input/requirements';
import type { LineContext } from './line-context';
import type { PointValues } from './result';
import { fmt, kelvin, pct, type WorkingKind } from './working';

/** Injector duty above which a warning is raised, fraction (common practice, no source). */
export const INJECTOR_DUTY_WARNING = 0.8;
/** Injector duty above which the point is at its limit, fraction (common practice, no source). */
export const INJECTOR_DUTY_LIMIT = 0.85;
/** Injector duty at which the injectors are open all the time (saturated), fraction (definition). */
const INJECTOR_DUTY_SATURATED = 1;
/** Share of the pump's flow above which a warning is raised, fraction (common practice, no source). */
const FUEL_PUMP_WARNING = 0.9;
/** Usual range of volumetric efficiency referred to manifold density, fraction (common practice, no source). */
const VOLUMETRIC_EFFICIENCY_RANGE = [0.3, 1.3] as const;
/** Usual range of lambda targets under load (common practice, no source). */
const LAMBDA_RANGE = [0.6, 1.3] as const;
/** Ambient temperatures engines are usually run in, K: −50 °C to +60 °C (from memory). */
const AMBIENT_TEMPERATURE_RANGE = [223.15, 333.15] as const;
/** Compressor isentropic efficiency above which a figure is doubtful for an automotive wheel, fraction (from memory). */
const COMPRESSOR_EFFICIENCY_PLAUSIBLE_MAX = 0.85;
/** Brake thermal efficiency above which a figure is doubtful for a piston engine, fraction (from memory). */
const BRAKE_THERMAL_EFFICIENCY_PLAUSIBLE_MAX = 0.5;

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
  compressorFindings(v, ctx, out);
  out.push(...leanFindings(v, ctx));
  if (v.reachable === false) return out;
  outletTemperatureFindings(v, ctx, out);
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
