/**
 * Port fuel injectors. An injector's flow goes with the square root of the pressure difference
 * across it (it is an orifice with an incompressible liquid), Q2 = Q1·√(ΔP2/ΔP1). Ratings are
 * at a stated pressure DIFFERENCE (commonly 3 bar, injecting into still air).
 */

/** How the rail pressure is held. */
export type FuelRegulator =
  /** A 1:1 regulator referenced to the manifold: the difference across the injector stays the base fuel pressure. */
  | 'manifold-referenced'
  /** A rail held at a fixed gauge pressure (returnless or atmosphere-referenced): boost eats into the difference. */
  | 'fixed-rail';

/** Flow at a new pressure difference from a rated flow (any volume-flow unit) at a rated difference (Pa). */
export function scaleInjectorFlow(ratedFlow: number, ratedPressureDifference: number, pressureDifference: number): number {
  return ratedFlow * Math.sqrt(pressureDifference / ratedPressureDifference);
}

/**
 * Pressure difference across the injector, Pa. `fuelPressure` is the base (gauge) pressure the
 * regulator holds: above the manifold for a 1:1 regulator, above the atmosphere for a fixed rail.
 */
export function injectorPressureDifference(args: {
  regulator: FuelRegulator;
  /** Base fuel pressure, Pa gauge. */
  fuelPressure: number;
  /** Manifold pressure, Pa absolute. */
  manifoldPressure: number;
  /** Ambient pressure, Pa absolute. */
  ambientPressure: number;
}): number {
  if (args.regulator === 'manifold-referenced') return args.fuelPressure;
  return args.ambientPressure + args.fuelPressure - args.manifoldPressure;
}

/** Rail pressure the pump must reach, Pa gauge: base pressure plus boost with a 1:1 regulator. */
export function railGaugePressure(regulator: FuelRegulator, fuelPressure: number, boost: number): number {
  return regulator === 'manifold-referenced' ? fuelPressure + boost : fuelPressure;
}

/** One set of identical injectors. */
export interface InjectorSet {
  /** Number of injectors in the set. */
  count: number;
  /** Rated flow of one injector, m³/s, at the rated pressure difference. */
  ratedFlow: number;
  /** Pressure difference of the rating, Pa. */
  ratedPressure: number;
}

/** Flow the set can deliver at 100 % duty, m³/s, at a pressure difference (Pa). */
export function setCapacity(set: InjectorSet, pressureDifference: number): number {
  return set.count * scaleInjectorFlow(set.ratedFlow, set.ratedPressure, pressureDifference);
}

/**
 * Duty cycle, fraction: the flow needed over the flow available when open all the time. With
 * staged sets both run together, sharing fuel in proportion to their capacity, so one duty
 * applies to every open injector.
 */
export function dutyCycle(requiredFlow: number, availableFlow: number): number {
  return requiredFlow / availableFlow;
}
