import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { capacityNodes, turbineModelFromMap } from '#shared/maps';
import type { TurbineMap } from '#shared/maps/types';
import { orificeFlowFunction } from '#shared/physics/wastegate';
import { demoTurbine, scaledTurbine } from './helpers';
import { expectClose } from '../expect-close';

/** A hand-made map: two speed lines over different ranges of expansion ratio. */
function twoLines(): TurbineMap {
  return {
    kind: 'turbine',
    formatVersion: 1,
    name: 'Hand-made',
    notes: [],
    housing: 'single',
    scrollFeed: null,
    areaRatio: 0.7,
    fileUnits: { flowParameterUnit: 'kg/s K^0.5 / Pa', efficiency: 'fraction', speedUnit: 'rpm' },
    curves: [
      {
        kind: 'flow',
        label: '60000',
        points: [
          { expansionRatio: 1.4, flowParameter: 2e-5, efficiency: 0.6, speed: 60_000 },
          { expansionRatio: 2.0, flowParameter: 3e-5, efficiency: 0.64, speed: 60_000 },
        ],
      },
      {
        kind: 'flow',
        label: '90000',
        points: [
          { expansionRatio: 1.7, flowParameter: 2.3e-5, efficiency: 0.7, speed: 90_000 },
          { expansionRatio: 2.6, flowParameter: 3.2e-5, efficiency: null, speed: 90_000 },
        ],
      },
    ],
  };
}

