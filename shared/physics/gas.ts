/**
 * Gas constants and isentropic relations for air and hot exhaust, treated as ideal gases with
 * constant specific heats at each state (the usual simplification for a one-point-per-rpm model).
 * The exhaust's own properties follow from the fuel and lambda (exhaust-gas.ts).
 */

/** Specific gas constant of dry air, J/(kg·K): ISO 2533:1975 (the ISA value). */
export const AIR_GAS_CONSTANT = 287.05287;
/** Ratio of specific heats of air, dimensionless: ideal diatomic gas near room temperature. */
export const AIR_GAMMA = 1.4;
/**
 * Specific heat of air at constant pressure, J/(kg·K), from γR/(γ−1) ≈ 1004.7 so that it stays
 * consistent with R and γ (tables give 1005 at 300 K, NBS Circular 564).
 */
export const AIR_CP = (AIR_GAMMA * AIR_GAS_CONSTANT) / (AIR_GAMMA - 1);

/** Ideal-gas density, kg/m³, from absolute pressure (Pa), temperature (K) and gas constant (J/(kg·K)). */
export function idealGasDensity(pressure: number, temperature: number, gasConstant = AIR_GAS_CONSTANT): number {
  return pressure / (gasConstant * temperature);
}

/** The isentropic exponent (γ−1)/γ, dimensionless. */
export function isentropicExponent(gamma = AIR_GAMMA): number {
  return (gamma - 1) / gamma;
}

/** Isentropic temperature ratio T2s/T1 for a pressure ratio: PR^((γ−1)/γ). */
export function isentropicTemperatureRatio(pressureRatio: number, gamma = AIR_GAMMA): number {
  return Math.pow(pressureRatio, isentropicExponent(gamma));
}

/** Isentropic outlet temperature T2s, K, of a compression from T1 (K) through a pressure ratio. */
export function isentropicOutletTemperature(inletTemperature: number, pressureRatio: number, gamma = AIR_GAMMA): number {
  return inletTemperature * isentropicTemperatureRatio(pressureRatio, gamma);
}

/**
 * Critical pressure ratio p_crit / p0 = (2/(γ+1))^(γ/(γ−1)), dimensionless: below it a nozzle or
 * valve is choked (isentropic flow tables, NACA Report 1135).
 */
export function criticalPressureRatio(gamma = AIR_GAMMA): number {
  return Math.pow(2 / (gamma + 1), gamma / (gamma - 1));
}

/**
 * Mass flow, kg/s, through an orifice of area (m²) with discharge coefficient, from upstream
 * stagnation pressure p0 (Pa) and temperature T0 (K) to downstream static pressure (Pa).
 * Choked when downstream/upstream ≤ the critical ratio; otherwise the subsonic relation
 * (NASA Glenn "mass flow choking"; any compressible-flow text).
 */
export function orificeMassFlow(args: {
  dischargeCoefficient: number;
  area: number;
  upstreamPressure: number;
  upstreamTemperature: number;
  downstreamPressure: number;
  gamma?: number;
  gasConstant?: number;
}): { massFlow: number; choked: boolean } {
  const gamma = args.gamma ?? AIR_GAMMA;
  const gasConstant = args.gasConstant ?? AIR_GAS_CONSTANT;
  const { dischargeCoefficient: cd, area, upstreamPressure: p0, upstreamTemperature: t0 } = args;
  const r = Math.max(0, Math.min(1, args.downstreamPressure / p0));
  if (r <= criticalPressureRatio(gamma)) {
    const massFlow = cd * area * p0 * Math.sqrt(gamma / (gasConstant * t0)) * Math.pow(2 / (gamma + 1), (gamma + 1) / (2 * (gamma - 1)));
    return { massFlow, choked: true };
  }
  const rho0 = p0 / (gasConstant * t0);
  const bracket = Math.pow(r, 2 / gamma) - Math.pow(r, (gamma + 1) / gamma);
  const massFlow = cd * area * Math.sqrt(2 * rho0 * p0 * (gamma / (gamma - 1)) * Math.max(0, bracket));
  return { massFlow, choked: false };
}
