import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { COINCIDENCE_TOLERANCE, compressorModelFromMap, mergeCoincidentPoints, parseMapFile, type SurfacePoint } from '#shared/maps';
import { compressorOf, parseOk } from './helpers';
import { expectClose } from '../expect-close';

const island = (correctedMassFlow: number, pressureRatio: number, value: number): SurfacePoint => ({
  correctedMassFlow,
  pressureRatio,
  value,
  source: 'island',
});
const measured = (correctedMassFlow: number, pressureRatio: number, value: number): SurfacePoint => ({
  correctedMassFlow,
  pressureRatio,
  value,
  source: 'speed-line',
});

describe('merging coincident map points', () => {
  // Corners at (0, 1) and (1, 2): the unit square is the data's own, so the tolerance reads in flow and PR directly.
  const corners = [measured(0, 1, 0.6), measured(1, 2, 0.6)];

  it("uses a speed line's value over an island's, the mean of speed lines, the highest of islands", () => {
    const merged = mergeCoincidentPoints([
      ...corners,
      island(0.5, 1.5, 0.7),
      measured(0.5, 1.5, 0.72), // a measured point beside the contour: it wins (the rule)
      island(0.25, 1.25, 0.6),
      island(0.25, 1.25, 0.68), // islands only: the highest (the rule)
      island(0.25, 1.25, 0.64),
      measured(0.75, 1.75, 0.62),
      measured(0.75, 1.75, 0.66), // two speed lines: their mean (0.62 + 0.66)/2 = 0.64 (by hand)
    ]);
    expect(merged.correctedMassFlow).toEqual([0, 0.25, 0.5, 0.75, 1]); // one point per place, by flow
    expect(merged.value[1]).toBe(0.68);
    expect(merged.value[2]).toBe(0.72);
    expectClose(merged.value[3], 0.64, 1e-12);
    expect(merged.conflicts.map((c) => c.points)).toEqual([
      [4, 5, 6],
      [2, 3],
      [7, 8],
    ]); // input indices, by place
  });

  it('leaves points with the same value alone and does not call them a conflict', () => {
    const merged = mergeCoincidentPoints([...corners, island(0.5, 1.5, 0.7), island(0.5, 1.5, 0.7), measured(0.5, 1.5, 0.7)]);
    expect(merged.value).toEqual([0.6, 0.7, 0.6]);
    expect(merged.conflicts).toEqual([]);
  });

  it('joins points within the tolerance in the unit square, and chains of them, and no others', () => {
    expect(COINCIDENCE_TOLERANCE).toBe(1e-9); // the documented tolerance (docs/map-format.md)
    const near = mergeCoincidentPoints([...corners, island(0.5, 1.5, 0.7), island(0.5 + 0.9e-9, 1.5 - 0.9e-9, 0.74)]);
    expect(near.value).toEqual([0.6, 0.74, 0.6]); // 0.9e-9 apart in both: one place, the higher island
    expect(near.correctedMassFlow[1]).toBe(0.5); // where the place's lowest-flow point stands (the rule)
    const apart = mergeCoincidentPoints([...corners, island(0.5, 1.5, 0.7), island(0.5, 1.5 + 1.1e-9, 0.74)]);
    expect(apart.value).toHaveLength(4); // 1.1e-9 apart in PR: two places
    const chain = mergeCoincidentPoints([...corners, island(0.5, 1.5, 0.7), island(0.5 + 0.8e-9, 1.5, 0.72), island(0.5 + 1.6e-9, 1.5, 0.74)]);
    expect(chain.value).toEqual([0.6, 0.74, 0.6]); // the ends are 1.6e-9 apart but joined through the middle point
  });

  it('measures the tolerance in the unit square of the points, whatever the units', () => {
    // The same places in lb/min-sized numbers (x 132.277): still one place.
    const scale = 132.277;
    const merged = mergeCoincidentPoints([
      measured(0, 1, 0.6),
      measured(scale, 2, 0.6),
      island(0.5 * scale, 1.5, 0.7),
      island(0.5 * scale + 0.9e-9 * scale, 1.5, 0.74),
    ]);
    expect(merged.value).toHaveLength(3);
  });

  it('gives the same points, values and conflicts for any order of its input', () => {
    // Places on a coarse lattice so that many coincide, values and sources of every kind.
    const point = fc.record({
      i: fc.integer({ min: 0, max: 5 }),
      j: fc.integer({ min: 0, max: 5 }),
      value: fc.integer({ min: 50, max: 80 }),
      measured: fc.boolean(),
    });
    fc.assert(
      fc.property(
        fc
          .array(point, { minLength: 1, maxLength: 40 })
          .chain((raw) => fc.tuple(fc.constant(raw), fc.shuffledSubarray(raw, { minLength: raw.length, maxLength: raw.length }))),
        ([raw, shuffled]) => {
          const points = (list: typeof raw) =>
            list.map(
              (p) =>
                ({
                  correctedMassFlow: 0.05 + p.i * 0.01,
                  pressureRatio: 1.2 + p.j * 0.3,
                  value: p.value / 100,
                  source: p.measured ? 'speed-line' : 'island',
                }) as const,
            );
          const a = mergeCoincidentPoints(points(raw));
          const b = mergeCoincidentPoints(points(shuffled));
          expect(b.correctedMassFlow).toEqual(a.correctedMassFlow);
          expect(b.pressureRatio).toEqual(a.pressureRatio);
          for (let k = 0; k < a.value.length; k++) expect(b.value[k]).toBe(a.value[k]); // identical, not close
          expect(b.conflicts.map((c) => [c.value, c.points.length])).toEqual(a.conflicts.map((c) => [c.value, c.points.length]));
        },
      ),
      { numRuns: 500, seed: 13 },
    );
  });
});

