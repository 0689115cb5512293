import { describe, expect, it } from 'vitest';
import { engineAirMassFlow, manifoldDensity, revolutionsPerCycle, sharePerTurbocharger, volumeFlow } from '#shared/physics';
import { expectClose } from '../expect-close';

describe('engine airflow', () => {
  it('gives ρ 2.1773 kg/m³ and ṁ 0.19596 kg/s for 2.0 L, 6000 rpm, VE 0.90, 200 kPa, 320 K', () => {
    const rho = manifoldDensity(200_000, 320);
    expectClose(rho, 2.1773, 2e-5); // ideal gas, physics note check table
    const m = engineAirMassFlow({ volumetricEfficiency: 0.9, manifoldDensity: rho, displacement: 0.002, rpm: 6000, strokes: 4 });
    expectClose(m, 0.19596, 2e-5); // Heywood (1988) §2.10 relation, physics note check table
  });

  it('fills every revolution on a two-stroke: twice the four-stroke flow', () => {
    expect(revolutionsPerCycle(4)).toBe(2); // Heywood (1988) §2.10
    expect(revolutionsPerCycle(2)).toBe(1); // Heywood (1988) §2.10
    const args = { volumetricEfficiency: 0.9, manifoldDensity: 1.2, displacement: 0.001, rpm: 5000 };
    expectClose(engineAirMassFlow({ ...args, strokes: 2 }), 2 * engineAirMassFlow({ ...args, strokes: 4 }), 1e-15); // n_R = 1 vs 2
  });

  it('shares flow equally between parallel turbochargers and converts to volume flow', () => {
    expectClose(sharePerTurbocharger(0.4, 2), 0.2, 1e-15); // definition: equal split
    expectClose(volumeFlow(0.2, 1.2), 0.2 / 1.2, 1e-15); // definition Q = ṁ/ρ
  });
});
