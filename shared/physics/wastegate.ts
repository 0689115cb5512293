/**
 * Wastegate valves as compressible orifices (physics note §5; NASA Glenn "mass flow choking";
 * any compressible-flow text): choked when the downstream-to-upstream pressure ratio is at or
 * below the critical ratio (2/(γ+1))^(γ/(γ−1)), subsonic above it. The flow area is the valve's
 * π·d²/4; the discharge coefficient C_d (an assumption the user sets) covers lift, seat and
 * everything else a real valve loses against an ideal nozzle.
 */
import { criticalPressureRatio } from './gas';
import { TURBINE_GAS, type GasProperties } from './turbine';

/**
 * The dimensionless orifice flow function Φ(r) = ṁ·√(R·T0)/(A·p0) of an ideal nozzle, r the
 * downstream over upstream pressure: √(2γ/(γ−1)·(r^(2/γ) − r^((γ+1)/γ))) when subsonic,
 * √γ·(2/(γ+1))^((γ+1)/(2(γ−1))) when choked. 0 at r ≥ 1 (no pressure drop, no flow).
 */
export function orificeFlowFunction(pressureRatio: number, gamma: number): { value: number; choked: boolean } {
  if (!(pressureRatio < 1)) return { value: 0, choked: false };
  const r = Math.max(0, pressureRatio);
  if (r <= criticalPressureRatio(gamma)) {
    return { value: Math.sqrt(gamma) * Math.pow(2 / (gamma + 1), (gamma + 1) / (2 * (gamma - 1))), choked: true };
  }
  const bracket = Math.pow(r, 2 / gamma) - Math.pow(r, (gamma + 1) / gamma);
  return { value: Math.sqrt(((2 * gamma) / (gamma - 1)) * Math.max(0, bracket)), choked: false };
}

/** Mass flux of an ideal orifice, kg/(s·m²), from upstream p0 (Pa) and T0 (K) to a downstream pressure (Pa). */
export function orificeMassFlux(
  upstreamPressure: number,
  upstreamTemperature: number,
  downstreamPressure: number,
  gas: GasProperties = TURBINE_GAS,
): { massFlux: number; choked: boolean } {
  const phi = orificeFlowFunction(downstreamPressure / upstreamPressure, gas.gamma);
  return { massFlux: (upstreamPressure * phi.value) / Math.sqrt(gas.gasConstant * upstreamTemperature), choked: phi.choked };
}

/** Flow area of a round valve, m², from its diameter, m. */
export function valveArea(diameter: number): number {
  return (Math.PI * diameter * diameter) / 4;
}

/** Diameter of a round valve, m, of a flow area, m². */
export function valveDiameter(area: number): number {
  return Math.sqrt((4 * area) / Math.PI);
}

/** The state of the gas at the gates: upstream p3 and T3, downstream p4. */
export interface GateConditions {
  /** Turbine inlet (exhaust manifold) pressure p3, Pa absolute. */
  upstreamPressure: number;
  /** Turbine inlet temperature T3, K. */
  upstreamTemperature: number;
  /** Pressure after the turbine p4, Pa absolute. */
  downstreamPressure: number;
  gas?: GasProperties;
}

/** Mass flow, kg/s, of `gates` identical gates of a valve diameter (m) and discharge coefficient, together. */
export function wastegateMassFlow(args: GateConditions & { gates: number; valveDiameter: number; dischargeCoefficient: number }): {
  massFlow: number;
  choked: boolean;
} {
  const flux = orificeMassFlux(args.upstreamPressure, args.upstreamTemperature, args.downstreamPressure, args.gas);
  return { massFlow: args.gates * args.dischargeCoefficient * valveArea(args.valveDiameter) * flux.massFlux, choked: flux.choked };
}

/** What each gate must be to pass a flow. */
export interface GateSize {
  /** Valve diameter each gate needs, m. */
  diameter: number;
  /** Flow area each gate needs, m². */
  area: number;
  /** Flow through each gate, kg/s. */
  massFlowPerGate: number;
  /** Ideal mass flux at these pressures, kg/(s·m²). */
  massFlux: number;
  choked: boolean;
}

/**
 * The valve diameter each of `gates` identical gates needs to pass `massFlow` (kg/s, all gates
 * together) from p3 to p4: A = ṁ_gate/(C_d·flux), d = √(4A/π). One gate, or one per scroll of a
 * divided housing, each taking an equal share. Null when p3 ≤ p4: no valve, however large, passes
 * flow without a pressure drop.
 */
export function wastegateDiameterFor(args: GateConditions & { massFlow: number; gates: number; dischargeCoefficient: number }): GateSize | null {
  const flux = orificeMassFlux(args.upstreamPressure, args.upstreamTemperature, args.downstreamPressure, args.gas);
  const massFlowPerGate = args.massFlow / args.gates;
  if (massFlowPerGate <= 0) return { diameter: 0, area: 0, massFlowPerGate: 0, massFlux: flux.massFlux, choked: flux.choked };
  if (!(flux.massFlux > 0)) return null;
  const area = massFlowPerGate / (args.dischargeCoefficient * flux.massFlux);
  return { diameter: valveDiameter(area), area, massFlowPerGate, massFlux: flux.massFlux, choked: flux.choked };
}