describe('a turbine map as one capacity curve', () => {
  it('averages the lines that reach each expansion ratio of the file', () => {
    const nodes = capacityNodes(twoLines());
    expect(nodes.expansionRatio).toEqual([1.4, 1.7, 2.0, 2.6]); // every ratio of the file, in order (definition)
    expectClose(nodes.flowParameter[0], 2e-5, 1e-12); // only the 60 000 line reaches 1.4 (hand-read)
    expectClose(nodes.flowParameter[1], (2.5e-5 + 2.3e-5) / 2, 1e-12); // 60 000 line at 1.7 is 2.5e-5 (straight line), mean with 2.3e-5 (hand-read)
    expectClose(nodes.flowParameter[2], (3e-5 + 2.6e-5) / 2, 1e-12); // 90 000 line at 2.0 is 2.6e-5 (hand-read)
    expectClose(nodes.flowParameter[3], 3.2e-5, 1e-12); // only the 90 000 line reaches 2.6 (hand-read)
    expectClose(nodes.efficiency![1], (0.62 + 0.7) / 2, 1e-12); // 60 000 line at 1.7 is 0.62 (straight line) (hand-read)
    expectClose(nodes.efficiency![2], 0.64, 1e-12); // the 90 000 line gives none beyond its first point (hand-read)
    expectClose(nodes.efficiency![3], 0.64, 1e-12); // no line gives one at 2.6: the last known is held (definition of the gap fill)
  });

  it('keeps the flow parameter from falling as ER rises', () => {
    const map = twoLines();
    map.curves[1].points[0].flowParameter = 1e-5; // a low line pulls the mean down at 1.7
    const nodes = capacityNodes(map);
    for (let i = 1; i < nodes.flowParameter.length; i++) expect(nodes.flowParameter[i]).toBeGreaterThanOrEqual(nodes.flowParameter[i - 1]); // running maximum (definition)
  });

  it('reads straight between nodes inside the map', () => {
    const model = turbineModelFromMap(twoLines());
    const r = model.read(1.55);
    expect(r.location).toBe('inside');
    expectClose(r.flowParameter, (2e-5 + 2.4e-5) / 2, 1e-12); // halfway between the nodes at 1.4 and 1.7 (hand-read)
  });

  it('holds both values above the map and says so', () => {
    const model = turbineModelFromMap(twoLines());
    const r = model.read(3.5);
    expect(r.location).toBe('above-map');
    expectClose(r.flowParameter, 3.2e-5, 1e-12); // held at the last node (definition)
    expectClose(r.efficiency!, 0.64, 1e-12); // held (definition)
  });

  it('below the map takes the nozzle through the first point: zero at ER 1, continuous at the first node', () => {
    const model = turbineModelFromMap(twoLines());
    expect(model.read(1).flowParameter).toBe(0); // no pressure drop, no flow (definition)
    expect(model.read(1.2).location).toBe('below-map');
    expectClose(model.read(1.4 - 1e-9).flowParameter, 2e-5, 1e-6); // meets the first node (continuity of the scaling)
    const nozzle = (er: number) => orificeFlowFunction(1 / er, 4 / 3).value;
    expectClose(model.read(1.2).flowParameter, (2e-5 * nozzle(1.2)) / nozzle(1.4), 1e-12); // compressible orifice relation scaled through the first point (physics note §5)
    expectClose(model.read(1.2).efficiency!, 0.6, 1e-12); // efficiency held at the first node (definition)
  });

  it('doubles the flow of a per-scroll map of a divided housing', () => {
    const single = demoTurbine('ar064-single');
    const perScroll = scaledTurbine(single, 0.5, { housing: 'divided', scrollFeed: 'per-scroll' });
    const both = scaledTurbine(single, 1, { housing: 'divided', scrollFeed: 'both' });
    const a = turbineModelFromMap(single);
    const b = turbineModelFromMap(perScroll);
    const c = turbineModelFromMap(both);
    expect(b.mapFlowParameterDivisor).toBe(2); // per-scroll flow (physics note §5)
    expect(c.mapFlowParameterDivisor).toBe(1); // measured with both scrolls fed (physics note §5)
    for (const er of [1.1, 1.5, 2.2, 3.0, 4.0]) {
      expectClose(b.read(er).flowParameter, a.read(er).flowParameter, 1e-12); // capacity is twice the per-scroll FP (physics note §5)
      expectClose(c.read(er).flowParameter, a.read(er).flowParameter, 1e-12); // used as it is (physics note §5)
    }
  });

  it('gives the demo turbines more capacity for the larger A/R, rising with ER', () => {
    const small = turbineModelFromMap(demoTurbine('ar064-single'));
    const large = turbineModelFromMap(demoTurbine('ar082-single'));
    for (const er of [1.2, 1.5, 2.0, 2.5, 3.0]) expect(large.read(er).flowParameter).toBeGreaterThan(small.read(er).flowParameter); // the generator's FP_max grows with A/R (data/maps/README.md)
    // 31.66 kg/s·K^0.5/MPa at ER 1.35 on the 60 000 rpm line of the A/R 0.82 file, the only line there.
    expectClose(large.read(1.35).flowParameter, 31.66e-6, 1e-12); // data/maps/turbine-t64-ar082-single.csv (hand-read, MPa → Pa)
  });

  it('has an inverse that agrees with its reading everywhere (fast-check)', () => {
    const models = [turbineModelFromMap(demoTurbine('ar064-single')), turbineModelFromMap(demoTurbine('ar082-divided')), turbineModelFromMap(twoLines())];
    fc.assert(
      fc.property(fc.constantFrom(...models), fc.double({ min: 1.0001, max: 6, noNaN: true }), (model, er) => {
        const q = model.read(er).flowParameter * er;
        expectClose(model.expansionRatioForFlow!(q), er, 1e-9); // FP(ER)·ER is strictly increasing: one ER per flow (definition)
      }),
    );
  });
});

