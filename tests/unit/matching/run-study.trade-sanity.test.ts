import { describe, expect, it } from 'vitest';
import { INJECTOR_DUTY_WARNING } from '#shared/matching/findings';
import { runStudy } from '#shared/matching/run-study';
import { parseStudyInput } from '#shared/schemas/study-input';
import type { StudyInput } from '#shared/matching/input/study';
import { DEFAULT_BRAKE_THERMAL_EFFICIENCY, FUEL_PRESETS } from '#shared/physics';
import { toSI } from '#shared/units';
import { CC_PER_MIN, solved } from './fixtures';

/**
 * A built 2.4 L four-cylinder at 8,500 rpm and 20 psi on E85. The assumptions are the trade's
 * usual ones (common practice, no source): VE 1.05, intercooled to 45 °C, lambda 0.80 on E85,
 * brake thermal efficiency 0.33, 12 % drivetrain loss, injectors rated at 3 bar on a 1:1 regulator.
 */
function built24(staged: 'eight' | 'four'): StudyInput {
  const injector = { count: 4, ratedFlow: 1650 * CC_PER_MIN, ratedPressure: 3e5 };
  return {
    engine: {
      displacement: toSI(2.4, 'L', 'volume'),
      cylinders: 4,
      strokes: 4,
      rpm: { kind: 'list', values: [8500] },
      volumetricEfficiency: [{ rpm: 8500, value: 1.05 }],
    },
    fuelSystem: {
      fuel: FUEL_PRESETS.E85,
      lambda: [{ rpm: 8500, value: 0.8 }],
      injectors: {
        primary: injector,
        ...(staged === 'eight' ? { secondary: { ...injector, switchOverRpm: 5000 } } : {}),
        fuelPressure: 3e5,
        regulator: 'manifold-referenced',
      },
    },
    power: { basis: 'brake-thermal-efficiency', brakeThermalEfficiency: DEFAULT_BRAKE_THERMAL_EFFICIENCY, drivetrainLoss: 0.12 },
    losses: { inlet: { pressureLoss: 2000 }, chargeCooler: { pressureLoss: 10_000 } },
    intercooler: { kind: 'fixed', manifoldTemperature: toSI(45, 'degC', 'temperature') },
    scenarios: [
      {
        name: 'Sea level',
        ambient: { pressure: 101_325, temperature: 298.15 },
        boostSchedule: [{ label: 'Full', kind: 'full-load', boost: [{ rpm: 8500, value: toSI(20, 'psi', 'pressure') }] }],
      },
    ],
    plans: [{ name: 'Plan', turbochargers: 1, compressorEfficiency: 0.72 }],
  };
}

describe('facts of the trade (sanity checks)', () => {
  it('a built 2.4 L at 8,500 rpm and 20 psi on E85 makes roughly 420 kW at the wheels (±15 %)', () => {
    const v = solved(runStudy(parseStudyInput(built24('eight'))).lines[0].points[0]);
    expect(v.wheelPower! / 1000).toBeGreaterThan(420 * 0.85); // common practice, no source
    expect(v.wheelPower! / 1000).toBeLessThan(420 * 1.15); // common practice, no source
  });

  it('eight 1,650 cc/min injectors in two stages carry it well under 80 % duty; four alone run near the limit', () => {
    const eight = solved(runStudy(parseStudyInput(built24('eight'))).lines[0].points[0]);
    const four = solved(runStudy(parseStudyInput(built24('four'))).lines[0].points[0]);
    expect(eight.injectorStage).toBe('both');
    expect(eight.injectorDuty!).toBeLessThan(0.5); // "well under 80 %" (common practice, no source)
    // "near the limit": within about 15 points below the usual 80 %, or over it (common practice, no source)
    expect(four.injectorDuty!).toBeGreaterThan(INJECTOR_DUTY_WARNING - 0.15);
    expect(four.injectorDuty!).toBeLessThan(0.9);
  });
});
