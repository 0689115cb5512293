import { ISA_SEA_LEVEL_PRESSURE, ISA_SEA_LEVEL_TEMPERATURE } from '#shared/physics/atmosphere';

/** Reference conditions of a compressor map's corrected flow: K and Pa absolute. */
export interface MapReference {
  temperature: number;
  pressure: number;
}
/** Standard-day sea level: the corrected-flow reference when no map or Plan names one. */
export const STANDARD_REFERENCE: MapReference = { temperature: ISA_SEA_LEVEL_TEMPERATURE, pressure: ISA_SEA_LEVEL_PRESSURE };
/** Where a point lies against the edges of the map (geometry only; speed limits are judged by the engine). */
export type MapLocation = 'inside' | 'left-of-surge' | 'beyond-choke' | 'above-top-speed' | 'below-map' | 'off-map';

/**
 * What a surge or choke margin was measured against, or why there is none (docs/physics.md,
 * "Margins"): 'surge-line', 'choke-line' and 'top-speed-line' are measurements; the rest say why
 * the map cannot give the margin at the point's pressure ratio.
 */
export type MarginBasis =
  'surge-line' | 'choke-line' | 'top-speed-line' | 'above-surge-line' | 'below-surge-line' | 'below-choke-line' | 'above-map' | 'no-map';

/**
 * Where a shaft speed comes from: read between the speed lines, extrapolated along the map's edge
 * (above the top speed line, or at the surge edge left of the surge line), or why there is none.
 */
export type SpeedBasis = 'speed-lines' | 'above-top-speed-line' | 'surge-edge' | 'past-choke' | 'below-map' | 'outside-speed-lines' | 'no-map';

/** What a compressor map says at one (corrected mass flow, pressure ratio). */
export interface CompressorReading {
  /** Isentropic efficiency, fraction; null when the point is off the map. */
  efficiency: number | null;
  /** Corrected shaft speed, rpm, read between the speed lines or extrapolated along the edge (see `speedBasis`); null when the map cannot say. */
  shaftSpeed: number | null;
  /** (ṁc − ṁc,surge(PR)) / ṁc; null when the map has no surge line at this PR. */
  surgeMargin: number | null;
  /** (ṁc,edge(PR) − ṁc) / ṁc against the choke line or the top speed line above it; null when the map has no edge at this PR. */
  chokeMargin: number | null;
  /** (Nmax − N) / Nmax at the map's reference; null when the map has no max speed or the speed is unknown. */
  speedMargin: number | null;
  location: MapLocation;
  /** How each margin was found; absent from models that do not say (read as measured, or unknown when null). */
  surgeMarginBasis?: MarginBasis;
  chokeMarginBasis?: MarginBasis;
  speedBasis?: SpeedBasis;
}
/** A compressor map ready for lookups (the maps module builds one from a map file). */
export interface CompressorModel {
  reference: MapReference;
  /** The wheel's rated speed limit, rpm, when the map or plan gives one. */
  maxSpeed: number | null;
  read(correctedMassFlow: number, pressureRatio: number): CompressorReading;
}
