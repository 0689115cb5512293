/** The Working of a point's power: brake power from the air or the fuel, torque, wheel power, the fuel per power. */
import type { LineContext } from './line-context';
import type { PointValues } from './result';
import { SOURCES, step, wv, type WorkingStep } from './working';

/**
 * The power steps of a point; `burnSymbol` and `burnAir` name the air that burns the fuel (the
 * dry air the cylinders trap, or the engine's air flow itself), kg/s.
 */
export function powerSteps(ctx: LineContext, v: PointValues, burnSymbol: string, burnAir: number): WorkingStep[] {
  if (!ctx.fuel || !ctx.power || v.brakePower === null || v.fuelMassFlow === null) return [];
  const p = ctx.fuel.properties;
  const steps: WorkingStep[] = [];
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
  return steps;
}
