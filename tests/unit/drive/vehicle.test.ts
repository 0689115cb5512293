import { describe, expect, it } from 'vitest';
import { demoStudyDocument } from '#server/services/study-documents';
import { DEMO_VEHICLES } from '#server/services/demo-drive';
import { driveFigures } from '#shared/drive/figures';
import { readStudyDocument } from '#shared/study/document';
import { computed } from './helpers';

const withVehicle = (change: Record<string, unknown>) => {
  const vehicle = { ...Object.values(DEMO_VEHICLES)[0], ...change };
  return readStudyDocument({ ...demoStudyDocument(), vehicle });
};
const firstIssue = (change: Record<string, unknown>) => {
  const read = withVehicle(change);
  if (read.ok) throw new Error('expected the document to be refused');
  return read.issues[0];
};

describe('the vehicle in a study document', () => {
  it('is optional, and kept when given', () => {
    expect(readStudyDocument(demoStudyDocument()).ok).toBe(true);
    const read = withVehicle({});
    expect(read.ok && read.document.vehicle?.mass).toBe(1080); // demo data
  });

  it('refuses bad fields by their document path', () => {
    expect(firstIssue({ gearRatios: [3, 3.2] })).toEqual({
      path: 'vehicle.gearRatios.1',
      message: 'each gear ratio must be below the one before (first gear first)',
    });
    expect(firstIssue({ drivenAxle: 'all' })).toEqual({
      path: 'vehicle.frontTorqueShare',
      message: 'all-wheel drive needs the share of torque sent to the front axle',
    });
    expect(firstIssue({ drivenAxleWeightShare: 62 }).path).toBe('vehicle.drivenAxleWeightShare');
    expect(firstIssue({ mass: 'heavy' })).toEqual({ path: 'vehicle.mass', message: 'mass must be a number' });
    expect(firstIssue({ spool: { gear: 6, startRpm: 3000 } })).toEqual({ path: 'vehicle.spool.gear', message: 'spool gear 6 is beyond the 4 gears given' });
    expect(firstIssue({ wheels: 4 }).path).toBe('vehicle');
  });

  it('never blocks the study when a scenario it names is renamed or a plan it names is deleted', () => {
    const read = withVehicle({ scenario: 'Monza', rotors: [{ planId: 'plan-gone', rotorInertia: 3e-5 }] });
    expect(read.ok).toBe(true);
    if (!read.ok) return;
    const figures = driveFigures(read.document, computed(read.document).result)!;
    expect(figures.scenarioIndex).toBe(0);
    expect(figures.scenarioMissing).toBe(true);
    expect(firstIssue({ rotors: [{ planId: 'plan-s44' }, { planId: 'plan-s44' }] })).toEqual({
      path: 'vehicle.rotors.1.planId',
      message: 'two rotors name this plan',
    });
  });
});
