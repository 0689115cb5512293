/** The Working of the wastegates: the flow per area through a gate, the valve each gate needs, and its margin. */
import { criticalPressureRatio } from '#shared/physics/gas';
import { orificeMassFlux } from '#shared/physics/wastegate';
import type { LineContext } from '../line-context';
import type { PointValues } from '../result';
import { fmt, SOURCES, SPECIFIC_HEAT_UNIT, step, wv, type WorkingStep } from '../working';
import { gasOf } from './gas-working';
import { EXHAUST_SOURCES } from './sources';

const FLUX_UNIT = 'kg/(s m^2)';

/** The gate steps of a point whose gates are open; none otherwise. */
export function gateSteps(ctx: LineContext, v: PointValues, mWg: number, p3: number, p4: number, t3: number): WorkingStep[] {
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
          [wv('p_3', p3, 'pressure'), wv('gamma_e', gamma, 'ratio'), wv('R_e', r, 'none', SPECIFIC_HEAT_UNIT), wv('T_3', t3, 'temperature')],
          wv('G', flux, 'none', FLUX_UNIT),
          EXHAUST_SOURCES.orifice,
        )
      : step(
          'wastegate-mass-flux',
          'Flow per square metre of an ideal valve',
          'Not choked: the subsonic orifice relation at the pressure ratio across the gate.',
          'sqrt(2 * p_3 ^ 2 / (R_e * T_3) * gamma_e / (gamma_e - 1) * (r_wg ^ (2 / gamma_e) - r_wg ^ ((gamma_e + 1) / gamma_e)))',
          [
            wv('p_3', p3, 'pressure'),
            wv('R_e', r, 'none', SPECIFIC_HEAT_UNIT),
            wv('T_3', t3, 'temperature'),
            wv('gamma_e', gamma, 'ratio'),
            wv('r_wg', ratio, 'ratio'),
          ],
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
