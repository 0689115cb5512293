/**
 * The expansion ratio of each case of the power balance (physics note §5), found by Brent's method
 * on brackets that hold a sign change by construction; a root not found keeps the safe end of the
 * last bracket and says why.
 */
import { findRoot } from '#shared/math/root';
import { orificeMassFlux, valveArea } from '#shared/physics/wastegate';
import type { ExhaustGas } from './gas';
import type { TurbineModel } from './model';
import type { LineExhaustContext } from './result';
import { allThroughWheel, powerAt, readTurbine, stateAt, type TurbineState } from './turbine-state';

/** The power balance η_m·P_t = P_c with the gates open holds to this share of P_c. */
const POWER_BALANCE_TOLERANCE = 1e-6;
/** Expansion ratios are found to within this share. */
const RATIO_TOLERANCE = 1e-12;
/** No turbine is searched beyond this expansion ratio (a guard, far beyond any real one). */
const MAX_EXPANSION_RATIO = 1000;

export type Solved<T> = { ok: true; value: T; iterations: number } | { ok: false; value: T; reason: string };

/** Case 1: the expansion ratio at which the turbine swallows all the exhaust. */
export function shutGate(turbine: TurbineModel, g: ExhaustGas): Solved<TurbineState> {
  if (g.reader.expansionRatioForFlow) {
    // The map's own inverse, checked against its reading.
    const er = g.reader.expansionRatioForFlow(g.flow / g.swallow);
    if (Number.isFinite(er) && er > 1) {
      const state = allThroughWheel(g, er);
      if (Math.abs(state.flowParameter * er * g.swallow - g.flow) <= 1e-9 * g.flow) return { ok: true, value: state, iterations: 0 };
    }
  }
  return shutGateByRoot(turbine, g);
}

function shutGateByRoot(turbine: TurbineModel, g: ExhaustGas): Solved<TurbineState> {
  const excess = (er: number) => readTurbine(g.reader, er).flowParameter * er * g.swallow - g.flow;
  let hi = Math.max(2, turbine.expansionRatioRange[1]);
  let fHi = excess(hi);
  while (fHi < 0 && hi < MAX_EXPANSION_RATIO) {
    hi = Math.min(MAX_EXPANSION_RATIO, hi * 2);
    fHi = excess(hi);
  }
  const root = findRoot(excess, 1, hi, { fa: -g.flow, fb: fHi, absoluteTolerance: RATIO_TOLERANCE, relativeTolerance: RATIO_TOLERANCE });
  const er = root.ok ? root.x : hi;
  const state = allThroughWheel(g, er);
  return root.ok ? { ok: true, value: state, iterations: root.iterations } : { ok: false, value: state, reason: root.reason };
}

/** Case 3: the smaller expansion ratio at which the turbine gives exactly the power needed (W). */
export function gateOpen(g: ExhaustGas, powerNeeded: number, shut: TurbineState): Solved<TurbineState> {
  const balance = (er: number) => powerAt(g, er) - powerNeeded;
  const root = findRoot(balance, 1, shut.expansionRatio, {
    fa: -powerNeeded,
    fb: shut.power - powerNeeded,
    absoluteTolerance: RATIO_TOLERANCE,
    relativeTolerance: RATIO_TOLERANCE,
    functionTolerance: 1e-3 * POWER_BALANCE_TOLERANCE * powerNeeded,
  });
  if (root.ok) return { ok: true, value: stateAt(g, root.x), iterations: root.iterations };
  // The safe end holds at least the power needed.
  const end = root.bracket ? (root.bracket.fa >= 0 ? root.bracket.a : root.bracket.b) : shut.expansionRatio;
  return { ok: false, value: end === shut.expansionRatio ? shut : stateAt(g, end), reason: root.reason };
}

/** Gates wide open (no compressor power needed): the ratio at which turbine and fitted gates together pass the exhaust. */
export function gatesWideOpen(g: ExhaustGas, ex: LineExhaustContext, shut: TurbineState): Solved<TurbineState> {
  const gates = ex.input.wastegates;
  const gateArea = gates.count * gates.dischargeCoefficient * valveArea(gates.valveDiameter);
  const split = (er: number) => stateAt(g, er).massFlow + gateArea * orificeMassFlux(er * g.p4, g.t3, g.p4, g.gas).massFlux - g.flow;
  const fShut = gateArea * orificeMassFlux(shut.expansionRatio * g.p4, g.t3, g.p4, g.gas).massFlux;
  const root = findRoot(split, 1, shut.expansionRatio, { fa: -g.flow, fb: fShut, absoluteTolerance: RATIO_TOLERANCE, relativeTolerance: RATIO_TOLERANCE });
  if (root.ok) return { ok: true, value: stateAt(g, root.x), iterations: root.iterations };
  return { ok: false, value: shut, reason: root.reason };
}
