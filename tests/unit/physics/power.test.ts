import { describe, expect, it } from 'vitest';
import { bsfcFromEfficiency, brakePowerFromAir, DEFAULT_BRAKE_THERMAL_EFFICIENCY, efficiencyFromBsfc, PETROL, torque, wheelPower } from '#shared/physics';
import { toSI } from '#shared/units';
import { expectClose } from '../expect-close';

describe('power from air', () => {
  it('makes about 10 hp of crank power per lb/min of air on petrol (common practice, no source)', () => {
    const air = toSI(1, 'lb/min', 'massFlow');
    const hp = brakePowerFromAir(air, DEFAULT_BRAKE_THERMAL_EFFICIENCY, PETROL.lowerHeatingValue, PETROL.stoichiometricAfr) / toSI(1, 'hp', 'power');
    expectClose(hp, 10, 0.1); // common practice, no source: "about 10 hp per lb/min"
  });

  it('gives the same power from air for petrol and E85 within 1 % (energy per kg of air is nearly fuel-blind)', () => {
    const e85Afr = 9.8141;
    const e85Lhv = 29.342e6;
    // LHV/AFR_s: 44.0/14.7 = 2.993 and 29.342/9.8141 = 2.990 MJ per kg of air (hand calculation from Heywood App. D values)
    expectClose(brakePowerFromAir(0.3, 0.33, e85Lhv, e85Afr), brakePowerFromAir(0.3, 0.33, PETROL.lowerHeatingValue, PETROL.stoichiometricAfr), 0.01);
  });

  it('converts between BSFC and brake thermal efficiency', () => {
    const bsfc = bsfcFromEfficiency(0.33, PETROL.lowerHeatingValue);
    expectClose(bsfc * 3.6e9, 247.9, 1e-3); // 1/(0.33·44 MJ/kg) = 247.9 g/kWh (hand calculation)
    expectClose(efficiencyFromBsfc(bsfc, PETROL.lowerHeatingValue), 0.33, 1e-12); // algebraic inverse
  });

  it('takes the drivetrain loss and gives torque from power and speed', () => {
    expectClose(wheelPower(100_000, 0.15), 85_000, 1e-12); // definition
    expectClose(torque(100_000, 6000), 159.155, 1e-5); // P/(2πN/60) = 100 kW / 628.32 rad/s (definition)
    expect(torque(0, 6000)).toBe(0); // definition
  });
});
