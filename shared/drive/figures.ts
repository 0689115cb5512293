/**
 * Force at the wheels per gear, the traction limit beside it, and the boost the tyres can use: from
 * the study's own operating lines (each plan's torque at each engine speed), so that only points
 * the compressor can deliver count. SI throughout.
 *
 * The usable boost at an engine speed is the highest boost at which the wheel force stays within
 * the traction limit. Between the boost solved and a lower one the torque is taken to follow the
 * manifold pressure at the point's own charge temperature (the air the cylinders take follows the
 * manifold's density); a lower boost also cools the charge a little, so the estimate errs on the
 * side of too little torque, and writing the usable boost into a scenario recomputes the real lines.
 */
import { MAP_REGION_WORDS } from '../matching/compressor/reach';
import type { OperatingLine, OperatingPoint, StudyResult } from '../matching/result';
import type { StudyDocument } from '../schemas/study';
import { roadLoad, tractionLimit, type TractionLimit } from './traction';
import type { Vehicle } from './vehicle';

/** One engine speed in one gear. */
interface DrivePoint {
  /** Engine speed, rpm. */
  rpm: number;
  /** Road speed, m/s. */
  roadSpeed: number;
  /** Force at the driven wheels at the boost solved, N; null where the point gives no torque (`why` says). */
  wheelForce: number | null;
  /** The most force the tyres pass at this speed, N. */
  tractionLimit: number;
  limitedBy: TractionLimit['limitedBy'];
  /** Boost target of the row at this speed, Pa gauge. */
  boostTarget: number | null;
  /** Boost the point is solved at, Pa gauge (below the target where the turbine cannot hold it). */
  boost: number | null;
  /** The highest boost that keeps the wheel force within the limit (at most the target), Pa gauge; null where unknown. */
  usableBoost: number | null;
  /** The tyres pass less than the engine gives even without boost: usable boost is 0 and the pedal must do the rest. */
  beyondGripOffBoost: boolean;
  /** Why there is no force here (not reachable, not solved, no torque). */
  why: string | null;
}

export interface DriveGear {
  planIndex: number;
  planId: string;
  planName: string;
  /** Gear number, 1 for first. */
  gear: number;
  /** Overall ratio, gearbox times final drive. */
  overallRatio: number;
  /** The boost row the torque comes from. */
  rowIndex: number;
  rowLabel: string;
  points: DrivePoint[];
}

export interface DriveFigures {
  vehicle: Vehicle;
  scenarioIndex: number;
  scenarioName: string;
  /** The car names a scenario the study no longer has (renamed or deleted): the first one is used. */
  scenarioMissing: boolean;
  /** Drivetrain loss used, fraction of brake torque. */
  drivetrainLoss: number;
  /** Density of the ambient air for drag, kg/m³. */
  airDensity: number;
  gears: DriveGear[];
}

/** The scenario the vehicle names, or the first. */
export function driveScenarioIndex(doc: Pick<StudyDocument, 'scenarios'>, vehicle: Pick<Vehicle, 'scenario'>): number {
  const i = vehicle.scenario === undefined ? 0 : doc.scenarios.findIndex((s) => s.name === vehicle.scenario);
  return i < 0 ? 0 : i;
}

/**
 * The boost row a gear runs on: the gear row of the highest gear at or below it (a row for 3rd gear
 * also covers 4th when no row names 4th), else the first full-load row, else the first row.
 */
export function rowForGear(rows: readonly { kind: string; gear?: number }[], gear: number): number {
  let best = -1;
  rows.forEach((r, i) => {
    if (r.kind === 'gear' && r.gear !== undefined && r.gear <= gear && (best < 0 || r.gear > (rows[best].gear ?? 0))) best = i;
  });
  if (best >= 0) return best;
  const full = rows.findIndex((r) => r.kind === 'full-load');
  return full >= 0 ? full : 0;
}

/** Road speed at an engine speed in a gear, m/s. */
export function roadSpeedAt(rpm: number, overallRatio: number, tyreRadius: number): number {
  return (rpm * 2 * Math.PI * tyreRadius) / (60 * overallRatio);
}

/** Engine speed at a road speed in a gear, rpm. */
export function engineSpeedAt(roadSpeed: number, overallRatio: number, tyreRadius: number): number {
  return (roadSpeed * 60 * overallRatio) / (2 * Math.PI * tyreRadius);
}

