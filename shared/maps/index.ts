/**
 * Compressor and turbine maps: the Spoolbook map file format (read, check, write), the parsed
 * map model in SI units, interpolation on a map and the margins of an operating point.
 * Pure: no I/O; the server hands in an upload's bytes, the browser a file's text.
 */
export * from './format';
export type * from './types';
export { parseMapFile } from './parse';
export { writeMapFile } from './write';
export { compressorModelFromMap, type CompressorModelOptions } from './model';
export { triangulate, unitSquare, type TriangulatedSurface, type UnitSquare } from './interpolate';
export { mergeCoincidentPoints, COINCIDENCE_TOLERANCE, type SurfacePoint, type PointSource, type MergedPoints, type CoincidentPlace } from './coincident';
export { surfacePoints, type MapSurfacePoint } from './surface-points';
export { surgeMargin, chokeMargin, speedMargin, piecewiseLinear, type PiecewiseLinear } from './margins';
export { mapBoundary, surgeMarginAt, chokeMarginAt, speedOutside, isentropicHead, type MapBoundary, type BoundaryMargin, type BoundarySpeed } from './boundary';
export { withReference, withCompressorFileUnits, withTurbineFileUnits, withMetadata } from './convert';
export { referenceDensity } from './scales';
export { readUnit, mapValueToSI, mapValueFromSI, FLOW_PARAMETER_SI_UNIT } from './units';
export { nameProblem } from './header';
export { turbineModelFromMap, capacityNodes, type CapacityNodes } from './turbine-model';
