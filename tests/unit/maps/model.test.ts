import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { compressorModelFromMap, withCompressorFileUnits, withReference, writeMapFile } from '#shared/maps';
import type { CompressorModel } from '#shared/matching/compressor/model';
import { toSI } from '#shared/units';
import { compressorOf, demoMapsFolder, parseOk } from './helpers';
import { expectClose } from '../expect-close';

// A tiny map whose lines are easy to follow by hand.
const TINY = `# spoolbook-map: 1
# kind: compressor
# name: Tiny hand map
# flow: corrected mass, kg/s
# reference temperature: 298 K
# reference pressure: 100 kPa
# efficiency: percent
# max speed: 160000 rpm
curve,label,flow,pressure_ratio,efficiency,speed
surge,,0.05,1.2,,
surge,,0.08,1.8,,
surge,,0.10,2.4,,
choke,,0.15,1.1,,
choke,,0.20,1.6,,
choke,,0.25,2.2,,
speed,80000,0.05,1.2,65,80000
speed,80000,0.10,1.18,72,80000
speed,80000,0.15,1.1,60,80000
speed,120000,0.08,1.8,68,120000
speed,120000,0.14,1.75,75,120000
speed,120000,0.20,1.6,62,120000
speed,150000,0.10,2.4,66,150000
speed,150000,0.18,2.35,73,150000
speed,150000,0.25,2.2,60,150000
`;

const tiny = compressorModelFromMap(compressorOf(parseOk(TINY)));

describe('reading a compressor map', () => {
  it('gives efficiency, speed and margins at a map point, as worked by hand', () => {
    const reading = tiny.read(0.14, 1.75);
    expect(reading.location).toBe('inside');
    expectClose(reading.efficiency, 0.75, 1e-12); // the row "speed,120000,0.14,1.75,75,120000"
    expectClose(reading.shaftSpeed, 120_000, 1e-12); // same row
    // surge flow at PR 1.75 on (0.05, 1.2)–(0.08, 1.8): 0.05 + 0.03·0.55/0.6 = 0.0775 kg/s; (0.14 − 0.0775)/0.14 (by hand)
    expectClose(reading.surgeMargin, 0.4464285714, 1e-9);
    // choke flow at PR 1.75 on (0.20, 1.6)–(0.25, 2.2): 0.20 + 0.05·0.15/0.6 = 0.2125 kg/s; (0.2125 − 0.14)/0.14 (by hand)
    expectClose(reading.chokeMargin, 0.5178571429, 1e-9);
    // (160000 − 120000)/160000 (by hand)
    expectClose(reading.speedMargin, 0.25, 1e-12);
  });

  it('interpolates between the points of the map', () => {
    // On the hull edge from (0.05, 1.2) at 80000 rpm to (0.08, 1.8) at 120000 rpm, a third of the way along.
    // Hull edges are edges of every triangulation, so the value is exact whatever the triangles (by hand):
    // speed 80000 + (120000 − 80000)/3, efficiency 0.65 + (0.68 − 0.65)/3. Nudged inside by 1e-9 kg/s.
    const reading = tiny.read(0.06 + 1e-9, 1.4);
    expect(reading.location).toBe('inside');
    expectClose(reading.shaftSpeed, 93_333.333, 1e-6);
    expectClose(reading.efficiency, 0.66, 1e-6);
  });

  it('says where a point off the map is, and gives no efficiency there', () => {
    const cases: Array<[number, number, string]> = [
      [0.03, 1.5, 'left-of-surge'], // surge flow at 1.5 is 0.065 kg/s
      [0.3, 1.5, 'beyond-choke'], // choke flow at 1.5 is 0.19 kg/s
      [0.15, 2.6, 'above-top-speed'], // the top line is at PR 2.369 at 0.15 kg/s
      [0.12, 1.05, 'below-map'], // the lowest line is at PR 1.148 at 0.12 kg/s
    ];
    for (const [flow, ratio, location] of cases) {
      const reading = tiny.read(flow, ratio);
      expect(reading.location, `${flow} kg/s, PR ${ratio}`).toBe(location);
      expect(reading.efficiency).toBeNull();
    }
    // (0.03 − 0.065)/0.03: negative, the point is past the surge line (by hand)
    expectClose(tiny.read(0.03, 1.5).surgeMargin, -1.1666666667, 1e-9);
    // (0.19 − 0.30)/0.30 (by hand)
    expectClose(tiny.read(0.3, 1.5).chokeMargin, -0.3666666667, 1e-9);
    // No surge line at PR 1.05 (it starts at 1.2): no surge margin rather than an extrapolated one.
    expect(tiny.read(0.12, 1.05).surgeMargin).toBeNull();
    expect(tiny.read(0.12, 1.05).surgeMarginBasis).toBe('below-surge-line');
    // No speed past choke below the top line, nor below the lowest line: the map cannot say.
    expect(tiny.read(0.3, 1.5).shaftSpeed).toBeNull();
    expect(tiny.read(0.3, 1.5).speedBasis).toBe('past-choke');
    expect(tiny.read(0.12, 1.05).shaftSpeed).toBeNull();
  });

  it('returns "off-map" for input that is not a flow and a ratio', () => {
    for (const [flow, ratio] of [
      [Number.NaN, 1.5],
      [0.1, Number.POSITIVE_INFINITY],
      [-0.1, 1.5],
      [0, 1.5],
    ]) {
      expect(tiny.read(flow, ratio)).toEqual({
        efficiency: null,
        shaftSpeed: null,
        surgeMargin: null,
        chokeMargin: null,
        speedMargin: null,
        location: 'off-map',
        surgeMarginBasis: 'no-map',
        chokeMarginBasis: 'no-map',
        speedBasis: 'no-map',
      });
    }
  });

  it('takes the speed limit from the plan when given, else from the map', () => {
    const map = compressorOf(parseOk(TINY));
    expect(compressorModelFromMap(map).maxSpeed).toBe(160_000);
    const planLimit = compressorModelFromMap(map, { maxSpeed: 150_000 });
    expectClose(planLimit.read(0.14, 1.75).speedMargin, 0.2, 1e-12); // (150000 − 120000)/150000 (by hand)
    expect(compressorModelFromMap(map, { maxSpeed: null }).read(0.14, 1.75).speedMargin).toBeNull();
    expect(() => compressorModelFromMap(map, { maxSpeed: -1 })).toThrow(/maxSpeed/);
  });
});

