/**
 * Pressure losses that follow the flow. A duct, filter or charge cooler loses pressure as the
 * dynamic head of the gas through it, Δp = K·ρ·v²/2 with v = ṁ/(ρ·A), so Δp = K·ṁ²/(2·ρ·A²): a
 * loss measured at one flow and density scales as Δp = Δp_ref·(ṁ/ṁ_ref)²·(ρ_ref/ρ) at another
 * (incompressible duct flow, any fluid-mechanics text; K taken as constant, i.e. fully turbulent
 * flow). A loss given without its flow is held at every flow (the older, fixed form).
 */

/** Density a loss is taken to be measured at when none is stated, kg/m³: standard sea-level air (ISO 2533: 1.2250). */
export const LOSS_REFERENCE_DENSITY = 1.225;

/** A pressure loss as the Study states it. */
export interface PressureLossInput {
  /** The loss, Pa: at `referenceMassFlow` when given, otherwise at every flow. */
  pressureLoss: number;
  /** The engine's mass flow the loss was measured at, kg/s (air for the intake and cooler, exhaust after the turbine); absent: a fixed loss. */
  referenceMassFlow?: number;
  /** Density of the gas at that measurement, kg/m³; absent: LOSS_REFERENCE_DENSITY. */
  referenceDensity?: number;
}

/** Whether the loss follows the flow (it names the flow it was measured at). */
export function lossFollowsFlow(loss: PressureLossInput): loss is PressureLossInput & { referenceMassFlow: number } {
  return loss.referenceMassFlow !== undefined;
}

/** The loss at a mass flow (kg/s, the same kind as the reference) and density (kg/m³), Pa: see the module note. */
export function scaledPressureLoss(loss: PressureLossInput, massFlow: number, density: number): number {
  if (loss.referenceMassFlow === undefined) return loss.pressureLoss;
  const ratio = massFlow / loss.referenceMassFlow;
  return (loss.pressureLoss * ratio * ratio * (loss.referenceDensity ?? LOSS_REFERENCE_DENSITY)) / density;
}
