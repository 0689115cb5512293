/**
 * Builds the Working of one point on demand, from the line's context and the point's values.
 * Kept apart from the solve so a whole study stays cheap; the formulas here are the same
 * relations the solve uses, written as mathjs expressions over the symbols shown.
 */
import {
  AIR_CP,
  AIR_GAS_CONSTANT,
  ETHANOL,
  injectionPeriod,
  LOSS_REFERENCE_DENSITY,
  ratingFluidFactor,
  saturationVapourPressure,
  WATER_TO_AIR_MOLAR_MASS,
  WATER_VAPOUR_CP,
  type PressureLossInput,
  ISA_LAPSE_RATE,
  ISA_PRESSURE_EXPONENT,
  ISA_SEA_LEVEL_PRESSURE,
  ISA_SEA_LEVEL_TEMPERATURE,
  isaTemperature,
  PETROL,
  revolutionsPerCycle,
  scaleInjectorFlow,
  STANDARD_GRAVITY,
} from '../physics';
import { exhaustSteps, heldBoostStep } from './exhaust-working';
import { missingMarginWords } from './margin-words';
import { MAP_REGION_WORDS } from './reach';
import { lookupByRpm } from './rpm-table';
import type { LineContext, OperatingPoint, PointValues, RpmTable } from './types';
import { fmt, gammaStep, kelvin, pct, SOURCES, step, wv, type WorkingKind, type WorkingStep } from './working';

const R_UNIT = 'J/(kg K)';
const HUMID_SOURCE = 'ASHRAE Handbook Fundamentals 2017, ch. 1 (eqs. 20, 24 and 32; saturation pressure eqs. 5–6 through psychrolib)';
const LOSS_SOURCE = 'Duct loss Δp ∝ ṁ²/ρ (constant loss coefficient, incompressible duct flow)';

/** The ideal-gas source: ISO 2533's dry-air R, or the humid charge's. */
const idealGasSource = (ctx: LineContext) => (ctx.air.humidityRatio > 0 ? `Ideal-gas law, R of the humid charge (${HUMID_SOURCE})` : SOURCES.idealGas);

