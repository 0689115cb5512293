/** A Plan: the hardware being judged (compressor, how many turbochargers, the wheel's limit, the exhaust side). */
import { z } from 'zod';
import { exhaustSchema } from './exhaust';
import { count, fraction, name, num, temperature } from './fields';

/** Reference conditions of corrected flow. */
export const mapReferenceSchema = z.strictObject({
  /** K */
  temperature: temperature('reference temperature'),
  /** Pa absolute */
  pressure: num('reference pressure')
    .min(10_000, 'reference pressure is absolute, in Pa: at least 10 000 Pa')
    .max(200_000, 'reference pressure is absolute, in Pa: at most 200 000 Pa'),
});

export const planSchema = z.strictObject({
  name: name('plan name'),
  /** Number of identical turbochargers sharing the airflow in parallel. */
  turbochargers: count('turbochargers', 8),
  /**
   * Compressor isentropic efficiency, fraction: used when there is no map, where the map gives no
   * efficiency at a point it can deliver (below the lowest speed line), and to place a point the
   * compressor cannot deliver on the map (its results are then not shown).
   */
  compressorEfficiency: fraction('compressor efficiency'),
  /**
   * An explicit assumption, fraction: the compressor's efficiency past its choke line, above its map
   * or outside its speed lines. Set, such points are computed and counted on it (and the findings
   * name it); absent, they are not reachable and give no results.
   */
  offMapEfficiency: fraction('off-map efficiency').optional(),
  /** The wheel's rated speed limit, rpm, when known (the lower of this and the map's applies). */
  maxShaftSpeed: num('max shaft speed').gt(0, 'max shaft speed must be above 0 rpm').max(500_000, 'max shaft speed must be at most 500 000 rpm').optional(),
  /** Reference of corrected flow when no compressor model is supplied; ISA sea level when absent. */
  mapReference: mapReferenceSchema.optional(),
  /** The exhaust side; absent judges the Plan on the compressor alone. */
  exhaust: exhaustSchema.optional(),
});
export type PlanInput = z.output<typeof planSchema>;
