/**
 * Why a point's surge, choke or speed margin is missing, in words: the Working, the results table
 * and the map's hover text all say it the same way.
 */
import type { PointValues } from '../result';

/** Why a margin is missing, by the basis the engine gives for it (MarginBasis, SpeedBasis, 'no-limit'). */
const MISSING_MARGIN_WORDS: Record<string, string> = {
  'above-surge-line': "the point is above the surge line's top, where the map does not say where surge lies",
  'below-surge-line': "the point is below the surge line's lowest pressure ratio, where the map draws no surge line",
  'below-choke-line': "the point is below the choke line's lowest pressure ratio, where the map draws no choke line",
  'above-map': 'the point is above the whole map, where it has no edge at this pressure ratio',
  'no-map': 'there is no map',
  'past-choke': 'the map gives no speed past its choke line',
  'below-map': 'the wheel turns slower than the lowest speed line, which the map does not draw',
  'outside-speed-lines': 'the map gives no speed outside its speed lines',
  'no-limit': 'neither the map nor the Plan gives a speed limit',
};

export type MarginName = 'surge' | 'choke' | 'speed';

const MARGIN_KEYS = { surge: 'surgeMargin', choke: 'chokeMargin', speed: 'speedMargin' } as const;

/** Why one margin of a point is missing; null when the margin is there, or nothing says why. */
export function missingMarginWords(v: PointValues, margin: MarginName): string | null {
  if (v[MARGIN_KEYS[margin]] !== null || !v.marginBasis) return null;
  return MISSING_MARGIN_WORDS[v.marginBasis[margin]] ?? 'the map cannot say';
}
