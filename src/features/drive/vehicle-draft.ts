/**
 * The vehicle form's draft: every field as the text the user typed, in the units the form shows
 * (percent for shares, km/h for the run's end speed, mm for wheel sizes), turned into the SI
 * vehicle the study stores, or the messages of what is wrong, by field.
 */
import { GRIP_PRESETS, vehicleSchema, type Vehicle } from '#shared/drive/vehicle';
import { issuePath } from '#shared/schemas/issue-path';
import type { StudyDocument } from '#shared/schemas/study';

export interface VehicleDraft {
  mass: string;
  drivenAxle: 'front' | 'rear' | 'all';
  frontTorquePercent: string;
  drivenAxleWeightPercent: string;
  cgHeight: string;
  wheelbase: string;
  tyreRadius: string;
  grip: string;
  gearRatios: string;
  finalDrive: string;
  drivetrainLossPercent: string;
  shiftRpm: string;
  shiftTime: string;
  dragArea: string;
  rollingResistance: string;
  scenario: string;
  spoolGear: string;
  spoolStartRpm: string;
  launchRpm: string;
  runSpeedKmh: string;
  /** Per plan id: the rotor's inertia (kg·m²) and the compressor wheel's size (mm), either may be blank. */
  rotors: Record<string, { inertia: string; wheelMm: string }>;
}

const text = (x: number | undefined, scale = 1) => (x === undefined ? '' : String(Number((x * scale).toPrecision(6))));

/**
 * A car to start from when the study has none: round figures of a small hatchback, to be replaced
 * by the team's own (the form says so).
 */
const STARTING_CAR: Vehicle = {
  mass: 1200,
  drivenAxle: 'front',
  drivenAxleWeightShare: 0.6,
  cgHeight: 0.5,
  wheelbase: 2.6,
  tyreRadius: 0.31,
  grip: GRIP_PRESETS[0].grip,
  gearRatios: [3.3, 2.1, 1.5, 1.15, 0.95],
  finalDrive: 4,
  shiftRpm: 6500,
  shiftTime: 0.25,
  dragArea: 0.65,
  rollingResistance: 0.013,
};

export function draftOf(vehicle: Vehicle | undefined, doc: StudyDocument): VehicleDraft {
  const v = vehicle ?? STARTING_CAR;
  const rotors: VehicleDraft['rotors'] = {};
  for (const plan of doc.plans) {
    const r = v.rotors?.find((x) => x.planId === plan.id);
    rotors[plan.id] = { inertia: text(r?.rotorInertia), wheelMm: text(r?.wheelDiameter, 1000) };
  }
  return {
    mass: text(v.mass),
    drivenAxle: v.drivenAxle,
    frontTorquePercent: text(v.frontTorqueShare, 100),
    drivenAxleWeightPercent: text(v.drivenAxleWeightShare, 100),
    cgHeight: text(v.cgHeight),
    wheelbase: text(v.wheelbase),
    tyreRadius: text(v.tyreRadius),
    grip: text(v.grip),
    gearRatios: v.gearRatios.join(', '),
    finalDrive: text(v.finalDrive),
    drivetrainLossPercent: text(v.drivetrainLoss, 100),
    shiftRpm: text(v.shiftRpm),
    shiftTime: text(v.shiftTime),
    dragArea: text(v.dragArea),
    rollingResistance: text(v.rollingResistance),
    // A scenario the study no longer has shows as the first one (the figures use it too).
    scenario: v.scenario !== undefined && doc.scenarios.some((s) => s.name === v.scenario) ? v.scenario : '',
    spoolGear: text(v.spool?.gear),
    spoolStartRpm: text(v.spool?.startRpm),
    launchRpm: text(v.launchRpm),
    runSpeedKmh: text(v.runSpeed, 3.6),
    rotors,
  };
}

/** A typed number: blank is absent, anything else that is not a number is kept so the schema names it. */
function number(s: string, scale = 1): number | string | undefined {
  const t = s.trim();
  if (t === '') return undefined;
  const n = Number(t);
  return Number.isFinite(n) ? n / scale : t;
}

/** The form's field of each vehicle path, so a message lands beside the field that caused it. */
const FIELD_OF: Record<string, keyof VehicleDraft> = {
  frontTorqueShare: 'frontTorquePercent',
  drivenAxleWeightShare: 'drivenAxleWeightPercent',
  drivetrainLoss: 'drivetrainLossPercent',
  'spool.gear': 'spoolGear',
  'spool.startRpm': 'spoolStartRpm',
  runSpeed: 'runSpeedKmh',
};

export type DraftErrors = Partial<Record<keyof VehicleDraft | 'rotors', string>>;

export function vehicleOf(draft: VehicleDraft): { ok: true; vehicle: Vehicle } | { ok: false; errors: DraftErrors } {
  const gearRatios = draft.gearRatios
    .split(/[\s,;]+/)
    .filter((x) => x.trim() !== '')
    .map((x) => number(x));
  const spoolGear = number(draft.spoolGear);
  const spoolStartRpm = number(draft.spoolStartRpm);
  const rotors = Object.entries(draft.rotors)
    .map(([planId, r]) => ({ planId, rotorInertia: number(r.inertia), wheelDiameter: number(r.wheelMm, 1000) }))
    .filter((r) => r.rotorInertia !== undefined || r.wheelDiameter !== undefined)
    .map((r) => Object.fromEntries(Object.entries(r).filter(([, x]) => x !== undefined)));
  const candidate = Object.fromEntries(
    Object.entries({
      mass: number(draft.mass),
      drivenAxle: draft.drivenAxle,
      frontTorqueShare: draft.drivenAxle === 'all' ? number(draft.frontTorquePercent, 100) : undefined,
      drivenAxleWeightShare: number(draft.drivenAxleWeightPercent, 100),
      cgHeight: number(draft.cgHeight),
      wheelbase: number(draft.wheelbase),
      tyreRadius: number(draft.tyreRadius),
      grip: number(draft.grip),
      gearRatios,
      finalDrive: number(draft.finalDrive),
      drivetrainLoss: number(draft.drivetrainLossPercent, 100),
      shiftRpm: number(draft.shiftRpm),
      shiftTime: number(draft.shiftTime),
      dragArea: number(draft.dragArea),
      rollingResistance: number(draft.rollingResistance),
      scenario: draft.scenario === '' ? undefined : draft.scenario,
      spool: spoolGear === undefined && spoolStartRpm === undefined ? undefined : { gear: spoolGear, startRpm: spoolStartRpm },
      launchRpm: number(draft.launchRpm),
      runSpeed: number(draft.runSpeedKmh, 3.6),
      rotors: rotors.length > 0 ? rotors : undefined,
    }).filter(([, x]) => x !== undefined),
  );
  const parsed = vehicleSchema.safeParse(candidate);
  if (parsed.success) return { ok: true, vehicle: parsed.data };
  const errors: DraftErrors = {};
  for (const issue of parsed.error.issues) {
    const path = issuePath(issue.path);
    const field = path.startsWith('rotors') ? 'rotors' : path.startsWith('gearRatios') ? 'gearRatios' : (FIELD_OF[path] ?? (path as keyof VehicleDraft));
    errors[field] ??= issue.message;
  }
  return { ok: false, errors };
}
