import type { SurfacePoint } from './coincident';
import type { CompressorMap } from './types';

/** A point that feeds a surface, and where it is in the map (curve index, point index along the curve). */
export interface MapSurfacePoint extends SurfacePoint {
  curve: number;
  point: number;
}

/**
 * The points of a compressor map that a surface of `quantity` is interpolated from, in map order:
 *  - efficiency: every speed-line point that gives one, and every island point;
 *  - speed: every speed-line point (the speed lines are what carry the shaft speed).
 * Surge and choke rows, and speeds written on island rows, are kept in the file but not read.
 * An island's closing point (its first point repeated at the end) is left out: it adds no place.
 */
export function surfacePoints(map: CompressorMap, quantity: 'efficiency' | 'speed'): MapSurfacePoint[] {
  const found: MapSurfacePoint[] = [];
  for (let c = 0; c < map.curves.length; c++) {
    const { kind, points } = map.curves[c];
    if (kind !== 'speed' && !(kind === 'island' && quantity === 'efficiency')) continue;
    const source = kind === 'speed' ? 'speed-line' : 'island';
    // An island's closing point repeats its first: it adds no place.
    const end = kind === 'island' && points.length > 1 && samePlace(points[points.length - 1], points[0]) ? points.length - 1 : points.length;
    for (let i = 0; i < end; i++) {
      const p = points[i];
      const value = p[quantity];
      if (value !== null) found.push({ correctedMassFlow: p.correctedMassFlow, pressureRatio: p.pressureRatio, value, source, curve: c, point: i });
    }
  }
  return found;
}

function samePlace(a: { correctedMassFlow: number; pressureRatio: number }, b: { correctedMassFlow: number; pressureRatio: number }): boolean {
  return a.correctedMassFlow === b.correctedMassFlow && a.pressureRatio === b.pressureRatio;
}
