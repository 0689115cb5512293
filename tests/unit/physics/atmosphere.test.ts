import fc from 'fast-check';
import psychrolib from 'psychrolib';
import { describe, expect, it } from 'vitest';
import { geopotentialHeight, isaPressure, isaTemperature, ISA_PRESSURE_EXPONENT, isInTroposphere, standardAtmosphere } from '#shared/physics';
import { expectClose } from '../expect-close';

describe('ISA troposphere by geopotential height', () => {
  // Check table of the physics note; rows from ISO 2533:1975 / ICAO Doc 7488 and its constants.
  const rows = [
    { h: 0, t: 288.15, p: 101_325, rho: 1.225 }, // ISO 2533 / ICAO Doc 7488 sea level
    { h: 1000, t: 281.65, p: 89_874.6, rho: 1.11164 }, // ISO 2533 constants
    { h: 2000, t: 275.15, p: 79_495.2, rho: 1.00649 }, // ISO 2533 constants
    { h: 3000, t: 268.65, p: 70_108.5, rho: 0.90912 }, // ISO 2533 constants
  ];
  for (const row of rows) {
    it(`gives the tabulated state at H = ${row.h} m`, () => {
      const s = standardAtmosphere(row.h);
      expectClose(s.temperature, row.t, 1e-9); // exact: linear lapse, ISO 2533
      expectClose(s.pressure, row.p, 1e-6); // ISO 2533, table value rounded to 0.1 Pa
      expectClose(s.density, row.rho, 1e-5); // ISO 2533, table value rounded to 5–6 figures
    });
  }

  it('uses the exponent g0/(L·R) = 5.255876', () => {
    expectClose(ISA_PRESSURE_EXPONENT, 5.255876, 1e-6); // physics note §1, from ISO 2533 constants
  });

  it('agrees with ASHRAE standard pressure (psychrolib) at Z = 1000 m: 89 874.5 Pa', () => {
    psychrolib.SetUnitSystem(psychrolib.SI);
    const reference = psychrolib.GetStandardAtmPressure(1000);
    expectClose(reference, 89_874.5, 2e-6); // ASHRAE Handbook Fundamentals 2017 ch. 1 eq. 3, via psychrolib
    expectClose(isaPressure(1000), reference, 2e-6); // psychrolib (independent reference library)
  });

  it('agrees with psychrolib pressure and temperature over the whole troposphere', () => {
    psychrolib.SetUnitSystem(psychrolib.SI);
    fc.assert(
      fc.property(fc.double({ min: 0, max: 11_000, noNaN: true }), (h) => {
        // psychrolib rounds the constants to 5 figures (2.25577e-5, 5.2559): agree to 1e-5.
        expectClose(isaPressure(h), psychrolib.GetStandardAtmPressure(h), 1e-5); // ASHRAE 2017 ch. 1 eq. 3 via psychrolib
        expectClose(isaTemperature(h), psychrolib.GetStandardAtmTemperature(h) + 273.15, 1e-9); // ASHRAE 2017 ch. 1 eq. 4 via psychrolib
      }),
    );
  });

  it('converts geometric to geopotential height (r = 6 356 766 m)', () => {
    expectClose(geopotentialHeight(3000), 2998.585, 1e-6); // ISO 2533: H = r·z/(r + z)
    expect(geopotentialHeight(0)).toBe(0); // definition
  });

  it('knows where the troposphere law holds', () => {
    expect(isInTroposphere(11_000)).toBe(true); // ISO 2533: tropopause at 11 km geopotential
    expect(isInTroposphere(11_001)).toBe(false); // ISO 2533
    expect(isInTroposphere(-2001)).toBe(false); // ISO 2533 tables start at −2 km (from memory)
  });
});
