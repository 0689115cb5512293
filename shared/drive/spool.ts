/**
 * Time to boost per plan: from no boost at a start speed in a gear held, the rotor spun up by the
 * turbine's surplus power with the gates shut (quasi-steady: each moment is one of the engine's
 * own points, solved at the boost of that moment), the car accelerating and the engine speed
 * rising with it, until 90 % of the boost target.
 *
 * The shaft speed at a boost comes from the compressor's head: at each engine speed the isentropic
 * head Δh_s = cp·T1·(PR^((γ−1)/γ) − 1) is taken to follow the square of the shaft speed (Euler's
 * turbomachinery equation at a fixed work coefficient), scaled to the speed the map gives on the
 * study's own steady point there. Losses before and after the compressor are those of the steady
 * point at that engine speed. Both are approximations a planning estimate can carry; the result
 * is an estimate, not a measurement.
 */
import type { CompressorModel } from '../matching/compressor/model';
import { solvePoint } from '../matching/compressor/solve-point';
import { exhaustUsable } from '../matching/exhaust/context';
import { shutGate } from '../matching/exhaust/expansion';
import { exhaustGasOf } from '../matching/exhaust/gas';
import type { TurbineModel } from '../matching/exhaust/model';
import { MAP_REGION_WORDS } from '../matching/compressor/reach';
import type { OperatingLine, StudyResult } from '../matching/result';
import { valueAtRpm } from '../matching/rpm-table';
import type { StudyDocument } from '../schemas/study';
import { driveScenarioIndex, engineSpeedAt, roadSpeedAt, rowForGear, wheelForceOf } from './figures';
import { integrateSpool, type SpoolSample } from './spool-integrate';
import { roadLoad, tractionLimit } from './traction';
import type { Vehicle } from './vehicle';

/** Compressor wheel exducer diameter assumed when neither the study nor the map says, m (common practice, no source). */
const DEFAULT_WHEEL_DIAMETER = 0.055;

/**
 * Rotor inertia from the compressor wheel's size, kg·m²: 3·10⁻⁵ kg·m² at a 55 mm wheel, scaling
 * with the fifth power of the diameter (inertia of geometrically similar wheels goes as ρ·d⁵).
 * The reference figure is common practice, no source: a planning default, to be replaced by the
 * maker's figure.
 */
export function rotorInertiaFromWheel(wheelDiameter: number): number {
  return 3e-5 * Math.pow(wheelDiameter / DEFAULT_WHEEL_DIAMETER, 5);
}

type InertiaSource = 'study' | 'map' | 'wheel-size' | 'default-wheel';

export interface PlanSpool {
  planIndex: number;
  planId: string;
  planName: string;
  /** Rotor inertia used, kg·m², and where it came from. */
  inertia: number;
  inertiaFrom: InertiaSource;
  gear: number;
  startRpm: number;
  samples: SpoolSample[];
  /** Time to 90 % of the boost target, s; null when not reached or not known (`why` says). */
  timeTo90: number | null;
  why: string | null;
}

export interface SpoolInputs {
  compressorModels: readonly (CompressorModel | null)[];
  turbineModels: readonly (TurbineModel | null)[];
  /** The rotor inertia the map of each plan gives, kg·m² (null: none). */
  mapInertias?: readonly (number | null)[];
}

/** The spool settings a vehicle gives, with defaults: second gear (first when there is one), from the study's lowest rpm. */
function spoolSettingsOf(doc: StudyDocument, vehicle: Vehicle): { gear: number; startRpm: number } {
  if (vehicle.spool) return vehicle.spool;
  const rpm = doc.engine.rpm;
  const lowest = rpm.kind === 'list' ? rpm.values[0] : rpm.min;
  return { gear: Math.min(2, vehicle.gearRatios.length), startRpm: Math.min(lowest, vehicle.shiftRpm * 0.9) };
}

function inertiaOf(vehicle: Vehicle, planId: string, mapInertia: number | null): { inertia: number; inertiaFrom: InertiaSource } {
  const rotor = vehicle.rotors?.find((r) => r.planId === planId);
  if (rotor?.rotorInertia !== undefined) return { inertia: rotor.rotorInertia, inertiaFrom: 'study' };
  if (mapInertia !== null && mapInertia > 0) return { inertia: mapInertia, inertiaFrom: 'map' };
  if (rotor?.wheelDiameter !== undefined) return { inertia: rotorInertiaFromWheel(rotor.wheelDiameter), inertiaFrom: 'wheel-size' };
  return { inertia: rotorInertiaFromWheel(DEFAULT_WHEEL_DIAMETER), inertiaFrom: 'default-wheel' };
}

/** A table by rpm of the steady line's head calibration and losses, read by linear interpolation. */
interface Calibration {
  rpm: number[];
  /** ω²/Δh_s, (rad/s)² per J/kg. */
  k: number[];
  p1: number[];
  coolerLoss: number[];
  t1: number[];
}

function interpolate(xs: number[], ys: number[], x: number): number {
  if (x <= xs[0]) return ys[0];
  const last = xs.length - 1;
  if (x >= xs[last]) return ys[last];
  let i = 1;
  while (xs[i] < x) i++;
  return ys[i - 1] + ((ys[i] - ys[i - 1]) * (x - xs[i - 1])) / (xs[i] - xs[i - 1]);
}

