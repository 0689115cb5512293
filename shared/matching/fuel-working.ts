/** The Working of a point's fuel: the fuel's properties, the air that burns it and the fuel flow; then power and injectors. */
import { ETHANOL, PETROL } from '../physics';
import { HUMID_SOURCE } from './ambient-working';
import { injectorSteps } from './injector-working';
import type { LineContext } from './line-context';
import { powerSteps } from './power-working';
import type { PointValues } from './result';
import { fmt, pct, SOURCES, step, wv, type WorkingStep } from './working';

/** The fuel's stoichiometric air-fuel ratio, heating value and density: of a blend worked out from its parts. */
function fuelPropertySteps(fuel: NonNullable<LineContext['fuel']>): WorkingStep[] {
  const steps: WorkingStep[] = [];
  const p = fuel.properties;
  const choice = fuel.choice;
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
  return steps;
}

/** From the fuel's properties to the fuel flow, then the power and the injectors. */
export function fuelSteps(ctx: LineContext, v: PointValues): WorkingStep[] {
  if (!ctx.fuel || v.fuelMassFlow === null || v.lambda === null) return [];
  const p = ctx.fuel.properties;
  const steps = fuelPropertySteps(ctx.fuel);
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
  steps.push(...powerSteps(ctx, v, burnSymbol, burnAir));
  steps.push(...injectorSteps(ctx, v));
  return steps;
}
