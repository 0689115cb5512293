/**
 * The Working of a point's exhaust side, built on demand from the line's context and the point's
 * values: the same relations the solve uses (shared/matching/exhaust.ts), as mathjs expressions
 * over the symbols shown.
 */
import { exhaustGasAt } from '../physics/exhaust-gas';
import { criticalPressureRatio } from '../physics/gas';
import { LOSS_REFERENCE_DENSITY } from '../physics/losses';
import { molarHeatCapacity, UNIVERSAL_GAS_CONSTANT, type ExhaustSpecies } from '../physics/thermo-polynomials';
import { TURBINE_GAS, type GasProperties } from '../physics/turbine';
import { orificeMassFlux } from '../physics/wastegate';
import { lookupByRpm } from './rpm-table';
import type { LineContext, PointValues } from './types';
import { fmt, gammaStep, pct, SOURCES, step, wv, type WorkingStep } from './working';

/** Sources of the exhaust steps. */
export const EXHAUST_SOURCES = {
  gas: 'Products of combustion: Heywood, Internal Combustion Engine Fundamentals (1988), §4.3 (water-gas shift K = 3.5, frozen); cp from the NASA 7-coefficient polynomials (McBride, Gordon & Reno, NASA TM-4513, 1993; GRI-Mech 3.0 data)',
  gasFallback: 'Saravanamuttoo, Rogers & Cohen, Gas Turbine Theory: combustion gases γ = 1.333, cp = 1.148 kJ/(kg K) (no fuel given)',
  loss: 'Duct loss Δp ∝ ṁ²/ρ (constant loss coefficient, incompressible duct flow)',
  speed: 'Turbine map of the Plan, read between its speed lines at the shaft speed (straight line in speed)',
  turbinePower: 'NASA Glenn Research Center, compressor–turbine matching; Isermann, Combustion Engine Diagnosis (2017), eq. 5.4.17',
  swallowing: 'Turbine flow parameter FP = ṁ·√T3/p3 (definition), read from the turbine map',
  orifice: 'Compressible orifice flow: NASA Glenn Research Center, "Mass flow choking"; critical ratio from isentropic flow tables (NACA Report 1135)',
  root: "Brent's method on a bracket (Brent, Algorithms for Minimization without Derivatives, 1973)",
  turbineMap: 'Turbine map of the Plan',
} as const;

const CP_UNIT = 'J/(kg K)';
const FP_UNIT = 'kg K^0.5/(s Pa)';
const FLUX_UNIT = 'kg/(s m^2)';

/** The boost the turbine holds, where it cannot hold the target: the step that replaces the target on the way down. */
export function heldBoostStep(ctx: LineContext, v: PointValues): WorkingStep | null {
  if (v.targetHeld !== false || v.boostTarget === undefined || !ctx.exhaust) return null;
  return step(
    'boost-held',
    'Boost the turbine holds',
    `With the gates shut the turbine cannot drive the compressor at the ${fmt(v.boostTarget / 1000)} kPa target. The boost is lowered until the shut-gate turbine just drives it (η_m·P_t = P_c), solving the whole point again at each trial boost (${v.boostIterations ?? 0} iterations). Everything below is at this boost.`,
    'boost_held',
    [wv('boost_held', v.boost, 'pressure')],
    wv('boost', v.boost, 'pressure'),
    EXHAUST_SOURCES.root,
  );
}