describe('the turbine map read at the shaft speed', () => {
  it('interpolates between the two speed lines around the speed, as worked by hand', () => {
    const at = turbineModelFromMap(twoLines()).atSpeed!(75_000);
    expect(at.speedBasis).toBe('speed-lines');
    expect([at.lowerSpeed, at.upperSpeed]).toEqual([60_000, 90_000]);
    const r = at.read(1.8);
    // 60 000 line at ER 1.8: η 0.6 + (0.4/0.6)·0.04 = 0.62667, FP 2e-5 + (0.4/0.6)·1e-5 = 2.6667e-5;
    // 90 000 line at 1.8: η 0.7 (its only efficiency, held), FP 2.3e-5 + (0.1/0.9)·0.9e-5 = 2.4e-5;
    // halfway in speed: η (0.62667 + 0.7)/2 = 0.66333, FP (2.6667e-5 + 2.4e-5)/2 = 2.5333e-5 (by hand, straight lines).
    expectClose(r.efficiency!, 0.663333, 1e-5);
    expectClose(r.flowParameter, 2.53333e-5, 1e-5);
    expect(r.location).toBe('inside');
    const lines = at.linesAt(1.8);
    expectClose(lines.lowerEfficiency!, 0.626667, 1e-5); // the 60 000 line at 1.8 (hand-read)
    expectClose(lines.upperEfficiency!, 0.7, 1e-12); // the 90 000 line (hand-read)
    // A quarter of the way from 60 000 to 90 000 rpm: η 0.62667 + 0.25·(0.7 − 0.62667) = 0.645 (by hand).
    expectClose(turbineModelFromMap(twoLines()).atSpeed!(67_500).read(1.8).efficiency!, 0.645, 1e-5);
  });

  it('reads a line exactly at its own speed, and holds the nearest line outside the lines, saying so', () => {
    const map = demoTurbine('ar082-single');
    const model = turbineModelFromMap(map);
    const line = map.curves.find((c) => c.label === '90000')!;
    const on = model.atSpeed!(90_000);
    for (const p of line.points) {
      expectClose(on.read(p.expansionRatio).efficiency!, p.efficiency!, 1e-12); // the file's own number (data/maps/turbine-t64-ar082-single.csv)
      expectClose(on.read(p.expansionRatio).flowParameter, p.flowParameter, 1e-12);
    }
    const slow = model.atSpeed!(40_000);
    expect(slow.speedBasis).toBe('held-at-lowest-line');
    expect(slow.lowerSpeed).toBe(60_000);
    expect(slow.read(1.5)).toEqual(model.atSpeed!(60_000).read(1.5)); // held at the 60 000 rpm line (design, docs/physics.md §8)
    const fast = model.atSpeed!(170_000);
    expect(fast.speedBasis).toBe('held-at-top-line');
    expect(fast.read(3.2)).toEqual(model.atSpeed!(150_000).read(3.2));
  });

  it('differs from the mean of the lines where the lines differ, and keeps the mean where no line has a speed', () => {
    const model = turbineModelFromMap(demoTurbine('ar064-single'));
    // At ER 2.2 the slow lines are far from their best blade-speed ratio: the lines' efficiencies spread widely (the demo file).
    expect(Math.abs(model.atSpeed!(150_000).read(2.2).efficiency! - model.read(2.2).efficiency!)).toBeGreaterThan(0.02);
    const noSpeeds = demoTurbine('ar064-single');
    noSpeeds.curves = noSpeeds.curves.map((c) => ({ ...c, points: c.points.map((p) => ({ ...p, speed: null })) }));
    expect(turbineModelFromMap(noSpeeds).atSpeed).toBeUndefined(); // the mean of the lines is all it has (design)
  });

  it('has an inverse that agrees with its reading at any shaft speed (fast-check)', () => {
    const models = [turbineModelFromMap(demoTurbine('ar064-single')), turbineModelFromMap(demoTurbine('ar082-divided')), turbineModelFromMap(twoLines())];
    fc.assert(
      fc.property(
        fc.constantFrom(...models),
        fc.double({ min: 20_000, max: 200_000, noNaN: true }),
        fc.double({ min: 1.0001, max: 6, noNaN: true }),
        (model, speed, er) => {
          const at = model.atSpeed!(speed);
          const q = at.read(er).flowParameter * er;
          expectClose(at.expansionRatioForFlow!(q), er, 1e-9); // FP(ER)·ER strictly increasing at every speed (running maximum)
        },
      ),
    );
  });
});
