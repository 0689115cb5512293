/**
 * Builds the Working of one point on demand, from the line's context and the point's values.
 * Kept apart from the solve so a whole study stays cheap; the formulas are the same relations the
 * solve uses, written as mathjs expressions over the symbols shown.
 */
import { airflowSteps, manifoldTemperatureStep } from './air-working';
import { ambientSteps } from './ambient-working';
import { compressorPowerSteps, compressorTemperatureStep, efficiencyStep, mapSteps } from './compressor/working';
import { exhaustSteps, heldBoostStep } from './exhaust/working';
import { fuelSteps } from './fuel-working';
import type { LineContext } from './line-context';
import { lookupStep, pressureSteps } from './pressure-working';
import type { OperatingPoint } from './result';
import type { WorkingStep } from './working';

const allFinite = (s: WorkingStep) => Number.isFinite(s.result.value) && s.values.every((x) => Number.isFinite(x.value));

/**
 * The Working of one point, built on demand: every step from ambient to injector duty, in the
 * order a person would work it by hand. `fixedManifoldTemperature` says the manifold temperature
 * was given for the point (single points computed outside a study).
 */
export function pointWorking(ctx: LineContext, point: OperatingPoint, options: { fixedManifoldTemperature?: boolean } = {}): WorkingStep[] {
  const steps = ambientSteps(ctx);
  const rpm = point.rpm;
  const v = point.values;
  const t = ctx.tables;
  if (!v) {
    if (t.volumetricEfficiency)
      steps.push(lookupStep('volumetric-efficiency', 'Volumetric efficiency at this speed', t.volumetricEfficiency, rpm, 'VE', 0, 'fraction'));
    if (t.boost) steps.push(lookupStep('boost', 'Boost target at this speed', t.boost, rpm, 'boost', 0, 'pressure'));
    return steps.filter(allFinite);
  }
  // Where the turbine cannot hold the target, the target is shown first and the held boost after it.
  const held = heldBoostStep(ctx, v);
  steps.push(
    lookupStep('volumetric-efficiency', 'Volumetric efficiency at this speed', t.volumetricEfficiency, rpm, 'VE', v.volumetricEfficiency, 'fraction'),
    held
      ? lookupStep('boost', 'Boost target at this speed', t.boost, rpm, 'boost_target', v.boostTarget ?? v.boost, 'pressure')
      : lookupStep('boost', 'Boost target at this speed', t.boost, rpm, 'boost', v.boost, 'pressure'),
  );
  if (held) steps.push(held);
  if (v.lambda !== null) steps.push(lookupStep('lambda', 'Lambda target at this speed', t.lambda, rpm, 'lambda', v.lambda, 'ratio'));
  steps.push(...pressureSteps(ctx, v));
  const fixedGiven = options.fixedManifoldTemperature === true;
  const power = compressorPowerSteps(ctx, v);
  if (!fixedGiven && ctx.intercooler.kind === 'effectiveness') {
    // The manifold temperature needs T2 first (for a point that cannot be delivered, only to place it).
    steps.push(
      efficiencyStep(ctx, v),
      compressorTemperatureStep(v),
      manifoldTemperatureStep(ctx, v, fixedGiven),
      ...airflowSteps(ctx, v),
      ...mapSteps(ctx, v),
      ...power,
    );
  } else {
    // With the manifold temperature given, the point's place needs no efficiency: a point that
    // cannot be delivered shows no efficiency or outlet temperature at all.
    const compressorSteps = v.compressorEfficiency === null ? [] : [efficiencyStep(ctx, v), compressorTemperatureStep(v)];
    steps.push(manifoldTemperatureStep(ctx, v, fixedGiven), ...airflowSteps(ctx, v), ...mapSteps(ctx, v), ...compressorSteps, ...power);
  }
  steps.push(...fuelSteps(ctx, v));
  steps.push(...exhaustSteps(ctx, v));
  return steps.filter(allFinite);
}
