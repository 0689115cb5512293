/**
 * The exhaust gas an engine makes from its fuel and lambda, and its properties at a temperature.
 *
 * Composition (Heywood, Internal Combustion Engine Fundamentals, 1988, §4.3): air is O2 + 3.773 N2
 * (the argon counted with the nitrogen). Lean and stoichiometric (λ ≥ 1) the fuel burns completely
 * to CO2 and H2O and the excess O2 passes through. Rich (λ < 1) the oxygen runs short: the
 * products hold CO and H2 as well, split by the water-gas shift equilibrium
 * CO2 + H2 ⇌ CO + H2O with K = (n_CO·n_H2O)/(n_CO2·n_H2) = 3.5, the composition frozen at about
 * 1740 K as Heywood takes it; dissociation is neglected (small below about 2000 K).
 *
 * Fuels by their atoms per kg: petrol as CH1.87 (Heywood, App. D, "gasoline"), ethanol C2H5OH,
 * methanol CH3OH; an ethanol blend by the mass fractions of shared/physics/fuel.ts. The products'
 * share of each species follows from those atoms; the engine's own air-fuel ratios (fuel.ts) set
 * the flows, so the two can differ by the 0.7 % between 14.6 and 14.7 for petrol, which moves the
 * gas properties by far less.
 *
 * Properties of the mixture at T: cp = Σ n_i·cp_i(T) / Σ n_i·M_i (NASA polynomials,
 * thermo-polynomials.ts), R = R_u·Σ n_i / Σ n_i·M_i, γ = cp/(cp − R).
 */
import { ethanolMassFraction, type FuelChoice } from './fuel';
import { molarHeatCapacity, NASA_FITS, UNIVERSAL_GAS_CONSTANT, type ExhaustSpecies } from './thermo-polynomials';

/** Moles of oxygen atoms' partner N2 per mole of O2 in air (Heywood 1988, §3.1: 3.773). */
export const NITROGEN_PER_OXYGEN = 3.773;
/** Water-gas shift constant K = (n_CO·n_H2O)/(n_CO2·n_H2) of rich products (Heywood 1988, §4.3: 3.5, about 1740 K). */
export const WATER_GAS_SHIFT_CONSTANT = 3.5;

/** Atoms of a fuel, mol per kg of fuel. */
export interface FuelAtoms {
  carbon: number;
  hydrogen: number;
  oxygen: number;
}

/** Standard atomic weights, kg/mol (IUPAC). */
const M_C = 0.012011;
const M_H = 0.00100794;
const M_O = 0.0159994;

function atomsOf(c: number, h: number, o: number): FuelAtoms {
  const molar = c * M_C + h * M_H + o * M_O;
  return { carbon: c / molar, hydrogen: h / molar, oxygen: o / molar };
}

/** Petrol as CH1.87 (Heywood 1988, App. D). */
export const PETROL_ATOMS = atomsOf(1, 1.87, 0);
/** Ethanol, C2H5OH. */
export const ETHANOL_ATOMS = atomsOf(2, 6, 1);
/** Methanol, CH3OH. */
export const METHANOL_ATOMS = atomsOf(1, 4, 1);

/** The atoms of a Study's fuel, mol per kg. */
export function fuelAtoms(fuel: FuelChoice): FuelAtoms {
  switch (fuel.kind) {
    case 'petrol':
      return PETROL_ATOMS;
    case 'methanol':
      return METHANOL_ATOMS;
    case 'ethanol-blend': {
      const w = ethanolMassFraction(Math.min(100, Math.max(0, fuel.ethanolPercent)) / 100);
      return {
        carbon: w * ETHANOL_ATOMS.carbon + (1 - w) * PETROL_ATOMS.carbon,
        hydrogen: w * ETHANOL_ATOMS.hydrogen + (1 - w) * PETROL_ATOMS.hydrogen,
        oxygen: w * ETHANOL_ATOMS.oxygen + (1 - w) * PETROL_ATOMS.oxygen,
      };
    }
  }
}

