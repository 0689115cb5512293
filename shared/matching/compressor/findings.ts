/**
 * Findings of the compressor side of a point: where it sits on the map and what that means, its
 * margins against the study's requirements, overspeed, and its outlet temperature.
 */
import { finding, type Finding, type FindingCode } from '../finding';
import { REQUIREMENT_DEFAULTS } from '../input/requirements';
import type { LineContext } from '../line-context';
import type { PointValues } from '../result';
import { fmt, kelvin, pct } from '../working';
import type { MapRegion } from './result';

const NOT_REACHABLE = 'Not reachable with this compressor: its power, torque and temperatures are not given.';

/** Words on how a margin beyond the choke line's top was measured. */
function chokeEdgeWords(v: PointValues): string {
  return v.marginBasis?.choke === 'top-speed-line' ? ", measured to the top speed line above the choke line's top" : '';
}

/** The finding that says where a point off the map sits and what that means; null on or below the map. */
function regionFinding(region: MapRegion, v: PointValues): Finding | null {
  const rpm = v.rpm;
  const tail = v.reachable ? '' : ` ${NOT_REACHABLE}`;
  switch (region) {
    case 'on-map':
      return null;
    case 'below-map':
      return finding(
        'map-below-map',
        'info',
        'The point is below the map (a low pressure ratio, usual at light load): the wheel turns slower than the lowest speed line.',
        rpm,
      );
    case 'left-of-surge':
      return finding(
        'map-left-of-surge',
        'limit',
        `The point is left of the surge line (surge margin ${pct(v.surgeMargin ?? 0)}): the compressor surges here.${tail}`,
        rpm,
        v.surgeMargin !== null ? { value: v.surgeMargin, threshold: 0, kind: 'fraction' } : undefined,
      );
    case 'past-choke':
      return finding(
        'map-beyond-choke',
        'limit',
        `The point is past choke (choke margin ${pct(v.chokeMargin ?? 0)}${chokeEdgeWords(v)}): the compressor cannot pass this flow at this pressure ratio.${tail}`,
        rpm,
        v.chokeMargin !== null ? { value: v.chokeMargin, threshold: 0, kind: 'fraction' } : undefined,
      );
    case 'over-speed':
      // The overspeed finding says it, with the figures.
      return null;
    case 'above-map':
      return finding(
        'map-above-top-speed',
        'limit',
        `The point is above the top speed line${v.shaftSpeed !== null ? ` (about ${fmt(v.shaftSpeed)} rpm, extrapolated)` : ''}: the map does not show the compressor running there.${tail}`,
        rpm,
      );
    case 'outside-speed-lines':
      return finding(
        'map-off-map',
        'limit',
        `The point is inside the map's outline but outside its speed lines: the map cannot say what the compressor does here.${tail}`,
        rpm,
      );
  }
}

const SPEED_WORDS: Record<string, string> = {
  'above-top-speed-line': ' (extrapolated above the top speed line)',
  'surge-edge': ' (taken along the surge line)',
};

/** Warnings for margins that hold but are thinner than the study requires. */
function thinMarginFindings(v: PointValues, ctx: LineContext): Finding[] {
  const req = ctx.requirements ?? REQUIREMENT_DEFAULTS;
  const out: Finding[] = [];
  const thin = (code: FindingCode, what: string, margin: number | null, required: number) => {
    if (margin === null || !(margin >= 0) || !(margin < required)) return;
    out.push(
      finding(code, 'warning', `${what} ${pct(margin)} is under the ${pct(required)} the study requires.`, v.rpm, {
        value: margin,
        threshold: required,
        kind: 'fraction',
      }),
    );
  };
  thin('surge-margin-thin', 'Surge margin', v.surgeMargin, req.minSurgeMargin);
  thin('choke-margin-thin', 'Choke margin', v.chokeMargin, req.minChokeMargin);
  thin('speed-margin-thin', 'Speed margin', v.speedMargin, req.minSpeedMargin);
  return out;
}

/**
 * The compressor's findings of a solved point, wherever it sits (added to `out`): where its
 * efficiency came from, where it sits on the map, overspeed, and margins thinner than required.
 */
export function compressorFindings(v: PointValues, ctx: LineContext, out: Finding[]): void {
  const rpm = v.rpm;
  const reachable = v.reachable !== false;
  if (ctx.hasMap && reachable && v.efficiencySource === 'plan' && v.compressorEfficiency !== null) {
    const below = v.mapRegion === 'below-map';
    out.push(
      finding(
        'efficiency-off-map',
        below ? 'info' : 'warning',
        below
          ? `Below the map the efficiency is not given; the Plan's ${pct(v.compressorEfficiency)} is used (at a low pressure ratio it changes little).`
          : `The map gives no efficiency here; the Plan's ${pct(v.compressorEfficiency)} is used instead.`,
        rpm,
        { value: v.compressorEfficiency, kind: 'fraction' },
      ),
    );
  }
  if (v.offMapAssumed && v.compressorEfficiency !== null) {
    out.push(
      finding(
        'off-map-assumption',
        'warning',
        `Computed on the Plan's off-map efficiency assumption of ${pct(v.compressorEfficiency)}: the map does not reach this point.`,
        rpm,
        { value: v.compressorEfficiency, kind: 'fraction' },
      ),
    );
  }
  const region = v.mapRegion ?? null;
  const regionNote = region !== null ? regionFinding(region, v) : null;
  if (regionNote) out.push(regionNote);
  if (v.speedMargin !== null && v.speedMargin < 0 && v.shaftSpeed !== null && v.maxShaftSpeed !== null) {
    out.push(
      finding(
        'overspeed',
        'limit',
        `Shaft speed ${fmt(v.shaftSpeed)} rpm${SPEED_WORDS[v.marginBasis?.speed ?? ''] ?? ''} is over the limit ${fmt(v.maxShaftSpeed)} rpm (speed margin ${pct(v.speedMargin)}).${v.reachable === false && region === 'over-speed' ? ` ${NOT_REACHABLE}` : ''}`,
        rpm,
        { value: v.shaftSpeed, threshold: v.maxShaftSpeed, kind: 'speed' },
      ),
    );
  }
  out.push(...thinMarginFindings(v, ctx));
}

/** The outlet temperature of a point the compressor can deliver, against the stated limit and what the study accepts (added to `out`). */
export function outletTemperatureFindings(v: PointValues, ctx: LineContext, out: Finding[]): void {
  const rpm = v.rpm;
  const t2 = v.compressorOutletTemperature;
  const t2Limit = ctx.engine.limits.maxCompressorOutletTemperature;
  const t2Accepted = (ctx.requirements ?? REQUIREMENT_DEFAULTS).maxCompressorOutletTemperature;
  if (t2 !== null && t2Limit !== undefined && t2 > t2Limit) {
    out.push(
      finding(
        'compressor-outlet-temperature-limit',
        'limit',
        `Compressor outlet temperature ${kelvin(t2)} is above the stated limit ${kelvin(t2Limit)}.`,
        rpm,
        { value: t2, threshold: t2Limit, kind: 'temperature' },
      ),
    );
  } else if (t2 !== null && t2 > t2Accepted) {
    out.push(
      finding(
        'compressor-outlet-temperature-high',
        'warning',
        `Compressor outlet temperature ${kelvin(t2)} is above the ${kelvin(t2Accepted)} the study accepts.`,
        rpm,
        { value: t2, threshold: t2Accepted, kind: 'temperature' },
      ),
    );
  }
}
