import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { ExhaustLineSummary } from '#shared/matching/exhaust/result';
import type { Finding, Severity } from '#shared/matching/finding';
import type { OperatingPoint, PointValues } from '#shared/matching/result';
import {
  bestIndicesOf,
  COMPARE_ROW_KEYS,
  compareLines,
  compareRowKeys,
  EXHAUST_ROW_KEYS,
  type CompareRow,
  type CompareRowKey,
  type ComparableLine,
} from '#shared/study/compare';

// Tiny synthetic lines: only the values compareLines reads are set on purpose; the rest are
// filler of the right type. Every expected number below is hand-read from these points.

const filler: PointValues = {
  rpm: 0,
  volumetricEfficiency: 0.9,
  boost: 100_000,
  lambda: 0.85,
  ambientPressure: 101_325,
  ambientTemperature: 293.15,
  compressorInletPressure: 99_000,
  compressorInletTemperature: 293.15,
  inletDensity: 1.18,
  manifoldPressure: 201_325,
  manifoldTemperature: 320,
  airDensity: 2.19,
  engineMassFlow: 0.15,
  massFlow: 0.15,
  correctedMassFlow: 0.15,
  inletVolumeFlow: 0.13,
  compressorOutletPressure: 210_000,
  pressureRatio: 2,
  throttled: false,
  compressorEfficiency: 0.72,
  efficiencySource: 'map',
  isentropicOutletTemperature: 357,
  compressorOutletTemperature: 382,
  compressorPower: 13_000,
  iterations: 3,
  converged: true,
  mapLocation: 'inside',
  correctedShaftSpeed: null,
  shaftSpeed: null,
  surgeMargin: null,
  chokeMargin: null,
  speedMargin: null,
  maxShaftSpeed: null,
  stoichiometricAfr: 14.7,
  lowerHeatingValue: 44e6,
  fuelDensity: 745,
  fuelMassFlow: 0.012,
  fuelVolumeFlow: 1.6e-5,
  brakeThermalEfficiency: 0.33,
  brakePower: null,
  wheelPower: null,
  torque: null,
  apparentBsfc: 7e-8,
  injectorPressureDifference: 300_000,
  injectorStage: 'primary',
  injectorCapacity: 6e-5,
  injectorDuty: null,
  railPressure: 400_000,
  pumpFlowRequired: 1.6e-5,
};

function finding(severity: Severity, rpm: number): Finding {
  return { code: 'input-out-of-range', severity, message: `${severity} at ${rpm}`, rpm };
}

function solved(rpm: number, values: Partial<PointValues>, findings: Severity[] = []): OperatingPoint {
  return { solved: true, rpm, values: { ...filler, rpm, ...values }, findings: findings.map((s) => finding(s, rpm)) };
}

function unsolved(rpm: number, findings: Severity[]): OperatingPoint {
  return { solved: false, rpm, values: null, findings: findings.map((s) => finding(s, rpm)) };
}

/** Plan A on a map: margins shrink towards 5000 rpm, choke tightest at 7000 rpm. */
const lineA: ComparableLine = {
  points: [
    solved(
      3000,
      {
        surgeMargin: 0.2,
        chokeMargin: 0.5,
        speedMargin: 0.3,
        shaftSpeed: 100_000,
        brakePower: 100_000,
        wheelPower: 85_000,
        torque: 318,
        injectorDuty: 0.5,
        compressorOutletTemperature: 380,
        pressureRatio: 1.8,
      },
      ['info'],
    ),
    solved(
      5000,
      {
        surgeMargin: 0.12,
        chokeMargin: 0.25,
        speedMargin: 0.1,
        shaftSpeed: 135_000,
        brakePower: 180_000,
        wheelPower: 153_000,
        torque: 344,
        injectorDuty: 0.82,
        compressorOutletTemperature: 420,
        pressureRatio: 2.4,
      },
      ['warning'],
    ),
    solved(7000, {
      surgeMargin: 0.3,
      chokeMargin: 0.05,
      speedMargin: 0.12,
      shaftSpeed: 132_000,
      brakePower: 170_000,
      wheelPower: 144_500,
      torque: 232,
      injectorDuty: 0.78,
      compressorOutletTemperature: 415,
      pressureRatio: 2.35,
    }),
  ],
};

