import { describe, expect, it } from 'vitest';
import { demoStudyDocument } from '#server/services/study-documents';
import { DEMO_VEHICLES } from '#server/services/demo-drive';
import { readStudyDocument } from '#shared/study/document';

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

  it('names only scenarios and plans the study has', () => {
    expect(firstIssue({ scenario: 'Monza' })).toEqual({ path: 'vehicle.scenario', message: 'no scenario is named "Monza"' });
    expect(firstIssue({ rotors: [{ planId: 'plan-x', rotorInertia: 3e-5 }] })).toEqual({
      path: 'vehicle.rotors.0.planId',
      message: 'no plan has the id "plan-x"',
    });
  });
});
