/**
 * Compressor and turbine maps: the Spoolbook map file format (read, check, write), the parsed
 * map model in SI units, interpolation on a map and the margins of an operating point.
 * Pure: no I/O; the server hands in an upload's bytes, the browser a file's text. This index
 * names what other layers use; the modules themselves hold the rest.
 */
export { MAX_MAP_DATA_ROWS, MAX_MAP_FILE_BYTES } from './format';
export { parseMapFile } from './parse';
export { writeMapFile } from './write';
export { compressorModelFromMap } from './model';
export { triangulate } from './interpolate';
export { mergeCoincidentPoints, COINCIDENCE_TOLERANCE, type SurfacePoint } from './coincident';
export { isentropicHead } from './boundary';
export { withReference, withCompressorFileUnits, withMetadata } from './convert';
export { mapValueFromSI } from './units';
export { turbineModelFromMap, capacityNodes } from './turbine-model';
