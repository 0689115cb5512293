/** The Working of the compressor side of a point: its efficiency, outlet temperature and power, and where it sits on the map. */
import type { LineContext } from '../line-context';
import type { PointValues } from '../result';
import { fmt, pct, SOURCES, SPECIFIC_HEAT_UNIT, step, wv, type WorkingStep } from '../working';
import { missingMarginWords } from './margin-words';
import { MAP_REGION_WORDS } from './reach';

/** The map's readings at the point: shaft speed, surge, choke and speed margins, and where the point sits. */
export function mapSteps(ctx: LineContext, v: PointValues): WorkingStep[] {
  const steps: WorkingStep[] = [];
  const basis = v.marginBasis;
  if (v.shaftSpeed !== null) {
    const where = SPEED_BASIS_WORDS[basis?.speed ?? 'speed-lines'] ?? SPEED_BASIS_WORDS['speed-lines'];
    steps.push(
      step(
        'shaft-speed',
        basis?.speed === 'above-top-speed-line' || basis?.speed === 'surge-edge'
          ? "Shaft speed, extrapolated along the map's edge"
          : 'Shaft speed from the map',
        `${where} Like corrected flow, the speed is referred to the map's reference temperature, so the wheel's real speed is N_c·√(T1/T_ref): faster on a hot day.`,
        'N_c * sqrt(T_1 / T_ref)',
        [
          wv('N_c', v.correctedShaftSpeed ?? v.shaftSpeed, 'speed'),
          wv('T_1', v.compressorInletTemperature, 'temperature'),
          wv('T_ref', ctx.reference.temperature, 'temperature'),
        ],
        wv('N_tc', v.shaftSpeed, 'speed'),
        basis?.speed === 'above-top-speed-line' || basis?.speed === 'surge-edge' ? `${SOURCES.map}; ${SOURCES.similarity}` : SOURCES.map,
      ),
    );
  }
  if (v.surgeMargin !== null) {
    const surgeFlow = v.correctedMassFlow * (1 - v.surgeMargin);
    steps.push(
      step(
        'surge-margin',
        'Surge margin',
        'How far the point sits to the right of the surge line at the same pressure ratio, as a share of its corrected flow. Negative means left of surge.',
        '(m_dot_c - m_dot_c_surge) / m_dot_c',
        [wv('m_dot_c', v.correctedMassFlow, 'massFlow'), wv('m_dot_c_surge', surgeFlow, 'massFlow')],
        wv('SM', v.surgeMargin, 'fraction'),
        `${SOURCES.definition}; ${SOURCES.map}`,
      ),
    );
  }
  if (v.chokeMargin !== null) {
    const chokeFlow = v.correctedMassFlow * (1 + v.chokeMargin);
    steps.push(
      step(
        'choke-margin',
        'Choke margin',
        basis?.choke === 'top-speed-line'
          ? "How much more corrected flow the compressor could pass at the same pressure ratio, as a share of the point's flow. Above the choke line's top the map's right edge is the top speed line, where it comes down to this pressure ratio on its choke side: the flow is measured to it. Negative means past choke."
          : "How much more corrected flow the compressor could pass at the same pressure ratio before choking, as a share of the point's flow. Negative means past choke.",
        '(m_dot_c_choke - m_dot_c) / m_dot_c',
        [wv('m_dot_c', v.correctedMassFlow, 'massFlow'), wv('m_dot_c_choke', chokeFlow, 'massFlow')],
        wv('CM', v.chokeMargin, 'fraction'),
        `${SOURCES.definition}; ${SOURCES.map}`,
      ),
    );
  }
  if (v.speedMargin !== null) {
    if (v.shaftSpeed !== null && v.maxShaftSpeed !== null) {
      steps.push(
        step(
          'speed-margin',
          'Speed margin',
          `Headroom below the shaft speed limit (${ctx.plan.maxShaftSpeed !== undefined ? "the lower of the Plan's and the map's" : "the map's"}).`,
          '(N_max - N_tc) / N_max',
          [wv('N_max', v.maxShaftSpeed, 'speed'), wv('N_tc', v.shaftSpeed, 'speed')],
          wv('SpM', v.speedMargin, 'fraction'),
          `${SOURCES.definition}; ${SOURCES.map}`,
        ),
      );
    } else {
      steps.push(
        step(
          'speed-margin',
          'Speed margin',
          'As the map reports it.',
          'SpM',
          [wv('SpM', v.speedMargin, 'fraction')],
          wv('SpM', v.speedMargin, 'fraction'),
          SOURCES.map,
        ),
      );
    }
  }
  const region = regionStep(v);
  if (region) steps.push(region);
  return steps;
}

const SPEED_BASIS_WORDS: Partial<Record<string, string>> = {
  'speed-lines': 'The speed lines give the corrected speed N_c at this corrected flow and pressure ratio.',
  'above-top-speed-line':
    'The point is above the top speed line, so the map has no speed for it: N_c is extrapolated up from the top line at the same flow, taking the isentropic head PR^((γ−1)/γ) − 1 to rise with the square of the tip speed (similar operation). An estimate, not a map reading.',
  'surge-edge':
    "The point is left of the surge line: N_c is the speed along the surge line at this pressure ratio, between the speed lines' first points (the isentropic head taken to rise with the square of the tip speed). An estimate, not a map reading.",
};

