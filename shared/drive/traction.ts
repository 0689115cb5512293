/**
 * The traction limit with longitudinal load transfer (Gillespie 1992, "Fundamentals of Vehicle
 * Dynamics", ch. 2, traction-limited acceleration): as the car accelerates, the axles' loads shift
 * rearward by ΔW = m·a·h/L, and a = (F − D − R)/m depends on the very force F the tyres pass. The
 * limit is the fixed point of F = μ·N(F), solved here in closed form per axle. Drag is taken to
 * act at the centre of gravity's height and the road is level; both are said where the figures
 * are shown.
 */
import type { Vehicle } from './vehicle';

/** Standard acceleration of gravity, m/s² (CGPM 1901, by definition). */
export const GRAVITY = 9.80665;

/** The resistances at one road speed, N. */
export interface RoadLoad {
  /** Aerodynamic drag ½·ρ·CdA·v², N. */
  drag: number;
  /** Rolling resistance f_r·m·g, N. */
  rolling: number;
}

export function roadLoad(vehicle: Pick<Vehicle, 'mass' | 'dragArea' | 'rollingResistance'>, roadSpeed: number, airDensity: number): RoadLoad {
  return { drag: 0.5 * airDensity * vehicle.dragArea * roadSpeed * roadSpeed, rolling: vehicle.rollingResistance * vehicle.mass * GRAVITY };
}

export interface TractionLimit {
  /** The most force the driven tyres pass at the wheels, N. */
  force: number;
  /** What sets it: the driven tyres' grip, or the front axle unloading fully (the front lifts). */
  limitedBy: 'grip' | 'front-lifts';
  /** Load on the front and rear axles at that force, N. */
  frontLoad: number;
  rearLoad: number;
}

/** The share of drive torque on the front axle and the static share of weight on it. */
function axleShares(vehicle: Pick<Vehicle, 'drivenAxle' | 'frontTorqueShare' | 'drivenAxleWeightShare'>): { frontTorque: number; frontWeight: number } {
  if (vehicle.drivenAxle === 'front') return { frontTorque: 1, frontWeight: vehicle.drivenAxleWeightShare };
  if (vehicle.drivenAxle === 'rear') return { frontTorque: 0, frontWeight: 1 - vehicle.drivenAxleWeightShare };
  return { frontTorque: vehicle.frontTorqueShare ?? 0.5, frontWeight: vehicle.drivenAxleWeightShare };
}

/**
 * The traction limit at one road load. With k the front's share of the drive, s the front's static
 * share of the weight W, μ the grip and ΔW = (h/L)·(F − D − R) the load moved rearward:
 *   front axle:  k·F ≤ μ·(s·W − ΔW)       ⇒ F ≤ μ·(s·W + (h/L)(D+R)) / (k + μ·h/L)
 *   rear axle:   (1−k)·F ≤ μ·((1−s)·W + ΔW) ⇒ F ≤ μ·((1−s)·W − (h/L)(D+R)) / ((1−k) − μ·h/L), when the divisor is positive
 *   front lifts: s·W − ΔW ≥ 0             ⇒ F ≤ s·W·L/h + D + R
 * (With D = R = 0, front drive gives Gillespie's F = μ·W·(c/L)/(1 + μ·h/L), rear drive
 * F = μ·W·(b/L)/(1 − μ·h/L).)
 */
export function tractionLimit(vehicle: Vehicle, load: RoadLoad): TractionLimit {
  const { frontTorque: k, frontWeight: s } = axleShares(vehicle);
  const W = vehicle.mass * GRAVITY;
  const mu = vehicle.grip;
  const hl = vehicle.cgHeight / vehicle.wheelbase;
  const resist = load.drag + load.rolling;
  let force = (s * W) / hl + resist;
  let limitedBy: TractionLimit['limitedBy'] = 'front-lifts';
  if (k > 0) {
    const front = (mu * (s * W + hl * resist)) / (k + mu * hl);
    if (front < force) [force, limitedBy] = [front, 'grip'];
  }
  const rearDivisor = 1 - k - mu * hl;
  if (rearDivisor > 0) {
    const rear = (mu * ((1 - s) * W - hl * resist)) / rearDivisor;
    if (rear < force) [force, limitedBy] = [Math.max(0, rear), 'grip'];
  }
  const transfer = hl * (force - resist);
  return { force, limitedBy, frontLoad: s * W - transfer, rearLoad: (1 - s) * W + transfer };
}
