import type { CompressorModel, CompressorReading } from '../matching/compressor-model';
import { mergeCoincidentPoints } from './coincident';
import { triangulate, type TriangulatedSurface } from './interpolate';
import { locateOnEdges, mapEdges } from './location';
import { marginLines, marginsAt } from './margins';
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

/**
 * A compressor map ready for lookups. Everything costly (two triangulations, the edge lines and a
 * grid index of starting triangles) is built here once, so that `read` costs two short triangle
 * walks and a few binary searches.
 *
 * Efficiency is interpolated from every point that carries one (speed lines and islands), shaft
 * speed from every point that carries one (speed lines). Both are null off the map, and efficiency
 * is also null inside the map where no points with efficiency surround the point.
 */
export function compressorModelFromMap(map: CompressorMap, options: CompressorModelOptions = {}): CompressorModel {
  const maxSpeed = options.maxSpeed === undefined ? map.maxSpeed : options.maxSpeed;
  if (maxSpeed !== null && !(Number.isFinite(maxSpeed) && maxSpeed > 0)) {
    throw new Error(`compressorModelFromMap: maxSpeed must be a positive number of rpm (got ${maxSpeed})`);
  }
  const lines = marginLines(map);
  const edges = mapEdges(map, lines);
  const efficiencySurface = surfaceOf(map, 'efficiency');
  const speedSurface = surfaceOf(map, 'speed');

  return {
    reference: { ...map.reference },
    maxSpeed,
    read(correctedMassFlow, pressureRatio) {
      if (!(Number.isFinite(correctedMassFlow) && Number.isFinite(pressureRatio) && correctedMassFlow > 0 && pressureRatio > 0)) {
        return { ...OFF_MAP };
      }
      let location = locateOnEdges(edges, correctedMassFlow, pressureRatio) as CompressorReading['location'];
      let shaftSpeed: number | null = null;
      let efficiency: number | null = null;
      if (location === 'inside') {
        shaftSpeed = speedSurface.valueAt(correctedMassFlow, pressureRatio);
        // Inside the edges but outside the speed points' hull (where a digitised surge line runs
        // left of the speed lines' first points): the map gives no speed there.
        if (shaftSpeed === null) location = 'off-map';
        else efficiency = efficiencySurface.valueAt(correctedMassFlow, pressureRatio);
      }
      return { efficiency, shaftSpeed, ...marginsAt(lines, correctedMassFlow, pressureRatio, shaftSpeed, maxSpeed), location };
    },
  };
}
