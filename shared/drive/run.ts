/**
 * The acceleration run: from rest to a chosen road speed through the gears, per plan, on the
 * steady torque of each engine speed (the boost each plan holds there, not its spool), the force
 * at the wheels capped by the traction limit, no drive during each shift. Where the plan's point is
 * not reachable the run stops and says so: it never drives on a point the compressor cannot give.
 */
import type { DriveFigures, DriveGear } from './figures';
import { engineSpeedAt } from './figures';
import { roadLoad, tractionLimit } from './traction';
import { VEHICLE_DEFAULTS } from './vehicle';

/** What limits the car at a moment. */
type RunLimit = 'traction' | 'boost' | 'engine' | 'shift';

interface RunPhase {
  gear: number;
  limitedBy: RunLimit;
  /** s */
  from: number;
  to: number;
  /** Road speeds at its ends, m/s. */
  fromSpeed: number;
  toSpeed: number;
}

export interface PlanRun {
  planIndex: number;
  planName: string;
  /** End speed of the run, m/s. */
  runSpeed: number;
  /** Time to the end speed, s; null when the run cannot finish (`why` says). */
  time: number | null;
  /** Distance to the end speed, m; null with `time`. */
  distance: number | null;
  /** Time spent with the tyres at their limit, and with the turbine below the boost target, s. */
  tractionLimitedTime: number;
  boostLimitedTime: number;
  phases: RunPhase[];
  /** Road speed against time, a sample every 0.05 s. */
  samples: { time: number; roadSpeed: number; gear: number }[];
  why: string | null;
}

const STEP = 0.005;
const SAMPLE_EVERY = 10;
const MAX_TIME = 60;

/** The force a gear gives at an engine speed, N, with whether the turbine holds the target there; null and why where unknown. */
function gearForceAt(gear: DriveGear, rpm: number): { force: number; boostShort: boolean } | { why: string } {
  const pts = gear.points;
  const last = pts[pts.length - 1];
  if (rpm < pts[0].rpm || rpm > last.rpm)
    return { why: `the study computes engine speeds from ${pts[0].rpm} to ${last.rpm} rpm only, not ${Math.round(rpm)} rpm` };
  let i = 0;
  while (i < pts.length - 2 && pts[i + 1].rpm < rpm) i++;
  // On a computed speed, that point alone: its neighbours do not matter there.
  const exact = pts.find((p) => p.rpm === rpm);
  const a = exact ?? pts[i];
  const b = exact ?? (pts.length > 1 ? pts[i + 1] : a);
  const missing = a.wheelForce === null ? a : b.wheelForce === null ? b : null;
  if (missing || a.wheelForce === null || b.wheelForce === null) return { why: `gear ${gear.gear} at ${missing?.rpm} rpm: ${missing?.why ?? 'no force'}` };
  const t = b.rpm === a.rpm ? 0 : (rpm - a.rpm) / (b.rpm - a.rpm);
  const short = (p: typeof a) => p.boost !== null && p.boostTarget !== null && p.boost < p.boostTarget - 1;
  return { force: a.wheelForce + (b.wheelForce - a.wheelForce) * t, boostShort: short(a) || short(b) };
}

/** The acceleration run of each plan of the drive figures. */
export function accelerationRuns(figures: DriveFigures, launchRpmDefault: number): PlanRun[] {
  const vehicle = figures.vehicle;
  const runSpeed = vehicle.runSpeed ?? VEHICLE_DEFAULTS.runSpeed;
  const launchRpm = vehicle.launchRpm ?? launchRpmDefault;
  const plans = [...new Set(figures.gears.map((g) => g.planIndex))];
  return plans.map((planIndex) => {
    const gears = figures.gears.filter((g) => g.planIndex === planIndex);
    const planName = gears[0].planName;
    let time = 0;
    let speed = 0;
    let distance = 0;
    let gear = 1;
    let shiftLeft = 0;
    let traction = 0;
    let boostShort = 0;
    const phases: RunPhase[] = [];
    const samples: PlanRun['samples'] = [];
    const note = (limitedBy: RunLimit) => {
      const last = phases[phases.length - 1];
      if (last && last.gear === gear && last.limitedBy === limitedBy) [last.to, last.toSpeed] = [time, speed];
      else phases.push({ gear, limitedBy, from: time, to: time, fromSpeed: speed, toSpeed: speed });
    };
    const finish = (why: string | null): PlanRun => ({
      planIndex,
      planName,
      runSpeed,
      time: why === null ? time : null,
      distance: why === null ? distance : null,
      tractionLimitedTime: traction,
      boostLimitedTime: boostShort,
      phases,
      samples,
      why,
    });
    for (let n = 0; ; n++) {
      if (n % SAMPLE_EVERY === 0) samples.push({ time, roadSpeed: speed, gear });
      if (speed >= runSpeed) return finish(null);
      if (time > MAX_TIME) return finish(`the car does not reach ${(runSpeed * 3.6).toFixed(0)} km/h within ${MAX_TIME} s`);
      const load = roadLoad(vehicle, speed, figures.airDensity);
      let drive = 0;
      let limitedBy: RunLimit = 'shift';
      if (shiftLeft > 0) {
        note('shift');
        shiftLeft -= STEP;
        if (shiftLeft <= 1e-12) gear++;
      } else {
        const g = gears[gear - 1];
        const rpm = Math.max(launchRpm, engineSpeedAt(speed, g.overallRatio, vehicle.tyreRadius));
        if (rpm >= vehicle.shiftRpm && gear < gears.length) {
          shiftLeft = vehicle.shiftTime;
          if (shiftLeft <= 0) gear++;
          continue;
        }
        const at = gearForceAt(g, rpm);
        if ('why' in at) return finish(`at ${(speed * 3.6).toFixed(0)} km/h: ${at.why}`);
        const limit = tractionLimit(vehicle, load).force;
        drive = Math.min(at.force, limit);
        limitedBy = limit < at.force ? 'traction' : at.boostShort ? 'boost' : 'engine';
        if (limitedBy === 'traction') traction += STEP;
        if (at.boostShort) boostShort += STEP;
        note(limitedBy);
      }
      const accel = (drive - load.drag - load.rolling) / vehicle.mass;
      if (limitedBy !== 'shift' && !(accel > 0)) return finish(`the car stops gaining speed at ${(speed * 3.6).toFixed(0)} km/h in gear ${gear}`);
      const next = Math.max(0, speed + accel * STEP);
      distance += 0.5 * (speed + next) * STEP;
      speed = next;
      time += STEP;
    }
  });
}
