/** The Working of the exhaust gas: its cp, R and γ at T3 from the fuel burnt, and the loss after the turbine. */
import { exhaustGasAt } from '#shared/physics/exhaust-gas';
import { LOSS_REFERENCE_DENSITY } from '#shared/physics/losses';
import { molarHeatCapacity, UNIVERSAL_GAS_CONSTANT, type ExhaustSpecies } from '#shared/physics/thermo-polynomials';
import { TURBINE_GAS, type GasProperties } from '#shared/physics/turbine';
import type { LineContext } from '../line-context';
import type { PointValues } from '../result';
import { fmt, gammaStep, pct, SOURCES, SPECIFIC_HEAT_UNIT, step, wv, type WorkingStep } from '../working';
import { EXHAUST_SOURCES } from './sources';

/** The exhaust gas a point was solved with (the lean gas-turbine pair where no fuel was given). */
export function gasOf(v: PointValues): GasProperties {
  return typeof v.exhaustGasCp === 'number' && typeof v.exhaustGasGamma === 'number' && typeof v.exhaustGasConstant === 'number'
    ? { cp: v.exhaustGasCp, gamma: v.exhaustGasGamma, gasConstant: v.exhaustGasConstant }
    : TURBINE_GAS;
}

const SPECIES: ExhaustSpecies[] = ['N2', 'O2', 'CO2', 'H2O', 'CO', 'H2'];

/** The exhaust gas's cp, R and γ at T3, from the products of the fuel burnt (none without a fuel: the fixed pair is named instead). */
export function exhaustGasSteps(ctx: LineContext, v: PointValues, t3: number, gas: GasProperties): WorkingStep[] {
  if (!ctx.fuel || v.lambda === null || typeof v.exhaustGasCp !== 'number') {
    return [
      step(
        'exhaust-gas-cp',
        'Exhaust gas specific heat',
        "No fuel is given, so the lean pair of gas-turbine practice stands in (it understates a rich engine's turbine work).",
        'c_pe',
        [wv('c_pe', gas.cp, 'none', SPECIFIC_HEAT_UNIT)],
        wv('c_pe', gas.cp, 'none', SPECIFIC_HEAT_UNIT),
        EXHAUST_SOURCES.gasFallback,
      ),
    ];
  }
  const products = exhaustGasAt({
    fuel: ctx.fuel.choice,
    lambda: v.lambda,
    temperature: t3,
    humidityRatio: ctx.air.humidityRatio,
    trappingEfficiency: ctx.engine.trappingEfficiency,
  });
  const present = SPECIES.filter((s) => products.moleFractions[s] > 0);
  const molar = products.molarMass;
  const rich = v.lambda < 1;
  const extras = [
    ctx.air.humidityRatio > 0 ? 'the water the humid air brought' : null,
    ctx.engine.trappingEfficiency < 1 ? `the ${pct(1 - ctx.engine.trappingEfficiency)} of the delivered air that short-circuits to the exhaust` : null,
  ].filter(Boolean);
  return [
    step(
      'exhaust-gas-cp',
      'Exhaust gas specific heat at the turbine inlet',
      `The products of burning the fuel at lambda ${fmt(v.lambda, 3)}: ${rich ? 'rich, so CO and H2 remain beside CO2 and H2O, split by the water-gas shift equilibrium (K = 3.5, frozen)' : 'lean or stoichiometric, so the fuel burns completely to CO2 and H2O and the spare O2 passes through'}${extras.length ? `, with ${extras.join(' and ')}` : ''}. Each gas's molar cp at T3 from its NASA polynomial, weighted by its mole fraction, over the mixture's molar mass.`,
      `(${present.map((s) => `x_${s} * Cp_${s}`).join(' + ')}) / M_e`,
      [
        ...present.flatMap((s) => [wv(`x_${s}`, products.moleFractions[s], 'fraction'), wv(`Cp_${s}`, molarHeatCapacity(s, t3), 'none', 'J/(mol K)')]),
        wv('M_e', molar, 'none', 'kg/mol'),
      ],
      wv('c_pe', v.exhaustGasCp, 'none', SPECIFIC_HEAT_UNIT),
      EXHAUST_SOURCES.gas,
    ),
    step(
      'exhaust-gas-constant',
      'Exhaust gas constant',
      "The universal gas constant over the mixture's molar mass.",
      'R_u / M_e',
      [wv('R_u', UNIVERSAL_GAS_CONSTANT, 'none', 'J/(mol K)'), wv('M_e', molar, 'none', 'kg/mol')],
      wv('R_e', gas.gasConstant, 'none', SPECIFIC_HEAT_UNIT),
      `${SOURCES.definition} (ideal gas; R_u CODATA 2018)`,
    ),
    gammaStep(
      'exhaust-gas-gamma',
      'Exhaust gas ratio of specific heats',
      'For an ideal gas cv = cp − R, so γ = cp/(cp − R). It sets how much of the heat an expansion through ER turns into work.',
      ['c_pe', gas.cp],
      ['R_e', gas.gasConstant],
      ['gamma_e', gas.gamma],
    ),
  ];
}

/** The loss after the turbine at this point's exhaust flow. */
export function downstreamLossStep(ctx: LineContext, v: PointValues, t3: number, gas: GasProperties): WorkingStep {
  const loss = ctx.exhaust!.input.downstreamLoss;
  const dp = v.downstreamLoss ?? loss.pressureLoss;
  if (loss.referenceMassFlow === undefined) {
    return step(
      'downstream-loss',
      'Pressure loss after the turbine',
      'Given as the same loss at every flow (state the flow it was measured at to have it follow the flow).',
      'dp_ds_ref',
      [wv('dp_ds_ref', loss.pressureLoss, 'pressure')],
      wv('dp_ds', dp, 'pressure'),
      SOURCES.given,
    );
  }
  const flow = v.engineMassFlow + (v.fuelMassFlow ?? 0);
  const rhoRef = loss.referenceDensity ?? LOSS_REFERENCE_DENSITY;
  return step(
    'downstream-loss',
    'Pressure loss after the turbine at this flow',
    `The loss stated at ${fmt(loss.referenceMassFlow)} kg/s of exhaust and ${fmt(rhoRef)} kg/m³${loss.referenceDensity === undefined ? ' (standard sea-level air, as none was stated)' : ''}, scaled with the square of the engine's exhaust flow over the gas density, taken at ambient pressure and T3 (the gas's cooling through the turbine is left out).`,
    'dp_ds_ref * (m_dot_ex_eng / m_dot_ref) ^ 2 * rho_ref / (p_amb / (R_e * T_3))',
    [
      wv('dp_ds_ref', loss.pressureLoss, 'pressure'),
      wv('m_dot_ex_eng', flow, 'massFlow'),
      wv('m_dot_ref', loss.referenceMassFlow, 'massFlow'),
      wv('rho_ref', rhoRef, 'density'),
      wv('p_amb', v.ambientPressure, 'pressure'),
      wv('R_e', gas.gasConstant, 'none', SPECIFIC_HEAT_UNIT),
      wv('T_3', t3, 'temperature'),
    ],
    wv('dp_ds', dp, 'pressure'),
    EXHAUST_SOURCES.loss,
  );
}
