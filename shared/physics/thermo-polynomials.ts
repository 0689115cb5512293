/**
 * Specific heat of the gases in engine exhaust from NASA 7-coefficient polynomials:
 *   cp/R_u = a1 + a2·T + a3·T² + a4·T³ + a5·T⁴,
 * one set of coefficients below 1000 K and one above (the form of McBride, Gordon & Reno, NASA
 * TM-4513, 1993). The coefficients are those of the GRI-Mech 3.0 thermodynamic data (Smith et al.,
 * 1999), which collects NASA-form fits from Burcat's tables ("L" entries) and Gurvich's TPIS
 * tables; they reproduce the NIST-JANAF tables within a few tenths of a percent from 300 to 3500 K.
 */

/** The universal gas constant, J/(mol·K) (CODATA 2018, exact since the 2019 SI). */
export const UNIVERSAL_GAS_CONSTANT = 8.314462618;

export type ExhaustSpecies = 'N2' | 'O2' | 'CO2' | 'H2O' | 'CO' | 'H2';

interface NasaFit {
  /** Molar mass, kg/mol (IUPAC standard atomic weights). */
  molarMass: number;
  /** a1…a5 from 1000 K up. */
  high: readonly [number, number, number, number, number];
  /** a1…a5 below 1000 K. */
  low: readonly [number, number, number, number, number];
}

/** The switch between the two coefficient sets, K. */
const T_MID = 1000;

export const NASA_FITS: Record<ExhaustSpecies, NasaFit> = {
  N2: {
    molarMass: 0.0280134,
    high: [2.92664, 1.4879768e-3, -5.68476e-7, 1.0097038e-10, -6.753351e-15],
    low: [3.298677, 1.4082404e-3, -3.963222e-6, 5.641515e-9, -2.444854e-12],
  },
  O2: {
    molarMass: 0.0319988,
    high: [3.28253784, 1.48308754e-3, -7.57966669e-7, 2.09470555e-10, -2.16717794e-14],
    low: [3.78245636, -2.99673416e-3, 9.84730201e-6, -9.68129509e-9, 3.24372837e-12],
  },
  CO2: {
    molarMass: 0.0440095,
    high: [3.85746029, 4.41437026e-3, -2.21481404e-6, 5.23490188e-10, -4.72084164e-14],
    low: [2.35677352, 8.98459677e-3, -7.12356269e-6, 2.45919022e-9, -1.43699548e-13],
  },
  H2O: {
    molarMass: 0.0180153,
    high: [3.03399249, 2.17691804e-3, -1.64072518e-7, -9.7041987e-11, 1.68200992e-14],
    low: [4.19864056, -2.0364341e-3, 6.52040211e-6, -5.48797062e-9, 1.77197817e-12],
  },
  CO: {
    molarMass: 0.0280101,
    high: [2.71518561, 2.06252743e-3, -9.98825771e-7, 2.30053008e-10, -2.03647716e-14],
    low: [3.57953347, -6.1035368e-4, 1.01681433e-6, 9.07005884e-10, -9.04424499e-13],
  },
  H2: {
    molarMass: 0.0020159,
    high: [3.3372792, -4.94024731e-5, 4.99456778e-7, -1.79566394e-10, 2.00255376e-14],
    low: [2.34433112, 7.98052075e-3, -1.9478151e-5, 2.01572094e-8, -7.37611761e-12],
  },
};

/** The temperatures the fits hold over, K; outside they are not extrapolated (held at the ends). */
export const NASA_FIT_RANGE = [200, 3500] as const;

/** Molar specific heat of one species at constant pressure, J/(mol·K), at a temperature in K. */
export function molarHeatCapacity(species: ExhaustSpecies, temperature: number): number {
  const t = Math.min(NASA_FIT_RANGE[1], Math.max(NASA_FIT_RANGE[0], temperature));
  const [a1, a2, a3, a4, a5] = t >= T_MID ? NASA_FITS[species].high : NASA_FITS[species].low;
  return UNIVERSAL_GAS_CONSTANT * (a1 + t * (a2 + t * (a3 + t * (a4 + t * a5))));
}