function calibrate(line: OperatingLine): Calibration | null {
  const { cp, gamma } = line.context.air;
  const e = (gamma - 1) / gamma;
  const c: Calibration = { rpm: [], k: [], p1: [], coolerLoss: [], t1: [] };
  for (const p of line.points) {
    if (!p.solved) continue;
    const v = p.values;
    const head = cp * v.compressorInletTemperature * (Math.pow(v.pressureRatio, e) - 1);
    if (v.shaftSpeed === null || !(v.shaftSpeed > 0) || !(head > 0)) continue;
    const omega = (v.shaftSpeed * 2 * Math.PI) / 60;
    c.rpm.push(v.rpm);
    c.k.push((omega * omega) / head);
    c.p1.push(v.compressorInletPressure);
    c.coolerLoss.push(v.chargeCoolerLoss ?? 0);
    c.t1.push(v.compressorInletTemperature);
  }
  return c.rpm.length > 0 ? c : null;
}

/** The time to boost of every plan of a study with a vehicle (empty without one). */
export function planSpools(doc: StudyDocument, result: StudyResult, inputs: SpoolInputs): PlanSpool[] {
  const vehicle = doc.vehicle;
  if (!vehicle) return [];
  const { gear, startRpm } = spoolSettingsOf(doc, vehicle);
  const scenarioIndex = driveScenarioIndex(doc, vehicle);
  const rowIndex = rowForGear(doc.scenarios[scenarioIndex].boostSchedule, gear);
  const overallRatio = vehicle.gearRatios[gear - 1] * vehicle.finalDrive;
  const drivetrainLoss = vehicle.drivetrainLoss ?? doc.power.drivetrainLoss;
  return doc.plans.map((plan, planIndex) => {
    const { inertia, inertiaFrom } = inertiaOf(vehicle, plan.id, inputs.mapInertias?.[planIndex] ?? null);
    const base = { planIndex, planId: plan.id, planName: plan.name, inertia, inertiaFrom, gear, startRpm };
    const none = (why: string): PlanSpool => ({ ...base, samples: [], timeTo90: null, why });
    const line = result.lines.find((l) => l.planIndex === planIndex && l.scenarioIndex === scenarioIndex && l.rowIndex === rowIndex);
    const compressor = inputs.compressorModels[planIndex] ?? null;
    const turbine = inputs.turbineModels[planIndex] ?? null;
    if (!line) return none('the line is not computed');
    const ctx = line.context;
    const ex = ctx.exhaust;
    if (!ex) return none('the plan has no exhaust side: the time to boost needs its turbine');
    if (!turbine || !ex.turbine || !exhaustUsable(ex)) return none('the plan has no usable turbine map');
    if (!compressor) return none('the plan has no compressor map: the shaft speed is unknown');
    const cal = calibrate(line);
    if (!cal) return none("the compressor map gives no shaft speed on this line's steady points");
    const boostTable = ctx.tables.boost;
    const engine = doc.engine;
    const e = (ctx.air.gamma - 1) / ctx.air.gamma;
    const pAmb = ctx.ambient.pressure;
    const airDensity = pAmb / (ctx.air.gasConstant * ctx.ambient.temperature);
    const head = (rpm: number, boost: number) => {
      const pr = Math.max(1, (pAmb + boost + interpolate(cal.rpm, cal.coolerLoss, rpm)) / interpolate(cal.rpm, cal.p1, rpm));
      return ctx.air.cp * interpolate(cal.rpm, cal.t1, rpm) * (Math.pow(pr, e) - 1);
    };
    let startEfficiency: number | undefined;
    const run = integrateSpool(
      {
        target: (rpm) => (boostTable ? valueAtRpm(boostTable, rpm) : 0),
        shaftSpeedAt: (rpm, boost) => Math.sqrt(interpolate(cal.rpm, cal.k, rpm) * head(rpm, boost)),
        boostAt: (rpm, omega) => {
          const h = (omega * omega) / interpolate(cal.rpm, cal.k, rpm);
          const pr = Math.pow(1 + h / (ctx.air.cp * interpolate(cal.rpm, cal.t1, rpm)), 1 / e);
          return pr * interpolate(cal.rpm, cal.p1, rpm) - interpolate(cal.rpm, cal.coolerLoss, rpm) - pAmb;
        },
        state: (rpm, boost, roadSpeed) => {
          const op = {
            rpm,
            volumetricEfficiency: valueAtRpm(engine.volumetricEfficiency, rpm),
            boost,
            lambda: valueAtRpm(doc.fuelSystem.lambda, rpm),
          };
          const p = solvePoint(ctx, compressor, op, { lineChecked: true, findings: false, startEfficiency });
          if (!p.solved) return { why: `no physical state at ${Math.round(rpm)} rpm` };
          const v = p.values;
          if (v.reachable === false)
            return {
              why: `at ${Math.round(rpm)} rpm and ${(boost / 1000).toFixed(0)} kPa the compressor point is ${v.mapRegion ? MAP_REGION_WORDS[v.mapRegion] : 'off its map'}: not reachable, so the estimate stops there`,
            };
          startEfficiency = v.compressorEfficiency ?? undefined;
          const shut = shutGate(turbine, exhaustGasOf(v, ctx, ex, turbine));
          const surplus = ex.mechanicalEfficiency * shut.value.power - (v.compressorPower ?? 0);
          const load = roadLoad(vehicle, roadSpeed, airDensity);
          const drive =
            v.torque === null ? 0 : Math.min(wheelForceOf(v.torque, overallRatio, drivetrainLoss, vehicle.tyreRadius), tractionLimit(vehicle, load).force);
          const acceleration = (drive - load.drag - load.rolling) / vehicle.mass;
          return { surplus, acceleration: Number.isFinite(acceleration) ? acceleration : 0 };
        },
        roadSpeedAt: (rpm) => roadSpeedAt(rpm, overallRatio, vehicle.tyreRadius),
        engineSpeedAt: (speed) => engineSpeedAt(speed, overallRatio, vehicle.tyreRadius),
      },
      { inertia, startRpm, stopRpm: vehicle.shiftRpm },
    );
    return { ...base, samples: run.samples, timeTo90: run.timeTo90, why: run.why };
  });
}
