/**
 * Fuels and their blends. Ethanol content is by VOLUME, as fuel is sold; properties that add by
 * mass (stoichiometric air-fuel ratio, lower heating value) are combined through mass fractions.
 */

/** What the engine model needs to know about one fuel. */
export interface FuelProperties {
  /** Stoichiometric air-fuel ratio, kg air per kg fuel. */
  stoichiometricAfr: number;
  /** Lower heating value, J/kg. */
  lowerHeatingValue: number;
  /** Liquid density, kg/m³. */
  density: number;
}

/** Petrol: AFR_s 14.7 (US DOE AFDC fuel properties; Heywood App. D gives 14.6), LHV 44.0 MJ/kg (Heywood App. D),
 * density 745 kg/m³ (the middle of the 720–780 kg/m³ range). */
export const PETROL: FuelProperties = { stoichiometricAfr: 14.7, lowerHeatingValue: 44.0e6, density: 745 };
/** Ethanol: AFR_s 9.0, LHV 26.9 MJ/kg (Heywood App. D), density 789 kg/m³. */
export const ETHANOL: FuelProperties = { stoichiometricAfr: 9.0, lowerHeatingValue: 26.9e6, density: 789 };
/** Methanol: AFR_s 6.47, LHV 20.0 MJ/kg (Heywood App. D), density 792 kg/m³. */
export const METHANOL: FuelProperties = { stoichiometricAfr: 6.47, lowerHeatingValue: 20.0e6, density: 792 };

/** A fuel as a Study names it. `ethanolPercent` is percent by volume, 0 to 100. */
export type FuelChoice = { kind: 'petrol' } | { kind: 'ethanol-blend'; ethanolPercent: number } | { kind: 'methanol' };

/** Named presets the screens offer; E85 is simply an ethanol blend at 85 % by volume. */
export const FUEL_PRESETS = {
  petrol: { kind: 'petrol' },
  E10: { kind: 'ethanol-blend', ethanolPercent: 10 },
  E85: { kind: 'ethanol-blend', ethanolPercent: 85 },
  E100: { kind: 'ethanol-blend', ethanolPercent: 100 },
  methanol: { kind: 'methanol' },
} as const satisfies Record<string, FuelChoice>;

/** Ethanol mass fraction of a blend from its volume fraction (both 0..1), through the two densities. */
export function ethanolMassFraction(ethanolVolumeFraction: number): number {
  const ethanolMass = ethanolVolumeFraction * ETHANOL.density;
  const petrolMass = (1 - ethanolVolumeFraction) * PETROL.density;
  return ethanolMass / (ethanolMass + petrolMass);
}

/**
 * Properties of a petrol–ethanol blend given percent ethanol by volume (0..100). AFR_s and LHV
 * are per kg of fuel, so they combine linearly by mass fraction; the density is the volume-weighted
 * mean (the small contraction on mixing is ignored).
 */
export function ethanolBlend(ethanolPercent: number): FuelProperties {
  const volumeFraction = ethanolPercent / 100;
  const w = ethanolMassFraction(volumeFraction);
  return {
    stoichiometricAfr: w * ETHANOL.stoichiometricAfr + (1 - w) * PETROL.stoichiometricAfr,
    lowerHeatingValue: w * ETHANOL.lowerHeatingValue + (1 - w) * PETROL.lowerHeatingValue,
    density: volumeFraction * ETHANOL.density + (1 - volumeFraction) * PETROL.density,
  };
}

/** The properties of a Study's fuel choice. */
export function fuelProperties(fuel: FuelChoice): FuelProperties {
  switch (fuel.kind) {
    case 'petrol':
      return PETROL;
    case 'methanol':
      return METHANOL;
    case 'ethanol-blend':
      return ethanolBlend(fuel.ethanolPercent);
  }
}

/** Fuel mass flow, kg/s: ṁ_f = ṁ_air/(λ·AFR_s). */
export function fuelMassFlow(airMassFlow: number, lambda: number, stoichiometricAfr: number): number {
  return airMassFlow / (lambda * stoichiometricAfr);
}

/** Fuel volume flow, m³/s, of a fuel mass flow (kg/s) at the fuel's density (kg/m³). */
export function fuelVolumeFlow(massFlow: number, density: number): number {
  return massFlow / density;
}