/** Where the point sits on the map, what that means for its results, and why any margin is missing. */
function regionStep(v: PointValues): WorkingStep | null {
  const region = v.mapRegion;
  if (!region) return null;
  const missing: string[] = [];
  for (const margin of ['surge', 'choke', 'speed'] as const) {
    const why = missingMarginWords(v, margin);
    if (why) missing.push(`no ${margin} margin: ${why}`);
  }
  const meaning =
    v.reachable === false
      ? 'The compressor cannot deliver this point: it is not reachable with this compressor, so its efficiency, outlet temperature, power, torque, fuel and exhaust side are not given.'
      : v.offMapAssumed
        ? "The map does not reach this point; it is computed on the Plan's off-map efficiency assumption, as the findings say."
        : region === 'below-map'
          ? 'A light load: the compressor meets it turning slower than its lowest speed line.'
          : 'The compressor can deliver this point.';
  return step(
    'map-region',
    'Where the point sits on the map',
    `The point is ${MAP_REGION_WORDS[region]}. ${meaning}${missing.length > 0 ? ` ${missing.map((m) => m[0].toUpperCase() + m.slice(1)).join('. ')}.` : ''}`,
    'm_dot_c',
    [wv('m_dot_c', v.correctedMassFlow, 'massFlow')],
    wv('m_dot_c', v.correctedMassFlow, 'massFlow'),
    SOURCES.map,
  );
}

/** The efficiency a point was computed with, or, where it is not reachable, the one that placed it. */
function efficiencyOf(v: PointValues): number {
  return v.compressorEfficiency ?? v.placementEfficiency ?? Number.NaN;
}

/** Compressor outlet temperature of a point, or, where it is not reachable, the estimate that placed it, K. */
export function outletTemperatureOf(v: PointValues): number {
  return v.compressorOutletTemperature ?? v.compressorInletTemperature + (v.isentropicOutletTemperature - v.compressorInletTemperature) / efficiencyOf(v);
}

/** The compressor efficiency the point was computed with, and where it came from. */
export function efficiencyStep(ctx: LineContext, v: PointValues): WorkingStep {
  const eta = efficiencyOf(v);
  if (v.compressorEfficiency === null) {
    return step(
      'compressor-efficiency',
      'Efficiency used to place the point',
      `The compressor cannot deliver this point, and the map gives no efficiency there. To place the point on the map the Plan's ${pct(eta)} is used; nothing that would follow from running there is given.`,
      'eta_place',
      [wv('eta_place', eta, 'fraction')],
      wv('eta_place', eta, 'fraction'),
      SOURCES.assumption,
    );
  }
  if (v.efficiencySource === 'off-map-assumption') {
    return step(
      'compressor-efficiency',
      'Compressor efficiency: the off-map assumption',
      `The map does not reach this point. The Plan states an explicit off-map efficiency of ${pct(eta)}, and the point is computed on it (the findings name it).`,
      'eta_off_map',
      [wv('eta_off_map', eta, 'fraction')],
      wv('eta_c', eta, 'fraction'),
      SOURCES.assumption,
    );
  }
  if (v.efficiencySource === 'map') {
    return step(
      'compressor-efficiency',
      'Compressor efficiency from the map',
      `Read from the map at corrected flow ${fmt(v.correctedMassFlow)} kg/s and pressure ratio ${fmt(v.pressureRatio)}.`,
      'eta_map',
      [wv('eta_map', eta, 'fraction')],
      wv('eta_c', eta, 'fraction'),
      SOURCES.map,
    );
  }
  const why =
    v.efficiencySource === 'point'
      ? 'Given for this point.'
      : ctx.hasMap
        ? "The map has no efficiency at this point, so the Plan's stated efficiency is used (see the findings)."
        : "No compressor map is attached, so the Plan's stated efficiency is used.";
  return step(
    'compressor-efficiency',
    'Compressor efficiency',
    why,
    'eta_stated',
    [wv('eta_stated', eta, 'fraction')],
    wv('eta_c', eta, 'fraction'),
    v.efficiencySource === 'point' ? SOURCES.given : SOURCES.assumption,
  );
}

/** The compressor outlet temperature (or, where the point is not reachable, the estimate that placed it). */
export function compressorTemperatureStep(v: PointValues): WorkingStep {
  const placing = v.compressorOutletTemperature === null;
  return step(
    'outlet-temperature',
    placing ? 'Outlet temperature used to place the point' : 'Compressor outlet temperature',
    placing
      ? 'Only to place the point on the map (through the intercooler and the manifold density): the compressor cannot deliver the point, so this is no result.'
      : 'A real compressor heats the air more than an ideal one: the ideal rise is divided by the efficiency.',
    `T_1 + (T_2s - T_1) / ${placing ? 'eta_place' : 'eta_c'}`,
    [
      wv('T_1', v.compressorInletTemperature, 'temperature'),
      wv('T_2s', v.isentropicOutletTemperature, 'temperature'),
      wv(placing ? 'eta_place' : 'eta_c', efficiencyOf(v), 'fraction'),
    ],
    wv('T_2', outletTemperatureOf(v), 'temperature'),
    SOURCES.compressorThermo,
  );
}

/** The compressor's shaft power; none where the point is not reachable. */
export function compressorPowerSteps(ctx: LineContext, v: PointValues): WorkingStep[] {
  const t2 = v.compressorOutletTemperature;
  return v.compressorPower === null || t2 === null
    ? []
    : [
        step(
          'compressor-power',
          'Compressor power',
          'The shaft power that heats the air from T_1 to T_2.',
          'm_dot * c_p * (T_2 - T_1)',
          [
            wv('m_dot', v.massFlow, 'massFlow'),
            wv('c_p', ctx.air.cp, 'none', SPECIFIC_HEAT_UNIT),
            wv('T_2', t2, 'temperature'),
            wv('T_1', v.compressorInletTemperature, 'temperature'),
          ],
          wv('P_c', v.compressorPower, 'power'),
          SOURCES.compressorThermo,
        ),
      ];
}
