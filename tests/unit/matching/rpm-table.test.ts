import { describe, expect, it } from 'vitest';
import { lookupByRpm, rpmPointsOf, valueAtRpm } from '#shared/matching/rpm-table';

const table = [
  { rpm: 2000, value: 0.8 },
  { rpm: 4000, value: 1.0 },
  { rpm: 6000, value: 0.9 },
];

describe('tables by rpm', () => {
  it('interpolates linearly between rows', () => {
    expect(valueAtRpm(table, 3000)).toBeCloseTo(0.9, 12); // midway between 0.8 and 1.0 (definition of linear interpolation)
    expect(valueAtRpm(table, 5500)).toBeCloseTo(0.925, 12); // 1.0 + (0.9 − 1.0)·0.75 (definition)
  });

  it('holds the end values flat outside the table and says so', () => {
    expect(lookupByRpm(table, 1000)).toMatchObject({ value: 0.8, held: 'below' }); // held flat by design
    expect(lookupByRpm(table, 9000)).toMatchObject({ value: 0.9, held: 'above' }); // held flat by design
    expect(lookupByRpm(table, 4000)).toMatchObject({ value: 1.0, held: null }); // exact row (definition)
    expect(valueAtRpm([{ rpm: 3000, value: 2 }], 9000)).toBe(2); // one row: constant (definition)
  });

  it('lists rpm points from a range including the end when the steps land on it', () => {
    expect(rpmPointsOf({ kind: 'range', min: 1000, max: 2000, step: 250 })).toEqual([1000, 1250, 1500, 1750, 2000]); // arithmetic
    expect(rpmPointsOf({ kind: 'range', min: 1000, max: 1900, step: 250 })).toEqual([1000, 1250, 1500, 1750]); // arithmetic
    expect(rpmPointsOf({ kind: 'range', min: 1000, max: 1000.3, step: 0.1 })).toHaveLength(4); // 1000, 1000.1, 1000.2, 1000.3 despite rounding
    expect(rpmPointsOf({ kind: 'list', values: [3000, 5000] })).toEqual([3000, 5000]); // as given
  });
});
