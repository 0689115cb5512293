/** The Working of the turbine's efficiency against the shaft speed, and of the share of its power the bearings keep. */
import type { LineContext } from '../line-context';
import type { PointValues } from '../result';
import { fmt, pct, step, wv, type WorkingStep } from '../working';
import { EXHAUST_SOURCES } from './sources';

/** How the bearings' share is taken, in words. */
export function mechanicalWords(ctx: LineContext): string {
  const ex = ctx.exhaust!;
  if (ex.turbine?.efficiencyKind === 'with-bearing-losses')
    return `The turbine map's efficiency is total-to-static with the bearings' losses in it, so the Plan's mechanical efficiency (${pct(ex.input.mechanicalEfficiency)}) is not applied again: η_m = 100 %.`;
  const unstated =
    ex.turbine?.efficiencyKind === 'aerodynamic'
      ? "The turbine map's efficiency is aerodynamic only"
      : 'The turbine map does not say what its efficiency counts, so it is read as aerodynamic only';
  return `${unstated}: the bearings take a share, and η_m = ${pct(ex.mechanicalEfficiency)} (the Plan's) reaches the compressor.`;
}

/** The turbine's efficiency as read against the shaft speed. */
export function turbineSpeedSteps(v: PointValues): WorkingStep[] {
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
