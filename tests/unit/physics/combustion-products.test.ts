import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  combustionProducts,
  ETHANOL_ATOMS,
  exhaustGasProperties,
  fuelAtoms,
  METHANOL_ATOMS,
  PETROL_ATOMS,
  stoichiometricOxygen,
  WATER_GAS_SHIFT_CONSTANT,
} from '#shared/physics/combustion-products';
import { exhaustGasAt } from '#shared/physics/exhaust-gas';
import { molarHeatCapacity, type ExhaustSpecies } from '#shared/physics/thermo-polynomials';
import { expectClose } from '../expect-close';

describe('specific heats from the NASA polynomials', () => {
  // NIST-JANAF Thermochemical Tables, 4th ed. (Chase, 1998), cp in J/(mol·K) (from memory). The
  // polynomial fits reproduce the tables within a few tenths of a percent.
  const janaf: [ExhaustSpecies, number, number][] = [
    ['N2', 500, 29.58],
    ['N2', 1000, 32.697],
    ['N2', 1500, 34.852],
    ['O2', 500, 31.091],
    ['O2', 1000, 34.87],
    ['O2', 1500, 36.55], // the NIST Chemistry WebBook's Shomate fit for O2 gives 36.55 at 1500 K (from memory)
    ['CO2', 500, 44.627],
    ['CO2', 1000, 54.308],
    ['CO2', 1500, 58.379],
    ['H2O', 500, 35.226],
    ['H2O', 1000, 41.268],
    ['H2O', 1500, 47.073],
    ['CO', 500, 29.794],
    ['CO', 1000, 33.183],
    ['CO', 1500, 35.225],
    ['H2', 500, 29.26],
    ['H2', 1000, 30.205],
    ['H2', 1500, 32.298],
  ];
  for (const [species, t, cp] of janaf) {
    it(`gives ${species} at ${t} K within 0.5 % of the JANAF table`, () => {
      expectClose(molarHeatCapacity(species, t), cp, 5e-3);
    });
  }

  it('joins its two ranges at 1000 K', () => {
    for (const s of ['N2', 'O2', 'CO2', 'H2O', 'CO', 'H2'] as const) expectClose(molarHeatCapacity(s, 999.999999), molarHeatCapacity(s, 1000), 2e-3); // the fits share the point (NASA TM-4513 form)
  });
});

/** cp/R_u of the NASA 7-coefficient fits as published (GRI-Mech 3.0 thermo data), written out again here. */
const FITS: Record<string, { m: number; lo: number[]; hi: number[] }> = {
  N2: {
    m: 28.0134,
    lo: [3.298677, 1.4082404e-3, -3.963222e-6, 5.641515e-9, -2.444854e-12],
    hi: [2.92664, 1.4879768e-3, -5.68476e-7, 1.0097038e-10, -6.753351e-15],
  },
  O2: {
    m: 31.9988,
    lo: [3.78245636, -2.99673416e-3, 9.84730201e-6, -9.68129509e-9, 3.24372837e-12],
    hi: [3.28253784, 1.48308754e-3, -7.57966669e-7, 2.09470555e-10, -2.16717794e-14],
  },
  CO2: {
    m: 44.0095,
    lo: [2.35677352, 8.98459677e-3, -7.12356269e-6, 2.45919022e-9, -1.43699548e-13],
    hi: [3.85746029, 4.41437026e-3, -2.21481404e-6, 5.23490188e-10, -4.72084164e-14],
  },
  H2O: {
    m: 18.0153,
    lo: [4.19864056, -2.0364341e-3, 6.52040211e-6, -5.48797062e-9, 1.77197817e-12],
    hi: [3.03399249, 2.17691804e-3, -1.64072518e-7, -9.7041987e-11, 1.68200992e-14],
  },
  CO: {
    m: 28.0101,
    lo: [3.57953347, -6.1035368e-4, 1.01681433e-6, 9.07005884e-10, -9.04424499e-13],
    hi: [2.71518561, 2.06252743e-3, -9.98825771e-7, 2.30053008e-10, -2.03647716e-14],
  },
  H2: {
    m: 2.0159,
    lo: [2.34433112, 7.98052075e-3, -1.9478151e-5, 2.01572094e-8, -7.37611761e-12],
    hi: [3.3372792, -4.94024731e-5, 4.99456778e-7, -1.79566394e-10, 2.00255376e-14],
  },
};
const RU = 8.314462618; // J/(mol·K), CODATA 2018

