import { describe, expect, it } from 'vitest';
import { airFlowFromFuel, fitVolumetricEfficiency, measuredBoostThreshold, volumetricEfficiencyFrom } from '#shared/logs/fit';
import { expectClose } from '../expect-close';

describe('volumetric efficiency backed out of the air flow', () => {
  it('solves the definition for VE on a case worked by hand', () => {
    // Worked by hand from ṁ = VE·ρ_man·V_d·N/(60·n_R) (Heywood 1988 §2.10): 2.0 L four-stroke at
    // 6000 rpm, 200 kPa absolute and 320 K: ρ = 200 000/(287.05287·320) = 2.17728 kg/m³, and
    // 0.195955 kg/s of air gives VE = 0.195955·60·2/(2.17728·0.002·6000) = 0.9000.
    const ve = volumetricEfficiencyFrom({
      massFlow: 0.195955,
      manifoldPressure: 200_000,
      manifoldTemperature: 320,
      rpm: 6000,
      displacement: 0.002,
      strokes: 4,
    });
    expectClose(ve, 0.9, 1e-4, { what: 'VE' });
  });

  it('counts one revolution per cycle for a two-stroke', () => {
    // Heywood 1988 §2.10: n_R = 1 for a two-stroke, so the same flow is half the VE of the four-stroke case above (0.45).
    const ve = volumetricEfficiencyFrom({
      massFlow: 0.195955,
      manifoldPressure: 200_000,
      manifoldTemperature: 320,
      rpm: 6000,
      displacement: 0.002,
      strokes: 2,
    });
    expectClose(ve, 0.45, 1e-4, { what: 'VE' });
  });

  it('gives the air flow from fuel flow and lambda', () => {
    // ṁ_air = ṁ_fuel·λ·AFR_s (definition of lambda, Heywood 1988 §3.5): 10 g/s of petrol (AFR_s 14.7, US DOE AFDC) at λ 0.85 = 124.95 g/s.
    expectClose(airFlowFromFuel(0.01, 0.85, 14.7), 0.12495, 1e-9, { what: 'air flow' });
  });

  it('bands the samples by engine speed with mean, spread and count', () => {
    // Two bands worked by hand: at 3000 rpm VE 0.8 and 1.0 (mean 0.9, sample standard deviation
    // √(2·0.1²/1) = 0.141421); at 4000 rpm three samples of VE 0.95. Flows from the definition (Heywood 1988 §2.10).
    const density = 150_000 / (287.05287 * 300);
    const flow = (ve: number, rpm: number) => (ve * density * 0.002 * rpm) / 120;
    const rpm = Float64Array.from([3010, 2990, 4000, 4010, 3990]);
    const ves = [0.8, 1.0, 0.95, 0.95, 0.95];
    const channels = {
      time: Float64Array.from([0, 1, 2, 3, 4]),
      engineSpeed: rpm,
      manifoldPressure: new Float64Array(5).fill(150_000),
      manifoldTemperature: new Float64Array(5).fill(300),
      massAirFlow: Float64Array.from(ves.map((ve, i) => flow(ve, rpm[i]))),
    };
    const fit = fitVolumetricEfficiency(
      channels,
      new Uint8Array(5).fill(1),
      { displacement: 0.002, strokes: 4, stoichiometricAfr: null },
      { bandWidth: 500, minSamples: 2 },
    );
    expect(fit.flowFrom).toBe('mass air flow');
    expect(fit.bands.map((b) => [b.rpm, b.samples])).toEqual([
      [3000, 2],
      [4000, 3],
    ]);
    expectClose(fit.bands[0].value, 0.9, 1e-9, { what: 'mean VE at 3000' });
    expectClose(fit.bands[0].spread, 0.141421, 1e-5, { what: 'spread at 3000' });
    expectClose(fit.bands[1].spread, 0, 1e-6, { what: 'spread at 4000', absoluteBelow: 1e-9 });
  });

  it('finds no fit without a flow channel', () => {
    const channels = { time: Float64Array.from([0, 1]), engineSpeed: Float64Array.from([3000, 3000]), manifoldPressure: Float64Array.from([1e5, 1e5]) };
    expect(fitVolumetricEfficiency(channels, Uint8Array.from([1, 1]), { displacement: 0.002, strokes: 4, stoichiometricAfr: 14.7 }).bands).toEqual([]);
  });

  it('puts the boost threshold at the first band reaching 90 % of the target', () => {
    // Invented ramp (common practice, no source, for the 90 % rule): boost 0 at 2000 rpm rising 50 kPa per 1000 rpm, target 100 kPa: 90 kPa at 3800 rpm,
    // so the 250-rpm band centred on 3750 (mean of 3625–3875 ≈ 87.5 kPa) misses and the 4000 band (100 kPa) is the first to reach it.
    const rpm = Float64Array.from({ length: 401 }, (_, i) => 2000 + i * 10);
    const boost = Float64Array.from(rpm, (r) => Math.min(100_000, (r - 2000) * 50));
    expect(measuredBoostThreshold(rpm, boost, new Uint8Array(401).fill(1), () => 100_000)).toBe(4000);
  });
});
