/** Fuel flow, power and injectors of a solved point. */
// Imported from the modules themselves, not the physics index: re-export chains cost on the hot path.
import { revolutionsPerCycle } from '../physics/airflow';
import {
  dutyWithDeadTime,
  injectionPeriod,
  injectorPressureDifference as injectorPressureDifferenceOf,
  railGaugePressure,
  setCapacity,
} from '../physics/injectors';
import type { LineContext } from './line-context';
import type { PointValues } from './result';

/**
 * Fuel flow, power and injectors of a solved point (in place: the point is still being built).
 * Fuel and power follow the dry air the cylinders trap: humidity burns nothing, and the air a
 * two-stroke short-circuits to the exhaust meets no fuel that burns.
 */
export function addFuel(v: PointValues, ctx: LineContext, lambda: number): void {
  const { stoichiometricAfr, lowerHeatingValue, density } = ctx.fuel!.properties;
  v.stoichiometricAfr = stoichiometricAfr;
  v.lowerHeatingValue = lowerHeatingValue;
  v.fuelDensity = density;
  const air = v.trappedAirMassFlow ?? v.engineMassFlow;
  const fuelMassFlow = air / (lambda * stoichiometricAfr);
  const fuelVolumeFlow = fuelMassFlow / density;
  v.fuelMassFlow = fuelMassFlow;
  v.fuelVolumeFlow = fuelVolumeFlow;
  v.pumpFlowRequired = fuelVolumeFlow;
  if (ctx.power) {
    const eta = ctx.power.brakeThermalEfficiency;
    // Only fuel that finds air burns: rich, the air runs out first (the excess fuel leaves unburnt);
    // lean, the fuel does (the excess air only dilutes). Heywood 1988, eq. 2.23 with the burnt fuel.
    const airLimited = lambda <= 1;
    const burntFuel = airLimited ? air / stoichiometricAfr : fuelMassFlow;
    const brakePower = eta * burntFuel * lowerHeatingValue;
    v.powerLimitedBy = airLimited ? 'air' : 'fuel';
    v.brakeThermalEfficiency = eta;
    v.brakePower = brakePower;
    v.wheelPower = ctx.power.drivetrainLoss === null ? null : brakePower * (1 - ctx.power.drivetrainLoss);
    v.torque = brakePower / ((2 * Math.PI * v.rpm) / 60);
    v.apparentBsfc = brakePower > 0 ? fuelMassFlow / brakePower : null;
  }
  const inj = ctx.injectors;
  if (inj) {
    const dp = injectorPressureDifferenceOf({
      regulator: inj.regulator,
      fuelPressure: inj.fuelPressure,
      manifoldPressure: v.manifoldPressure,
      ambientPressure: v.ambientPressure,
    });
    v.injectorPressureDifference = dp;
    v.railPressure = railGaugePressure(inj.regulator, inj.fuelPressure, v.boost);
    const both = inj.secondary !== undefined && v.rpm >= inj.secondary.switchOverRpm;
    v.injectorStage = both ? 'both' : 'primary';
    if (dp > 0) {
      const capacity = setCapacity(inj.primary, dp, density) + (both ? setCapacity(inj.secondary!, dp, density) : 0);
      const flowDuty = fuelVolumeFlow / capacity;
      // Every opening loses the dead time: the set that loses most sets the duty.
      const deadTime = Math.max(inj.primary.deadTime?.time ?? 0, both ? (inj.secondary!.deadTime?.time ?? 0) : 0);
      v.injectorCapacity = capacity;
      v.injectorFlowDuty = flowDuty;
      v.injectorDuty = deadTime > 0 ? dutyWithDeadTime(flowDuty, deadTime, injectionPeriod(v.rpm, revolutionsPerCycle(ctx.engine.strokes))) : flowDuty;
    } else {
      v.injectorCapacity = 0;
    }
  }
}