/** Plan B on another map: left of surge at 3000 rpm, and the 7000 rpm point could not be solved. */
const lineB: ComparableLine = {
  points: [
    solved(
      3000,
      {
        surgeMargin: -0.05,
        chokeMargin: 0.6,
        speedMargin: 0.4,
        shaftSpeed: 90_000,
        brakePower: 95_000,
        wheelPower: 80_750,
        torque: 302,
        injectorDuty: 0.45,
        compressorOutletTemperature: 375,
        pressureRatio: 1.75,
      },
      ['limit', 'info'],
    ),
    solved(
      5000,
      {
        surgeMargin: 0.15,
        chokeMargin: 0.35,
        speedMargin: 0.2,
        shaftSpeed: 120_000,
        brakePower: 190_000,
        wheelPower: 161_500,
        torque: 363,
        injectorDuty: 0.86,
        compressorOutletTemperature: 430,
        pressureRatio: 2.45,
      },
      ['limit'],
    ),
    unsolved(7000, ['limit']),
  ],
};

/** Plan C without a map: no margins, no shaft speed; its power peaks twice (first one counts). */
const lineC: ComparableLine = {
  points: [
    solved(4000, { brakePower: 150_000, wheelPower: 127_500, torque: 358, injectorDuty: 0.7, compressorOutletTemperature: 400, pressureRatio: 2.1 }, [
      'warning',
      'warning',
    ]),
    solved(6000, { brakePower: 150_000, wheelPower: 127_500, torque: 239, injectorDuty: 0.75, compressorOutletTemperature: 405, pressureRatio: 2.1 }),
  ],
};

function row(rows: CompareRow[], key: CompareRowKey): CompareRow {
  const found = rows.find((r) => r.key === key);
  if (!found) throw new Error(`no row ${key}`);
  return found;
}

