/** The Working of a point's pressures: table lookups by rpm, the losses, and the compressor's pressure ratio. */
import { LOSS_REFERENCE_DENSITY, type PressureLossInput } from '../physics';
import type { RpmTable } from './input/rpm';
import type { LineContext } from './line-context';
import type { PointValues } from './result';
import { lookupByRpm } from './rpm-table';
import { fmt, SOURCES, step, wv, type WorkingKind, type WorkingStep } from './working';

const LOSS_SOURCE = 'Duct loss Δp ∝ ṁ²/ρ (constant loss coefficient, incompressible duct flow)';

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

/** A value read from a Study table by rpm (or given for the point). */
export function lookupStep(id: string, title: string, table: RpmTable | null, rpm: number, symbol: string, given: number, kind: WorkingKind): WorkingStep {
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

/** From ambient to the compressor's outlet: the losses, inlet and manifold pressures, the pressure ratio and the ideal outlet temperature. */
export function pressureSteps(ctx: LineContext, v: PointValues): WorkingStep[] {
  const inletLoss = v.inletLoss ?? ctx.losses.inlet.pressureLoss;
  const coolerLoss = v.chargeCoolerLoss ?? ctx.losses.chargeCooler.pressureLoss;
  return [
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
  ];
}
