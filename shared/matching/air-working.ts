/** The Working of the charge from the compressor to the cylinders: manifold temperature and density, the engine's air flow, corrected flow. */
import { revolutionsPerCycle } from '../physics';
import { HUMID_SOURCE } from './ambient-working';
import { outletTemperatureOf } from './compressor/working';
import type { LineContext } from './line-context';
import type { PointValues } from './result';
import { fmt, kelvin, SOURCES, SPECIFIC_HEAT_UNIT, step, wv, type WorkingStep } from './working';

/** The ideal-gas source: ISO 2533's dry-air R, or the humid charge's. */
const idealGasSource = (ctx: LineContext) => (ctx.air.humidityRatio > 0 ? `Ideal-gas law, R of the humid charge (${HUMID_SOURCE})` : SOURCES.idealGas);

/** What the air is in the Working: "humid air" when it holds water. */
const chargeWords = (ctx: LineContext) => (ctx.air.humidityRatio > 0 ? 'humid air' : 'dry air');

/** The manifold temperature: given, or after the intercooler. */
export function manifoldTemperatureStep(ctx: LineContext, v: PointValues, fixedGiven: boolean): WorkingStep {
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

/** The charge's density in the manifold, the engine's air flow, each turbocharger's share and its corrected flow. */
export function airflowSteps(ctx: LineContext, v: PointValues): WorkingStep[] {
  const nR = revolutionsPerCycle(ctx.engine.strokes);
  const steps: WorkingStep[] = [
    step(
      'manifold-density',
      'Air density in the manifold',
      `Ideal gas: density is pressure over R times absolute temperature (R of ${chargeWords(ctx)}).`,
      'p_man / (R * T_man)',
      [
        wv('p_man', v.manifoldPressure, 'pressure'),
        wv('R', ctx.air.gasConstant, 'none', SPECIFIC_HEAT_UNIT),
        wv('T_man', v.manifoldTemperature, 'temperature'),
      ],
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
      [
        wv('p_1', v.compressorInletPressure, 'pressure'),
        wv('R', ctx.air.gasConstant, 'none', SPECIFIC_HEAT_UNIT),
        wv('T_1', v.compressorInletTemperature, 'temperature'),
      ],
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