describe('compareLines on three hand-made lines', () => {
  const rows = compareLines([lineA, lineB, lineC]);
  const values = (key: CompareRowKey) => row(rows, key).cells.map((c) => c.value);
  const rpms = (key: CompareRowKey) => row(rows, key).cells.map((c) => c.rpm);
  const best = (key: CompareRowKey) => row(rows, key).bestIndices;

  it('gives every row once, in the documented order', () => {
    expect(rows.map((r) => r.key)).toEqual(COMPARE_ROW_KEYS);
    for (const r of rows) {
      expect(r.cells).toHaveLength(3);
      expect(r.bestMeaning.length).toBeGreaterThan(0);
    }
  });

  it('takes the smallest margins and where they occur, and marks no value found past a limit', () => {
    // Hand-read: A's smallest surge margin 0.12 at 5000 rpm, B's −0.05 at 3000 rpm, C has no map.
    expect(values('minSurgeMargin')).toEqual([0.12, -0.05, null]);
    expect(rpms('minSurgeMargin')).toEqual([5000, 3000, null]);
    expect(best('minSurgeMargin')).toEqual([0]); // highest margin wins: A (hand-read)
    expect(row(rows, 'minSurgeMargin').cells[1].excluded).toBe(true); // negative: past the surge line
    // Hand-read: A's smallest choke margin 0.05 at 7000 rpm; B's 0.35 at 5000 rpm (7000 unsolved).
    expect(values('minChokeMargin')).toEqual([0.05, 0.35, null]);
    expect(rpms('minChokeMargin')).toEqual([7000, 5000, null]);
    // B's 0.35 is found at a point with a finding at a limit: never best; A is the best of the rest (design).
    expect(row(rows, 'minChokeMargin').cells[1].excluded).toBe(true);
    expect(best('minChokeMargin')).toEqual([0]);
    // Hand-read: speed margins 0.10 (A, 5000 rpm) and 0.20 (B, 5000 rpm, at a limit).
    expect(values('minSpeedMargin')).toEqual([0.1, 0.2, null]);
    expect(best('minSpeedMargin')).toEqual([0]);
  });

  it('takes the peaks, lowest wins for speed, duty, temperature and pressure ratio', () => {
    // Hand-read: peak shaft speed 135 000 rpm (A) and 120 000 rpm (B, at a limit): A is the only eligible one.
    expect(values('peakShaftSpeed')).toEqual([135_000, 120_000, null]);
    expect(best('peakShaftSpeed')).toEqual([0]);
    // Hand-read: peak injector duty 0.82, 0.86, 0.75; lowest wins: C.
    expect(values('peakInjectorDuty')).toEqual([0.82, 0.86, 0.75]);
    expect(best('peakInjectorDuty')).toEqual([2]);
    // Hand-read: peak compressor outlet temperature 420 K, 430 K, 405 K; lowest wins: C.
    expect(values('peakCompressorOutletTemperature')).toEqual([420, 430, 405]);
    expect(best('peakCompressorOutletTemperature')).toEqual([2]);
    // Hand-read: peak pressure ratio 2.4, 2.45, 2.1; lowest wins: C.
    expect(values('peakPressureRatio')).toEqual([2.4, 2.45, 2.1]);
    expect(best('peakPressureRatio')).toEqual([2]);
  });

  it('takes peak power, its rpm (first point on a tie within a line) and peak torque', () => {
    // Hand-read: peak crank power 180 kW at 5000 rpm (A), 190 kW at 5000 rpm (B), 150 kW first at 4000 rpm (C).
    expect(values('peakBrakePower')).toEqual([180_000, 190_000, 150_000]);
    expect(rpms('peakBrakePower')).toEqual([5000, 5000, 4000]);
    expect(best('peakBrakePower')).toEqual([0]); // B's is at a limit: A is highest of the rest (hand-read)
    expect(values('peakBrakePowerRpm')).toEqual([5000, 5000, 4000]); // hand-read, as above
    expect(best('peakBrakePowerRpm')).toEqual([]); // no best by definition of the row
    // Hand-read: peak wheel power 153 kW, 161.5 kW (at a limit), 127.5 kW; peak torque 344, 363 (at a limit), 358 N·m.
    expect(values('peakWheelPower')).toEqual([153_000, 161_500, 127_500]);
    expect(best('peakWheelPower')).toEqual([0]);
    expect(values('peakTorque')).toEqual([344, 363, 358]);
    expect(best('peakTorque')).toEqual([2]);
  });

  it('counts points by their worst finding, solved or not', () => {
    // Hand-counted: A's points are info / warning / none; B's limit+info / limit / limit (unsolved); C's warning×2 / none.
    expect(values('pointsAtLimit')).toEqual([0, 3, 0]);
    expect(best('pointsAtLimit')).toEqual([0, 2]); // fewest, tie between A and C (hand-counted)
    expect(values('pointsWithWarnings')).toEqual([1, 0, 1]);
    expect(best('pointsWithWarnings')).toEqual([1]);
    expect(values('pointsWithNotes')).toEqual([1, 0, 0]);
    expect(best('pointsWithNotes')).toEqual([1, 2]);
    expect(rpms('pointsAtLimit')).toEqual([null, null, null]); // counts have no rpm (definition)
  });
});

describe('compareLines with plan verdicts', () => {
  const fits: ComparableLine = { ...lineA, planVerdict: 'fits' };
  const unfit: ComparableLine = { points: [solved(3000, { surgeMargin: 0.4, brakePower: 250_000 })], planVerdict: 'does-not-fit' };

  it("gives the verdict row first, with each line's plan verdict", () => {
    const rows = compareLines([fits, unfit, lineC]);
    expect(rows[0].key).toBe('planVerdict');
    expect(rows[0].cells.map((c) => c.verdict)).toEqual(['fits', 'does-not-fit', 'not-judged']);
    expect(rows[0].bestIndices).toEqual([]);
  });

  it('never marks a cell of a plan that does not fit, however good its value', () => {
    const rows = compareLines([fits, unfit]);
    // Hand-read: the unfit line has the higher surge margin (0.4 against 0.12) and power (250 against 180 kW).
    expect(row(rows, 'minSurgeMargin').bestIndices).toEqual([0]);
    expect(row(rows, 'peakBrakePower').bestIndices).toEqual([0]);
    for (const r of rows) expect(r.bestIndices).not.toContain(1);
  });

  it('takes peaks over reachable points only', () => {
    const line: ComparableLine = {
      points: [solved(3000, { brakePower: 100_000 }), solved(7000, { brakePower: 300_000, reachable: false })],
    };
    // Hand-read: the 300 kW point cannot be delivered, so the peak is the 100 kW at 3000 rpm.
    expect(row(compareLines([line]), 'peakBrakePower').cells[0]).toMatchObject({ value: 100_000, rpm: 3000 });
  });
});

