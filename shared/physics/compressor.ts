import { AIR_CP, AIR_GAMMA, isentropicTemperatureRatio } from './gas';

/** Reference conditions of corrected flow: temperature K, absolute pressure Pa. */
export interface FlowReference {
  temperature: number;
  pressure: number;
}

/** Pressure ratio p2/p1, dimensionless (static pressures taken as total: the velocities are low). */
export function pressureRatio(outletPressure: number, inletPressure: number): number {
  return outletPressure / inletPressure;
}

/**
 * Corrected mass flow, kg/s: ṁ_c = ṁ·√(T1/T_ref)/(p1/p_ref), against the map's own reference
 * (NASA Glenn "corrected airflow"; Isermann, Combustion Engine Diagnosis, 2017, eqs. 5.4.14–15).
 */
export function correctedMassFlow(massFlow: number, inletTemperature: number, inletPressure: number, reference: FlowReference): number {
  return (massFlow * Math.sqrt(inletTemperature / reference.temperature)) / (inletPressure / reference.pressure);
}

/** Actual mass flow, kg/s, back from corrected mass flow (the inverse of correctedMassFlow). */
export function actualMassFlow(corrected: number, inletTemperature: number, inletPressure: number, reference: FlowReference): number {
  return (corrected * (inletPressure / reference.pressure)) / Math.sqrt(inletTemperature / reference.temperature);
}

/**
 * Compressor outlet temperature T2, K: T1·[1 + (PR^((γ−1)/γ) − 1)/η_c] with the isentropic
 * efficiency η_c as a fraction (NASA Glenn compressor thermodynamics).
 */
export function compressorOutletTemperature(inletTemperature: number, pressureRatio: number, efficiency: number, gamma = AIR_GAMMA): number {
  return inletTemperature * (1 + (isentropicTemperatureRatio(pressureRatio, gamma) - 1) / efficiency);
}

/** Compressor shaft power, W: ṁ·cp·(T2 − T1). */
export function compressorPower(massFlow: number, outletTemperature: number, inletTemperature: number, cp = AIR_CP): number {
  return massFlow * cp * (outletTemperature - inletTemperature);
}

/** Charge temperature after a cooler of effectiveness ε (fraction), K: T2 − ε·(T2 − T_cool) (Incropera & DeWitt §11.4). */
export function intercoolerOutletTemperature(inletTemperature: number, effectiveness: number, coolantTemperature: number): number {
  return inletTemperature - effectiveness * (inletTemperature - coolantTemperature);
}