/** What the air is in the Working: "humid air" when it holds water. */
const chargeWords = (ctx: LineContext) => (ctx.air.humidityRatio > 0 ? 'humid air' : 'dry air');

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
      [wv('R_a', AIR_GAS_CONSTANT, 'none', R_UNIT), wv('W', air.humidityRatio, 'none', 'kg/kg'), wv('eps_w', WATER_TO_AIR_MOLAR_MASS, 'ratio')],
      wv('R', air.gasConstant, 'none', R_UNIT),
      HUMID_SOURCE,
    ),
    step(
      'humid-cp',
      'Specific heat of the humid charge',
      'Dry air and water vapour each carry their own heat, by mass.',
      '(c_pa + W * c_pw) / (1 + W)',
      [wv('c_pa', AIR_CP, 'none', R_UNIT), wv('W', air.humidityRatio, 'none', 'kg/kg'), wv('c_pw', WATER_VAPOUR_CP, 'none', R_UNIT)],
      wv('c_p', air.cp, 'none', R_UNIT),
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

/** A loss at this point: given (the same at every flow), or scaled from its reference flow and density. */
function lossStep(
  id: string,
  title: string,
  where: string,
  loss: PressureLossInput,
  value: number,
  flow: number,
  density: { symbol: string; value: number; words: string },
  symbol: string,
): WorkingStep {
  if (loss.referenceMassFlow === undefined) {
    return step(
      id,
      title,
      `${where} Given as the same loss at every flow (state the engine flow it was measured at to have it follow the flow).`,
      `${symbol}_ref`,
      [wv(`${symbol}_ref`, loss.pressureLoss, 'pressure')],
      wv(symbol, value, 'pressure'),
      SOURCES.given,
    );
  }
  const rhoRef = loss.referenceDensity ?? LOSS_REFERENCE_DENSITY;
  return step(
    id,
    `${title} at this flow`,
    `${where} The loss stated at an engine air flow of ${fmt(loss.referenceMassFlow)} kg/s and ${fmt(rhoRef)} kg/m³${loss.referenceDensity === undefined ? ' (standard sea-level air, as none was stated)' : ''}, scaled with the square of the flow over the density (${density.words}).`,
    `${symbol}_ref * (m_dot_air / m_dot_ref) ^ 2 * rho_ref / ${density.symbol}`,
    [
      wv(`${symbol}_ref`, loss.pressureLoss, 'pressure'),
      wv('m_dot_air', flow, 'massFlow'),
      wv('m_dot_ref', loss.referenceMassFlow, 'massFlow'),
      wv('rho_ref', rhoRef, 'density'),
      wv(density.symbol, density.value, 'density'),
    ],
    wv(symbol, value, 'pressure'),
    LOSS_SOURCE,
  );
}

function ambientSteps(ctx: LineContext): WorkingStep[] {
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
          wv('R', AIR_GAS_CONSTANT, 'none', R_UNIT),
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

function lookupStep(id: string, title: string, table: RpmTable | null, rpm: number, symbol: string, given: number, kind: WorkingKind): WorkingStep {
  if (!table) {
    return step(id, title, 'Given for this point.', symbol, [wv(symbol, given, kind)], wv(symbol, given, kind), SOURCES.given);
  }
  const l = lookupByRpm(table, rpm);
  if (l.lower === l.upper) {
    const why =
      l.held === 'below'
        ? `${fmt(rpm)} rpm is below the table's first row (${fmt(l.lower.rpm)} rpm), so its value is held flat.`
        : l.held === 'above'
          ? `${fmt(rpm)} rpm is above the table's last row (${fmt(l.lower.rpm)} rpm), so its value is held flat.`
          : `The table has a row at ${fmt(rpm)} rpm.`;
    return step(id, title, why, 'y_0', [wv('y_0', l.lower.value, kind), wv('N_0', l.lower.rpm, 'speed')], wv(symbol, l.value, kind), SOURCES.interpolation);
  }
  return step(
    id,
    title,
    `Read between the table rows at ${fmt(l.lower.rpm)} and ${fmt(l.upper.rpm)} rpm, on a straight line.`,
    'y_0 + (y_1 - y_0) * (N - N_0) / (N_1 - N_0)',
    [wv('y_0', l.lower.value, kind), wv('y_1', l.upper.value, kind), wv('N', rpm, 'speed'), wv('N_0', l.lower.rpm, 'speed'), wv('N_1', l.upper.rpm, 'speed')],
    wv(symbol, l.value, kind),
    SOURCES.interpolation,
  );
}

function mapSteps(ctx: LineContext, v: PointValues): WorkingStep[] {
  const steps: WorkingStep[] = [];
  const basis = v.marginBasis;
  if (v.shaftSpeed !== null) {
    const where = SPEED_BASIS_WORDS[basis?.speed ?? 'speed-lines'] ?? SPEED_BASIS_WORDS['speed-lines'];
    steps.push(
      step(
        'shaft-speed',
        basis?.speed === 'above-top-speed-line' || basis?.speed === 'surge-edge'
          ? "Shaft speed, extrapolated along the map's edge"
          : 'Shaft speed from the map',
        `${where} Like corrected flow, the speed is referred to the map's reference temperature, so the wheel's real speed is N_c·√(T1/T_ref): faster on a hot day.`,
        'N_c * sqrt(T_1 / T_ref)',
        [
          wv('N_c', v.correctedShaftSpeed ?? v.shaftSpeed, 'speed'),
          wv('T_1', v.compressorInletTemperature, 'temperature'),
          wv('T_ref', ctx.reference.temperature, 'temperature'),
        ],
        wv('N_tc', v.shaftSpeed, 'speed'),
        basis?.speed === 'above-top-speed-line' || basis?.speed === 'surge-edge' ? `${SOURCES.map}; ${SOURCES.similarity}` : SOURCES.map,
      ),
    );
  }
  if (v.surgeMargin !== null) {
    const surgeFlow = v.correctedMassFlow * (1 - v.surgeMargin);
    steps.push(
      step(
        'surge-margin',
        'Surge margin',
        'How far the point sits to the right of the surge line at the same pressure ratio, as a share of its corrected flow. Negative means left of surge.',
        '(m_dot_c - m_dot_c_surge) / m_dot_c',
        [wv('m_dot_c', v.correctedMassFlow, 'massFlow'), wv('m_dot_c_surge', surgeFlow, 'massFlow')],
        wv('SM', v.surgeMargin, 'fraction'),
        `${SOURCES.definition}; ${SOURCES.map}`,
      ),
    );
  }
  if (v.chokeMargin !== null) {
    const chokeFlow = v.correctedMassFlow * (1 + v.chokeMargin);
    steps.push(
      step(
        'choke-margin',
        'Choke margin',
        basis?.choke === 'top-speed-line'
          ? "How much more corrected flow the compressor could pass at the same pressure ratio, as a share of the point's flow. Above the choke line's top the map's right edge is the top speed line, where it comes down to this pressure ratio on its choke side: the flow is measured to it. Negative means past choke."
          : "How much more corrected flow the compressor could pass at the same pressure ratio before choking, as a share of the point's flow. Negative means past choke.",
        '(m_dot_c_choke - m_dot_c) / m_dot_c',
        [wv('m_dot_c', v.correctedMassFlow, 'massFlow'), wv('m_dot_c_choke', chokeFlow, 'massFlow')],
        wv('CM', v.chokeMargin, 'fraction'),
        `${SOURCES.definition}; ${SOURCES.map}`,
      ),
    );
  }
  if (v.speedMargin !== null) {
    if (v.shaftSpeed !== null && v.maxShaftSpeed !== null) {
      steps.push(
        step(
          'speed-margin',
          'Speed margin',
          `Headroom below the shaft speed limit (${ctx.plan.maxShaftSpeed !== undefined ? "the lower of the Plan's and the map's" : "the map's"}).`,
          '(N_max - N_tc) / N_max',
          [wv('N_max', v.maxShaftSpeed, 'speed'), wv('N_tc', v.shaftSpeed, 'speed')],
          wv('SpM', v.speedMargin, 'fraction'),
          `${SOURCES.definition}; ${SOURCES.map}`,
        ),
      );
    } else {
      steps.push(
        step(
          'speed-margin',
          'Speed margin',
          'As the map reports it.',
          'SpM',
          [wv('SpM', v.speedMargin, 'fraction')],
          wv('SpM', v.speedMargin, 'fraction'),
          SOURCES.map,
        ),
      );
    }
  }
  const region = regionStep(v);
  if (region) steps.push(region);
  return steps;
}

const SPEED_BASIS_WORDS: Partial<Record<string, string>> = {
  'speed-lines': 'The speed lines give the corrected speed N_c at this corrected flow and pressure ratio.',
  'above-top-speed-line':
    'The point is above the top speed line, so the map has no speed for it: N_c is extrapolated up from the top line at the same flow, taking the isentropic head PR^((γ−1)/γ) − 1 to rise with the square of the tip speed (similar operation). An estimate, not a map reading.',
  'surge-edge':
    "The point is left of the surge line: N_c is the speed along the surge line at this pressure ratio, between the speed lines' first points (the isentropic head taken to rise with the square of the tip speed). An estimate, not a map reading.",
};

/** Where the point sits on the map, what that means for its results, and why any margin is missing. */
function regionStep(v: PointValues): WorkingStep | null {
  const region = v.mapRegion;
  if (!region) return null;
  const missing: string[] = [];
  for (const margin of ['surge', 'choke', 'speed'] as const) {
    const why = missingMarginWords(v, margin);
    if (why) missing.push(`no ${margin} margin: ${why}`);
  }
  const meaning =
    v.reachable === false
      ? 'The compressor cannot deliver this point: it is not reachable with this compressor, so its efficiency, outlet temperature, power, torque, fuel and exhaust side are not given.'
      : v.offMapAssumed
        ? "The map does not reach this point; it is computed on the Plan's off-map efficiency assumption, as the findings say."
        : region === 'below-map'
          ? 'A light load: the compressor meets it turning slower than its lowest speed line.'
          : 'The compressor can deliver this point.';
  return step(
    'map-region',
    'Where the point sits on the map',
    `The point is ${MAP_REGION_WORDS[region]}. ${meaning}${missing.length > 0 ? ` ${missing.map((m) => m[0].toUpperCase() + m.slice(1)).join('. ')}.` : ''}`,
    'm_dot_c',
    [wv('m_dot_c', v.correctedMassFlow, 'massFlow')],
    wv('m_dot_c', v.correctedMassFlow, 'massFlow'),
    SOURCES.map,
  );
}

/** The efficiency a point was computed with, or, where it is not reachable, the one that placed it. */
function efficiencyOf(v: PointValues): number {
  return v.compressorEfficiency ?? v.placementEfficiency ?? Number.NaN;
}

/** Compressor outlet temperature of a point, or, where it is not reachable, the estimate that placed it, K. */
function outletTemperatureOf(v: PointValues): number {
  return v.compressorOutletTemperature ?? v.compressorInletTemperature + (v.isentropicOutletTemperature - v.compressorInletTemperature) / efficiencyOf(v);
}

function efficiencyStep(ctx: LineContext, v: PointValues): WorkingStep {
  const eta = efficiencyOf(v);
  if (v.compressorEfficiency === null) {
    return step(
      'compressor-efficiency',
      'Efficiency used to place the point',
      `The compressor cannot deliver this point, and the map gives no efficiency there. To place the point on the map the Plan's ${pct(eta)} is used; nothing that would follow from running there is given.`,
      'eta_place',
      [wv('eta_place', eta, 'fraction')],
      wv('eta_place', eta, 'fraction'),
      SOURCES.assumption,
    );
  }
  if (v.efficiencySource === 'off-map-assumption') {
    return step(
      'compressor-efficiency',
      'Compressor efficiency: the off-map assumption',
      `The map does not reach this point. The Plan states an explicit off-map efficiency of ${pct(eta)}, and the point is computed on it (the findings name it).`,
      'eta_off_map',
      [wv('eta_off_map', eta, 'fraction')],
      wv('eta_c', eta, 'fraction'),
      SOURCES.assumption,
    );
  }
  if (v.efficiencySource === 'map') {
    return step(
      'compressor-efficiency',
      'Compressor efficiency from the map',
      `Read from the map at corrected flow ${fmt(v.correctedMassFlow)} kg/s and pressure ratio ${fmt(v.pressureRatio)}.`,
      'eta_map',
      [wv('eta_map', eta, 'fraction')],
      wv('eta_c', eta, 'fraction'),
      SOURCES.map,
    );
  }
  const why =
    v.efficiencySource === 'point'
      ? 'Given for this point.'
      : ctx.hasMap
        ? "The map has no efficiency at this point, so the Plan's stated efficiency is used (see the findings)."
        : "No compressor map is attached, so the Plan's stated efficiency is used.";
  return step(
    'compressor-efficiency',
    'Compressor efficiency',
    why,
    'eta_stated',
    [wv('eta_stated', eta, 'fraction')],
    wv('eta_c', eta, 'fraction'),
    v.efficiencySource === 'point' ? SOURCES.given : SOURCES.assumption,
  );
}

function compressorTemperatureStep(v: PointValues): WorkingStep {
  const placing = v.compressorOutletTemperature === null;
  return step(
    'outlet-temperature',
    placing ? 'Outlet temperature used to place the point' : 'Compressor outlet temperature',
    placing
      ? 'Only to place the point on the map (through the intercooler and the manifold density): the compressor cannot deliver the point, so this is no result.'
      : 'A real compressor heats the air more than an ideal one: the ideal rise is divided by the efficiency.',
    `T_1 + (T_2s - T_1) / ${placing ? 'eta_place' : 'eta_c'}`,
    [
      wv('T_1', v.compressorInletTemperature, 'temperature'),
      wv('T_2s', v.isentropicOutletTemperature, 'temperature'),
      wv(placing ? 'eta_place' : 'eta_c', efficiencyOf(v), 'fraction'),
    ],
    wv('T_2', outletTemperatureOf(v), 'temperature'),
    SOURCES.compressorThermo,
  );
}

function manifoldTemperatureStep(ctx: LineContext, v: PointValues, fixedGiven: boolean): WorkingStep {
  const ic = ctx.intercooler;
  if (fixedGiven || ic.kind === 'fixed') {
    return step(
      'manifold-temperature',
      'Manifold temperature',
      'Given: the temperature the charge reaches the manifold at.',
      'T_man',
      [wv('T_man', v.manifoldTemperature, 'temperature')],
      wv('T_man', v.manifoldTemperature, 'temperature'),
      SOURCES.given,
    );
  }
  const coolant = ic.coolantTemperature ?? v.ambientTemperature;
  const iterationNote =
    ctx.hasMap && v.efficiencySource === 'map'
      ? ` The efficiency depends on where the flow lands on the map, and the flow on this temperature, so the two were solved together: ${v.iterations} pass${v.iterations === 1 ? '' : 'es'}${v.converged ? '' : ', not settled'}.`
      : '';
  return step(
    'manifold-temperature',
    'Manifold temperature after the intercooler',
    `The intercooler removes the share ε of the difference between the hot charge and its coolant (${ic.coolantTemperature === undefined ? 'ambient air' : 'the stated coolant'}).${iterationNote}`,
    'T_2 - eps * (T_2 - T_cool)',
    [wv('T_2', outletTemperatureOf(v), 'temperature'), wv('eps', ic.effectiveness, 'fraction'), wv('T_cool', coolant, 'temperature')],
    wv('T_man', v.manifoldTemperature, 'temperature'),
    SOURCES.intercooler,
  );
}

function airflowSteps(ctx: LineContext, v: PointValues): WorkingStep[] {
  const nR = revolutionsPerCycle(ctx.engine.strokes);
  const steps: WorkingStep[] = [
    step(
      'manifold-density',
      'Air density in the manifold',
      `Ideal gas: density is pressure over R times absolute temperature (R of ${chargeWords(ctx)}).`,
      'p_man / (R * T_man)',
      [wv('p_man', v.manifoldPressure, 'pressure'), wv('R', ctx.air.gasConstant, 'none', R_UNIT), wv('T_man', v.manifoldTemperature, 'temperature')],
      wv('rho_man', v.airDensity, 'density'),
      idealGasSource(ctx),
    ),
    step(
      'engine-airflow',
      'Engine air mass flow',
      `Each cycle the cylinders fill their swept volume to VE times the manifold density; a ${ctx.engine.strokes}-stroke engine completes a cycle every ${nR} revolution${nR === 1 ? '' : 's'}.`,
      'VE * rho_man * V_d * N / (60 * n_R)',
      [
        wv('VE', v.volumetricEfficiency, 'fraction'),
        wv('rho_man', v.airDensity, 'density'),
        wv('V_d', ctx.engine.displacement, 'volume'),
        wv('N', v.rpm, 'speed'),
        wv('n_R', nR, 'count'),
      ],
      wv('m_dot_air', v.engineMassFlow, 'massFlow'),
      SOURCES.heywoodAirflow,
    ),
    step(
      'turbocharger-share',
      'Air mass flow per turbocharger',
      ctx.plan.turbochargers === 1 ? 'One turbocharger takes all the air.' : `${ctx.plan.turbochargers} turbochargers in parallel share the air equally.`,
      'm_dot_air / n_tc',
      [wv('m_dot_air', v.engineMassFlow, 'massFlow'), wv('n_tc', ctx.plan.turbochargers, 'count')],
      wv('m_dot', v.massFlow, 'massFlow'),
      SOURCES.definition,
    ),
    step(
      'inlet-density',
      'Air density at the compressor inlet',
      `Ideal gas at the compressor inlet (${chargeWords(ctx)}).`,
      'p_1 / (R * T_1)',
      [wv('p_1', v.compressorInletPressure, 'pressure'), wv('R', ctx.air.gasConstant, 'none', R_UNIT), wv('T_1', v.compressorInletTemperature, 'temperature')],
      wv('rho_1', v.inletDensity, 'density'),
      idealGasSource(ctx),
    ),
    step(
      'inlet-volume-flow',
      'Volume flow at the compressor inlet',
      'For maps drawn in volume flow: mass flow over inlet density.',
      'm_dot / rho_1',
      [wv('m_dot', v.massFlow, 'massFlow'), wv('rho_1', v.inletDensity, 'density')],
      wv('Q_1', v.inletVolumeFlow, 'volumeFlow'),
      SOURCES.definition,
    ),
    step(
      'corrected-flow',
      'Corrected mass flow',
      `The flow the compressor would pass at the map's reference conditions (${kelvin(ctx.reference.temperature)}, ${fmt(ctx.reference.pressure / 1000)} kPa; ${ctx.referenceFrom === 'map' ? "the map's own" : ctx.referenceFrom === 'plan' ? 'stated in the Plan' : 'ISA sea level, as no map is attached'}) for the same place on the map.`,
      'm_dot * sqrt(T_1 / T_ref) / (p_1 / p_ref)',
      [
        wv('m_dot', v.massFlow, 'massFlow'),
        wv('T_1', v.compressorInletTemperature, 'temperature'),
        wv('T_ref', ctx.reference.temperature, 'temperature'),
        wv('p_1', v.compressorInletPressure, 'pressure'),
        wv('p_ref', ctx.reference.pressure, 'pressure'),
      ],
      wv('m_dot_c', v.correctedMassFlow, 'massFlow'),
      SOURCES.correctedFlow,
    ),
  ];
  return steps;
}

function fuelSteps(ctx: LineContext, v: PointValues): WorkingStep[] {
  if (!ctx.fuel || v.fuelMassFlow === null || v.lambda === null) return [];
  const steps: WorkingStep[] = [];
  const p = ctx.fuel.properties;
  const choice = ctx.fuel.choice;
  if (choice.kind === 'ethanol-blend') {
    const x = choice.ethanolPercent / 100;
    const w = (x * ETHANOL.density) / (x * ETHANOL.density + (1 - x) * PETROL.density);
    steps.push(
      step(
        'ethanol-mass-fraction',
        'Ethanol share by mass',
        `E${fmt(choice.ethanolPercent, 3)} is ${pct(x)} ethanol by volume; ethanol is denser than petrol, so its share by mass is a little higher.`,
        'x_E * rho_E / (x_E * rho_E + (1 - x_E) * rho_P)',
        [wv('x_E', x, 'fraction'), wv('rho_E', ETHANOL.density, 'density'), wv('rho_P', PETROL.density, 'density')],
        wv('w_E', w, 'fraction'),
        SOURCES.blend,
      ),
      step(
        'stoichiometric-afr',
        'Stoichiometric air-fuel ratio of the blend',
        'Air needed per kg of fuel adds up by mass.',
        'w_E * AFR_E + (1 - w_E) * AFR_P',
        [wv('w_E', w, 'fraction'), wv('AFR_E', ETHANOL.stoichiometricAfr, 'ratio'), wv('AFR_P', PETROL.stoichiometricAfr, 'ratio')],
        wv('AFR_s', p.stoichiometricAfr, 'ratio'),
        `${SOURCES.blend}; ${SOURCES.fuelProperties}`,
      ),
      step(
        'lower-heating-value',
        'Lower heating value of the blend',
        'Energy per kg of fuel adds up by mass.',
        'w_E * LHV_E + (1 - w_E) * LHV_P',
        [wv('w_E', w, 'fraction'), wv('LHV_E', ETHANOL.lowerHeatingValue, 'energyPerMass'), wv('LHV_P', PETROL.lowerHeatingValue, 'energyPerMass')],
        wv('LHV', p.lowerHeatingValue, 'energyPerMass'),
        `${SOURCES.blend}; ${SOURCES.fuelProperties}`,
      ),
      step(
        'fuel-density',
        'Density of the blend',
        'Volumes add up (the small shrink on mixing is ignored).',
        'x_E * rho_E + (1 - x_E) * rho_P',
        [wv('x_E', x, 'fraction'), wv('rho_E', ETHANOL.density, 'density'), wv('rho_P', PETROL.density, 'density')],
        wv('rho_f', p.density, 'density'),
        SOURCES.blend,
      ),
    );
  } else {
    const name = choice.kind === 'petrol' ? 'petrol' : 'methanol';
    steps.push(
      step(
        'stoichiometric-afr',
        `Stoichiometric air-fuel ratio of ${name}`,
        'Mass of air that burns one kg of the fuel completely.',
        'AFR_s',
        [wv('AFR_s', p.stoichiometricAfr, 'ratio')],
        wv('AFR_s', p.stoichiometricAfr, 'ratio'),
        SOURCES.fuelProperties,
      ),
      step(
        'lower-heating-value',
        `Lower heating value of ${name}`,
        'Heat released per kg of fuel, water leaving as vapour.',
        'LHV',
        [wv('LHV', p.lowerHeatingValue, 'energyPerMass')],
        wv('LHV', p.lowerHeatingValue, 'energyPerMass'),
        SOURCES.fuelProperties,
      ),
      step(
        'fuel-density',
        `Density of ${name}`,
        choice.kind === 'petrol' ? 'The middle of the 720–780 kg/m³ range.' : 'Liquid density near room temperature.',
        'rho_f',
        [wv('rho_f', p.density, 'density')],
        wv('rho_f', p.density, 'density'),
        SOURCES.fuelProperties,
      ),
    );
  }
  // Fuel and power follow the dry air the cylinders trap: the engine's air flow itself for dry air and a four-stroke.
  const humid = ctx.air.humidityRatio > 0;
  const trapping = ctx.engine.trappingEfficiency;
  const burnSymbol = humid || trapping < 1 ? 'm_dot_tr' : 'm_dot_air';
  const burnAir = v.trappedAirMassFlow ?? v.engineMassFlow;
  const dryAir = v.dryAirMassFlow ?? v.engineMassFlow;
  if (humid) {
    steps.push(
      step(
        'dry-air-flow',
        "Dry air in the engine's air flow",
        'The water in humid air burns no fuel: fuel and power follow the dry air alone.',
        'm_dot_air / (1 + W)',
        [wv('m_dot_air', v.engineMassFlow, 'massFlow'), wv('W', ctx.air.humidityRatio, 'none', 'kg/kg')],
        wv(trapping < 1 ? 'm_dot_da' : 'm_dot_tr', dryAir, 'massFlow'),
        HUMID_SOURCE,
      ),
    );
  }
  if (trapping < 1) {
    steps.push(
      step(
        'trapped-air',
        'Air the cylinders trap',
        `A two-stroke scavenges with fresh charge: of the air delivered, the share ${pct(trapping)} stays in the cylinder when the ports close and the rest short-circuits to the exhaust. Fuel and power follow the trapped air; the compressor still passes all of it (charging efficiency = delivery ratio × trapping efficiency).`,
        `${humid ? 'm_dot_da' : 'm_dot_air'} * eta_tr`,
        [wv(humid ? 'm_dot_da' : 'm_dot_air', dryAir, 'massFlow'), wv('eta_tr', trapping, 'fraction')],
        wv('m_dot_tr', burnAir, 'massFlow'),
        "Heywood, Internal Combustion Engine Fundamentals (1988), §6.6 (trapping efficiency); the trapping efficiency is the Study's",
      ),
    );
  }
  steps.push(
    step(
      'fuel-mass-flow',
      'Fuel mass flow',
      `Lambda is the air-fuel ratio over the stoichiometric one; below 1 the mixture is rich.${burnSymbol === 'm_dot_tr' ? ' The air is the dry air the cylinders trap.' : ''}`,
      `${burnSymbol} / (lambda * AFR_s)`,
      [wv(burnSymbol, burnAir, 'massFlow'), wv('lambda', v.lambda, 'ratio'), wv('AFR_s', p.stoichiometricAfr, 'ratio')],
      wv('m_dot_f', v.fuelMassFlow, 'massFlow'),
      SOURCES.definition,
    ),
    step(
      'fuel-volume-flow',
      'Fuel volume flow',
      'Mass flow over the fuel density.',
      'm_dot_f / rho_f',
      [wv('m_dot_f', v.fuelMassFlow, 'massFlow'), wv('rho_f', p.density, 'density')],
      wv('Q_f', v.fuelVolumeFlow!, 'volumeFlow'),
      SOURCES.definition,
    ),
  );
  if (ctx.power && v.brakePower !== null) {
    if (ctx.power.basis === 'bsfc' && ctx.power.bsfc !== null) {
      steps.push(
        step(
          'brake-thermal-efficiency',
          'Brake thermal efficiency from the BSFC',
          'The stated BSFC is referred to the fuel that burns, so it fixes the share of the fuel energy that reaches the crank.',
          '1 / (bsfc * LHV)',
          [wv('bsfc', ctx.power.bsfc, 'none', 'kg/J'), wv('LHV', p.lowerHeatingValue, 'energyPerMass')],
          wv('eta_b', ctx.power.brakeThermalEfficiency, 'fraction'),
          SOURCES.definition,
        ),
      );
    }
    steps.push(
      v.powerLimitedBy === 'fuel'
        ? step(
            'brake-power',
            'Brake power from the fuel (lean)',
            'The mixture is lean (lambda above 1): all the fuel finds air and burns, and the excess air only dilutes the charge, so the fuel sets the power: η_b·LHV·min(m_dot_f, m_dot_air/AFR_s) takes the fuel.',
            'eta_b * m_dot_f * LHV',
            [
              wv('eta_b', ctx.power.brakeThermalEfficiency, 'fraction'),
              wv('m_dot_f', v.fuelMassFlow, 'massFlow'),
              wv('LHV', p.lowerHeatingValue, 'energyPerMass'),
            ],
            wv('P_b', v.brakePower, 'power'),
            SOURCES.power,
          )
        : step(
            'brake-power',
            'Brake power from the air',
            `The mixture is rich or stoichiometric (lambda at or below 1), so the air sets the power: only the fuel it can burn, ${burnSymbol}/AFR_s, releases its heat; the extra fuel does not. η_b·LHV·min(m_dot_f, ${burnSymbol}/AFR_s) takes the air.`,
            `eta_b * ${burnSymbol} * LHV / AFR_s`,
            [
              wv('eta_b', ctx.power.brakeThermalEfficiency, 'fraction'),
              wv(burnSymbol, burnAir, 'massFlow'),
              wv('LHV', p.lowerHeatingValue, 'energyPerMass'),
              wv('AFR_s', p.stoichiometricAfr, 'ratio'),
            ],
            wv('P_b', v.brakePower, 'power'),
            SOURCES.power,
          ),
      step(
        'torque',
        'Brake torque',
        'Power over crank angular speed.',
        'P_b / (2 * pi * N / 60)',
        [wv('P_b', v.brakePower, 'power'), wv('N', v.rpm, 'speed')],
        wv('T_q', v.torque!, 'torque'),
        SOURCES.definition,
      ),
    );
    if (v.wheelPower !== null && ctx.power.drivetrainLoss !== null) {
      steps.push(
        step(
          'wheel-power',
          'Wheel power',
          'Brake power less the share the drivetrain loses.',
          'P_b * (1 - loss_dt)',
          [wv('P_b', v.brakePower, 'power'), wv('loss_dt', ctx.power.drivetrainLoss, 'fraction')],
          wv('P_w', v.wheelPower, 'power'),
          SOURCES.assumption,
        ),
      );
    }
    if (v.apparentBsfc !== null) {
      steps.push(
        step(
          'apparent-bsfc',
          'Fuel injected per brake power',
          'The BSFC a dyno would measure: all the fuel injected, rich share included, over brake power.',
          'm_dot_f / P_b',
          [wv('m_dot_f', v.fuelMassFlow, 'massFlow'), wv('P_b', v.brakePower, 'power')],
          wv('bsfc_inj', v.apparentBsfc, 'none', 'kg/J'),
          SOURCES.definition,
        ),
      );
    }
  }
  steps.push(...injectorSteps(ctx, v));
  return steps;
}

function injectorSteps(ctx: LineContext, v: PointValues): WorkingStep[] {
  const inj = ctx.injectors;
  if (!inj || v.injectorPressureDifference === null || v.fuelVolumeFlow === null) return [];
  const dp = v.injectorPressureDifference;
  const steps: WorkingStep[] = [
    inj.regulator === 'manifold-referenced'
      ? step(
          'injector-pressure-difference',
          'Pressure across the injectors',
          'A 1:1 regulator raises the rail with the manifold, so the difference stays the base fuel pressure.',
          'p_fuel',
          [wv('p_fuel', inj.fuelPressure, 'pressure')],
          wv('dP_inj', dp, 'pressure'),
          SOURCES.definition,
        )
      : step(
          'injector-pressure-difference',
          'Pressure across the injectors',
          'The rail is held at a fixed pressure above the atmosphere, so boost eats into the difference.',
          'p_amb + p_fuel - p_man',
          [wv('p_amb', v.ambientPressure, 'pressure'), wv('p_fuel', inj.fuelPressure, 'pressure'), wv('p_man', v.manifoldPressure, 'pressure')],
          wv('dP_inj', dp, 'pressure'),
          SOURCES.definition,
        ),
    step(
      'rail-pressure',
      'Rail pressure the pump must hold',
      inj.regulator === 'manifold-referenced' ? 'Base pressure plus boost (gauge).' : 'The fixed rail pressure (gauge).',
      inj.regulator === 'manifold-referenced' ? 'p_fuel + boost' : 'p_fuel',
      inj.regulator === 'manifold-referenced'
        ? [wv('p_fuel', inj.fuelPressure, 'pressure'), wv('boost', v.boost, 'pressure')]
        : [wv('p_fuel', inj.fuelPressure, 'pressure')],
      wv('p_rail', v.railPressure!, 'pressure'),
      SOURCES.definition,
    ),
  ];
  if (dp <= 0 || v.injectorDuty === null || v.injectorCapacity === null) return steps;
  const both = v.injectorStage === 'both' && inj.secondary !== undefined;
  const sets = both
    ? ([
        ['p', inj.primary],
        ['s', inj.secondary!],
      ] as const)
    : ([['p', inj.primary]] as const);
  const fuelDensity = v.fuelDensity ?? undefined;
  const oneInjector = (set: typeof inj.primary) => scaleInjectorFlow(set.ratedFlow, set.ratedPressure, dp) * ratingFluidFactor(set, fuelDensity);
  for (const [tag, set] of sets) {
    const rated = set.ratingFluidDensity !== undefined && fuelDensity !== undefined;
    steps.push(
      step(
        `injector-flow-${tag === 'p' ? 'primary' : 'secondary'}`,
        `Flow of one ${tag === 'p' ? 'primary' : 'secondary'} injector`,
        rated
          ? `An injector is an orifice: its flow goes with the square root of the pressure across it, and, at one pressure, with the square root of the rating fluid's density over the fuel's (rated with a ${fmt(set.ratingFluidDensity!)} kg/m³ fluid).`
          : 'An injector is an orifice: its flow goes with the square root of the pressure across it (rated with the fuel itself, as no rating fluid is named).',
        rated ? 'Q_rated * sqrt(dP_inj / dP_rated) * sqrt(rho_rating / rho_f)' : 'Q_rated * sqrt(dP_inj / dP_rated)',
        [
          wv('Q_rated', set.ratedFlow, 'volumeFlow'),
          wv('dP_inj', dp, 'pressure'),
          wv('dP_rated', set.ratedPressure, 'pressure'),
          ...(rated ? [wv('rho_rating', set.ratingFluidDensity!, 'density'), wv('rho_f', fuelDensity!, 'density')] : []),
        ],
        wv(`Q_inj_${tag}`, oneInjector(set), 'volumeFlow'),
        SOURCES.injector,
      ),
    );
  }
  const qp = oneInjector(inj.primary);
  steps.push(
    both
      ? step(
          'injector-capacity',
          'Flow of all open injectors',
          `Above ${fmt(inj.secondary!.switchOverRpm)} rpm the secondaries open too; both sets share the fuel in proportion to their flow, so all run at one duty.`,
          'n_p * Q_inj_p + n_s * Q_inj_s',
          [
            wv('n_p', inj.primary.count, 'count'),
            wv('Q_inj_p', qp, 'volumeFlow'),
            wv('n_s', inj.secondary!.count, 'count'),
            wv('Q_inj_s', oneInjector(inj.secondary!), 'volumeFlow'),
          ],
          wv('Q_avail', v.injectorCapacity, 'volumeFlow'),
          SOURCES.definition,
        )
      : step(
          'injector-capacity',
          'Flow of all open injectors',
          inj.secondary ? `Below ${fmt(inj.secondary.switchOverRpm)} rpm only the primaries inject.` : 'All injectors open together.',
          'n_p * Q_inj_p',
          [wv('n_p', inj.primary.count, 'count'), wv('Q_inj_p', qp, 'volumeFlow')],
          wv('Q_avail', v.injectorCapacity, 'volumeFlow'),
          SOURCES.definition,
        ),
  );
  const deadSets = (both ? [inj.primary, inj.secondary!] : [inj.primary]).filter((s) => s.deadTime !== undefined && s.deadTime.time > 0);
  if (deadSets.length === 0) {
    steps.push(
      step(
        'injector-duty',
        'Injector duty cycle',
        'The share of the time the injectors must be open: fuel needed over what they pass when open all the time (no dead time given). Common practice keeps it at or under 80–85 %.',
        'Q_f / Q_avail',
        [wv('Q_f', v.fuelVolumeFlow, 'volumeFlow'), wv('Q_avail', v.injectorCapacity, 'volumeFlow')],
        wv('duty', v.injectorDuty, 'fraction'),
        `${SOURCES.definition}; limits: ${SOURCES.commonPractice}`,
      ),
    );
  } else {
    const worst = deadSets.reduce((a, b) => (b.deadTime!.time > a.deadTime!.time ? b : a));
    const nR = revolutionsPerCycle(ctx.engine.strokes);
    const period = injectionPeriod(v.rpm, nR);
    steps.push(
      step(
        'injection-period',
        'Time between injections',
        `Each injector fires once per working cycle (sequential injection), and a ${ctx.engine.strokes}-stroke completes a cycle every ${nR} revolution${nR === 1 ? '' : 's'}.`,
        '60 * n_R / N',
        [wv('n_R', nR, 'count'), wv('N', v.rpm, 'speed')],
        wv('t_inj', period, 'none', 's'),
        SOURCES.heywoodAirflow,
      ),
      step(
        'injector-duty',
        'Injector duty cycle with the dead time',
        `The fuel needs the injectors open for its share of the time, and every opening loses the dead time (${fmt(worst.deadTime!.time * 1000, 3)} ms at ${fmt(worst.deadTime!.voltage, 3)} V${deadSets.length > 1 || both ? ', the longer of the open sets' : ''}; longer at a lower battery voltage). Common practice keeps it at or under 80–85 %.`,
        'Q_f / Q_avail + t_dead / t_inj',
        [
          wv('Q_f', v.fuelVolumeFlow, 'volumeFlow'),
          wv('Q_avail', v.injectorCapacity, 'volumeFlow'),
          wv('t_dead', worst.deadTime!.time, 'none', 's'),
          wv('t_inj', period, 'none', 's'),
        ],
        wv('duty', v.injectorDuty, 'fraction'),
        `${SOURCES.definition}; dead time: the injector maker's data (${SOURCES.given.toLowerCase()}); limits: ${SOURCES.commonPractice}`,
      ),
    );
  }
  if (ctx.pumpFlowAvailable !== null) {
    steps.push(
      step(
        'pump-share',
        "Share of the pump's flow",
        "The pump must deliver the engine's fuel flow at the rail pressure.",
        'Q_f / Q_pump',
        [wv('Q_f', v.fuelVolumeFlow, 'volumeFlow'), wv('Q_pump', ctx.pumpFlowAvailable, 'volumeFlow')],
        wv('pump_share', v.fuelVolumeFlow / ctx.pumpFlowAvailable, 'fraction'),
        SOURCES.definition,
      ),
    );
  }
  return steps;
}

const allFinite = (s: WorkingStep) => Number.isFinite(s.result.value) && s.values.every((x) => Number.isFinite(x.value));

/**
 * The Working of one point, built on demand: every step from ambient to injector duty, in the
 * order a person would work it by hand. `fixedManifoldTemperature` says the manifold temperature
 * was given for the point (single points computed outside a study).
 */
export function pointWorking(ctx: LineContext, point: OperatingPoint, options: { fixedManifoldTemperature?: boolean } = {}): WorkingStep[] {
  const steps = ambientSteps(ctx);
  const rpm = point.rpm;
  const v = point.values;
  const t = ctx.tables;
  if (!v) {
    if (t.volumetricEfficiency)
      steps.push(lookupStep('volumetric-efficiency', 'Volumetric efficiency at this speed', t.volumetricEfficiency, rpm, 'VE', 0, 'fraction'));
    if (t.boost) steps.push(lookupStep('boost', 'Boost target at this speed', t.boost, rpm, 'boost', 0, 'pressure'));
    return steps.filter(allFinite);
  }
  // Where the turbine cannot hold the target, the target is shown first and the held boost after it.
  const held = heldBoostStep(ctx, v);
  steps.push(
    lookupStep('volumetric-efficiency', 'Volumetric efficiency at this speed', t.volumetricEfficiency, rpm, 'VE', v.volumetricEfficiency, 'fraction'),
    held
      ? lookupStep('boost', 'Boost target at this speed', t.boost, rpm, 'boost_target', v.boostTarget ?? v.boost, 'pressure')
      : lookupStep('boost', 'Boost target at this speed', t.boost, rpm, 'boost', v.boost, 'pressure'),
  );
  if (held) steps.push(held);
  if (v.lambda !== null) steps.push(lookupStep('lambda', 'Lambda target at this speed', t.lambda, rpm, 'lambda', v.lambda, 'ratio'));
  const inletLoss = v.inletLoss ?? ctx.losses.inlet.pressureLoss;
  const coolerLoss = v.chargeCoolerLoss ?? ctx.losses.chargeCooler.pressureLoss;
  steps.push(
    lossStep(
      'inlet-loss',
      'Filter and intake loss',
      'What the filter and intake lose before the compressor.',
      ctx.losses.inlet,
      inletLoss,
      v.engineMassFlow,
      {
        symbol: 'rho_in',
        value: v.ambientPressure / (ctx.air.gasConstant * v.compressorInletTemperature),
        words: 'of the intake air at ambient pressure and the compressor inlet temperature, p_amb/(R·T_1)',
      },
      'dp_in',
    ),
    step(
      'inlet-pressure',
      'Compressor inlet pressure',
      'Ambient pressure less what the filter and intake lose.',
      'p_amb - dp_in',
      [wv('p_amb', v.ambientPressure, 'pressure'), wv('dp_in', inletLoss, 'pressure')],
      wv('p_1', v.compressorInletPressure, 'pressure'),
      SOURCES.definition,
    ),
    step(
      'inlet-temperature',
      'Compressor inlet temperature',
      ctx.losses.inletTemperatureRise > 0 ? 'Ambient temperature plus the stated heating of the intake.' : 'The compressor breathes ambient air.',
      'T_amb + dT_in',
      [wv('T_amb', v.ambientTemperature, 'temperature'), wv('dT_in', ctx.losses.inletTemperatureRise, 'none', 'K')],
      wv('T_1', v.compressorInletTemperature, 'temperature'),
      SOURCES.definition,
    ),
    step(
      'manifold-pressure',
      'Manifold pressure',
      'Boost is gauge pressure: it adds to the ambient pressure.',
      'p_amb + boost',
      [wv('p_amb', v.ambientPressure, 'pressure'), wv('boost', v.boost, 'pressure')],
      wv('p_man', v.manifoldPressure, 'pressure'),
      SOURCES.definition,
    ),
    lossStep(
      'charge-cooler-loss',
      'Charge-cooler and pipe loss',
      'What the charge cooler and pipes lose from the compressor to the manifold.',
      ctx.losses.chargeCooler,
      coolerLoss,
      v.engineMassFlow,
      {
        symbol: 'rho_man',
        value: v.airDensity,
        words: 'of the charge in the manifold',
      },
      'dp_cc',
    ),
    v.throttled
      ? step(
          'outlet-pressure',
          'Compressor outlet pressure',
          'The manifold is below the compressor inlet pressure: the throttle after the compressor takes the drop, so the compressor is taken at its inlet pressure.',
          'max(p_man + dp_cc, p_1)',
          [wv('p_man', v.manifoldPressure, 'pressure'), wv('dp_cc', coolerLoss, 'pressure'), wv('p_1', v.compressorInletPressure, 'pressure')],
          wv('p_2', v.compressorOutletPressure, 'pressure'),
          SOURCES.definition,
        )
      : step(
          'outlet-pressure',
          'Compressor outlet pressure',
          'The compressor must also make up what the charge cooler and pipes lose on the way to the manifold.',
          'p_man + dp_cc',
          [wv('p_man', v.manifoldPressure, 'pressure'), wv('dp_cc', coolerLoss, 'pressure')],
          wv('p_2', v.compressorOutletPressure, 'pressure'),
          SOURCES.definition,
        ),
    step(
      'pressure-ratio',
      'Pressure ratio',
      'Outlet over inlet pressure, both absolute. Static pressures stand in for total pressures: the air is slow in the pipes.',
      'p_2 / p_1',
      [wv('p_2', v.compressorOutletPressure, 'pressure'), wv('p_1', v.compressorInletPressure, 'pressure')],
      wv('PR', v.pressureRatio, 'ratio'),
      SOURCES.definition,
    ),
    step(
      'isentropic-outlet-temperature',
      'Ideal (isentropic) outlet temperature',
      'The temperature a perfect compressor would reach at this pressure ratio.',
      'T_1 * PR ^ ((gamma - 1) / gamma)',
      [wv('T_1', v.compressorInletTemperature, 'temperature'), wv('PR', v.pressureRatio, 'ratio'), wv('gamma', ctx.air.gamma, 'ratio')],
      wv('T_2s', v.isentropicOutletTemperature, 'temperature'),
      SOURCES.compressorThermo,
    ),
  );
  const fixedGiven = options.fixedManifoldTemperature === true;
  const t2 = v.compressorOutletTemperature;
  const power =
    v.compressorPower === null || t2 === null
      ? []
      : [
          step(
            'compressor-power',
            'Compressor power',
            'The shaft power that heats the air from T_1 to T_2.',
            'm_dot * c_p * (T_2 - T_1)',
            [
              wv('m_dot', v.massFlow, 'massFlow'),
              wv('c_p', ctx.air.cp, 'none', R_UNIT),
              wv('T_2', t2, 'temperature'),
              wv('T_1', v.compressorInletTemperature, 'temperature'),
            ],
            wv('P_c', v.compressorPower, 'power'),
            SOURCES.compressorThermo,
          ),
        ];
  if (!fixedGiven && ctx.intercooler.kind === 'effectiveness') {
    // The manifold temperature needs T2 first (for a point that cannot be delivered, only to place it).
    steps.push(
      efficiencyStep(ctx, v),
      compressorTemperatureStep(v),
      manifoldTemperatureStep(ctx, v, fixedGiven),
      ...airflowSteps(ctx, v),
      ...mapSteps(ctx, v),
      ...power,
    );
  } else {
    // With the manifold temperature given, the point's place needs no efficiency: a point that
    // cannot be delivered shows no efficiency or outlet temperature at all.
    const compressorSteps = v.compressorEfficiency === null ? [] : [efficiencyStep(ctx, v), compressorTemperatureStep(v)];
    steps.push(manifoldTemperatureStep(ctx, v, fixedGiven), ...airflowSteps(ctx, v), ...mapSteps(ctx, v), ...compressorSteps, ...power);
  }
  steps.push(...fuelSteps(ctx, v));
  steps.push(...exhaustSteps(ctx, v));
  return steps.filter(allFinite);
}
