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
  /** Density of the fluid the rating was measured with, kg/m³; absent: the fuel itself. */
  ratingFluidDensity?: number;
  /** Opening delay lost on every injection, at the battery voltage it was measured at; absent: none. */
  deadTime?: { /** s */ time: number; /** V */ voltage: number };
}

/**
 * Volume flow of a fluid of density ρ against the rating fluid's at the same pressure difference:
 * an orifice passes Q = C_d·A·√(2ΔP/ρ), so Q_fuel = Q_rating·√(ρ_rating/ρ_fuel). 1 when the set
 * names no rating fluid (rated with the fuel itself).
 */
export function ratingFluidFactor(set: InjectorSet, fuelDensity: number | undefined): number {
  return set.ratingFluidDensity === undefined || fuelDensity === undefined ? 1 : Math.sqrt(set.ratingFluidDensity / fuelDensity);
}

/**
 * Flow the set can deliver at 100 % duty, m³/s of fuel, at a pressure difference (Pa): √ΔP
 * scaling and, when the rating fluid is named, its density against the fuel's (kg/m³).
 */
export function setCapacity(set: InjectorSet, pressureDifference: number, fuelDensity?: number): number {
  return set.count * scaleInjectorFlow(set.ratedFlow, set.ratedPressure, pressureDifference) * ratingFluidFactor(set, fuelDensity);
}

/**
 * Time between two injections of one injector, s: one injection per working cycle (sequential
 * injection), a cycle every n_R revolutions, so 60·n_R/N (Heywood 1988 §2.10 for n_R).
 */
export function injectionPeriod(rpm: number, revolutionsPerCycle: number): number {
  return (60 * revolutionsPerCycle) / rpm;
}

/**
 * Duty cycle with the dead time: the injector must be commanded open for the fuel's share of the
 * period plus the dead time it loses on each opening, so duty = flow duty + t_dead/t_period.
 */
export function dutyWithDeadTime(flowDuty: number, deadTime: number, period: number): number {
  return flowDuty + deadTime / period;
}

/**
 * Duty cycle, fraction: the flow needed over the flow available when open all the time. With
 * staged sets both run together, sharing fuel in proportion to their capacity, so one duty
 * applies to every open injector.
 */
export function dutyCycle(requiredFlow: number, availableFlow: number): number {
  return requiredFlow / availableFlow;
}
