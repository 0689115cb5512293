/**
 * The turbine side of the quasi-steady power balance (physics note §5): hot exhaust as an ideal
 * gas with constant properties, turbine power from the isentropic expansion, and the turbine's
 * swallowing capacity from its flow parameter.
 */

/** Properties of a hot gas taken as ideal with constant specific heats. */
export interface GasProperties {
  /** Ratio of specific heats, dimensionless. */
  gamma: number;
  /** Specific heat at constant pressure, J/(kg·K). */
  cp: number;
  /** Specific gas constant, J/(kg·K). */
  gasConstant: number;
}

/**
 * Hot combustion products at the turbine: γ = 1.333 (4/3) and cp = 1148 J/(kg·K), the values
 * turbomachinery texts use for expansion (Saravanamuttoo, Rogers & Cohen, Gas Turbine Theory,
 * "combustion gases"). R = cp·(γ−1)/γ = 287.0 J/(kg·K) keeps the three consistent.
 */
export const TURBINE_GAS: GasProperties = { gamma: 4 / 3, cp: 1148, gasConstant: (1148 * (4 / 3 - 1)) / (4 / 3) };

/** Exhaust mass flow, kg/s: the air and the fuel burnt with it both leave through the exhaust. */
export function exhaustMassFlow(airMassFlow: number, fuelMassFlow: number): number {
  return airMassFlow + fuelMassFlow;
}

/** The expansion exponent (γ−1)/γ of a gas, dimensionless. */
export function expansionExponent(gamma: number): number {
  return (gamma - 1) / gamma;
}

/** Share of the inlet enthalpy an ideal expansion through ER releases: 1 − ER^(−(γ−1)/γ); 0 at ER ≤ 1. */
export function isentropicExpansionShare(expansionRatio: number, gamma: number): number {
  return expansionRatio > 1 ? 1 - Math.pow(expansionRatio, -expansionExponent(gamma)) : 0;
}

/**
 * Turbine power, W: P_t = k·ṁ_t·cp_e·T3·η_t·(1 − ER^(−(γe−1)/γe)) (NASA Glenn compressor–turbine
 * matching; Isermann, Combustion Engine Diagnosis, 2017, eq. 5.4.17). `pulseFactor` k multiplies
 * the energy for what a steady model misses of a divided housing's pulses (1 = none).
 */
export function turbinePower(args: {
  /** Mass flow through the turbine wheel, kg/s. */
  massFlow: number;
  /** Turbine inlet temperature T3, K. */
  inletTemperature: number;
  /** Expansion ratio p3/p4, dimensionless. */
  expansionRatio: number;
  /** Turbine isentropic efficiency, fraction. */
  efficiency: number;
  pulseFactor?: number;
  gas?: GasProperties;
}): number {
  const gas = args.gas ?? TURBINE_GAS;
  const k = args.pulseFactor ?? 1;
  return k * args.massFlow * gas.cp * args.inletTemperature * args.efficiency * isentropicExpansionShare(args.expansionRatio, gas.gamma);
}

/**
 * The expansion ratio at which a turbine gives a power (W), from the turbine power equation
 * solved for ER: ER = (1 − P/(k·ṁ·cp·T3·η))^(−γ/(γ−1)). Null when the flow cannot give that
 * power at any expansion ratio (P ≥ k·ṁ·cp·T3·η, the limit of an infinite ratio).
 */
export function expansionRatioForPower(args: {
  /** Turbine power wanted, W. */
  power: number;
  massFlow: number;
  inletTemperature: number;
  efficiency: number;
  pulseFactor?: number;
  gas?: GasProperties;
}): number | null {
  const gas = args.gas ?? TURBINE_GAS;
  const available = (args.pulseFactor ?? 1) * args.massFlow * gas.cp * args.inletTemperature * args.efficiency;
  if (!(args.power >= 0) || !(available > 0)) return null;
  const share = args.power / available;
  if (!(share < 1)) return null;
  return Math.pow(1 - share, -1 / expansionExponent(gas.gamma));
}

/** Turbine flow parameter, kg·K^0.5/(s·Pa): FP = ṁ·√T3/p3 (the quantity a turbine map plots). */
export function flowParameter(massFlow: number, inletTemperature: number, inletPressure: number): number {
  return (massFlow * Math.sqrt(inletTemperature)) / inletPressure;
}

/**
 * Mass flow a turbine swallows, kg/s, at an expansion ratio: ṁ_t = FP(ER)·ER·p4/√T3, since
 * p3 = ER·p4 (physics note §5). `flowParameter` is the map's FP at that ER, kg·K^0.5/(s·Pa).
 */
export function turbineSwallowingFlow(flowParameter: number, expansionRatio: number, outletPressure: number, inletTemperature: number): number {
  return (flowParameter * expansionRatio * outletPressure) / Math.sqrt(inletTemperature);
}
