/**
 * The time-to-boost integration: the quasi-steady shaft balance I·dω/dt = (P_t − P_c)/ω written
 * for the rotor's kinetic energy E = ½·I·ω², dE/dt = P_t − P_c, which has no trouble at ω = 0 and
 * is exact for a constant surplus. Explicit steps in time; the engine speed rises with the car in
 * the gear held. Pure: the physics comes in through `SpoolPhysics`.
 */

/** What the integration asks of the engine, turbocharger and car at one moment. */
export interface SpoolPhysics {
  /** Boost target at an engine speed, Pa gauge (the gates open there). */
  target(rpm: number): number;
  /** Boost the compressor gives at a shaft speed (rad/s) and engine speed, Pa gauge, not capped at the target. */
  boostAt(rpm: number, shaftSpeed: number): number;
  /** The shaft speed (rad/s) at which the compressor gives a boost at an engine speed. */
  shaftSpeedAt(rpm: number, boost: number): number;
  /**
   * At an engine speed and boost: the turbine's surplus power with the gates shut, η_m·P_t − P_c (W),
   * and the car's acceleration (m/s²); or why the estimate cannot go on from here.
   */
  state(rpm: number, boost: number, roadSpeed: number): { surplus: number; acceleration: number } | { why: string };
  /** Engine speed at a road speed, rpm. */
  engineSpeedAt(roadSpeed: number): number;
  roadSpeedAt(rpm: number): number;
}

export interface SpoolSample {
  /** s */
  time: number;
  /** Pa gauge */
  boost: number;
  /** Shaft speed, rpm. */
  shaftSpeed: number;
  /** Engine speed, rpm. */
  rpm: number;
  /** m/s */
  roadSpeed: number;
}

export interface SpoolRun {
  samples: SpoolSample[];
  /** Time to 90 % of the target, s; null when not reached (`why` says). */
  timeTo90: number | null;
  why: string | null;
}

export interface SpoolSettings {
  /** Polar moment of inertia of the rotor, kg·m². */
  inertia: number;
  /** Engine speed at the start, rpm. */
  startRpm: number;
  /** The run stops at this engine speed (the driver shifts), rpm. */
  stopRpm: number;
  /** Time step, s. */
  step?: number;
  /** Longest time followed, s. */
  maxTime?: number;
}

/** Share of the target that counts as "on boost". */
const ON_BOOST_SHARE = 0.9;
const RAD_PER_S_TO_RPM = 60 / (2 * Math.PI);
const fmtKpa = (pa: number) => `${(pa / 1000).toFixed(0)} kPa`;

/** Integrates from no boost at the start speed until the target is held, the stop speed, or the time limit. */
export function integrateSpool(physics: SpoolPhysics, settings: SpoolSettings): SpoolRun {
  const { inertia, startRpm, stopRpm } = settings;
  const dt = settings.step ?? 0.02;
  const maxTime = settings.maxTime ?? 10;
  let rpm = startRpm;
  let roadSpeed = physics.roadSpeedAt(rpm);
  let boost = Math.min(0, physics.target(rpm));
  let omega = physics.shaftSpeedAt(rpm, boost);
  let energy = 0.5 * inertia * omega * omega;
  let time = 0;
  const samples: SpoolSample[] = [];
  let previousExcess = Number.NaN;
  for (let n = 0; ; n++) {
    samples.push({ time, boost, shaftSpeed: omega * RAD_PER_S_TO_RPM, rpm, roadSpeed });
    const excess = boost - ON_BOOST_SHARE * physics.target(rpm);
    if (excess >= 0) {
      // Linear between the last two steps: exact where boost grows linearly in time.
      const timeTo90 = n === 0 ? 0 : time - (dt * excess) / (excess - previousExcess);
      return { samples, timeTo90, why: null };
    }
    previousExcess = excess;
    if (time >= maxTime - 1e-9) return { samples, timeTo90: null, why: `boost reaches only ${fmtKpa(boost)} within ${maxTime} s` };
    if (rpm >= stopRpm)
      return { samples, timeTo90: null, why: `the engine reaches the shift speed (${Math.round(stopRpm)} rpm) at ${fmtKpa(boost)}, before 90 % of the target` };
    const s = physics.state(rpm, boost, roadSpeed);
    if ('why' in s) return { samples, timeTo90: null, why: s.why };
    energy = Math.max(0, energy + s.surplus * dt);
    roadSpeed = Math.max(0, roadSpeed + s.acceleration * dt);
    rpm = Math.min(stopRpm, physics.engineSpeedAt(roadSpeed));
    time = (n + 1) * dt;
    omega = Math.sqrt((2 * energy) / inertia);
    boost = physics.boostAt(rpm, omega);
    const target = physics.target(rpm);
    if (boost >= target) {
      // The gates open: the shaft turns no faster than the target needs.
      boost = target;
      omega = physics.shaftSpeedAt(rpm, target);
      energy = 0.5 * inertia * omega * omega;
    }
  }
}
