/** The turbine at one expansion ratio for one point's exhaust gas: what it swallows and the power it gives. */
import { isentropicExpansionShare } from '#shared/physics/turbine';
import type { ExhaustGas, TurbineReader } from './gas';
import type { TurbineLocation } from './model';

/** A turbine reading with anything non-finite or impossible made safe: no flow at ER ≤ 1, efficiency null when not in (0, 1]. */
export function readTurbine(turbine: TurbineReader, expansionRatio: number): { flowParameter: number; efficiency: number | null; location: TurbineLocation } {
  if (!(expansionRatio > 1)) return { flowParameter: 0, efficiency: null, location: 'below-map' };
  const r = turbine.read(expansionRatio);
  const flowParameter = typeof r.flowParameter === 'number' && Number.isFinite(r.flowParameter) && r.flowParameter > 0 ? r.flowParameter : 0;
  const efficiency = typeof r.efficiency === 'number' && Number.isFinite(r.efficiency) && r.efficiency > 0 && r.efficiency <= 1 ? r.efficiency : null;
  const location: TurbineLocation = r.location === 'inside' || r.location === 'below-map' || r.location === 'above-map' ? r.location : 'above-map';
  return { flowParameter, efficiency, location };
}

/** The turbine's state at one expansion ratio for one point's gas. */
export interface TurbineState {
  expansionRatio: number;
  flowParameter: number;
  efficiency: number;
  efficiencyAssumed: boolean;
  location: TurbineLocation;
  /** Mass flow the wheel swallows at this ratio, kg/s. */
  massFlow: number;
  /** Turbine power, W (pulse factor included). */
  power: number;
}

export function stateAt(g: ExhaustGas, expansionRatio: number): TurbineState {
  const r = readTurbine(g.reader, expansionRatio);
  const efficiency = r.efficiency ?? g.fallbackEfficiency;
  const massFlow = r.flowParameter * expansionRatio * g.swallow;
  return {
    expansionRatio,
    flowParameter: r.flowParameter,
    efficiency,
    efficiencyAssumed: r.efficiency === null,
    location: r.location,
    massFlow,
    power: g.pulse * massFlow * g.gas.cp * g.t3 * efficiency * isentropicExpansionShare(expansionRatio, g.gas.gamma),
  };
}

/** Turbine power at one expansion ratio, W, without building a state (the root finder's inner loop). */
export function powerAt(g: ExhaustGas, expansionRatio: number): number {
  if (!(expansionRatio > 1)) return 0;
  const r = g.reader.read(expansionRatio);
  const fp = typeof r.flowParameter === 'number' && Number.isFinite(r.flowParameter) && r.flowParameter > 0 ? r.flowParameter : 0;
  const eta = typeof r.efficiency === 'number' && Number.isFinite(r.efficiency) && r.efficiency > 0 && r.efficiency <= 1 ? r.efficiency : g.fallbackEfficiency;
  return g.pulse * fp * expansionRatio * g.swallow * g.gas.cp * g.t3 * eta * isentropicExpansionShare(expansionRatio, g.gas.gamma);
}

/** The state with all the exhaust through the wheel: its flow taken as exactly the exhaust flow. */
export function allThroughWheel(g: ExhaustGas, er: number): TurbineState {
  const state = stateAt(g, er);
  state.massFlow = g.flow;
  state.power = g.pulse * g.flow * g.gas.cp * g.t3 * state.efficiency * isentropicExpansionShare(er, g.gas.gamma);
  return state;
}
