/** The Working of a Scenario's air: pressure and temperature (given or from the ISA) and the humidity it carries. */
import {
  AIR_CP,
  AIR_GAS_CONSTANT,
  ISA_LAPSE_RATE,
  ISA_PRESSURE_EXPONENT,
  ISA_SEA_LEVEL_PRESSURE,
  ISA_SEA_LEVEL_TEMPERATURE,
  isaTemperature,
  saturationVapourPressure,
  STANDARD_GRAVITY,
  WATER_TO_AIR_MOLAR_MASS,
  WATER_VAPOUR_CP,
} from '../physics';
import type { LineContext } from './line-context';
import { fmt, gammaStep, SOURCES, SPECIFIC_HEAT_UNIT, step, wv, type WorkingStep } from './working';

export const HUMID_SOURCE = 'ASHRAE Handbook Fundamentals 2017, ch. 1 (eqs. 20, 24 and 32; saturation pressure eqs. 5–6 through psychrolib)';

/** The humidity of the air, and the gas constant, cp and γ it gives the charge (none for dry air). */
function humidSteps(ctx: LineContext): WorkingStep[] {
  const a = ctx.ambient;
  const air = ctx.air;
  if (!(a.relativeHumidity > 0) || !(air.humidityRatio > 0)) return [];
  const pws = saturationVapourPressure(a.temperature);
  return [
    step(
      'humidity-ratio',
      'Water in the air (humidity ratio)',
      `At ${fmt(a.relativeHumidity * 100, 3)} % relative humidity the vapour holds that share of the saturation pressure at the air's temperature; the humidity ratio is the mass of water per kg of dry air.`,
      'eps_w * RH * p_ws / (p_amb - RH * p_ws)',
      [
        wv('eps_w', WATER_TO_AIR_MOLAR_MASS, 'ratio'),
        wv('RH', a.relativeHumidity, 'fraction'),
        wv('p_ws', pws, 'pressure'),
        wv('p_amb', a.pressure, 'pressure'),
      ],
      wv('W', air.humidityRatio, 'none', 'kg/kg'),
      HUMID_SOURCE,
    ),
    step(
      'humid-gas-constant',
      'Gas constant of the humid charge',
      'Water vapour is lighter than air, so a kilogram of humid air takes more room: its gas constant is higher and its density lower at the same pressure and temperature.',
      'R_a * (1 + W / eps_w) / (1 + W)',
      [wv('R_a', AIR_GAS_CONSTANT, 'none', SPECIFIC_HEAT_UNIT), wv('W', air.humidityRatio, 'none', 'kg/kg'), wv('eps_w', WATER_TO_AIR_MOLAR_MASS, 'ratio')],
      wv('R', air.gasConstant, 'none', SPECIFIC_HEAT_UNIT),
      HUMID_SOURCE,
    ),
    step(
      'humid-cp',
      'Specific heat of the humid charge',
      'Dry air and water vapour each carry their own heat, by mass.',
      '(c_pa + W * c_pw) / (1 + W)',
      [wv('c_pa', AIR_CP, 'none', SPECIFIC_HEAT_UNIT), wv('W', air.humidityRatio, 'none', 'kg/kg'), wv('c_pw', WATER_VAPOUR_CP, 'none', SPECIFIC_HEAT_UNIT)],
      wv('c_p', air.cp, 'none', SPECIFIC_HEAT_UNIT),
      HUMID_SOURCE,
    ),
    gammaStep(
      'humid-gamma',
      'Ratio of specific heats of the humid charge',
      'For an ideal gas cv = cp − R.',
      ['c_p', air.cp],
      ['R', air.gasConstant],
      ['gamma', air.gamma],
    ),
  ];
}

/** The ambient pressure and temperature, then the water the air holds. */
export function ambientSteps(ctx: LineContext): WorkingStep[] {
  return [...pressureTemperatureSteps(ctx), ...humidSteps(ctx)];
}

function pressureTemperatureSteps(ctx: LineContext): WorkingStep[] {
  const a = ctx.ambient;
  const steps: WorkingStep[] = [];
  if (a.input.altitude !== undefined) {
    const h = a.input.altitude;
    const tIsa = isaTemperature(h);
    steps.push(
      step(
        'isa-temperature',
        'Standard-day temperature at the altitude',
        `The ISA troposphere cools ${ISA_LAPSE_RATE * 1000} K for every 1000 m of geopotential height. The altitude is taken as geopotential height (within 0.2 % of geometric height below 11 km).`,
        'T_0 - L * H',
        [wv('T_0', ISA_SEA_LEVEL_TEMPERATURE, 'temperature'), wv('L', ISA_LAPSE_RATE, 'none', 'K/m'), wv('H', h, 'length')],
        wv('T_isa', tIsa, 'temperature'),
        SOURCES.isa,
      ),
      step(
        'ambient-pressure',
        'Ambient pressure from the altitude',
        'Pressure in the ISA troposphere falls with temperature as a power law; the exponent g0/(L·R) is about 5.2559.',
        'p_0 * (T_isa / T_0) ^ (g_0 / (L * R))',
        [
          wv('p_0', ISA_SEA_LEVEL_PRESSURE, 'pressure'),
          wv('T_isa', tIsa, 'temperature'),
          wv('T_0', ISA_SEA_LEVEL_TEMPERATURE, 'temperature'),
          wv('g_0', STANDARD_GRAVITY, 'none', 'm/s^2'),
          wv('L', ISA_LAPSE_RATE, 'none', 'K/m'),
          wv('R', AIR_GAS_CONSTANT, 'none', SPECIFIC_HEAT_UNIT),
        ],
        wv('p_amb', a.pressure, 'pressure'),
        `${SOURCES.isa} (exponent ${fmt(ISA_PRESSURE_EXPONENT, 7)})`,
      ),
    );
    steps.push(
      a.temperatureFrom === 'isa'
        ? step(
            'ambient-temperature',
            'Ambient temperature',
            'No temperature was given, so the standard-day temperature at the altitude is used.',
            'T_isa',
            [wv('T_isa', tIsa, 'temperature')],
            wv('T_amb', a.temperature, 'temperature'),
            SOURCES.isa,
          )
        : step(
            'ambient-temperature',
            'Ambient temperature',
            'The temperature of the day is given; the pressure still follows the standard atmosphere.',
            'T_amb',
            [wv('T_amb', a.temperature, 'temperature')],
            wv('T_amb', a.temperature, 'temperature'),
            SOURCES.given,
          ),
    );
  } else {
    steps.push(
      step(
        'ambient-pressure',
        'Ambient pressure',
        'The barometric pressure is given in the Scenario.',
        'p_amb',
        [wv('p_amb', a.pressure, 'pressure')],
        wv('p_amb', a.pressure, 'pressure'),
        SOURCES.given,
      ),
      step(
        'ambient-temperature',
        'Ambient temperature',
        'The air temperature is given in the Scenario.',
        'T_amb',
        [wv('T_amb', a.temperature, 'temperature')],
        wv('T_amb', a.temperature, 'temperature'),
        SOURCES.given,
      ),
    );
  }
  return steps;
}