/** Force at the driven wheels from a brake torque, N. */
export function wheelForceOf(torque: number, overallRatio: number, drivetrainLoss: number, tyreRadius: number): number {
  return (torque * overallRatio * (1 - drivetrainLoss)) / tyreRadius;
}

/** Why a point gives no torque, in words; null when it gives one. */
function noTorqueWhy(p: OperatingPoint): string | null {
  if (!p.solved) return `not solved: ${p.findings[0]?.message ?? 'no physical state'}`;
  const v = p.values;
  if (v.reachable === false)
    return `not reachable: the compressor point is ${v.mapRegion ? MAP_REGION_WORDS[v.mapRegion] : 'off its map'}, so it gives no torque`;
  if (v.torque === null) return 'no torque: the study gives no fuel or power basis here';
  return null;
}

/**
 * The highest boost at which the force stays within `limit`, Pa gauge, with torque following the
 * manifold pressure from the solved point (module note); never above the target, never below 0
 * (or the target, when that is below 0).
 */
export function usableBoostOf(force: number, limit: number, boost: number, target: number, ambientPressure: number): { usable: number; beyondGrip: boolean } {
  if (force <= limit) return { usable: target, beyondGrip: false };
  const highest = ((ambientPressure + boost) * limit) / force - ambientPressure;
  const floor = Math.min(0, target);
  return { usable: Math.min(target, Math.max(highest, floor)), beyondGrip: highest < floor };
}

function gearPoints(line: OperatingLine, vehicle: Vehicle, overallRatio: number, drivetrainLoss: number, airDensity: number): DrivePoint[] {
  return line.points.map((p) => {
    const roadSpeed = roadSpeedAt(p.rpm, overallRatio, vehicle.tyreRadius);
    const limit = tractionLimit(vehicle, roadLoad(vehicle, roadSpeed, airDensity));
    const why = noTorqueWhy(p);
    const base = { rpm: p.rpm, roadSpeed, tractionLimit: limit.force, limitedBy: limit.limitedBy, why };
    if (!p.solved) return { ...base, wheelForce: null, boostTarget: null, boost: null, usableBoost: null, beyondGripOffBoost: false };
    const v = p.values;
    const target = v.boostTarget ?? v.boost;
    if (why !== null || v.torque === null)
      return { ...base, wheelForce: null, boostTarget: target, boost: v.boost, usableBoost: null, beyondGripOffBoost: false };
    const wheelForce = wheelForceOf(v.torque, overallRatio, drivetrainLoss, vehicle.tyreRadius);
    const { usable, beyondGrip } = usableBoostOf(wheelForce, limit.force, v.boost, target, v.ambientPressure);
    return { ...base, wheelForce, boostTarget: target, boost: v.boost, usableBoost: usable, beyondGripOffBoost: beyondGrip };
  });
}

/** The drive figures of a study with a vehicle (null without one), from the study's result. */
export function driveFigures(doc: StudyDocument, result: StudyResult): DriveFigures | null {
  const vehicle = doc.vehicle;
  if (!vehicle) return null;
  const scenarioIndex = driveScenarioIndex(doc, vehicle);
  const scenario = doc.scenarios[scenarioIndex];
  const drivetrainLoss = vehicle.drivetrainLoss ?? doc.power.drivetrainLoss;
  const byKey = new Map(result.lines.filter((l) => l.scenarioIndex === scenarioIndex).map((l) => [`${l.planIndex}/${l.rowIndex}`, l]));
  let airDensity = Number.NaN;
  const gears: DriveGear[] = [];
  doc.plans.forEach((plan, planIndex) => {
    vehicle.gearRatios.forEach((ratio, g) => {
      const gear = g + 1;
      const rowIndex = rowForGear(scenario.boostSchedule, gear);
      const line = byKey.get(`${planIndex}/${rowIndex}`);
      if (!line) return;
      if (Number.isNaN(airDensity)) airDensity = line.context.ambient.pressure / (line.context.air.gasConstant * line.context.ambient.temperature);
      const overallRatio = ratio * vehicle.finalDrive;
      gears.push({
        planIndex,
        planId: plan.id,
        planName: plan.name,
        gear,
        overallRatio,
        rowIndex,
        rowLabel: line.rowLabel,
        points: gearPoints(line, vehicle, overallRatio, drivetrainLoss, airDensity),
      });
    });
  });
  const scenarioMissing = vehicle.scenario !== undefined && scenario.name !== vehicle.scenario;
  return { vehicle, scenarioIndex, scenarioName: scenario.name, scenarioMissing, drivetrainLoss, airDensity, gears };
}
