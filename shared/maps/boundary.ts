import { AIR_GAMMA, isentropicExponent } from '../physics/gas';
import type { MarginBasis, SpeedBasis } from '../matching/compressor/model';
import { flowByPressureRatio, pressureRatioByFlow, type PiecewiseLinear } from './margins';
import type { CompressorCurve, CompressorMap } from './types';

/**
 * The whole edge of a compressor map, and the margins of a point measured against it.
 *
 * A map's operating range is closed by four lines: the surge line on the left, the top speed line
 * above, the choke line on the right and the lowest speed line below. Each margin is a flow
 * distance at the point's own pressure ratio, as a share of the point's corrected flow, signed
 * (negative past the limit):
 *
 *   surge margin = (ṁc − ṁc,left(PR)) / ṁc, ṁc,left from the surge line;
 *   choke margin = (ṁc,right(PR) − ṁc) / ṁc, ṁc,right from the choke line, or, above the choke
 *                  line's top, from the top speed line where it comes down to that pressure ratio
 *                  on its choke side (the map's right edge there);
 *
 * Where the edge does not exist at the point's pressure ratio (above the surge line's top, above
 * the whole map, below the lines' lowest points) the margin is null and its basis says why: a
 * margin read off a line that is not there would be a guess presented as a measurement.
 *
 * Shaft speed outside the speed lines is extrapolated along the edge with one rule, named in its
 * basis: the isentropic head h = PR^((γ−1)/γ) − 1 rises with the square of the tip speed at similar
 * flow (the work coefficient Δh/U² of geometrically similar operation is constant: Dixon & Hall,
 * Fluid Mechanics and Thermodynamics of Turbomachinery, 7th ed., ch. 1 and 7), so N² is taken as
 * linear in h. Above the top speed line: N = N_top·√(h(PR)/h(PR_top(ṁc))). Left of the surge line:
 * N at the surge edge at this PR, from the speed lines' first points. Past choke (below the top
 * line) and below the lowest line the map gives no speed: null.
 */
export interface MapBoundary {
  surge: PiecewiseLinear;
  choke: PiecewiseLinear;
  /** The top speed line as drawn: corrected flows (kg/s, increasing) and pressure ratios. */
  top: { flows: Float64Array; ratios: Float64Array; speed: number; line: PiecewiseLinear };
  bottom: PiecewiseLinear;
  /** The first (surge-side) point of each speed line, in increasing speed: pressure ratio and speed (rpm). */
  surgeEnds: { ratio: number; speed: number }[];
}

const HEAD_EXPONENT = isentropicExponent(AIR_GAMMA);

/** Isentropic head of a compression, dimensionless: PR^((γ−1)/γ) − 1 (h/(cp·T1)). */
export function isentropicHead(pressureRatio: number): number {
  return Math.pow(pressureRatio, HEAD_EXPONENT) - 1;
}

export function mapBoundary(map: CompressorMap): MapBoundary {
  const surgeCurve = map.curves.find((c) => c.kind === 'surge');
  const chokeCurve = map.curves.find((c) => c.kind === 'choke');
  if (!surgeCurve || !chokeCurve) throw new Error(`map "${map.name}" has no ${surgeCurve ? 'choke' : 'surge'} line`);
  const speedLines = map.curves.filter((c): c is CompressorCurve => c.kind === 'speed' && c.points[0]?.speed != null);
  if (speedLines.length < 2) throw new Error(`map "${map.name}" has fewer than two speed lines`);
  const bySpeed = [...speedLines].sort((a, b) => a.points[0].speed! - b.points[0].speed!);
  const topCurve = bySpeed[bySpeed.length - 1];
  return {
    surge: flowByPressureRatio(surgeCurve),
    choke: flowByPressureRatio(chokeCurve),
    top: {
      flows: Float64Array.from(topCurve.points.map((p) => p.correctedMassFlow)),
      ratios: Float64Array.from(topCurve.points.map((p) => p.pressureRatio)),
      speed: topCurve.points[0].speed!,
      line: pressureRatioByFlow(topCurve),
    },
    bottom: pressureRatioByFlow(bySpeed[0]),
    surgeEnds: bySpeed.map((c) => ({ ratio: c.points[0].pressureRatio, speed: c.points[0].speed! })),
  };
}

export interface BoundaryMargin {
  /** Signed margin, fraction of the point's corrected flow; null where the edge is not there. */
  value: number | null;
  basis: MarginBasis;
}

/** Surge margin against the surge line at the same pressure ratio. */
export function surgeMarginAt(b: MapBoundary, correctedMassFlow: number, pressureRatio: number): BoundaryMargin {
  if (pressureRatio > b.surge.xMax) return { value: null, basis: 'above-surge-line' };
  if (pressureRatio < b.surge.xMin) return { value: null, basis: 'below-surge-line' };
  const surgeFlow = b.surge.at(pressureRatio)!;
  return { value: (correctedMassFlow - surgeFlow) / correctedMassFlow, basis: 'surge-line' };
}

