import { describe, expect, it } from 'vitest';
import { driveFigures, type DriveFigures, type DriveGear } from '#shared/drive/figures';
import { accelerationRuns } from '#shared/drive/run';
import type { Vehicle } from '#shared/drive/vehicle';
import { expectClose } from '../expect-close';
import { computed, demoDriveDocument } from './helpers';

const vehicle: Vehicle = {
  mass: 1000,
  drivenAxle: 'rear',
  drivenAxleWeightShare: 0.5,
  cgHeight: 0.5,
  wheelbase: 2.5,
  tyreRadius: 0.3,
  grip: 1.2,
  gearRatios: [3, 1.5],
  finalDrive: 1,
  shiftRpm: 6000,
  shiftTime: 0.5,
  dragArea: 0,
  rollingResistance: 0,
  runSpeed: 30,
};

/** Gears that give a flat force at every engine speed from 1000 to 8000 rpm, at their target. */
function flatGears(forces: number[]): DriveGear[] {
  return forces.map((force, g) => ({
    planIndex: 0,
    planId: 'p',
    planName: 'Flat',
    gear: g + 1,
    overallRatio: vehicle.gearRatios[g],
    rowIndex: 0,
    rowLabel: 'Full load',
    points: [1000, 8000].map((rpm) => ({
      rpm,
      roadSpeed: 0,
      wheelForce: force,
      tractionLimit: 1e9,
      limitedBy: 'grip' as const,
      boostTarget: 100_000,
      boost: 100_000,
      usableBoost: 100_000,
      beyondGripOffBoost: false,
      why: null,
    })),
  }));
}
const figures = (gears: DriveGear[], change: Partial<Vehicle> = {}): DriveFigures => ({
  vehicle: { ...vehicle, ...change },
  scenarioIndex: 0,
  scenarioName: 'Sea level',
  scenarioMissing: false,
  drivetrainLoss: 0,
  airDensity: 1.2,
  gears,
});

describe('the acceleration run', () => {
  it('matches uniform acceleration in one gear', () => {
    // a = F/m = 3000/1000 = 3 m/s²; 0 → 30 m/s: t = v/a = 10 s, s = v²/(2a) = 150 m (uniform acceleration).
    // In first gear 30 m/s is 30·60·3/(2π·0.3) = 2865 rpm, below the shift speed (by hand).
    const [run] = accelerationRuns(figures(flatGears([3000, 1500])), 1000);
    expect(run.why).toBeNull();
    expectClose(run.time, 10, 1e-3, { what: 'time' });
    expectClose(run.distance, 150, 1e-3, { what: 'distance' });
    expect(run.phases.map((p) => p.limitedBy)).toEqual(['engine']);
  });

  it('adds the shift time with no drive, and counts time at the traction limit', () => {
    // First gear's 6000 rpm is 6000·2π·0.3/(60·3) = 62.83 m/s: beyond the run; make it shift at 20 m/s instead
    // (shift rpm 20·60·3/(2π·0.3) = 1909.86 rpm). Second gear gives half the force: 0→20 m/s at 3 m/s² (6.667 s),
    // 0.5 s coasting at 20 m/s (no drag), 20→30 m/s at 1.5 m/s² (6.667 s): 13.833 s (uniform acceleration, by hand).
    const [run] = accelerationRuns(figures(flatGears([3000, 1500]), { shiftRpm: 1909.859 }), 1000);
    expectClose(run.time, 13.8333, 2e-3, { what: 'time with a shift' });
    expect(run.phases.map((p) => `${p.gear}:${p.limitedBy}`)).toEqual(['1:engine', '1:shift', '2:engine']);
    const gripLimited = accelerationRuns(figures(flatGears([3000, 1500]), { grip: 0.2 }), 1000)[0];
    // μ = 0.2 rear drive: F ≤ 0.2·0.5·W/(1 − 0.2·0.2) = 1021.5 N (Gillespie 1992 ch. 2), below the 3000 N the engine gives.
    expect(gripLimited.tractionLimitedTime).toBeCloseTo(gripLimited.time!, 1);
  });

  it('stops and says why where a plan cannot give the point', () => {
    const gears = flatGears([3000, 1500]);
    gears[0].points[0] = { ...gears[0].points[0], wheelForce: null, why: 'not reachable: the compressor point is left of surge, so it gives no torque' };
    const [run] = accelerationRuns(figures(gears), 1000);
    expect(run.time).toBeNull();
    expect(run.why).toBe('at 0 km/h: gear 1 at 1000 rpm: not reachable: the compressor point is left of surge, so it gives no torque');
  });

  it('runs the demo turbine housing study to 100 km/h, traction-limited in first gear', () => {
    const doc = demoDriveDocument('turbineHousing');
    const runs = accelerationRuns(driveFigures(doc, computed(doc).result)!, 2500);
    for (const r of runs) {
      expect(r.why).toBeNull();
      expect(r.phases[0]).toMatchObject({ gear: 1, limitedBy: 'traction' }); // by construction of the demo car
    }
  });
});