describe('marking the best cell', () => {
  const cells = (...values: (number | null)[]) => values.map((value) => ({ value, rpm: null }));

  it('marks nothing when all values are the same, or fewer than two lines give one', () => {
    expect(bestIndicesOf(cells(0.2, 0.2), 'highest')).toEqual([]); // definition: nothing to choose
    expect(bestIndicesOf(cells(0.2, null, null), 'highest')).toEqual([]); // definition: one value is no comparison
    expect(bestIndicesOf(cells(null, null), 'lowest')).toEqual([]);
  });

  it('marks every tied winner, and treats engine rounding as a tie', () => {
    expect(bestIndicesOf(cells(3, 1, 3, 2), 'highest')).toEqual([0, 2]); // hand-read
    expect(bestIndicesOf(cells(1 + 1e-12, 1, 2), 'lowest')).toEqual([0, 1]); // 1e-12 is below the 1e-9 tie tolerance
    expect(bestIndicesOf(cells(1 + 1e-6, 1, 2), 'lowest')).toEqual([1]); // 1e-6 is above it
  });

  it('never marks a "none" row', () => {
    expect(bestIndicesOf(cells(1, 2, 3), 'none')).toEqual([]);
  });
});

describe('compareLines on edge cases', () => {
  it('skips values that are not finite and lines whose points are all unsolved', () => {
    const weird: ComparableLine = { points: [solved(3000, { brakePower: Number.NaN }), solved(4000, { brakePower: 90_000 })] };
    const dead: ComparableLine = { points: [unsolved(3000, ['limit'])] };
    const rows = compareLines([weird, dead]);
    // Hand-read: NaN at 3000 rpm is skipped, 90 kW at 4000 rpm remains; the dead line has no value.
    expect(row(rows, 'peakBrakePower').cells).toEqual([
      { value: 90_000, rpm: 4000 },
      { value: null, rpm: null },
    ]);
    expect(row(rows, 'peakBrakePower').bestIndices).toEqual([]); // only one value: no comparison (definition)
    expect(row(rows, 'pointsAtLimit').cells.map((c) => c.value)).toEqual([0, 1]); // hand-counted
  });

  it('returns the rows with no cells for no lines', () => {
    const rows = compareLines([]);
    expect(rows.map((r) => r.key)).toEqual(COMPARE_ROW_KEYS);
    for (const r of rows) expect(r.cells).toEqual([]);
  });
});

describe('compareLines properties', () => {
  const maybe = fc.option(fc.double({ min: -1, max: 3, noNaN: true }), { nil: null });
  const pointArb = fc.record({ rpm: fc.integer({ min: 1000, max: 9000 }), surge: maybe, power: maybe });
  const lineArb = fc.array(pointArb, { minLength: 0, maxLength: 6 }).map((ps) => ({
    points: ps.map((p) => solved(p.rpm, { surgeMargin: p.surge, brakePower: p.power })),
  }));

  it('each cell is the plain minimum or maximum of its line, and the marked cells hold the best of them', () => {
    fc.assert(
      fc.property(fc.array(lineArb, { minLength: 1, maxLength: 4 }), (lines) => {
        const rows = compareLines(lines);
        const surge = row(rows, 'minSurgeMargin');
        const power = row(rows, 'peakBrakePower');
        lines.forEach((line, i) => {
          const surges = line.points.map((p) => p.values!.surgeMargin).filter((x): x is number => x !== null);
          const powers = line.points.map((p) => p.values!.brakePower).filter((x): x is number => x !== null);
          // Definition of the row: Math.min / Math.max over the values present, null when none.
          expect(surge.cells[i].value).toBe(surges.length ? Math.min(...surges) : null);
          expect(power.cells[i].value).toBe(powers.length ? Math.max(...powers) : null);
        });
        // A negative margin is past the surge line: never marked (design); the best is taken among the rest.
        const given = surge.cells.map((c) => c.value).filter((x): x is number => x !== null && x >= 0);
        for (const i of surge.bestIndices) expect(surge.cells[i].value!).toBeGreaterThanOrEqual(0);
        // Highest margin wins (definition), ties within the 1e-9 tolerance included.
        for (const i of surge.bestIndices)
          expect(Math.abs(surge.cells[i].value! - Math.max(...given))).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(Math.max(...given))));
        // A cell clearly below the best is never marked.
        surge.cells.forEach((c, i) => {
          if (c.value !== null && c.value < Math.max(...given) - 1e-6) expect(surge.bestIndices).not.toContain(i);
        });
      }),
      { numRuns: 300 },
    );
  });
});

