import fc from 'fast-check';
import { describe, it } from 'vitest';
import { actualMassFlow, compressorOutletTemperature, compressorPower, correctedMassFlow, intercoolerOutletTemperature, pressureRatio } from '#shared/physics';
import { expectClose } from '../expect-close';

describe('compressor relations', () => {
  it('gives T2 = 372.30 K and 16.91 kW at PR 2, η 0.75, 0.2 kg/s, cp 1005, T1 288.15 K', () => {
    const t2 = compressorOutletTemperature(288.15, 2, 0.75);
    expectClose(t2, 372.3, 2e-5); // NASA Glenn compressor thermodynamics, physics note check table
    expectClose(compressorPower(0.2, t2, 288.15, 1005), 16_910, 5e-4); // same source, 16.91 kW to 4 figures
  });

  it('gives the corrected flow of the check table for two references', () => {
    expectClose(correctedMassFlow(0.2, 308.15, 95_000, { temperature: 298.15, pressure: 100_000 }), 0.214, 5e-4); // definition, physics note check table
    expectClose(correctedMassFlow(0.2, 308.15, 95_000, { temperature: 288.15, pressure: 101_325 }), 0.2206, 5e-4); // definition, physics note check table
  });

  const reference = fc.record({ temperature: fc.double({ min: 250, max: 320, noNaN: true }), pressure: fc.double({ min: 90_000, max: 105_000, noNaN: true }) });

  it('equals actual flow at the reference conditions', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.001, max: 2, noNaN: true }), reference, (m, ref) => {
        expectClose(correctedMassFlow(m, ref.temperature, ref.pressure, ref), m, 1e-12); // definition: √1/1 = 1
      }),
    );
  });

  it('changes between two references by exactly √(T_refB/T_refA)·(p_refA/p_refB)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.001, max: 2, noNaN: true }),
        fc.double({ min: 220, max: 330, noNaN: true }),
        fc.double({ min: 40_000, max: 105_000, noNaN: true }),
        reference,
        reference,
        (m, t1, p1, a, b) => {
          const ratio = correctedMassFlow(m, t1, p1, a) / correctedMassFlow(m, t1, p1, b);
          expectClose(ratio, Math.sqrt(b.temperature / a.temperature) * (a.pressure / b.pressure), 1e-12); // definition of corrected flow
        },
      ),
    );
  });

  it('inverts corrected flow back to actual flow', () => {
    const ref = { temperature: 298.15, pressure: 100_000 };
    expectClose(actualMassFlow(correctedMassFlow(0.2, 308.15, 95_000, ref), 308.15, 95_000, ref), 0.2, 1e-12); // algebraic inverse
  });

  it('takes pressure ratio as outlet over inlet and cools by effectiveness', () => {
    expectClose(pressureRatio(250_000, 100_000), 2.5, 1e-15); // definition
    expectClose(intercoolerOutletTemperature(400, 0.75, 300), 325, 1e-12); // Incropera & DeWitt §11.4: T2 − ε(T2 − Tc)
  });
});