/** cp (J/(kg·K)), R (J/(kg·K)) and γ of a mixture of moles at T, by hand from the fits above. */
function byHand(moles: Record<string, number>, t: number) {
  let heat = 0;
  let grams = 0;
  let total = 0;
  for (const [s, n] of Object.entries(moles)) {
    const a = t >= 1000 ? FITS[s].hi : FITS[s].lo;
    heat += n * RU * (a[0] + a[1] * t + a[2] * t ** 2 + a[3] * t ** 3 + a[4] * t ** 4);
    grams += n * FITS[s].m;
    total += n;
  }
  const cp = (heat / grams) * 1000;
  const r = ((RU * total) / grams) * 1000;
  return { cp, r, gamma: cp / (cp - r) };
}

/** Products per kg of fuel CcHhOo at λ, worked by hand: lean by complete combustion; rich by solving the water-gas balance by bisection. */
function productsByHand(c: number, h: number, o: number, lambda: number): Record<string, number> {
  const o2st = c + h / 4 - o / 2;
  const o2 = lambda * o2st;
  const n2 = 3.773 * o2; // Heywood 1988, §3.1
  if (lambda >= 1) return { CO2: c, H2O: h / 2, O2: o2 - o2st, N2: n2 };
  // Oxygen atoms left after C → CO and H → H2O is what turns CO into CO2 beyond H2 → H2O: a − d = D.
  const D = 2 * o2 + o - c - h / 2;
  // K·a·d = (C − a)(H/2 − d), K = 3.5 (Heywood 1988, §4.3); f(a) rises with a, so bisect on [max(0, D), C].
  const f = (a: number) => 3.5 * a * (a - D) - (c - a) * (h / 2 - (a - D));
  let lo = Math.max(0, D);
  let hi = c;
  for (let i = 0; i < 200; i++) {
    const mid = (lo + hi) / 2;
    if (f(mid) > 0) hi = mid;
    else lo = mid;
  }
  const a = (lo + hi) / 2;
  return { CO2: a, CO: c - a, H2O: h / 2 - (a - D), H2: a - D, N2: n2 };
}

