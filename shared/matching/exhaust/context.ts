/** The exhaust side of a line: the Plan's block with its defaults, the turbine map's particulars, and whether it can be computed. */
import type { PlanInput } from '../input/plan';
import type { TurbineModel } from './model';
import type { LineExhaustContext } from './result';

/** Turbine efficiency assumed where the map gives none, fraction (from memory: small radial turbines run about 0.6–0.75). */
export const DEFAULT_TURBINE_EFFICIENCY = 0.65;
/** Pulse-energy factor when none is set: the steady model as it is. */
export const DEFAULT_PULSE_FACTOR = 1;

/** The exhaust context of a Plan's lines, or null when the Plan has no exhaust block. */
export function lineExhaustContext(plan: PlanInput, turbine: TurbineModel | null): LineExhaustContext | null {
  const input = plan.exhaust;
  if (!input) return null;
  const efficiencyKind = turbine?.efficiencyKind ?? null;
  return {
    input: {
      ...input,
      pulseFactor: input.pulseFactor ?? DEFAULT_PULSE_FACTOR,
      turbineEfficiency: input.turbineEfficiency ?? DEFAULT_TURBINE_EFFICIENCY,
    },
    // A map whose efficiency counts the bearings' losses already holds the mechanical efficiency: applied once.
    mechanicalEfficiency: efficiencyKind === 'with-bearing-losses' ? 1 : input.mechanicalEfficiency,
    turbine: turbine
      ? {
          name: turbine.name,
          housing: turbine.housing,
          scrollFeed: turbine.scrollFeed,
          areaRatio: turbine.areaRatio,
          efficiencyKind,
          speedLines: [...(turbine.speedLines ?? [])],
          expansionRatioRange: [turbine.expansionRatioRange[0], turbine.expansionRatioRange[1]],
          mapFlowParameterDivisor: turbine.mapFlowParameterDivisor,
          capacityRule: turbine.capacityRule,
        }
      : null,
  };
}

const positive = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x) && x > 0;

/** Reasons the exhaust inputs give no physical state (only with input the study schema never checked). */
export function exhaustProblems(ex: LineExhaustContext): string[] {
  const i = ex.input;
  const out: string[] = [];
  if (!(positive(i.mechanicalEfficiency) && i.mechanicalEfficiency <= 1)) out.push('mechanical efficiency is not between 0 and 1');
  const ds = i.downstreamLoss;
  if (!(ds && ds.pressureLoss >= 0 && Number.isFinite(ds.pressureLoss))) out.push('the loss after the turbine is negative');
  else if ((ds.referenceMassFlow !== undefined && !positive(ds.referenceMassFlow)) || (ds.referenceDensity !== undefined && !positive(ds.referenceDensity)))
    out.push('the loss after the turbine has a reference flow or density that is not positive');
  if (!positive(i.pulseFactor)) out.push('the pulse factor is not positive');
  if (!(positive(i.turbineEfficiency) && i.turbineEfficiency <= 1)) out.push('the assumed turbine efficiency is not between 0 and 1');
  const g = i.wastegates;
  if (!(g && (g.count === 1 || g.count === 2))) out.push('the gate count is not 1 or 2');
  else {
    if (!positive(g.valveDiameter)) out.push('the gate valve diameter is not positive');
    if (!(positive(g.dischargeCoefficient) && g.dischargeCoefficient <= 1)) out.push('the gate discharge coefficient is not between 0 and 1');
  }
  if (
    !Array.isArray(i.turbineInletTemperature) ||
    i.turbineInletTemperature.length === 0 ||
    !i.turbineInletTemperature.every((r) => positive(r.value) && Number.isFinite(r.rpm))
  )
    out.push('the turbine inlet temperature table is empty or not positive');
  return out;
}

const usable = new WeakMap<LineExhaustContext, boolean>();
/** exhaustProblems is empty: checked once per line context, not at every point. */
export function exhaustUsable(ex: LineExhaustContext): boolean {
  let ok = usable.get(ex);
  if (ok === undefined) {
    ok = exhaustProblems(ex).length === 0;
    usable.set(ex, ok);
  }
  return ok;
}