/** The exhaust steps of a solved point; none when the line has no exhaust side or it was not computed. */
export function exhaustSteps(ctx: LineContext, v: PointValues): WorkingStep[] {
  const ex = ctx.exhaust;
  if (!ex || !ex.turbine || !v.exhaustCase) return [];
  const need = [
    v.compressorPower,
    v.exhaustMassFlow,
    v.turbineInletTemperature,
    v.turbineOutletPressure,
    v.turbineInletPressure,
    v.expansionRatio,
    v.turbineFlowParameter,
    v.turbineMapFlowParameter,
    v.turbineEfficiency,
    v.turbineMassFlow,
    v.turbinePower,
    v.shutGateExpansionRatio,
    v.shutGateTurbineEfficiency,
    v.shutGateTurbinePower,
    v.wastegateMassFlow,
    v.wastegateFraction,
    v.drivePressureRatio,
  ];
  if (need.some((x) => typeof x !== 'number' || !Number.isFinite(x))) return [];
  const pC = v.compressorPower!;
  const mEx = v.exhaustMassFlow!;
  const t3 = v.turbineInletTemperature!;
  const p4 = v.turbineOutletPressure!;
  const p3 = v.turbineInletPressure!;
  const er = v.expansionRatio!;
  const erShut = v.shutGateExpansionRatio!;
  const etaShut = v.shutGateTurbineEfficiency!;
  const pShut = v.shutGateTurbinePower!;
  const mT = v.turbineMassFlow!;
  const mWg = v.wastegateMassFlow!;
  const etaM = ex.mechanicalEfficiency;
  const pulse = ex.input.pulseFactor;
  const gas = gasOf(v);
  const gamma = gas.gamma;
  const cp = gas.cp;
  const gasSource =
    v.exhaustGasCp !== null && v.exhaustGasCp !== undefined && ctx.fuel && v.lambda !== null ? EXHAUST_SOURCES.gas : EXHAUST_SOURCES.gasFallback;
  const n = ctx.plan.turbochargers;
  const t = ex.turbine;
  const divisor = t.mapFlowParameterDivisor;
  const steps: WorkingStep[] = [];

  steps.push(
    step(
      'exhaust-mass-flow',
      'Exhaust mass flow per turbocharger',
      `Everything that goes into the cylinders leaves through the exhaust: the air and the fuel burnt with it${n > 1 ? `, shared by ${n} turbochargers` : ''}.`,
      '(m_dot_air + m_dot_f) / n_tc',
      [wv('m_dot_air', v.engineMassFlow, 'massFlow'), wv('m_dot_f', v.fuelMassFlow ?? 0, 'massFlow'), wv('n_tc', n, 'count')],
      wv('m_dot_ex', mEx, 'massFlow'),
      `${SOURCES.definition} (mass balance)`,
    ),
  );
  const table = ex.input.turbineInletTemperature;
  const l = lookupByRpm(table, v.rpm);
  steps.push(
    l.lower === l.upper
      ? step(
          'turbine-inlet-temperature',
          'Turbine inlet temperature',
          l.held
            ? `${fmt(v.rpm)} rpm is outside the table (${fmt(table[0].rpm)}–${fmt(table[table.length - 1].rpm)} rpm), so the nearest row is held.`
            : 'The table has a row at this speed.',
          'T_3_row',
          [wv('T_3_row', l.lower.value, 'temperature')],
          wv('T_3', t3, 'temperature'),
          `${SOURCES.given}; ${SOURCES.interpolation}`,
        )
      : step(
          'turbine-inlet-temperature',
          'Turbine inlet temperature',
          `Read between the Plan's rows at ${fmt(l.lower.rpm)} and ${fmt(l.upper.rpm)} rpm, on a straight line.`,
          'y_0 + (y_1 - y_0) * (N - N_0) / (N_1 - N_0)',
          [
            wv('y_0', l.lower.value, 'temperature'),
            wv('y_1', l.upper.value, 'temperature'),
            wv('N', v.rpm, 'speed'),
            wv('N_0', l.lower.rpm, 'speed'),
            wv('N_1', l.upper.rpm, 'speed'),
          ],
          wv('T_3', t3, 'temperature'),
          `${SOURCES.given}; ${SOURCES.interpolation}`,
        ),
    ...exhaustGasSteps(ctx, v, t3, gas),
    downstreamLossStep(ctx, v, t3, gas),
    step(
      'turbine-outlet-pressure',
      'Pressure after the turbine',
      'Ambient pressure plus what the downpipe, catalyst and silencers lose.',
      'p_amb + dp_ds',
      [wv('p_amb', v.ambientPressure, 'pressure'), wv('dp_ds', v.downstreamLoss ?? p4 - v.ambientPressure, 'pressure')],
      wv('p_4', p4, 'pressure'),
      SOURCES.definition,
    ),
    step(
      'shut-gate-expansion-ratio',
      'Expansion ratio with the gates shut',
      `With the gates shut every kg of exhaust goes through the wheel. The turbine swallows ṁ = FP·ER·p4/√T3, with FP read from the map at each ER (${t.capacityRule}); the ratio at which it swallows all of it was found by root finding. FP_shut is the map's flow parameter there.`,
      'm_dot_ex * sqrt(T_3) / (FP_shut * p_4)',
      [
        wv('m_dot_ex', mEx, 'massFlow'),
        wv('T_3', t3, 'temperature'),
        wv('FP_shut', (mEx * Math.sqrt(t3)) / (erShut * p4), 'none', FP_UNIT),
        wv('p_4', p4, 'pressure'),
      ],
      wv('ER_shut', erShut, 'ratio'),
      `${EXHAUST_SOURCES.swallowing}; ${EXHAUST_SOURCES.root}`,
    ),
    step(
      'shut-gate-turbine-power',
      'Turbine power with the gates shut',
      `The power the turbine could give at this boost: all the exhaust expanding through ER_shut at the map's efficiency there, γ_e = ${fmt(gamma, 4)}, cp_e = ${fmt(cp)} J/(kg K)${pulse !== 1 ? `, times the pulse-energy factor ${fmt(pulse, 3)} (an assumption for what a steady model cannot see of a divided manifold's pulses)` : ''}.`,
      'PF * m_dot_ex * c_pe * T_3 * eta_t_shut * (1 - ER_shut ^ (-(gamma_e - 1) / gamma_e))',
      [
        wv('PF', pulse, 'ratio'),
        wv('m_dot_ex', mEx, 'massFlow'),
        wv('c_pe', cp, 'none', CP_UNIT),
        wv('T_3', t3, 'temperature'),
        wv('eta_t_shut', etaShut, 'fraction'),
        wv('ER_shut', erShut, 'ratio'),
        wv('gamma_e', gamma, 'ratio'),
      ],
      wv('P_t_shut', pShut, 'power'),
      `${EXHAUST_SOURCES.turbinePower}; ${gasSource}`,
    ),
  );
  const drive = etaM * pShut;
  const caseWords =
    v.exhaustCase === 'gate-open'
      ? `more than the compressor needs (${fmt(pC / 1000)} kW): the target is held and the gates open to bleed off the rest.`
      : v.exhaustCase === 'target-not-held'
        ? `just what the compressor needs at the held boost (${fmt(pC / 1000)} kW): the gates stay shut.`
        : 'more than the compressor needs, which is nothing here: the throttle sets the boost and the gates are taken wide open.';
  steps.push(
    step(
      'shut-gate-drive-power',
      'Power reaching the compressor with the gates shut',
      `${mechanicalWords(ctx)} That is ${caseWords}`,
      'eta_m * P_t_shut',
      [wv('eta_m', etaM, 'fraction'), wv('P_t_shut', pShut, 'power')],
      wv('P_drive_shut', drive, 'power'),
      `${EXHAUST_SOURCES.turbinePower}; ${SOURCES.assumption}`,
    ),
  );

  if (v.exhaustCase !== 'target-not-held') {
    steps.push(
      step(
        'expansion-ratio',
        'Expansion ratio with the gates open',
        v.exhaustCase === 'gate-open'
          ? `The gates open until the turbine gives just the power the compressor needs: the smaller ER at which η_m·P_t(ER) = P_c, found by root finding between ER 1 and ER_shut.`
          : 'With the gates wide open, the ER at which the wheel and the fitted gates together pass all the exhaust, found by root finding.',
        'ER_open',
        [wv('ER_open', er, 'ratio')],
        wv('ER', er, 'ratio'),
        EXHAUST_SOURCES.root,
      ),
    );
  } else {
    steps.push(
      step(
        'expansion-ratio',
        'Expansion ratio',
        'The gates are shut: the turbine works at the shut-gate ratio.',
        'ER_shut',
        [wv('ER_shut', erShut, 'ratio')],
        wv('ER', er, 'ratio'),
        SOURCES.definition,
      ),
    );
  }
  steps.push(
    step(
      'turbine-inlet-pressure',
      'Turbine inlet (exhaust manifold) pressure',
      'The expansion ratio times the pressure after the turbine.',
      'ER * p_4',
      [wv('ER', er, 'ratio'), wv('p_4', p4, 'pressure')],
      wv('p_3', p3, 'pressure'),
      SOURCES.definition,
    ),
    step(
      'drive-pressure-ratio',
      'Drive pressure ratio',
      'Exhaust manifold over intake manifold pressure: above 1 the engine pushes its exhaust out against more pressure than it breathes in.',
      'p_3 / p_man',
      [wv('p_3', p3, 'pressure'), wv('p_man', v.manifoldPressure, 'pressure')],
      wv('DPR', v.drivePressureRatio!, 'ratio'),
      SOURCES.definition,
    ),
  );
  if (v.exhaustCase !== 'target-not-held') {
    steps.push(
      divisor === 2
        ? step(
            'turbine-flow-parameter',
            'Turbine flow parameter',
            `The map gives the flow of one scroll (${v.turbineMapLocation === 'inside' ? 'read at ER, at the shaft speed where one is known' : 'outside its range: see the findings'}); the two scrolls in parallel pass twice it.`,
            'k_scroll * FP_map',
            [wv('k_scroll', divisor, 'count'), wv('FP_map', v.turbineMapFlowParameter!, 'none', FP_UNIT)],
            wv('FP', v.turbineFlowParameter!, 'none', FP_UNIT),
            EXHAUST_SOURCES.turbineMap,
          )
        : step(
            'turbine-flow-parameter',
            'Turbine flow parameter',
            v.turbineMapLocation === 'inside'
              ? 'Read on the map at ER, at the shaft speed where one is known (as the efficiency below).'
              : "Outside the map's range of expansion ratio (see the findings).",
            'FP_map',
            [wv('FP_map', v.turbineMapFlowParameter!, 'none', FP_UNIT)],
            wv('FP', v.turbineFlowParameter!, 'none', FP_UNIT),
            EXHAUST_SOURCES.turbineMap,
          ),
      step(
        'turbine-mass-flow',
        'Mass flow through the turbine wheel',
        'What the turbine swallows at this expansion ratio.',
        'FP * ER * p_4 / sqrt(T_3)',
        [wv('FP', v.turbineFlowParameter!, 'none', FP_UNIT), wv('ER', er, 'ratio'), wv('p_4', p4, 'pressure'), wv('T_3', t3, 'temperature')],
        wv('m_dot_t', mT, 'massFlow'),
        EXHAUST_SOURCES.swallowing,
      ),
      ...turbineSpeedSteps(v),
      step(
        'turbine-power',
        'Turbine power',
        "The wheel's flow expanding through ER at the map's efficiency there.",
        'PF * m_dot_t * c_pe * T_3 * eta_t * (1 - ER ^ (-(gamma_e - 1) / gamma_e))',
        [
          wv('PF', pulse, 'ratio'),
          wv('m_dot_t', mT, 'massFlow'),
          wv('c_pe', cp, 'none', CP_UNIT),
          wv('T_3', t3, 'temperature'),
          wv('eta_t', v.turbineEfficiency!, 'fraction'),
          wv('ER', er, 'ratio'),
          wv('gamma_e', gamma, 'ratio'),
        ],
        wv('P_t', v.turbinePower!, 'power'),
        `${EXHAUST_SOURCES.turbinePower}; ${gasSource}`,
      ),
    );
    if (v.exhaustCase === 'gate-open') {
      steps.push(
        step(
          'power-balance',
          'Power balance',
          `What reaches the compressor equals its power P_c = ${fmt(pC / 1000)} kW, to the solver's tolerance.`,
          'eta_m * P_t',
          [wv('eta_m', etaM, 'fraction'), wv('P_t', v.turbinePower!, 'power')],
          wv('P_drive', etaM * v.turbinePower!, 'power'),
          EXHAUST_SOURCES.turbinePower,
        ),
      );
    }
    steps.push(
      step(
        'wastegate-mass-flow',
        'Flow through the wastegates',
        'What the wheel does not take goes through the gates: mass is conserved.',
        'm_dot_ex - m_dot_t',
        [wv('m_dot_ex', mEx, 'massFlow'), wv('m_dot_t', mT, 'massFlow')],
        wv('m_dot_wg', mWg, 'massFlow'),
        SOURCES.definition,
      ),
      step(
        'wastegate-fraction',
        'Wastegate share of the exhaust',
        'The share of the exhaust that bypasses the wheel.',
        'm_dot_wg / m_dot_ex',
        [wv('m_dot_wg', mWg, 'massFlow'), wv('m_dot_ex', mEx, 'massFlow')],
        wv('WG', v.wastegateFraction!, 'fraction'),
        SOURCES.definition,
      ),
    );
  } else {
    steps.push(
      ...turbineSpeedSteps(v),
      step(
        'power-balance',
        'Power balance at the held boost',
        `What reaches the compressor equals its power at the held boost, P_c = ${fmt(pC / 1000)} kW, to the solver's tolerance.`,
        'eta_m * P_t_shut',
        [wv('eta_m', etaM, 'fraction'), wv('P_t_shut', pShut, 'power')],
        wv('P_drive', drive, 'power'),
        EXHAUST_SOURCES.turbinePower,
      ),
    );
  }
  steps.push(...gateSteps(ctx, v, mWg, p3, p4, t3));
  return steps;
}

function gateSteps(ctx: LineContext, v: PointValues, mWg: number, p3: number, p4: number, t3: number): WorkingStep[] {
  const ex = ctx.exhaust!;
  const gates = ex.input.wastegates;
  const need = v.wastegateDiameterNeeded;
  if (v.exhaustCase !== 'gate-open' || !(mWg > 0) || typeof need !== 'number' || !(need > 0) || typeof v.wastegateMargin !== 'number') return [];
  const gas = gasOf(v);
  const gamma = gas.gamma;
  const r = gas.gasConstant;
  const ratio = p4 / p3;
  const critical = criticalPressureRatio(gamma);
  const choked = ratio <= critical;
  const flux = orificeMassFlux(p3, t3, p4, gas).massFlux;
  const area = mWg / (gates.count * gates.dischargeCoefficient * flux);
  return [
    step(
      'wastegate-pressure-ratio',
      'Pressure ratio across the gates',
      `After over before the gates. At or below the critical ratio ${fmt(critical, 4)} (γ_e = ${fmt(gamma, 4)}) the flow in the valve throat is sonic (choked); here it is ${choked ? 'choked' : 'not choked'}.`,
      'p_4 / p_3',
      [wv('p_4', p4, 'pressure'), wv('p_3', p3, 'pressure')],
      wv('r_wg', ratio, 'ratio'),
      EXHAUST_SOURCES.orifice,
    ),
    choked
      ? step(
          'wastegate-mass-flux',
          'Flow per square metre of an ideal valve',
          'Choked: the flow depends only on the conditions before the gate.',
          'p_3 * sqrt(gamma_e / (R_e * T_3)) * (2 / (gamma_e + 1)) ^ ((gamma_e + 1) / (2 * (gamma_e - 1)))',
          [wv('p_3', p3, 'pressure'), wv('gamma_e', gamma, 'ratio'), wv('R_e', r, 'none', CP_UNIT), wv('T_3', t3, 'temperature')],
          wv('G', flux, 'none', FLUX_UNIT),
          EXHAUST_SOURCES.orifice,
        )
      : step(
          'wastegate-mass-flux',
          'Flow per square metre of an ideal valve',
          'Not choked: the subsonic orifice relation at the pressure ratio across the gate.',
          'sqrt(2 * p_3 ^ 2 / (R_e * T_3) * gamma_e / (gamma_e - 1) * (r_wg ^ (2 / gamma_e) - r_wg ^ ((gamma_e + 1) / gamma_e)))',
          [wv('p_3', p3, 'pressure'), wv('R_e', r, 'none', CP_UNIT), wv('T_3', t3, 'temperature'), wv('gamma_e', gamma, 'ratio'), wv('r_wg', ratio, 'ratio')],
          wv('G', flux, 'none', FLUX_UNIT),
          EXHAUST_SOURCES.orifice,
        ),
    step(
      'wastegate-area-needed',
      'Valve area each gate needs',
      `${gates.count === 1 ? 'One gate takes all the wastegate flow' : 'Two gates (one per scroll, or a pair) share the wastegate flow equally'}; a real valve passes C_d = ${fmt(gates.dischargeCoefficient, 3)} of an ideal one (an assumption).`,
      'm_dot_wg / (n_wg * C_d * G)',
      [wv('m_dot_wg', mWg, 'massFlow'), wv('n_wg', gates.count, 'count'), wv('C_d', gates.dischargeCoefficient, 'fraction'), wv('G', flux, 'none', FLUX_UNIT)],
      wv('A_wg', area, 'area'),
      `${EXHAUST_SOURCES.orifice}; ${SOURCES.assumption}`,
    ),
    step(
      'wastegate-diameter-needed',
      'Valve diameter each gate needs',
      'The diameter of a round valve of that area.',
      'sqrt(4 * A_wg / pi)',
      [wv('A_wg', area, 'area')],
      wv('d_wg', need, 'length'),
      SOURCES.definition,
    ),
    step(
      'wastegate-margin',
      'Wastegate margin',
      `The fitted valve (${fmt(gates.valveDiameter * 1000, 3)} mm) against the one needed here, as a share of the fitted one: negative means the gates are too small and boost will creep.`,
      '(d_fit - d_wg) / d_fit',
      [wv('d_fit', gates.valveDiameter, 'length'), wv('d_wg', need, 'length')],
      wv('WG_margin', v.wastegateMargin, 'fraction'),
      SOURCES.definition,
    ),
  ];
}

/** The exhaust gas a point was solved with (the lean gas-turbine pair where no fuel was given). */
function gasOf(v: PointValues): GasProperties {
  return typeof v.exhaustGasCp === 'number' && typeof v.exhaustGasGamma === 'number' && typeof v.exhaustGasConstant === 'number'
    ? { cp: v.exhaustGasCp, gamma: v.exhaustGasGamma, gasConstant: v.exhaustGasConstant }
    : TURBINE_GAS;
}

/** How the bearings' share is taken, in words. */
function mechanicalWords(ctx: LineContext): string {
  const ex = ctx.exhaust!;
  if (ex.turbine?.efficiencyKind === 'with-bearing-losses')
    return `The turbine map's efficiency is total-to-static with the bearings' losses in it, so the Plan's mechanical efficiency (${pct(ex.input.mechanicalEfficiency)}) is not applied again: η_m = 100 %.`;
  const unstated =
    ex.turbine?.efficiencyKind === 'aerodynamic'
      ? "The turbine map's efficiency is aerodynamic only"
      : 'The turbine map does not say what its efficiency counts, so it is read as aerodynamic only';
  return `${unstated}: the bearings take a share, and η_m = ${pct(ex.mechanicalEfficiency)} (the Plan's) reaches the compressor.`;
}

const SPECIES: ExhaustSpecies[] = ['N2', 'O2', 'CO2', 'H2O', 'CO', 'H2'];

/** The exhaust gas's cp, R and γ at T3, from the products of the fuel burnt (none without a fuel: the fixed pair is named instead). */
function exhaustGasSteps(ctx: LineContext, v: PointValues, t3: number, gas: GasProperties): WorkingStep[] {
  if (!ctx.fuel || v.lambda === null || typeof v.exhaustGasCp !== 'number') {
    return [
      step(
        'exhaust-gas-cp',
        'Exhaust gas specific heat',
        "No fuel is given, so the lean pair of gas-turbine practice stands in (it understates a rich engine's turbine work).",
        'c_pe',
        [wv('c_pe', gas.cp, 'none', CP_UNIT)],
        wv('c_pe', gas.cp, 'none', CP_UNIT),
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
      wv('c_pe', v.exhaustGasCp, 'none', CP_UNIT),
      EXHAUST_SOURCES.gas,
    ),
    step(
      'exhaust-gas-constant',
      'Exhaust gas constant',
      "The universal gas constant over the mixture's molar mass.",
      'R_u / M_e',
      [wv('R_u', UNIVERSAL_GAS_CONSTANT, 'none', 'J/(mol K)'), wv('M_e', molar, 'none', 'kg/mol')],
      wv('R_e', gas.gasConstant, 'none', CP_UNIT),
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
function downstreamLossStep(ctx: LineContext, v: PointValues, t3: number, gas: GasProperties): WorkingStep {
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
      wv('R_e', gas.gasConstant, 'none', CP_UNIT),
      wv('T_3', t3, 'temperature'),
    ],
    wv('dp_ds', dp, 'pressure'),
    EXHAUST_SOURCES.loss,
  );
}

/** The turbine's efficiency as read against the shaft speed. */
function turbineSpeedSteps(v: PointValues): WorkingStep[] {
  const r = v.turbineSpeedReading;
  const eta = v.turbineEfficiency;
  if (!r || typeof eta !== 'number') return [];
  if (r.basis === 'mean-of-lines' || r.lowerSpeed === null || r.upperSpeed === null) {
    return [
      step(
        'turbine-speed',
        'Turbine efficiency without a shaft speed',
        r.shaftSpeed === null
          ? 'The compressor side gives no shaft speed here (no compressor map, or the point lies where the map has no speed), so the turbine map is read as the mean of its speed lines at this expansion ratio.'
          : "The turbine map's lines carry no speeds, so it is read as the mean of its lines at this expansion ratio.",
        'eta_t_mean',
        [wv('eta_t_mean', eta, 'fraction')],
        wv('eta_t', eta, 'fraction'),
        EXHAUST_SOURCES.turbineMap,
      ),
    ];
  }
  if (r.basis !== 'speed-lines' || r.lowerEfficiency === null || r.upperEfficiency === null || r.lowerSpeed === r.upperSpeed || r.shaftSpeed === null) {
    const held = r.basis === 'held-at-lowest-line' ? 'below the lowest' : r.basis === 'held-at-top-line' ? 'above the top' : 'on a';
    return [
      step(
        'turbine-speed',
        'Turbine efficiency at the shaft speed',
        r.basis === 'speed-lines'
          ? `The turbocharger turns at ${fmt(r.shaftSpeed ?? r.lowerSpeed)} rpm, on the map's ${fmt(r.lowerSpeed)} rpm line: the line is read at this expansion ratio.`
          : `The turbocharger turns at ${fmt(r.shaftSpeed ?? 0)} rpm, ${held} speed line of the turbine map (${fmt(r.lowerSpeed)} rpm): the map says nothing beyond its lines, so that line is held and read at this expansion ratio. An estimate; the findings say so.`,
        'eta_t_line',
        [wv('eta_t_line', eta, 'fraction')],
        wv('eta_t', eta, 'fraction'),
        EXHAUST_SOURCES.speed,
      ),
    ];
  }
  return [
    step(
      'turbine-speed',
      'Turbine efficiency at the shaft speed',
      `The compressor and turbine share one shaft, at ${fmt(r.shaftSpeed)} rpm here. The turbine map's lines at ${fmt(r.lowerSpeed)} and ${fmt(r.upperSpeed)} rpm are each read at this expansion ratio and joined by a straight line in speed.`,
      'eta_N0 + (eta_N1 - eta_N0) * (N_tc - N_0) / (N_1 - N_0)',
      [
        wv('eta_N0', r.lowerEfficiency, 'fraction'),
        wv('eta_N1', r.upperEfficiency, 'fraction'),
        wv('N_tc', r.shaftSpeed, 'speed'),
        wv('N_0', r.lowerSpeed, 'speed'),
        wv('N_1', r.upperSpeed, 'speed'),
      ],
      wv('eta_t', eta, 'fraction'),
      EXHAUST_SOURCES.speed,
    ),
  ];
}
