/**
 * The Working of a point's exhaust side, built on demand from the line's context and the point's
 * values: the same relations the solve uses (shared/matching/exhaust/), as mathjs expressions
 * over the symbols shown.
 */
import type { LineContext } from '../line-context';
import type { PointValues } from '../result';
import { lookupByRpm } from '../rpm-table';
import { fmt, SOURCES, SPECIFIC_HEAT_UNIT, step, wv, type WorkingStep } from '../working';
import { downstreamLossStep, exhaustGasSteps, gasOf } from './gas-working';
import { gateSteps } from './gate-working';
import { EXHAUST_SOURCES, FP_UNIT } from './sources';
import { mechanicalWords, turbineSpeedSteps } from './turbine-working';

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
        wv('c_pe', cp, 'none', SPECIFIC_HEAT_UNIT),
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
          wv('c_pe', cp, 'none', SPECIFIC_HEAT_UNIT),
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
