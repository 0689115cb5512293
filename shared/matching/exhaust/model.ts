/**
 * What the exhaust side needs of a turbine map: its swallowing capacity and efficiency as
 * functions of expansion ratio. The maps module builds one from a map file
 * (`turbineModelFromMap`); tests may hand in their own.
 */

/** Where an expansion ratio lies against the map's range. */
export type TurbineLocation = 'inside' | 'below-map' | 'above-map';

/** What a turbine map says at one expansion ratio. */
export interface TurbineReading {
  /**
   * Flow parameter of the whole turbine (both scrolls of a divided housing together),
   * ṁ·√T3/p3 in kg·K^0.5/(s·Pa). Zero at ER ≤ 1.
   */
  flowParameter: number;
  /** Turbine isentropic efficiency, fraction; null when the map gives none. */
  efficiency: number | null;
  location: TurbineLocation;
}

export type TurbineHousing = 'single' | 'divided';

/** What a turbine map's efficiency counts: with the bearings' losses, or the wheel's aerodynamic efficiency alone. */
export type TurbineEfficiencyKind = 'with-bearing-losses' | 'aerodynamic';

/**
 * How a turbine reading used the shaft speed: between the speed lines around it, held at the
 * lowest or the top line outside them, or the mean of the lines where no shaft speed is known.
 */
export type TurbineSpeedBasis = 'speed-lines' | 'held-at-lowest-line' | 'held-at-top-line' | 'mean-of-lines';

/** The turbine map at one shaft speed: a reading and its inverse, as TurbineModel's, and how the speed was used. */
export interface TurbineAtSpeed {
  read(expansionRatio: number): TurbineReading;
  expansionRatioForFlow?(reducedFlow: number): number;
  speedBasis: Exclude<TurbineSpeedBasis, 'mean-of-lines'>;
  /** The shaft speed read at, rpm. */
  shaftSpeed: number;
  /** The speed lines read (the same line twice when one is held), rpm. */
  lowerSpeed: number;
  upperSpeed: number;
  /** The efficiency each of the two lines gives at an expansion ratio (held at the map's ends); null where a line gives none. */
  linesAt(expansionRatio: number): { lowerEfficiency: number | null; upperEfficiency: number | null };
}

/** A turbine map ready for lookups. */
export interface TurbineModel {
  /** The map's name, for the Working. */
  name: string | null;
  /** The housing the map was measured on. */
  housing: TurbineHousing;
  /** Divided housings: the map's flow is for both scrolls fed together, or for one scroll. */
  scrollFeed: 'both' | 'per-scroll' | null;
  /** Housing A/R as printed on the map; null when not given. */
  areaRatio: number | null;
  /** What the map's efficiency counts; null (or absent) when the map does not say: read as aerodynamic only. */
  efficiencyKind?: TurbineEfficiencyKind | null;
  /** Speeds of the lines the map can be read at, slowest first, rpm (absent or empty: none). */
  speedLines?: readonly number[];
  /** Lowest and highest expansion ratio the map covers. */
  expansionRatioRange: readonly [number, number];
  /** Divide a reading's flow parameter by this to place it on the map as drawn (2 for a per-scroll map). */
  mapFlowParameterDivisor: number;
  /** In words: how the speed lines became one capacity curve and what happens outside the map. */
  capacityRule: string;
  /** The reading without a shaft speed (the mean of the lines). */
  read(expansionRatio: number): TurbineReading;
  /** The map at a shaft speed, rpm; absent when the map's lines carry no speed. */
  atSpeed?(shaftSpeed: number): TurbineAtSpeed;
  /**
   * Optional inverse of the capacity curve: the expansion ratio at which the turbine swallows a
   * reduced flow q = ṁ·√T3/p4 = FP(ER)·ER, kg·K^0.5/(s·Pa). The engine checks the answer against
   * `read` and falls back to root finding when it is absent or off.
   */
  expansionRatioForFlow?(reducedFlow: number): number;
}
