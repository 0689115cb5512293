import { describe, it } from 'vitest';
import { fromSI, math, toSI, unitConverter } from '#shared/units';
import { expectClose } from '../expect-close';

describe('units at the edges', () => {
  it('converts the check-table units to SI', () => {
    expectClose(toSI(1, 'psi', 'pressure'), 6894.757, 1e-7); // NIST SP 811 App. B; mathjs units (independent library)
    expectClose(math.unit(1, 'lbm').toNumber('kg'), 0.45359237, 1e-12); // NIST SP 811 (exact); mathjs units
    expectClose(toSI(1, 'degR', 'temperature'), 5 / 9, 1e-12); // NIST SP 811 (exact); mathjs units
    expectClose(toSI(1, 'inHg', 'pressure'), 3386.39, 2e-6); // NIST SP 811 App. B.8, conventional inch of mercury at 0 °C
  });

  // The user's SI and US customary units of the issue, each against an exact or NIST value.
  const cases: [number, string, Parameters<typeof toSI>[2], number, string][] = [
    [1, 'kPa', 'pressure', 1000, 'SI prefix (exact)'],
    [1, 'bar', 'pressure', 1e5, 'NIST SP 811 (exact)'],
    [20, 'psi', 'pressure', 137_895.1, 'NIST SP 811: 20 × 6894.757'],
    [25, 'degC', 'temperature', 298.15, 'NIST SP 811 (exact offset)'],
    [77, 'degF', 'temperature', 298.15, 'NIST SP 811 (exact)'],
    [1, 'lb/min', 'massFlow', 0.45359237 / 60, 'NIST SP 811 (exact)'],
    [1, 'cfm', 'volumeFlow', 0.3048 ** 3 / 60, 'NIST SP 811 (exact)'],
    [2.4, 'L', 'volume', 0.0024, 'NIST SP 811 (exact)'],
    [1650, 'cc', 'volume', 1.65e-3, 'NIST SP 811 (exact)'],
    [146, 'ci', 'volume', 146 * 0.0254 ** 3, 'NIST SP 811 (exact)'],
    [1, 'kW', 'power', 1000, 'SI prefix (exact)'],
    [1, 'hp', 'power', 745.6999, 'NIST SP 811 App. B: mechanical horsepower'],
    [1, 'N m', 'torque', 1, 'SI (exact)'],
    [1, 'lbf ft', 'torque', 1.355818, 'NIST SP 811 App. B'],
  ];
  for (const [value, unit, kind, si, source] of cases) {
    it(`converts ${value} ${unit} to ${si} (${source})`, () => {
      expectClose(toSI(value, unit, kind), si, 1e-6);
      expectClose(fromSI(toSI(value, unit, kind), unit, kind), value, 1e-12); // round trip (definition)
    });
  }

  // The screens convert thousands of values per redraw with unitConverter: the same numbers as mathjs.
  for (const [value, unit, kind, si, source] of cases) {
    it(`converts ${value} ${unit} and back like mathjs with the straight-line converter (${source})`, () => {
      const c = unitConverter(unit, kind);
      expectClose(c.toSI(value), si, 1e-6);
      expectClose(c.toSI(value), toSI(value, unit, kind), 1e-12); // mathjs units (independent library)
      for (const x of [0, si, -si, 1e-3 * si, 123.456]) expectClose(c.fromSI(x), fromSI(x, unit, kind), 1e-12);
    });
  }
});