// A hand-made map with three places where points of different efficiencies coincide. Line numbers
// (as a text editor counts) are on the right; header lines 1–8, column names on line 9.
const HAND_MAP = `# spoolbook-map: 1
# kind: compressor
# name: Hand map, islands meeting on the surge line
# flow: corrected mass, kg/s
# reference temperature: 288.15 K
# reference pressure: 101.325 kPa
# efficiency: fraction
# max speed: 160000 rpm
curve,label,flow,pressure_ratio,efficiency,speed
surge,,0.10,1.2,,
surge,,0.16,1.8,,
surge,,0.20,2.4,,
choke,,0.30,1.1,,
choke,,0.40,1.6,,
choke,,0.50,2.2,,
speed,80000,0.10,1.2,0.65,80000
speed,80000,0.20,1.18,0.72,80000
speed,80000,0.30,1.1,0.60,80000
speed,100000,0.18,1.5,0.70,100000
speed,100000,0.40,1.6,0.64,100000
speed,120000,0.16,1.8,0.68,120000
speed,120000,0.28,1.75,0.75,120000
speed,120000,0.40,1.6,0.62,120000
speed,150000,0.20,2.4,0.66,150000
speed,150000,0.36,2.35,0.73,150000
speed,150000,0.50,2.2,0.60,150000
island,0.70,0.16,1.8,0.70,
island,0.70,0.24,1.3,0.70,
island,0.70,0.32,1.5,0.70,
island,0.70,0.22,1.6,0.70,
island,0.70,0.16,1.8,0.70,
island,0.74,0.22,1.6,0.74,
island,0.74,0.26,1.55,0.74,
island,0.74,0.24,1.65,0.74,
island,0.74,0.22,1.6,0.74,
`;
// line 20: speed 100000 at (0.40, 1.6), 0.64    line 21: speed 120000 at (0.16, 1.8), 0.68
// line 23: speed 120000 at (0.40, 1.6), 0.62    line 27: island 0.70 at (0.16, 1.8)
// line 30: island 0.70 at (0.22, 1.6)          line 32: island 0.74 at (0.22, 1.6)

/** The same file with its lines (polylines) in reverse order. */
function blocksReversed(text: string): string {
  const lines = text.trimEnd().split('\n');
  const head = lines.slice(0, 9);
  const blocks: string[][] = [];
  for (const row of lines.slice(9)) {
    const key = row.split(',').slice(0, 2).join(',');
    const last = blocks[blocks.length - 1];
    if (last && last[0].split(',').slice(0, 2).join(',') === key) last.push(row);
    else blocks.push([row]);
  }
  return [...head, ...blocks.reverse().flat(), ''].join('\n');
}

describe('a map with coincident points of different efficiencies', () => {
  it('reads each place by the rule, worked by hand, in either order of the file', () => {
    for (const text of [HAND_MAP, blocksReversed(HAND_MAP)]) {
      const model = compressorModelFromMap(compressorOf(parseOk(text)));
      // (0.16, 1.8): speed line 120000 says 0.68, island 0.70 says 0.70: the speed line's point wins (the rule)
      const surgeEnd = model.read(0.16, 1.8);
      expect(surgeEnd.location).toBe('inside');
      expectClose(surgeEnd.efficiency, 0.68, 1e-12);
      expectClose(surgeEnd.shaftSpeed, 120_000, 1e-12); // the row on line 21
      // (0.22, 1.6): islands 0.70 and 0.74 only: the highest island, 0.74 (the rule)
      expectClose(model.read(0.22, 1.6).efficiency, 0.74, 1e-12);
      // (0.40, 1.6): speed lines 100000 (0.64) and 120000 (0.62): their mean, 0.63, and mean speed 110000 rpm (by hand)
      const chokeEnd = model.read(0.4, 1.6);
      expectClose(chokeEnd.efficiency, 0.63, 1e-12);
      expectClose(chokeEnd.shaftSpeed, 110_000, 1e-12);
    }
  });

  it('says in a note how many places were merged, by which rule, and where the first is', () => {
    const result = parseMapFile(HAND_MAP);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.notes).toEqual([
      {
        code: 'coincident-points-merged',
        line: null,
        column: null,
        // three places, two rows each (lines 20+23, 21+27, 30+32, counted above); the first by line is lines 20 and 23
        message:
          "3 places hold points with different efficiencies (6 rows); each place is read as one point: a speed line's efficiency where one passes through it (the mean where several do), otherwise the highest island's efficiency; the first is at lines 20 and 23",
      },
      {
        code: 'coincident-points-merged',
        line: null,
        column: null,
        // one place: (0.40, 1.6) on lines 20 and 23 (counted above)
        message:
          '1 place holds speed-line points with different speeds (2 rows); each place is read as one point at the mean of their speeds; the first is at lines 20 and 23',
      },
    ]);
  });

  it('notes nothing for a map whose points never disagree', () => {
    const agreeing = HAND_MAP.replace('island,0.70,0.16,1.8,0.70,\n', 'island,0.70,0.162,1.8,0.70,\n')
      .replace('island,0.70,0.16,1.8,0.70,\n', 'island,0.70,0.162,1.8,0.70,\n')
      .replace('speed,100000,0.40,1.6,0.64,100000', 'speed,100000,0.38,1.6,0.64,100000')
      .replace('island,0.74,0.22,1.6,0.74,', 'island,0.74,0.222,1.6,0.74,')
      .replace('island,0.74,0.22,1.6,0.74,', 'island,0.74,0.222,1.6,0.74,');
    const result = parseMapFile(agreeing);
    expect(result.ok && result.notes).toEqual([]);
  });
});
