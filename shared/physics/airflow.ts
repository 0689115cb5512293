import { AIR_GAS_CONSTANT } from './gas';

/** Engine cycles: two-stroke fires every revolution, four-stroke every second one. */
export type Strokes = 2 | 4;

/** Crank revolutions per working cycle n_R: 2 for four-stroke, 1 for two-stroke (Heywood 1988, §2.10). */
export function revolutionsPerCycle(strokes: Strokes): number {
  return strokes === 4 ? 2 : 1;
}

/**
 * Engine air mass flow, kg/s: ṁ = VE·ρ_man·V_d·N/(60·n_R) (Heywood, Internal Combustion Engine
 * Fundamentals, 1988, §2.10), with the volumetric efficiency referred to intake-manifold density
 * as is usual for pressure-charged engines.
 */
export function engineAirMassFlow(args: {
  /** Volumetric efficiency, fraction, referred to manifold density. */
  volumetricEfficiency: number;
  /** Air density in the intake manifold, kg/m³. */
  manifoldDensity: number;
  /** Total swept volume of all cylinders, m³. */
  displacement: number;
  /** Engine speed, rpm. */
  rpm: number;
  strokes: Strokes;
}): number {
  const { volumetricEfficiency, manifoldDensity, displacement, rpm, strokes } = args;
  return (volumetricEfficiency * manifoldDensity * displacement * rpm) / (60 * revolutionsPerCycle(strokes));
}

/** Manifold air density, kg/m³, from absolute manifold pressure (Pa) and temperature (K). */
export function manifoldDensity(manifoldPressure: number, manifoldTemperature: number): number {
  return manifoldPressure / (AIR_GAS_CONSTANT * manifoldTemperature);
}

/** Each of `count` identical turbochargers in parallel takes an equal share of the flow (kg/s). */
export function sharePerTurbocharger(engineMassFlow: number, count: number): number {
  return engineMassFlow / count;
}

/** Volume flow, m³/s, of a mass flow (kg/s) at a density (kg/m³). */
export function volumeFlow(massFlow: number, density: number): number {
  return massFlow / density;
}

/**
 * Air a two-stroke's cylinders keep, kg/s: the delivered air times the trapping efficiency, the
 * share of the delivered charge retained when the ports close (Heywood 1988 §6.6: trapping
 * efficiency = retained/delivered; charging efficiency = delivery ratio × trapping efficiency).
 * The rest short-circuits to the exhaust unburnt. A four-stroke is taken to trap all of it.
 */
export function trappedAirMassFlow(deliveredAirMassFlow: number, trappingEfficiency: number): number {
  return deliveredAirMassFlow * trappingEfficiency;
}
