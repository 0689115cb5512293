import { humidAirGas, humidityRatioFromRelativeHumidity, isaPressure, isaTemperature, type ChargeGas } from '../physics';
import type { AmbientInput, LineContext } from './types';

/** Ambient pressure (Pa) and temperature (K) of a Scenario, filling from the ISA what is not given. */
export function resolveAmbient(input: AmbientInput): LineContext['ambient'] {
  const relativeHumidity = input.relativeHumidity ?? 0;
  if (input.altitude !== undefined) {
    const temperature = input.temperature ?? isaTemperature(input.altitude);
    return {
      input,
      pressure: isaPressure(input.altitude),
      temperature,
      pressureFrom: 'isa',
      temperatureFrom: input.temperature === undefined ? 'isa' : 'given',
      relativeHumidity,
    };
  }
  return { input, pressure: input.pressure, temperature: input.temperature, pressureFrom: 'given', temperatureFrom: 'given', relativeHumidity };
}

/**
 * The gas of the charge a Scenario's air makes: dry air at 0 % relative humidity, otherwise humid
 * air of the humidity ratio the ambient state gives (ASHRAE 2017 ch. 1, psychrolib). Its gas
 * constant is NaN where the air cannot hold that humidity (the line is then not solved).
 */
export function chargeGasOf(ambient: LineContext['ambient']): ChargeGas {
  return humidAirGas(humidityRatioFromRelativeHumidity(ambient.temperature, ambient.pressure, ambient.relativeHumidity));
}
