import type { QuantityKind } from '#shared/units';
import type { UnitSystem } from './unit-system';

/**
 * The unit each kind of quantity is shown in, by unit system: mathjs unit names, converted
 * with `fromSI` from `shared/units` at the edge. Pressures here are what the trade reads
 * (kPa, psi); whether a pressure is gauge or absolute is said by its label, not its unit.
 */
export const displayUnits: Record<UnitSystem, Record<QuantityKind, string>> = {
  si: {
    pressure: 'kPa',
    temperature: 'degC',
    massFlow: 'kg/s',
    volumeFlow: 'm^3/s',
    volume: 'L',
    power: 'kW',
    torque: 'N m',
    length: 'mm',
    area: 'cm^2',
    density: 'kg/m^3',
    speed: 'rpm',
    energyPerMass: 'kJ/kg',
  },
  us: {
    pressure: 'psi',
    temperature: 'degF',
    massFlow: 'lb/min',
    volumeFlow: 'cfm',
    volume: 'cuin',
    power: 'hp',
    torque: 'lbf ft',
    length: 'in',
    area: 'in^2',
    density: 'lb/ft^3',
    speed: 'rpm',
    energyPerMass: 'BTU/lb',
  },
};

export function displayUnitOf(kind: QuantityKind, system: UnitSystem): string {
  return displayUnits[system][kind];
}
