/** A Scenario's ambient as a line is computed with it: the ISA filled in, and the gas its air makes. */
import { ambientConditions, humidAirGas, humidityRatioFromRelativeHumidity, type AmbientConditions, type ChargeGas } from '../physics';
import type { AmbientInput } from './input/ambient';

/** A Scenario's ambient resolved: pressure (Pa absolute) and temperature (K) with where each came from. */
export interface ResolvedAmbient extends AmbientConditions {
  input: AmbientInput;
  /** Relative humidity, fraction (0 when not given). */
  relativeHumidity: number;
}

/** Ambient pressure (Pa) and temperature (K) of a Scenario, filling from the ISA what is not given. */
export function resolveAmbient(input: AmbientInput): ResolvedAmbient {
  const { pressure, temperature, pressureFrom, temperatureFrom } = ambientConditions(input);
  return { input, pressure, temperature, pressureFrom, temperatureFrom, relativeHumidity: input.relativeHumidity ?? 0 };
}

/**
 * The gas of the charge a Scenario's air makes: dry air at 0 % relative humidity, otherwise humid
 * air of the humidity ratio the ambient state gives (ASHRAE 2017 ch. 1, psychrolib). Its gas
 * constant is NaN where the air cannot hold that humidity (the line is then not solved).
 */
export function chargeGasOf(ambient: ResolvedAmbient): ChargeGas {
  return humidAirGas(humidityRatioFromRelativeHumidity(ambient.temperature, ambient.pressure, ambient.relativeHumidity));
}