describe('compareLines with an exhaust side', () => {
  // Tiny synthetic exhaust summaries; every expected number below is hand-read from them.
  const summary = (over: Partial<ExhaustLineSummary>): ExhaustLineSummary => ({
    boostThresholdRpm: 3500,
    peakDrivePressureRatio: { value: 1.4, rpm: 6000 },
    wastegateDiameterNeeded: { value: 0.032, rpm: 7000 },
    wastegateDiameterFitted: 0.038,
    turbineInletPressureAtPeakPower: { value: 290_000, rpm: 6000 },
    peakTurbineInletPressure: { value: 300_000, rpm: 7000 },
    ...over,
  });
  // The exhaust side was computed at these points: the turbine held the target from 3500 rpm on.
  const heldFrom3500 = [solved(2500, { targetHeld: false }), solved(3500, { targetHeld: true })];
  const neverHeld = [solved(2500, { targetHeld: false }), solved(3500, { targetHeld: false })];

  /** Small housing: full boost early, high drive pressure. */
  const small: ComparableLine = { points: heldFrom3500, exhaust: summary({}) };
  /** Large housing: full boost later, lower drive pressure, a larger valve needed. */
  const large: ComparableLine = {
    points: heldFrom3500,
    exhaust: summary({
      boostThresholdRpm: 4500,
      peakDrivePressureRatio: { value: 1.1, rpm: 7000 },
      wastegateDiameterNeeded: { value: 0.036, rpm: 7000 },
      wastegateDiameterFitted: 0.044,
      turbineInletPressureAtPeakPower: { value: 240_000, rpm: 6500 },
    }),
  };
  /** Far too large: the turbine never holds the target, the gate never opens. */
  const lazy: ComparableLine = {
    points: neverHeld,
    exhaust: summary({
      boostThresholdRpm: null,
      peakDrivePressureRatio: { value: 0.9, rpm: 7000 },
      wastegateDiameterNeeded: null,
      turbineInletPressureAtPeakPower: { value: 200_000, rpm: 7000 },
    }),
  };
  /** A compressor-only Plan beside them. */
  const compressorOnly: ComparableLine = { points: heldFrom3500, exhaust: null };

  it('adds no row when no line has an exhaust side (null or absent)', () => {
    expect(compareLines([compressorOnly, { points: heldFrom3500 }]).map((r) => r.key)).toEqual(COMPARE_ROW_KEYS);
    expect(compareRowKeys(false)).toEqual(COMPARE_ROW_KEYS);
  });

  it('adds the exhaust rows after the peak pressure ratio and before the finding counts', () => {
    const keys = compareLines([small, compressorOnly]).map((r) => r.key);
    expect(keys).toEqual(compareRowKeys(true));
    // The documented order, written out (definition of the rows).
    expect(keys.slice(keys.indexOf('peakPressureRatio'), keys.indexOf('pointsAtLimit'))).toEqual([
      'peakPressureRatio',
      'boostThresholdRpm',
      'peakDrivePressureRatio',
      'wastegateDiameterNeeded',
      'wastegateDiameterFitted',
      'turbineInletPressureAtPeakPower',
    ]);
    expect(EXHAUST_ROW_KEYS).toHaveLength(5);
    expect(keys).toHaveLength(COMPARE_ROW_KEYS.length + 5);
  });

  it('reads the cells from the summaries and marks the lowest as best', () => {
    const rows = compareLines([small, large, lazy]);
    const cells = (key: CompareRowKey) => row(rows, key).cells;
    // Hand-read: thresholds 3500 and 4500 rpm, the third never holds its target.
    expect(cells('boostThresholdRpm')).toEqual([
      { value: 3500, rpm: null },
      { value: 4500, rpm: null },
      { value: null, rpm: null, note: 'not-reached' },
    ]);
    expect(row(rows, 'boostThresholdRpm').bestIndices).toEqual([0]); // lowest speed wins: small (hand-read)
    // Hand-read: drive pressure ratios 1.4 at 6000, 1.1 at 7000, 0.9 at 7000 rpm; lowest wins: lazy.
    expect(cells('peakDrivePressureRatio')).toEqual([
      { value: 1.4, rpm: 6000 },
      { value: 1.1, rpm: 7000 },
      { value: 0.9, rpm: 7000 },
    ]);
    expect(row(rows, 'peakDrivePressureRatio').bestIndices).toEqual([2]);
    // Hand-read: valves needed 32 and 36 mm, none for lazy (no note: the reason is not the threshold).
    expect(cells('wastegateDiameterNeeded')).toEqual([
      { value: 0.032, rpm: 7000 },
      { value: 0.036, rpm: 7000 },
      { value: null, rpm: null },
    ]);
    expect(row(rows, 'wastegateDiameterNeeded').bestIndices).toEqual([0]);
    // Hand-read: fitted valves 38, 44, 38 mm; no best by definition of the row.
    expect(cells('wastegateDiameterFitted').map((c) => c.value)).toEqual([0.038, 0.044, 0.038]);
    expect(row(rows, 'wastegateDiameterFitted').bestIndices).toEqual([]);
    // Hand-read: turbine inlet pressure at peak power 290, 240, 200 kPa abs.; lowest wins: lazy.
    expect(cells('turbineInletPressureAtPeakPower').map((c) => [c.value, c.rpm])).toEqual([
      [290_000, 6000],
      [240_000, 6500],
      [200_000, 7000],
    ]);
    expect(row(rows, 'turbineInletPressureAtPeakPower').bestIndices).toEqual([2]);
    expect(row(rows, 'turbineInletPressureAtPeakPower').kind).toBe('pressure');
    expect(row(rows, 'wastegateDiameterNeeded').kind).toBe('length');
  });

  it('tells a line that never reaches full boost from a line without an exhaust side', () => {
    const rows = compareLines([lazy, compressorOnly]);
    expect(row(rows, 'boostThresholdRpm').cells).toEqual([
      { value: null, rpm: null, note: 'not-reached' },
      { value: null, rpm: null, note: 'no-exhaust' },
    ]);
    // Every exhaust row of the compressor-only line says why it is empty.
    for (const key of EXHAUST_ROW_KEYS) expect(row(rows, key).cells[1]).toEqual({ value: null, rpm: null, note: 'no-exhaust' });
    // One exhaust line, nothing to choose between (definition of bestIndices).
    expect(row(rows, 'boostThresholdRpm').bestIndices).toEqual([]);
  });

  it('ranks a line that never reaches full boost after one that does, and marks nothing when none does', () => {
    expect(row(compareLines([lazy, large]), 'boostThresholdRpm').bestIndices).toEqual([1]); // reaching at 4500 rpm beats never (definition of the row)
    expect(row(compareLines([lazy, lazy]), 'boostThresholdRpm').bestIndices).toEqual([]); // neither reaches: nothing to choose
  });

  it('says nothing about reaching when the exhaust side was computed at no point', () => {
    const unsolvedOnly: ComparableLine = { points: [unsolved(3000, ['limit'])], exhaust: summary({ boostThresholdRpm: null }) };
    expect(row(compareLines([unsolvedOnly]), 'boostThresholdRpm').cells).toEqual([{ value: null, rpm: null }]);
  });
});