/**
 * The flow of the map's right edge above the choke line's top: where the top speed line comes
 * down through this pressure ratio on its choke side. Below the top line's last (choke-side)
 * point the edge runs straight down from it to the choke line's top. Null above the whole line.
 */
function topLineChokeFlow(b: MapBoundary, pressureRatio: number): number | null {
  const { flows, ratios } = b.top;
  const last = flows.length - 1;
  if (pressureRatio <= ratios[last]) return flows[last];
  // Walk from the choke end towards surge; the first segment that spans the pressure ratio is the right edge.
  for (let i = last; i > 0; i--) {
    const lo = Math.min(ratios[i - 1], ratios[i]);
    const hi = Math.max(ratios[i - 1], ratios[i]);
    if (pressureRatio >= lo && pressureRatio <= hi) {
      if (ratios[i] === ratios[i - 1]) return flows[i];
      const share = (pressureRatio - ratios[i]) / (ratios[i - 1] - ratios[i]);
      return flows[i] + share * (flows[i - 1] - flows[i]);
    }
  }
  return null;
}

/** Choke margin against the choke line, or above its top against the top speed line's choke side. */
export function chokeMarginAt(b: MapBoundary, correctedMassFlow: number, pressureRatio: number): BoundaryMargin {
  if (pressureRatio < b.choke.xMin) return { value: null, basis: 'below-choke-line' };
  if (pressureRatio <= b.choke.xMax) {
    const chokeFlow = b.choke.at(pressureRatio)!;
    return { value: (chokeFlow - correctedMassFlow) / correctedMassFlow, basis: 'choke-line' };
  }
  const edgeFlow = topLineChokeFlow(b, pressureRatio);
  if (edgeFlow === null) return { value: null, basis: 'above-map' };
  return { value: (edgeFlow - correctedMassFlow) / correctedMassFlow, basis: 'top-speed-line' };
}

/** Where a point lies against the edge, from its margins and the top and bottom speed lines. */
export type EdgeLocation = 'inside' | 'left-of-surge' | 'beyond-choke' | 'above-top-speed' | 'below-map';

export function locateAgainstBoundary(
  b: MapBoundary,
  correctedMassFlow: number,
  pressureRatio: number,
  surge: BoundaryMargin,
  choke: BoundaryMargin,
): EdgeLocation {
  if (surge.value !== null && surge.value < 0) return 'left-of-surge';
  if (choke.value !== null && choke.value < 0) return 'beyond-choke';
  if (pressureRatio > b.top.line.clamped(correctedMassFlow)) return 'above-top-speed';
  if (pressureRatio < b.bottom.clamped(correctedMassFlow)) return 'below-map';
  // Above the choke line's top but under the top line's choke side there is no choke margin only
  // when the point is above the whole map, which the test above has caught.
  return 'inside';
}

export interface BoundarySpeed {
  /** Corrected shaft speed, rpm; null where the map cannot say. */
  speed: number | null;
  basis: SpeedBasis;
}

/** N at head h from a known speed n0 at head h0, with N² linear in h through the origin. */
function speedByHead(n0: number, h0: number, h: number): number | null {
  if (!(h0 > 0) || !(h > 0)) return null;
  return n0 * Math.sqrt(h / h0);
}

/** Corrected shaft speed of a point outside the speed lines, extrapolated along the edge (see the module note). */
export function speedOutside(b: MapBoundary, correctedMassFlow: number, pressureRatio: number, location: EdgeLocation): BoundarySpeed {
  const h = isentropicHead(pressureRatio);
  const aboveTop = pressureRatio > b.top.line.clamped(correctedMassFlow);
  if (aboveTop) {
    const speed = speedByHead(b.top.speed, isentropicHead(b.top.line.clamped(correctedMassFlow)), h);
    return speed === null ? { speed: null, basis: 'outside-speed-lines' } : { speed, basis: 'above-top-speed-line' };
  }
  if (location === 'left-of-surge') {
    const ends = b.surgeEnds;
    if (pressureRatio < ends[0].ratio) return { speed: null, basis: 'below-map' };
    for (let i = 1; i < ends.length; i++) {
      if (pressureRatio <= ends[i].ratio) {
        const h0 = isentropicHead(ends[i - 1].ratio);
        const h1 = isentropicHead(ends[i].ratio);
        const n0 = ends[i - 1].speed ** 2;
        const n1 = ends[i].speed ** 2;
        const share = h1 > h0 ? (h - h0) / (h1 - h0) : 0;
        return { speed: Math.sqrt(n0 + share * (n1 - n0)), basis: 'surge-edge' };
      }
    }
    const top = ends[ends.length - 1];
    const speed = speedByHead(top.speed, isentropicHead(top.ratio), h);
    return speed === null ? { speed: null, basis: 'below-map' } : { speed, basis: 'above-top-speed-line' };
  }
  if (location === 'beyond-choke') return { speed: null, basis: 'past-choke' };
  return { speed: null, basis: 'below-map' };
}