/** Moles of each product species per kg of fuel burnt. */
export type ProductMoles = Record<ExhaustSpecies, number>;

/** O2 needed to burn a kg of the fuel completely, mol. */
export function stoichiometricOxygen(atoms: FuelAtoms): number {
  return atoms.carbon + atoms.hydrogen / 4 - atoms.oxygen / 2;
}

/** The products of burning a kg of fuel at a lambda (air supplied over stoichiometric), mol (see the module note). */
export function combustionProducts(atoms: FuelAtoms, lambda: number): ProductMoles {
  const { carbon: c, hydrogen: h, oxygen: o } = atoms;
  const oxygenSupplied = lambda * stoichiometricOxygen(atoms);
  const n2 = NITROGEN_PER_OXYGEN * oxygenSupplied;
  if (lambda >= 1) {
    return { CO2: c, H2O: h / 2, O2: oxygenSupplied - stoichiometricOxygen(atoms), N2: n2, CO: 0, H2: 0 };
  }
  // Rich: a mol CO2, C − a CO, H/2 − d H2O, d H2, with the oxygen balance a − d = D and
  // (C − a)·(H/2 − d) = K·a·d. Substituting d = a − D gives a quadratic in a.
  const k = WATER_GAS_SHIFT_CONSTANT;
  const d0 = 2 * oxygenSupplied + o - c - h / 2;
  const qa = 1 - k;
  const qb = -(c + h / 2 + d0 - k * d0);
  const qc = c * (h / 2 + d0);
  const root = Math.sqrt(Math.max(0, qb * qb - 4 * qa * qc));
  const low = Math.max(0, d0);
  const high = Math.min(c, h / 2 + d0);
  const candidates = [(-qb - root) / (2 * qa), (-qb + root) / (2 * qa)];
  // The root with every species non-negative; clamped into range against rounding at λ → 1.
  const a = Math.min(high, Math.max(low, candidates.find((x) => x >= low - 1e-9 * c && x <= high + 1e-9 * c) ?? candidates[0]));
  const hydrogenGas = a - d0;
  return { CO2: a, CO: c - a, H2O: h / 2 - hydrogenGas, H2: hydrogenGas, O2: 0, N2: n2 };
}

export interface ExhaustGasProperties {
  /** Specific heat at constant pressure, J/(kg·K). */
  cp: number;
  /** Specific gas constant, J/(kg·K). */
  gasConstant: number;
  /** Ratio of specific heats. */
  gamma: number;
  /** Mean molar mass, kg/mol. */
  molarMass: number;
  /** Mole fraction of each species. */
  moleFractions: ProductMoles;
}

const SPECIES: ExhaustSpecies[] = ['N2', 'O2', 'CO2', 'H2O', 'CO', 'H2'];

/** The properties of a mixture of products at a temperature, K. */
export function mixtureProperties(moles: ProductMoles, temperature: number): ExhaustGasProperties {
  let total = 0;
  let mass = 0;
  let heat = 0;
  for (const s of SPECIES) {
    total += moles[s];
    mass += moles[s] * NASA_FITS[s].molarMass;
    heat += moles[s] * molarHeatCapacity(s, temperature);
  }
  const cp = heat / mass;
  const gasConstant = (UNIVERSAL_GAS_CONSTANT * total) / mass;
  const moleFractions = Object.fromEntries(SPECIES.map((s) => [s, moles[s] / total])) as ProductMoles;
  return { cp, gasConstant, gamma: cp / (cp - gasConstant), molarMass: mass / total, moleFractions };
}

/** The exhaust gas of a fuel at a lambda, its properties at a temperature (K): see the module note. */
export function exhaustGasProperties(fuel: FuelChoice, lambda: number, temperature: number): ExhaustGasProperties {
  return mixtureProperties(combustionProducts(fuelAtoms(fuel), lambda), temperature);
}
