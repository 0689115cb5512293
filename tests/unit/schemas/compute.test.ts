import { describe, expect, it } from 'vitest';
import { computeRequestSchema, MAX_COMPUTE_POINTS } from '#shared/schemas/compute';

const valid = {
  engine: { displacement: 0.002, cylinders: 4, strokes: 4 },
  ambient: { pressure: 100_000, temperature: 298.15 },
  points: [{ rpm: 6000, volumetricEfficiency: 0.9, boost: 100_000, manifoldTemperature: 320 }],
};

function issues(body: unknown): { path: string; message: string }[] {
  const r = computeRequestSchema.safeParse(body);
  if (r.success) return [];
  return r.error.issues.map((i) => ({ path: i.path.map(String).join('.'), message: i.message }));
}

describe('the compute contract schema', () => {
  it('accepts the contract shape, with ambient by pressure or altitude', () => {
    expect(issues(valid)).toEqual([]);
    expect(issues({ ...valid, ambient: { altitude: 1500 } })).toEqual([]);
    expect(issues({ ...valid, ambient: { altitude: 1500, temperature: 300 } })).toEqual([]);
    expect(
      issues({ ...valid, losses: { inlet: 1000, chargeCooler: 5000 }, turbochargers: 2, mapReference: { temperature: 298.15, pressure: 100_000 } }),
    ).toEqual([]);
  });

  const cases: [string, unknown, string, RegExp][] = [
    ['an unknown field, by name', { ...valid, engine: { ...valid.engine, displacment: 1 } }, 'engine', /displacment/],
    ['an unknown top-level field', { ...valid, extra: 1 }, '', /extra/],
    ['negative displacement', { ...valid, engine: { ...valid.engine, displacement: -0.002 } }, 'engine.displacement', /above 0/],
    ['efficiency over 1', { ...valid, points: [{ ...valid.points[0], compressorEfficiency: 1.2 }] }, 'points.0.compressorEfficiency', /fraction/],
    ['boost that makes the manifold pressure non-positive', { ...valid, points: [{ ...valid.points[0], boost: -100_000 }] }, 'points.0.boost', /not positive/],
    [
      'boost too low at altitude',
      { ...valid, ambient: { altitude: 3000 }, points: [{ ...valid.points[0], boost: -75_000 }] },
      'points.0.boost',
      /not positive/,
    ],
    ['empty points', { ...valid, points: [] }, 'points', /at least one/],
    ['too many points', { ...valid, points: Array.from({ length: MAX_COMPUTE_POINTS + 1 }, () => valid.points[0]) }, 'points', /at most/],
    ['both pressure and altitude', { ...valid, ambient: { pressure: 100_000, altitude: 10, temperature: 300 } }, 'ambient.altitude', /either/],
    ['pressure without temperature', { ...valid, ambient: { pressure: 100_000 } }, 'ambient.temperature', /needed/],
    ['°C for K', { ...valid, points: [{ ...valid.points[0], manifoldTemperature: 45 }] }, 'points.0.manifoldTemperature', /kelvin|K/],
    ['strokes 3', { ...valid, engine: { ...valid.engine, strokes: 3 } }, 'engine.strokes', /2 or 4/],
    ['a string for a number', { ...valid, engine: { ...valid.engine, displacement: '2.0' } }, 'engine.displacement', /number/],
    [
      'inlet loss above ambient',
      { ...valid, ambient: { pressure: 40_000, temperature: 250 }, losses: { inlet: 45_000, chargeCooler: 0 } },
      'losses.inlet',
      /no pressure/,
    ],
    ['ethanol blend without percent', { ...valid, fuel: { kind: 'ethanol-blend', lambda: 0.8 } }, 'fuel.ethanolPercent', /needed/],
    ['both efficiency and bsfc', { ...valid, fuel: { kind: 'petrol', lambda: 0.8, brakeThermalEfficiency: 0.3, bsfc: 8e-8 } }, 'fuel.bsfc', /not both/],
    ['impossible bsfc', { ...valid, fuel: { kind: 'petrol', lambda: 0.8, bsfc: 1e-8 } }, 'fuel.bsfc', /over 1/],
  ];
  for (const [what, body, path, message] of cases) {
    it(`refuses ${what}, naming ${path || 'the body'}`, () => {
      const found = issues(body).find((i) => i.path === path);
      expect(found, JSON.stringify(issues(body))).toBeDefined(); // design: the field is named
      expect(found!.message).toMatch(message);
    });
  }
});
