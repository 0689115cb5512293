/** The Working of a point's injectors: the pressure across them, their flow, the duty cycle and the pump's share. */
import { injectionPeriod, ratingFluidFactor, revolutionsPerCycle, scaleInjectorFlow } from '../physics';
import type { LineContext } from './line-context';
import type { PointValues } from './result';
import { fmt, SOURCES, step, wv, type WorkingStep } from './working';

/** The injector steps of a point; none without injectors. */
export function injectorSteps(ctx: LineContext, v: PointValues): WorkingStep[] {
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