describe('the exhaust gas of the fuel burnt', () => {
  const fuels = [
    ['petrol (CH1.87)', { kind: 'petrol' }, PETROL_ATOMS],
    ['methanol', { kind: 'methanol' }, METHANOL_ATOMS],
  ] as const;

  it('knows its fuels by their atoms per kg', () => {
    // CH1.87: 1/(0.012011 + 1.87·0.00100794) = 71.96 mol C per kg (Heywood 1988, App. D; IUPAC atomic weights).
    expectClose(PETROL_ATOMS.carbon, 1 / (0.012011 + 1.87 * 0.00100794), 1e-12);
    expectClose(ETHANOL_ATOMS.oxygen, 1 / 0.046069, 1e-4); // C2H5OH, 46.069 g/mol
    expectClose(METHANOL_ATOMS.carbon, 1 / 0.032042, 1e-4); // CH3OH, 32.042 g/mol
    // E85 is 85 % ethanol by volume, 85.7 % by mass with densities 789 and 745 kg/m³ (the blend rule of fuel.ts).
    const w = (0.85 * 789) / (0.85 * 789 + 0.15 * 745);
    expectClose(fuelAtoms({ kind: 'ethanol-blend', ethanolPercent: 85 }).hydrogen, w * ETHANOL_ATOMS.hydrogen + (1 - w) * PETROL_ATOMS.hydrogen, 1e-12);
    // Stoichiometric air of CH1.87: (1 + 1.87/4) mol O2 per mol C, 14.54 kg air per kg with air O2 + 3.773 N2 (by hand).
    expectClose(stoichiometricOxygen(PETROL_ATOMS) * (0.0319988 + 3.773 * 0.0280134), 14.54, 1e-3);
  });

  for (const [name, fuel, atoms] of [
    ...fuels,
    ['E85', { kind: 'ethanol-blend', ethanolPercent: 85 }, fuelAtoms({ kind: 'ethanol-blend', ethanolPercent: 85 })],
  ] as const) {
    for (const lambda of [0.8, 1.0]) {
      for (const t of [900, 1300]) {
        it(`${name} at λ ${lambda} and ${t} K: cp, R and γ as worked from the polynomials`, () => {
          const hand = byHand(productsByHand(atoms.carbon, atoms.hydrogen, atoms.oxygen, lambda), t);
          const g = exhaustGasProperties(fuel, lambda, t);
          expectClose(g.cp, hand.cp, 1e-9);
          expectClose(g.gasConstant, hand.r, 1e-9);
          expectClose(g.gamma, hand.gamma, 1e-9);
        });
      }
    }
  }

  it('is heavier-working than the lean pair of gas-turbine practice for rich mixtures', () => {
    // Saravanamuttoo's lean gas-turbine pair is cp 1148 J/(kg·K), γ 4/3; rich engine exhaust at
    // 1100 K has cp about 1.32–1.42 kJ/(kg·K) and R about 300–316 (Heywood 1988 ch. 4 composition; from memory).
    for (const fuel of [{ kind: 'petrol' }, { kind: 'ethanol-blend', ethanolPercent: 85 }, { kind: 'methanol' }] as const) {
      const g = exhaustGasProperties(fuel, 0.8, 1100);
      expect(g.cp).toBeGreaterThan(1300);
      expect(g.cp).toBeLessThan(1450);
      expect(g.gasConstant).toBeGreaterThan(298);
      expect(g.gasConstant).toBeLessThan(320);
      expect(g.gamma).toBeLessThan(4 / 3);
    }
  });

  it('adds the humid air’s water and a two-stroke’s short-circuited air to the products, worked by hand', () => {
    const { carbon: c, hydrogen: h, oxygen: o } = PETROL_ATOMS;
    for (const [lambda, w, trapping] of [
      [0.9, 0.02, 0.8],
      [1.1, 0.01, 1],
      [0.8, 0, 0.7],
    ] as const) {
      const moles = productsByHand(c, h, o, lambda);
      const trappedO2 = lambda * (c + h / 4 - o / 2);
      const deliveredO2 = trappedO2 / trapping; // trapping efficiency = trapped/delivered (Heywood 1988 §6.6)
      const bypass = deliveredO2 - trappedO2;
      moles.O2 = (moles.O2 ?? 0) + bypass;
      moles.N2 += 3.773 * bypass; // air as O2 + 3.773 N2 (Heywood 1988, §3.1)
      const dryAirKg = deliveredO2 * (0.0319988 + 3.773 * 0.0280134);
      moles.H2O += (w * dryAirKg) / 0.0180153; // W kg of water per kg of dry air (ASHRAE 2017 ch. 1)
      const hand = byHand(moles, 1100);
      const g = exhaustGasAt({ fuel: { kind: 'petrol' }, lambda, temperature: 1100, humidityRatio: w, trappingEfficiency: trapping });
      expectClose(g.cp, hand.cp, 1e-9);
      expectClose(g.gasConstant, hand.r, 1e-9);
      expectClose(g.gamma, hand.gamma, 1e-9);
    }
    // Dry air and a four-stroke: exactly the products of the fuel burnt.
    expect(exhaustGasAt({ fuel: { kind: 'methanol' }, lambda: 0.85, temperature: 1150 })).toEqual(exhaustGasProperties({ kind: 'methanol' }, 0.85, 1150));
  });

  it('conserves every atom and keeps the water-gas balance at any lambda and fuel (fast-check)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 2, noNaN: true }), fc.double({ min: 0, max: 100, noNaN: true }), (lambda, ethanol) => {
        const atoms = fuelAtoms({ kind: 'ethanol-blend', ethanolPercent: ethanol });
        const p = combustionProducts(atoms, lambda);
        const o2 = lambda * stoichiometricOxygen(atoms);
        for (const n of Object.values(p)) expect(n).toBeGreaterThanOrEqual(-1e-9 * atoms.carbon);
        expectClose(p.CO2 + p.CO, atoms.carbon, 1e-9); // carbon balance
        expectClose(2 * p.H2O + 2 * p.H2, atoms.hydrogen, 1e-9); // hydrogen balance
        expectClose(2 * p.CO2 + p.CO + p.H2O + 2 * p.O2, 2 * o2 + atoms.oxygen, 1e-9); // oxygen balance
        if (lambda < 0.999) expectClose((p.CO * p.H2O) / (p.CO2 * p.H2), WATER_GAS_SHIFT_CONSTANT, 1e-6); // Heywood 1988, §4.3
        if (lambda >= 1) expect(p.CO + p.H2).toBe(0); // complete combustion when lean
      }),
      { numRuns: 300 },
    );
  });
});
