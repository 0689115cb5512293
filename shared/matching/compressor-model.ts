/** Reference conditions of a compressor map's corrected flow: K and Pa absolute. */
export interface MapReference { temperature: number; pressure: number }
export type MapLocation = 'inside' | 'left-of-surge' | 'beyond-choke' | 'above-top-speed' | 'below-map' | 'off-map';
/** What a compressor map says at one (corrected mass flow, pressure ratio). */
export interface CompressorReading {
  /** Isentropic efficiency, fraction; null when the point is off the map. */
  efficiency: number | null;
  /** Shaft speed, rpm; null when off the map. */
  shaftSpeed: number | null;
  /** (ṁc − ṁc,surge(PR)) / ṁc; null when the map has no surge line at this PR. */
  surgeMargin: number | null;
  /** (ṁc,choke(PR) − ṁc) / ṁc; null when the map has no choke limit at this PR. */
  chokeMargin: number | null;
  /** (Nmax − N) / Nmax; null when the map has no max speed or the speed is unknown. */
  speedMargin: number | null;
  location: MapLocation;
}
/** A compressor map ready for lookups (the maps module builds one from a map file). */
export interface CompressorModel {
  reference: MapReference;
  /** The wheel's rated speed limit, rpm, when the map or plan gives one. */
  maxSpeed: number | null;
  read(correctedMassFlow: number, pressureRatio: number): CompressorReading;
}
