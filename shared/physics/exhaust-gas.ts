/**
 * The gas that reaches the turbine: the products of the charge each cylinder traps and burns
 * (combustion-products.ts), plus what passes through without burning: in a two-stroke, the air
 * that short-circuits from the transfer ports to the exhaust (delivered × (1 − trapping
 * efficiency)); in every engine, the water vapour the humid air brought in. Both are added to the
 * products as they are, after the water-gas shift (frozen composition); the short-circuit air's
 * oxygen is taken not to burn the rich products' CO and H2 in the manifold.
 */
import {
  combustionProducts,
  fuelAtoms,
  mixtureProperties,
  NITROGEN_PER_OXYGEN,
  stoichiometricOxygen,
  type ExhaustGasProperties,
  type ProductMoles,
} from './combustion-products';
import type { FuelChoice } from './fuel';
import { NASA_FITS } from './thermo-polynomials';

export interface ExhaustGasConditions {
  fuel: FuelChoice;
  /** Lambda of the trapped charge. */
  lambda: number;
  /** Gas temperature, K. */
  temperature: number;
  /** Humidity ratio of the air, kg of water per kg of dry air (default 0: dry). */
  humidityRatio?: number;
  /** Share of the delivered air the cylinders trap, fraction (default 1: all of it). */
  trappingEfficiency?: number;
}

/** Moles per kg of fuel of the gas at the turbine (see the module note). */
function exhaustMoles(c: ExhaustGasConditions): ProductMoles {
  const atoms = fuelAtoms(c.fuel);
  const moles = combustionProducts(atoms, c.lambda);
  const w = c.humidityRatio ?? 0;
  const trapping = c.trappingEfficiency ?? 1;
  if (w !== 0 || trapping !== 1) {
    const trappedOxygen = c.lambda * stoichiometricOxygen(atoms);
    const deliveredOxygen = trappedOxygen / trapping;
    // Short-circuited air, mol per kg of fuel.
    const bypassOxygen = deliveredOxygen - trappedOxygen;
    moles.O2 += bypassOxygen;
    moles.N2 += NITROGEN_PER_OXYGEN * bypassOxygen;
    // Water of the humid air over all the dry air delivered, mol per kg of fuel.
    const dryAirMass = deliveredOxygen * (NASA_FITS.O2.molarMass + NITROGEN_PER_OXYGEN * NASA_FITS.N2.molarMass);
    moles.H2O += (w * dryAirMass) / NASA_FITS.H2O.molarMass;
  }
  return moles;
}

/** cp, R and γ of the gas at the turbine, with its composition (see the module note). */
export function exhaustGasAt(c: ExhaustGasConditions): ExhaustGasProperties {
  return mixtureProperties(exhaustMoles(c), c.temperature);
}
