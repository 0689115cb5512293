import type { MapLocation } from '../matching/compressor-model';
import { pressureRatioByFlow, type MarginLines, type PiecewiseLinear } from './margins';
import type { CompressorMap } from './types';

/**
 * Where a point lies against the edges of a compressor map, tested in this order so that the
 * finding that matters most wins where two apply:
 *   1. left of the surge line (flow below the surge flow at this PR; the line held level above its top),
 *   2. beyond the choke limit (flow above the choke flow at this PR; held level beyond its ends),
 *   3. above the top speed line (PR above it at this flow),
 *   4. below the lowest speed line,
 * otherwise inside. Below the surge line's lowest PR the surge test does not apply: a point
 * there is below the map, not in surge.
 */
export interface MapEdges {
  lines: MarginLines;
  topSpeedLine: PiecewiseLinear;
  bottomSpeedLine: PiecewiseLinear;
}

export function mapEdges(map: CompressorMap, lines: MarginLines): MapEdges {
  const speedLines = map.curves.filter((c) => c.kind === 'speed' && c.points[0]?.speed != null);
  if (speedLines.length < 2) throw new Error(`map "${map.name}" has fewer than two speed lines`);
  const bySpeed = [...speedLines].sort((a, b) => a.points[0].speed! - b.points[0].speed!);
  return {
    lines,
    topSpeedLine: pressureRatioByFlow(bySpeed[bySpeed.length - 1]),
    bottomSpeedLine: pressureRatioByFlow(bySpeed[0]),
  };
}

export function locateOnEdges(edges: MapEdges, correctedMassFlow: number, pressureRatio: number): Exclude<MapLocation, 'off-map'> {
  const { surge, choke } = edges.lines;
  if (pressureRatio >= surge.xMin && correctedMassFlow < surge.clamped(pressureRatio)) return 'left-of-surge';
  if (correctedMassFlow > choke.clamped(pressureRatio)) return 'beyond-choke';
  if (pressureRatio > edges.topSpeedLine.clamped(correctedMassFlow)) return 'above-top-speed';
  if (pressureRatio < edges.bottomSpeedLine.clamped(correctedMassFlow)) return 'below-map';
  return 'inside';
}
