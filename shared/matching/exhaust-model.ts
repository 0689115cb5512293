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
  /** Lowest and highest expansion ratio the map covers. */
  expansionRatioRange: readonly [number, number];
  /** Divide a reading's flow parameter by this to place it on the map as drawn (2 for a per-scroll map). */
  mapFlowParameterDivisor: number;
  /** In words: how the speed lines became one capacity curve and what happens outside the map. */
  capacityRule: string;
  read(expansionRatio: number): TurbineReading;
  /**
   * Optional inverse of the capacity curve: the expansion ratio at which the turbine swallows a
   * reduced flow q = ṁ·√T3/p4 = FP(ER)·ER, kg·K^0.5/(s·Pa). The engine checks the answer against
   * `read` and falls back to root finding when it is absent or off.
   */
  expansionRatioForFlow?(reducedFlow: number): number;
}
