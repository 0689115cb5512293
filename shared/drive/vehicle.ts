/**
 * The study's vehicle (optional): what turns the engine's torque into force at the tyres, and the
 * settings of the time-to-boost estimate and the acceleration run. SI throughout.
 */
import { z } from 'zod';
import { fraction, name, num, rpm } from '../matching/input/fields';

/**
 * Tyre–road grip coefficients offered as presets, dimensionless: common practice, no source. A
 * team that has measured its own tyres types the figure instead.
 */
export const GRIP_PRESETS = [
  { key: 'street', label: 'Street tyre, dry', grip: 0.9 },
  { key: 'semi-slick', label: 'Semi-slick, dry', grip: 1.1 },
  { key: 'slick', label: 'Slick, warm', grip: 1.4 },
] as const;

/** Most gears a vehicle may have. */
const MAX_GEARS = 10;

const positive = (what: string, unit: string, max: number, min = 0) =>
  num(what).gt(min, `${what} must be above ${min} ${unit}`).max(max, `${what} is in ${unit}, at most ${max} ${unit}`);

/** One plan's rotor: its polar moment of inertia, or the compressor wheel's size to estimate it from. */
const rotorSchema = z.strictObject({
  /** The plan's id in the study. */
  planId: z.string({ error: 'planId must be text' }).min(1, 'planId must not be empty').max(64),
  /** Polar moment of inertia of the whole rotor (both wheels and the shaft), kg·m². */
  rotorInertia: positive('rotor inertia', 'kg·m²', 0.01).optional(),
  /** Compressor wheel exducer diameter, m: estimates the inertia when none is given (here or in the map). */
  wheelDiameter: positive('wheel diameter', 'm (60 mm = 0.06 m)', 0.3, 0.01).optional(),
});

export const vehicleSchema = z
  .strictObject({
    /** Mass of the car as it runs, with driver and fuel, kg. */
    mass: positive('mass', 'kg', 20_000, 50),
    /** Which wheels are driven. */
    drivenAxle: z.enum(['front', 'rear', 'all'], { error: 'driven axle must be front, rear or all' }),
    /** All-wheel drive only: the share of the drive torque sent to the front axle, fraction 0 to 1. */
    frontTorqueShare: num('front torque share')
      .min(0, 'front torque share is a fraction from 0 to 1')
      .max(1, 'front torque share is a fraction from 0 to 1')
      .optional(),
    /** Share of the car's weight on the driven axle at rest, fraction (all-wheel drive: on the front axle). */
    drivenAxleWeightShare: fraction('driven axle weight share'),
    /** Height of the centre of gravity above the ground, m. */
    cgHeight: positive('centre of gravity height', 'm', 3),
    /** Wheelbase, m. */
    wheelbase: positive('wheelbase', 'm', 10, 0.5),
    /** Rolling radius of the driven tyres, m. */
    tyreRadius: positive('tyre radius', 'm (a 16 in wheel with a 205/55 tyre is about 0.31 m)', 1.5, 0.1),
    /** Tyre–road grip coefficient (peak longitudinal), dimensionless. */
    grip: positive('grip', '(a coefficient, dry street tyres about 0.9)', 3),
    /** Gear ratios, first gear first (engine turns per gearbox output turn). */
    gearRatios: z
      .array(positive('gear ratio', '(engine turns per output turn)', 10, 0.2), { error: 'gear ratios must be a list of numbers' })
      .min(1, 'give at least one gear ratio')
      .max(MAX_GEARS, `at most ${MAX_GEARS} gears`)
      .superRefine((ratios, ctx) => {
        for (let i = 1; i < ratios.length; i++)
          if (!(ratios[i] < ratios[i - 1]))
            ctx.addIssue({ code: 'custom', path: [i], message: 'each gear ratio must be below the one before (first gear first)' });
      }),
    /** Final drive ratio. */
    finalDrive: positive('final drive', '(a ratio)', 12, 0.5),
    /** Drivetrain loss, fraction of brake torque; absent: the study's power assumption. */
    drivetrainLoss: num('drivetrain loss').min(0, 'drivetrain loss must be 0 or more').max(0.6, 'drivetrain loss is a fraction, at most 0.6').optional(),
    /** Engine speed at which the driver shifts up, rpm. */
    shiftRpm: rpm('shift rpm'),
    /** Time without drive during a shift, s. */
    shiftTime: num('shift time').min(0, 'shift time must be 0 s or more').max(3, 'shift time is in s, at most 3 s'),
    /** Aerodynamic drag area Cd·A, m². */
    dragArea: num('drag area').min(0, 'drag area must be 0 m² or more').max(5, 'drag area Cd·A is in m², at most 5 m²'),
    /** Rolling resistance coefficient, dimensionless. */
    rollingResistance: num('rolling resistance').min(0, 'rolling resistance must be 0 or more').max(0.1, 'rolling resistance is a coefficient, at most 0.1'),
    /** The scenario whose ambient and boost rows the drive figures use; absent, or no longer in the study: the first scenario. */
    scenario: name('scenario').optional(),
    /** The time-to-boost estimate: the gear held and the engine speed it starts from. */
    spool: z
      .strictObject({
        gear: num('spool gear').int('spool gear must be a whole number').min(1, 'spool gear must be at least 1'),
        startRpm: rpm('spool start rpm'),
      })
      .optional(),
    /** The acceleration run lets the clutch slip at this engine speed until the car catches up with it, rpm; absent: the study's lowest rpm. */
    launchRpm: rpm('launch rpm').optional(),
    /** The acceleration run ends at this road speed, m/s. */
    runSpeed: positive('run speed', 'm/s (100 km/h = 27.8 m/s)', 150).optional(),
    /** Each plan's rotor, by plan id; a plan not listed takes its map's inertia or the default (a rotor of a plan no longer in the study is not used). */
    rotors: z.array(rotorSchema).max(10, 'at most 10 rotors').optional(),
  })
  .superRefine((v, ctx) => {
    if (v.drivenAxle === 'all' && v.frontTorqueShare === undefined)
      ctx.addIssue({ code: 'custom', path: ['frontTorqueShare'], message: 'all-wheel drive needs the share of torque sent to the front axle' });
    if (v.drivenAxle !== 'all' && v.frontTorqueShare !== undefined)
      ctx.addIssue({ code: 'custom', path: ['frontTorqueShare'], message: 'front torque share applies only to all-wheel drive' });
    if (v.spool && v.spool.gear > v.gearRatios.length)
      ctx.addIssue({ code: 'custom', path: ['spool', 'gear'], message: `spool gear ${v.spool.gear} is beyond the ${v.gearRatios.length} gears given` });
    if (v.spool && typeof v.shiftRpm === 'number' && !(v.spool.startRpm < v.shiftRpm))
      ctx.addIssue({ code: 'custom', path: ['spool', 'startRpm'], message: 'spool start rpm must be below the shift rpm' });
  });
export type Vehicle = z.output<typeof vehicleSchema>;

/** Defaults of the optional settings. */
export const VEHICLE_DEFAULTS = {
  /** The acceleration run's end speed, m/s (100 km/h). */
  runSpeed: 100 / 3.6,
} as const;
