/** What the compressor side says of a point, besides its numbers: where it sits and how its margins were found. */
import type { MarginBasis, SpeedBasis } from './model';

/**
 * Where a point sits for the builder: on the map, or where the compressor cannot deliver it (left
 * of surge, past choke, over the speed limit, above the map, outside the speed lines), or below the
 * map (a light load the compressor meets turning slower than its lowest line).
 */
export type MapRegion = 'on-map' | 'below-map' | 'left-of-surge' | 'past-choke' | 'over-speed' | 'above-map' | 'outside-speed-lines';

/** How a margin or speed of a point was found (see MarginBasis, SpeedBasis); 'no-limit' when no speed limit is given. */
export interface PointMarginBasis {
  surge: MarginBasis;
  choke: MarginBasis;
  speed: SpeedBasis | 'no-limit';
}

/** Where the compressor efficiency of a point came from; 'off-map-assumption' is the Plan's explicit off-map figure. */
export type EfficiencySource = 'map' | 'plan' | 'point' | 'off-map-assumption';
