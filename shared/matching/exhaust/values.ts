/** The exhaust values of a point: written from the solved power balance, checked finite, or cleared. */
import { orificeMassFlux, wastegateDiameterFor } from '#shared/physics/wastegate';
import type { PointValues } from '../result';
import type { ExhaustGas } from './gas';
import type { LineExhaustContext } from './result';
import type { TurbineState } from './turbine-state';

const EXHAUST_KEYS = [
  'exhaustMassFlow',
  'turbineInletTemperature',
  'turbineOutletPressure',
  'downstreamLoss',
  'exhaustGasCp',
  'exhaustGasGamma',
  'exhaustGasConstant',
  'turbineInletPressure',
  'expansionRatio',
  'drivePressureRatio',
  'turbineFlowParameter',
  'turbineMapFlowParameter',
  'turbineEfficiency',
  'turbineMassFlow',
  'turbinePower',
  'shutGateExpansionRatio',
  'shutGateTurbineEfficiency',
  'shutGateTurbinePower',
  'wastegateMassFlow',
  'wastegateFraction',
  'wastegateDiameterNeeded',
  'wastegateDiameterFitted',
  'wastegateMargin',
] as const satisfies readonly (keyof PointValues)[];

/** Writes the exhaust values of a point (in place: the point is still being built). */
export function writeExhaust(
  v: PointValues,
  ex: LineExhaustContext,
  divisor: number,
  g: ExhaustGas,
  shut: TurbineState,
  at: TurbineState,
  kind: NonNullable<PointValues['exhaustCase']>,
  held: boolean,
): void {
  const p3 = at.expansionRatio * g.p4;
  const gates = ex.input.wastegates;
  const turbineFlow = Math.min(at.massFlow, g.flow);
  const gateFlow = g.flow - turbineFlow;
  v.targetHeld = held;
  v.exhaustCase = kind;
  v.exhaustMassFlow = g.flow;
  v.turbineInletTemperature = g.t3;
  v.turbineOutletPressure = g.p4;
  v.downstreamLoss = g.downstreamLoss;
  v.exhaustGasCp = g.gas.cp;
  v.exhaustGasGamma = g.gas.gamma;
  v.exhaustGasConstant = g.gas.gasConstant;
  v.turbineSpeedReading = speedReadingOf(g, at.expansionRatio, v.shaftSpeed);
  v.turbineInletPressure = p3;
  v.expansionRatio = at.expansionRatio;
  v.drivePressureRatio = p3 / v.manifoldPressure;
  v.turbineFlowParameter = at.flowParameter;
  v.turbineMapFlowParameter = at.flowParameter / divisor;
  v.turbineMapLocation = at.location;
  v.turbineEfficiency = at.efficiency;
  v.turbineMassFlow = turbineFlow;
  v.turbinePower = at.power;
  v.shutGateExpansionRatio = shut.expansionRatio;
  v.shutGateTurbineEfficiency = shut.efficiency;
  v.shutGateTurbinePower = shut.power;
  v.wastegateMassFlow = gateFlow;
  v.wastegateFraction = gateFlow / g.flow;
  v.wastegateDiameterFitted = gates.valveDiameter;
  const flux = orificeMassFlux(p3, g.t3, g.p4, g.gas);
  v.wastegateChoked = gateFlow > 0 ? flux.choked : null;
  if (kind === 'no-power-needed') {
    // The throttle sets boost; the gates are simply open, so no size is asked of them.
    v.wastegateDiameterNeeded = null;
    v.wastegateMargin = null;
  } else {
    const size = wastegateDiameterFor({
      massFlow: gateFlow,
      gates: gates.count,
      dischargeCoefficient: gates.dischargeCoefficient,
      upstreamPressure: p3,
      upstreamTemperature: g.t3,
      downstreamPressure: g.p4,
      gas: g.gas,
    });
    v.wastegateDiameterNeeded = size ? size.diameter : null;
    v.wastegateMargin = size ? (gates.valveDiameter - size.diameter) / gates.valveDiameter : null;
  }
}

/** True when every exhaust number of the point is finite (or null): one sum carries any NaN or Infinity. */
export function exhaustFinite(v: PointValues): boolean {
  const sum =
    (v.exhaustMassFlow ?? 0) +
    (v.turbineInletTemperature ?? 0) +
    (v.turbineOutletPressure ?? 0) +
    (v.turbineInletPressure ?? 0) +
    (v.expansionRatio ?? 0) +
    (v.drivePressureRatio ?? 0) +
    (v.turbineFlowParameter ?? 0) +
    (v.turbineMapFlowParameter ?? 0) +
    (v.turbineEfficiency ?? 0) +
    (v.turbineMassFlow ?? 0) +
    (v.turbinePower ?? 0) +
    (v.shutGateExpansionRatio ?? 0) +
    (v.shutGateTurbineEfficiency ?? 0) +
    (v.shutGateTurbinePower ?? 0) +
    (v.wastegateMassFlow ?? 0) +
    (v.wastegateFraction ?? 0) +
    (v.wastegateDiameterNeeded ?? 0) +
    (v.wastegateDiameterFitted ?? 0) +
    (v.wastegateMargin ?? 0);
  return Number.isFinite(sum);
}

/** How the point read the turbine map against its shaft speed, with each line's efficiency at the point's ratio (for the Working). */
function speedReadingOf(g: ExhaustGas, expansionRatio: number, shaftSpeed: number | null): PointValues['turbineSpeedReading'] {
  const at = g.atSpeed;
  if (!at) return { basis: 'mean-of-lines', shaftSpeed: shaftSpeed ?? null, lowerSpeed: null, upperSpeed: null, lowerEfficiency: null, upperEfficiency: null };
  const lines = at.linesAt(expansionRatio);
  return { basis: at.speedBasis, shaftSpeed: at.shaftSpeed, lowerSpeed: at.lowerSpeed, upperSpeed: at.upperSpeed, ...lines };
}

export function clearExhaust(v: PointValues): void {
  for (const key of EXHAUST_KEYS) v[key] = null;
  v.turbineSpeedReading = null;
  v.targetHeld = null;
  v.exhaustCase = null;
  v.turbineMapLocation = null;
  v.wastegateChoked = null;
}

/**
 * Compressor power of a point fresh from solvePoint, W. It is always set there; only a point found
 * unreachable loses it, and that happens after the exhaust side is solved. NaN, never a silent 0, if not.
 */
export const solvedPower = (v: PointValues): number => v.compressorPower ?? Number.NaN;
