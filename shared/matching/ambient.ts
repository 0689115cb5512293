import { isaPressure, isaTemperature } from '../physics';
import type { AmbientInput, LineContext } from './types';

/** Ambient pressure (Pa) and temperature (K) of a Scenario, filling from the ISA what is not given. */
export function resolveAmbient(input: AmbientInput): LineContext['ambient'] {
  if (input.altitude !== undefined) {
    const temperature = input.temperature ?? isaTemperature(input.altitude);
    return {
      input,
      pressure: isaPressure(input.altitude),
      temperature,
      pressureFrom: 'isa',
      temperatureFrom: input.temperature === undefined ? 'isa' : 'given',
    };
  }
  return { input, pressure: input.pressure, temperature: input.temperature, pressureFrom: 'given', temperatureFrom: 'given' };
}