describe('one map, two files with different reference conditions and units', () => {
  // The S44 demo map is in kg/s at 298 K and 100 kPa. Write the same wheel in lb/min at
  // 545 °R and 13.95 psi, read that file, and put one physical engine point on both.
  const inKilograms = compressorOf(parseOk(readFileSync(path.join(demoMapsFolder, 'compressor-s44.csv'), 'utf8')));
  const inPoundsFile = writeMapFile(
    withCompressorFileUnits(withReference(inKilograms, { temperature: toSI(545, 'degR', 'temperature'), pressure: toSI(13.95, 'psi', 'pressure') }), {
      flowUnit: 'lb/min',
      referenceTemperatureUnit: 'degR',
      referencePressureUnit: 'psi',
    }),
  );
  const inPounds = compressorOf(parseOk(inPoundsFile));

  it('writes the second file in its own units', () => {
    expect(inPoundsFile).toContain('# flow: corrected mass, lb/min');
    expect(inPoundsFile).toContain('# reference temperature: 545 degR');
    expect(inPoundsFile).toContain('# reference pressure: 13.95 psi');
    // First surge point: 0.04917 kg/s at 298 K, 100 kPa is 0.04917·√(298/302.7778)·(96181.86/100000) = 0.046918 kg/s
    // at the new reference, = 6.20619 lb/min (1 lb = 0.45359237 kg, 545 °R = 302.7778 K, 1 psi = 6894.757 Pa:
    // NIST SP 811 Appendix B; worked by hand)
    const surgeRow = inPoundsFile.split('\n').find((l) => l.startsWith('surge,'))!;
    expect(inKilograms.curves[0].points[0].correctedMassFlow).toBe(0.04917); // the S44 file's first surge row
    expectClose(Number(surgeRow.split(',')[2]), 6.20619, 1e-5);
  });

  /** Corrected mass flow ṁc = ṁ·√(T1/T_ref)/(p1/p_ref) (NASA Glenn "corrected airflow"; physics.md §3). */
  function correctedFlow(model: CompressorModel, massFlow: number, inletTemperature: number, inletPressure: number): number {
    return (massFlow * Math.sqrt(inletTemperature / model.reference.temperature)) / (inletPressure / model.reference.pressure);
  }

  it('places the same engine point at the same physical place on both', () => {
    const a = compressorModelFromMap(inKilograms);
    const b = compressorModelFromMap(inPounds);
    // A hot, slightly low-pressure inlet (308.15 K, 95 kPa), so that both references differ from it.
    const inside = { massFlow: 0.12, temperature: 308.15, pressure: 95_000, ratio: 2.0 };
    const readA = a.read(correctedFlow(a, inside.massFlow, inside.temperature, inside.pressure), inside.ratio);
    const readB = b.read(correctedFlow(b, inside.massFlow, inside.temperature, inside.pressure), inside.ratio);
    expect(readA.location).toBe('inside');
    expect(readB.location).toBe('inside');
    for (const key of ['efficiency', 'shaftSpeed', 'surgeMargin', 'chokeMargin', 'speedMargin'] as const) {
      expectClose(readB[key], readA[key] as number, 1e-9); // same map: agreement up to rounding of the file
    }
    // And across the whole map, inside and out.
    for (let i = 0; i <= 30; i++) {
      for (let j = 0; j <= 30; j++) {
        const massFlow = 0.005 + i * 0.008;
        const ratio = 1 + j * 0.1;
        const ra = a.read(correctedFlow(a, massFlow, 308.15, 95_000), ratio);
        const rb = b.read(correctedFlow(b, massFlow, 308.15, 95_000), ratio);
        expect(rb.location, `${massFlow} kg/s, PR ${ratio}`).toBe(ra.location);
        for (const key of ['efficiency', 'shaftSpeed', 'surgeMargin', 'chokeMargin', 'speedMargin'] as const) {
          if (ra[key] === null) expect(rb[key]).toBeNull();
          else expectClose(rb[key], ra[key] as number, 1e-9);
        }
      }
    }
  });
});
