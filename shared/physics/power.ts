/**
 * Brake power from air. The air the engine swallows, not any excess fuel, sets the power:
 * only the stoichiometric share ṁ_air/AFR_s can burn completely, so a rich mixture adds fuel
 * flow but not power.
 */

/**
 * A starting brake thermal efficiency for a boosted spark-ignition engine at full load, fraction
 * (from memory: such engines run about 0.30–0.35). With it, petrol gives about 10 hp per lb/min
 * of air, the trade's rule of thumb.
 */
export const DEFAULT_BRAKE_THERMAL_EFFICIENCY = 0.33;

/** Brake power, W: P_b = η_b·ṁ_air·LHV/AFR_s, with brake thermal efficiency η_b as a fraction. */
export function brakePowerFromAir(airMassFlow: number, brakeThermalEfficiency: number, lowerHeatingValue: number, stoichiometricAfr: number): number {
  return (brakeThermalEfficiency * airMassFlow * lowerHeatingValue) / stoichiometricAfr;
}

/**
 * Brake thermal efficiency, fraction, implied by a brake specific fuel consumption (kg/J) referred
 * to the fuel that burns: η_b = 1/(bsfc·LHV).
 */
export function efficiencyFromBsfc(bsfc: number, lowerHeatingValue: number): number {
  return 1 / (bsfc * lowerHeatingValue);
}

/** Brake specific fuel consumption, kg/J, implied by a brake thermal efficiency: bsfc = 1/(η_b·LHV). */
export function bsfcFromEfficiency(brakeThermalEfficiency: number, lowerHeatingValue: number): number {
  return 1 / (brakeThermalEfficiency * lowerHeatingValue);
}

/** Wheel power, W: brake power less the drivetrain loss (a fraction of brake power). */
export function wheelPower(brakePower: number, drivetrainLoss: number): number {
  return brakePower * (1 - drivetrainLoss);
}

/** Crank angular speed, rad/s, from rpm. */
export function angularSpeed(rpm: number): number {
  return (2 * Math.PI * rpm) / 60;
}

/** Brake torque, N·m: P_b/(2πN/60). */
export function torque(brakePower: number, rpm: number): number {
  return brakePower / angularSpeed(rpm);
}
