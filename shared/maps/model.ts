import type { CompressorModel, CompressorReading } from '../matching/compressor/model';
import { mergeCoincidentPoints } from './coincident';
import { triangulate, type TriangulatedSurface } from './interpolate';
import { chokeMarginAt, locateAgainstBoundary, mapBoundary, speedOutside, surgeMarginAt } from './boundary';
import { surfacePoints } from './surface-points';
import type { CompressorMap } from './types';

export interface CompressorModelOptions {
  /** The wheel's speed limit, rpm, overriding the map's `max speed` (a plan may set its own). */
  maxSpeed?: number | null;
}

/** The surface of one quantity: coincident points merged by one rule (coincident.ts), the rest as they are. */
function surfaceOf(map: CompressorMap, value: 'efficiency' | 'speed'): TriangulatedSurface {
  const merged = mergeCoincidentPoints(surfacePoints(map, value));
  return triangulate(merged.correctedMassFlow, merged.pressureRatio, [merged.value]);
}

const OFF_MAP: CompressorReading = {
  efficiency: null,
  shaftSpeed: null,
  surgeMargin: null,
  chokeMargin: null,
  speedMargin: null,
  location: 'off-map',
};

/** Read as the basis of a reading that is not a flow and a pressure ratio. */
const NOT_A_POINT = { surgeMarginBasis: 'no-map', chokeMarginBasis: 'no-map', speedBasis: 'no-map' } as const;

/**
 * A compressor map ready for lookups. Everything costly (two triangulations, the edge lines and a
 * grid index of starting triangles) is built here once, so that `read` costs two short triangle
 * walks and a few binary searches.
 *
 * Efficiency is interpolated from every point that carries one (speed lines and islands), shaft
 * speed from every point that carries one (speed lines). Margins are measured against the whole
 * edge of the map and, outside the speed lines, the speed is extrapolated along the edge
 * (shared/maps/boundary.ts); each reading says how. Efficiency is null outside the map, and
 * inside it where no points with efficiency surround the point.
 */
export function compressorModelFromMap(map: CompressorMap, options: CompressorModelOptions = {}): CompressorModel {
  const maxSpeed = options.maxSpeed === undefined ? map.maxSpeed : options.maxSpeed;
  if (maxSpeed !== null && !(Number.isFinite(maxSpeed) && maxSpeed > 0)) {
    throw new Error(`compressorModelFromMap: maxSpeed must be a positive number of rpm (got ${maxSpeed})`);
  }
  const boundary = mapBoundary(map);
  const efficiencySurface = surfaceOf(map, 'efficiency');
  const speedSurface = surfaceOf(map, 'speed');

  return {
    reference: { ...map.reference },
    maxSpeed,
    read(correctedMassFlow, pressureRatio) {
      if (!(Number.isFinite(correctedMassFlow) && Number.isFinite(pressureRatio) && correctedMassFlow > 0 && pressureRatio > 0)) {
        return { ...OFF_MAP, ...NOT_A_POINT };
      }
      const surge = surgeMarginAt(boundary, correctedMassFlow, pressureRatio);
      const choke = chokeMarginAt(boundary, correctedMassFlow, pressureRatio);
      const edge = locateAgainstBoundary(boundary, correctedMassFlow, pressureRatio, surge, choke);
      let location: CompressorReading['location'] = edge;
      let shaftSpeed: number | null = null;
      let speedBasis: CompressorReading['speedBasis'];
      let efficiency: number | null = null;
      if (edge === 'inside') {
        shaftSpeed = speedSurface.valueAt(correctedMassFlow, pressureRatio);
        speedBasis = 'speed-lines';
        // Inside the edges but outside the speed points' hull (where a digitised surge line runs
        // left of the speed lines' first points): the map gives no speed there.
        if (shaftSpeed === null) {
          location = 'off-map';
          speedBasis = 'outside-speed-lines';
        } else efficiency = efficiencySurface.valueAt(correctedMassFlow, pressureRatio);
      } else {
        const outside = speedOutside(boundary, correctedMassFlow, pressureRatio, edge);
        shaftSpeed = outside.speed;
        speedBasis = outside.basis;
      }
      return {
        efficiency,
        shaftSpeed,
        surgeMargin: surge.value,
        chokeMargin: choke.value,
        speedMargin: shaftSpeed === null || maxSpeed === null ? null : (maxSpeed - shaftSpeed) / maxSpeed,
        location,
        surgeMarginBasis: surge.basis,
        chokeMarginBasis: choke.basis,
        speedBasis,
      };
    },
  };
}
