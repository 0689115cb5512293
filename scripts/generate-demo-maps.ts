/**
 * Generates Spoolbook's invented demo maps (data/maps/*.csv) from a simple physical model of a
 * centrifugal compressor and of a radial turbine. Nothing here is copied or traced from any
 * published map; the wheels, names and numbers are invented. The output is deterministic (no
 * randomness), so running it again reproduces the committed files byte for byte.
 *
 *   npx tsx scripts/generate-demo-maps.ts          (or: npm run maps:generate)
 *
 * Compressor model, per speed line N at the map's reference inlet conditions (T_ref, p_ref):
 *   tip speed          U = π·D·N/60
 *   flow coefficient   φ = ṁc/(ρ_ref·U·D²),  ρ_ref = p_ref/(R·T_ref)
 *   work               Δh = U²·(σ − κ·φ)      slip factor σ = 0.9; κ: backswept blades give less work at more flow
 *   efficiency         η = η_peak − a·((φ − φ_opt)/φ_opt)² − b·(M_u − M_u,opt)² − choke loss,
 *                      falling away quadratically from a peak along flow and along tip Mach number M_u = U/a_ref
 *   pressure ratio     PR = (1 + η·Δh/(cp·T_ref))^(γ/(γ−1))
 *   surge              where the speed line's slope dPR/dṁ turns from positive to negative (its peak)
 *   choke              where the flow reaches the inducer throat's limit φ_choke(U), which falls as U rises
 * Turbine model, per speed line:
 *   flow parameter     FP = FP_max·√(1 − ER^(−k))·(1 − c·(U/U_max)²)   a nozzle-like rise that saturates
 *   efficiency         η = η_bearings·(η_peak − a·(U/C_s − 0.68)²),  C_s = √(2·cp_e·T3·(1 − ER^(−(γ_e−1)/γ_e)))  (blade-speed ratio)
 *                      total-to-static, with the bearings' losses counted (as a gas stand that works turbine efficiency
 *                      out from the compressor's power gives it), so the files say "efficiency kind: total-to-static, with bearing losses"
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import path from 'node:path';
import { parseMapFile } from '#shared/maps/parse';
import { writeMapFile } from '#shared/maps/write';
import { compressorFlowScale, efficiencyScale, flowParameterScale, speedScale } from '#shared/maps/scales';
import type {
  CompressorCurve,
  CompressorFileUnits,
  CompressorMap,
  CompressorMapPoint,
  MapReferenceConditions,
  TurbineCurve,
  TurbineMap,
} from '#shared/maps/types';
import { mapValueToSI } from '#shared/maps/units';

const GAMMA = 1.4;
const R_AIR = 287.05287; // J/(kg·K), ISO 2533
const CP_AIR = (GAMMA * R_AIR) / (GAMMA - 1);
const GAMMA_EXHAUST = 1.33;
const CP_EXHAUST = 1150; // J/(kg·K), hot combustion products (physics.md §5)

const NOTE_INVENTED = 'Invented for Spoolbook by scripts/generate-demo-maps.ts from a simple physical model; not a real compressor or turbine.';
const NOTE_NOT_FOR_BUILD = 'For trying Spoolbook out only: do not choose hardware from it.';

// ---------------------------------------------------------------------------------------------
// Rounding in file units: the numbers a person would write, stored so that they read back exactly.

function roundSignificant(value: number, digits: number): number {
  if (value === 0) return 0;
  const power = Math.floor(Math.log10(Math.abs(value))) + 1 - digits;
  const factor = 10 ** Math.abs(power);
  return power >= 0 ? Math.round(value / factor) * factor : Math.round(value * factor) / factor;
}

function roundDecimals(value: number, decimals: number): number {
  const factor = 10 ** decimals;
  return Math.round(value * factor) / factor;
}

/** SI value of a number rounded in file units, computed the way the reader computes it. */
function viaFile(si: number, factor: number, round: (fileValue: number) => number): number {
  return round(si / factor) * factor;
}

// ---------------------------------------------------------------------------------------------
// Compressor

interface CompressorSpec {
  file: string;
  name: string;
  /** Impeller tip diameter, m. */
  tipDiameter: number;
  /** Rated speed, rpm; also the top speed line. */
  maxSpeed: number;
  /** Speed lines as fractions of the rated speed. */
  speedFractions: number[];
  peakEfficiency: number;
  /** Flow coefficient of best efficiency at the design tip Mach number. */
  optimumFlowCoefficient: number;
  /** Choke flow coefficient at low tip speed. */
  chokeFlowCoefficient: number;
  /** Backsweep term κ of the work coefficient σ − κ·φ. */
  backsweep: number;
  /**
   * How fast efficiency falls away from its peak towards surge (the coefficient of the quadratic
   * loss below the optimum flow; 0.45 when absent). A ported shroud keeps the inducer flowing near
   * surge: less loss there, and the speed lines peak (surge) at lower flow, a wider map.
   */
  surgeSideLoss?: number;
  reference: MapReferenceConditions;
  units: CompressorFileUnits;
  islandLevels: number[];
}

const SLIP_FACTOR = 0.9;
const DESIGN_TIP_MACH = 1.15;
const POINTS_PER_SPEED_LINE = 12;

class CompressorPhysics {
  readonly density: number;
  readonly soundSpeed: number;
  readonly chokeTipSpeed: number;
  constructor(readonly spec: CompressorSpec) {
    this.density = spec.reference.pressure / (R_AIR * spec.reference.temperature);
    this.soundSpeed = Math.sqrt(GAMMA * R_AIR * spec.reference.temperature);
    // Choke flow rises with speed but less than in proportion: at the rated tip speed the throat's
    // flow coefficient is 72 % of its low-speed value (tanh(x)/x = 0.72 at x ≈ 1.1).
    this.chokeTipSpeed = this.tipSpeed(spec.maxSpeed) / 1.1;
  }
  tipSpeed(speed: number): number {
    return (Math.PI * this.spec.tipDiameter * speed) / 60;
  }
  flowOf(phi: number, speed: number): number {
    const u = this.tipSpeed(speed);
    return phi * this.density * u * this.spec.tipDiameter ** 2;
  }
  chokePhi(speed: number): number {
    const x = this.tipSpeed(speed) / this.chokeTipSpeed;
    return (this.spec.chokeFlowCoefficient * Math.tanh(x)) / x;
  }
  optimumPhi(speed: number): number {
    const mach = this.tipSpeed(speed) / this.soundSpeed;
    return this.spec.optimumFlowCoefficient * (1 - 0.1 * (mach - DESIGN_TIP_MACH));
  }
  efficiency(phi: number, speed: number): number {
    const mach = this.tipSpeed(speed) / this.soundSpeed;
    const optimum = this.optimumPhi(speed);
    const offPeak = (phi - optimum) / optimum;
    const flowLoss = (phi < optimum ? (this.spec.surgeSideLoss ?? 0.45) : 0.5) * offPeak ** 2;
    const machLoss = 0.15 * (mach - DESIGN_TIP_MACH) ** 2;
    const nearChoke = Math.max(0, (phi / this.chokePhi(speed) - 0.75) / 0.25);
    return this.spec.peakEfficiency - flowLoss - machLoss - 0.08 * nearChoke ** 2;
  }
  pressureRatio(phi: number, speed: number): number {
    const u = this.tipSpeed(speed);
    const work = u * u * (SLIP_FACTOR - this.spec.backsweep * phi);
    const eta = this.efficiency(phi, speed);
    return (1 + (eta * work) / (CP_AIR * this.spec.reference.temperature)) ** (GAMMA / (GAMMA - 1));
  }
  /** The surge point: the flow coefficient at the peak of the speed line (golden-section search). */
  surgePhi(speed: number): number {
    let low = 0.2 * this.optimumPhi(speed);
    let high = this.optimumPhi(speed);
    const ratio = (Math.sqrt(5) - 1) / 2;
    for (let i = 0; i < 80; i++) {
      const a = high - ratio * (high - low);
      const b = low + ratio * (high - low);
      if (this.pressureRatio(a, speed) > this.pressureRatio(b, speed)) high = b;
      else low = a;
    }
    return (low + high) / 2;
  }
}

function speedLineSpeeds(spec: CompressorSpec): number[] {
  return spec.speedFractions.map((f) => (f === 1 ? spec.maxSpeed : Math.round((f * spec.maxSpeed) / 5000) * 5000));
}

interface Factors {
  flow: number;
  efficiency: number;
  speed: number;
}

function compressorPoint(
  physics: CompressorPhysics,
  phi: number,
  speed: number,
  factors: Factors,
  withEfficiency: boolean,
  withSpeed: boolean,
): CompressorMapPoint {
  const percent = physics.spec.units.efficiency === 'percent';
  return {
    correctedMassFlow: viaFile(physics.flowOf(phi, speed), factors.flow, (v) => roundSignificant(v, 4)),
    pressureRatio: roundDecimals(physics.pressureRatio(phi, speed), 3),
    efficiency: withEfficiency ? viaFile(physics.efficiency(phi, speed), factors.efficiency, (v) => roundDecimals(v, percent ? 1 : 3)) : null,
    speed: withSpeed ? viaFile(speed, factors.speed, (v) => Math.round(v)) : null,
  };
}

/** Removes a point equal to the one before it (rounding can merge close points). */
function withoutRepeats(points: CompressorMapPoint[]): CompressorMapPoint[] {
  return points.filter((p, i) => i === 0 || p.correctedMassFlow !== points[i - 1].correctedMassFlow || p.pressureRatio !== points[i - 1].pressureRatio);
}

/** φ where efficiency crosses `level` between `from` (above the level) and `to` (below it). */
function crossing(physics: CompressorPhysics, speed: number, level: number, from: number, to: number): number {
  let inside = from;
  let outside = to;
  for (let i = 0; i < 60; i++) {
    const mid = (inside + outside) / 2;
    if (physics.efficiency(mid, speed) >= level) inside = mid;
    else outside = mid;
  }
  return (inside + outside) / 2;
}

/**
 * An efficiency island at `level`: where the model's efficiency crosses the level on many
 * closely spaced speeds, left side going up and right side coming down, closed. The island is cut
 * by the surge line, the choke limit and the top and bottom speed lines, as on a measured map.
 */
function island(physics: CompressorPhysics, level: number, factors: Factors): CompressorMapPoint[] {
  const speeds = speedLineSpeeds(physics.spec);
  const lowest = speeds[0];
  const highest = speeds[speeds.length - 1];
  const left: CompressorMapPoint[] = [];
  const right: CompressorMapPoint[] = [];
  const point = (phi: number, speed: number) => compressorPoint(physics, phi, speed, factors, false, false);
  /** Points along a speed line between two flow coefficients, where the island is cut by that line. */
  const along = (speed: number, from: number, to: number) => Array.from({ length: 7 }, (_, k) => point(from + ((to - from) * (k + 1)) / 8, speed));
  let bottomCut: CompressorMapPoint[] = [];
  let topCut: CompressorMapPoint[] = [];
  const steps = 36;
  for (let i = 0; i <= steps; i++) {
    const speed = lowest + ((highest - lowest) * i) / steps;
    const surge = physics.surgePhi(speed);
    const choke = physics.chokePhi(speed);
    let best = surge;
    for (let k = 0; k <= 200; k++) {
      const phi = surge + ((choke - surge) * k) / 200;
      if (physics.efficiency(phi, speed) > physics.efficiency(best, speed)) best = phi;
    }
    if (physics.efficiency(best, speed) <= level) continue;
    const leftPhi = physics.efficiency(surge, speed) >= level ? surge : crossing(physics, speed, level, best, surge);
    const rightPhi = physics.efficiency(choke, speed) >= level ? choke : crossing(physics, speed, level, best, choke);
    left.push(point(leftPhi, speed));
    right.push(point(rightPhi, speed));
    // Still above the level on the lowest or the top speed line: the island is cut by that line,
    // so its edge there follows the line instead of a straight chord.
    if (i === 0) bottomCut = along(speed, rightPhi, leftPhi);
    if (i === steps) topCut = along(speed, leftPhi, rightPhi);
  }
  const ring = withoutRepeats([...left, ...topCut, ...right.reverse(), ...bottomCut]);
  const efficiency = viaFile(level, factors.efficiency, (v) => roundDecimals(v, 3));
  const points = ring.map((p) => ({ ...p, efficiency }));
  return points.length >= 3 ? [...points, { ...points[0] }] : [];
}

function compressorMap(spec: CompressorSpec): CompressorMap {
  const physics = new CompressorPhysics(spec);
  const factors: Factors = {
    flow: compressorFlowScale(spec.units, spec.reference),
    efficiency: efficiencyScale(spec.units.efficiency),
    speed: speedScale(spec.units.speedUnit),
  };
  const speedLines: CompressorCurve[] = speedLineSpeeds(spec).map((speed) => {
    const surge = physics.surgePhi(speed);
    const choke = physics.chokePhi(speed);
    const points: CompressorMapPoint[] = [];
    for (let i = 0; i < POINTS_PER_SPEED_LINE; i++) {
      // Closer together towards choke, where the line bends down.
      const share = Math.sin(((i / (POINTS_PER_SPEED_LINE - 1)) * Math.PI) / 2);
      points.push(compressorPoint(physics, surge + (choke - surge) * share, speed, factors, true, true));
    }
    return { kind: 'speed', label: String(speed), points: withoutRepeats(points) };
  });
  const ends = (which: 'first' | 'last'): CompressorMapPoint[] =>
    speedLines.map((line) => {
      const p = which === 'first' ? line.points[0] : line.points[line.points.length - 1];
      return { ...p, efficiency: null, speed: null };
    });
  const islands: CompressorCurve[] = spec.islandLevels
    .map((level) => ({ level, points: island(physics, level, factors) }))
    .filter((i) => i.points.length > 0)
    .map(({ level, points }) => ({
      kind: 'island',
      label: spec.units.efficiency === 'percent' ? String(roundDecimals(level * 100, 1)) : String(level),
      points,
    }));
  return {
    kind: 'compressor',
    formatVersion: 1,
    name: spec.name,
    notes: [
      NOTE_INVENTED,
      `Impeller tip diameter ${spec.tipDiameter * 1000} mm, rated ${spec.maxSpeed} rpm, peak efficiency ${Math.round(spec.peakEfficiency * 100)} %.`,
      NOTE_NOT_FOR_BUILD,
    ],
    reference: spec.reference,
    maxSpeed: viaFile(spec.maxSpeed, speedScale(spec.units.maxSpeedUnit), (v) => Math.round(v)),
    curves: [{ kind: 'surge', label: '', points: ends('first') }, { kind: 'choke', label: '', points: ends('last') }, ...speedLines, ...islands],
    fileUnits: spec.units,
  };
}

/** Reference conditions given in the file's own units, as the file states them. */
function reference(temperature: number, temperatureUnit: string, pressure: number, pressureUnit: string): MapReferenceConditions {
  return { temperature: mapValueToSI(temperature, temperatureUnit, 'temperature'), pressure: mapValueToSI(pressure, pressureUnit, 'pressure') };
}

const COMPRESSORS: CompressorSpec[] = [
  {
    file: 'compressor-s44.csv',
    name: 'Spoolbook demo compressor S44',
    tipDiameter: 0.056,
    maxSpeed: 180_000,
    speedFractions: [0.35, 0.5, 0.6, 0.7, 0.8, 0.9, 1],
    peakEfficiency: 0.76,
    optimumFlowCoefficient: 0.1,
    chokeFlowCoefficient: 0.16,
    backsweep: 3,
    reference: reference(298, 'K', 100, 'kPa'),
    units: {
      flowAxis: 'corrected-mass',
      flowUnit: 'kg/s',
      referenceTemperatureUnit: 'K',
      referencePressureUnit: 'kPa',
      efficiency: 'percent',
      speedUnit: 'rpm',
      maxSpeedUnit: 'rpm',
    },
    islandLevels: [0.6, 0.65, 0.7, 0.72, 0.74, 0.75],
  },
  {
    file: 'compressor-m58.csv',
    name: 'Spoolbook demo compressor M58',
    tipDiameter: 0.076,
    maxSpeed: 135_000,
    speedFractions: [0.35, 0.5, 0.6, 0.7, 0.8, 0.9, 1],
    peakEfficiency: 0.78,
    optimumFlowCoefficient: 0.105,
    chokeFlowCoefficient: 0.165,
    backsweep: 3,
    reference: reference(545, 'degR', 13.95, 'psi'),
    units: {
      flowAxis: 'corrected-mass',
      flowUnit: 'lb/min',
      referenceTemperatureUnit: 'degR',
      referencePressureUnit: 'psi',
      efficiency: 'percent',
      speedUnit: 'rpm',
      maxSpeedUnit: 'rpm',
    },
    islandLevels: [0.6, 0.65, 0.7, 0.74, 0.76, 0.77],
  },
  {
    file: 'compressor-l76.csv',
    name: 'Spoolbook demo compressor L76',
    tipDiameter: 0.1,
    maxSpeed: 100_000,
    speedFractions: [0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1],
    peakEfficiency: 0.8,
    optimumFlowCoefficient: 0.11,
    chokeFlowCoefficient: 0.17,
    backsweep: 3.2,
    reference: reference(85, 'degF', 28.4, 'inHg'),
    units: {
      flowAxis: 'corrected-mass',
      flowUnit: 'lb/min',
      referenceTemperatureUnit: 'degF',
      referencePressureUnit: 'inHg',
      efficiency: 'fraction',
      speedUnit: 'rpm',
      maxSpeedUnit: 'rpm',
    },
    islandLevels: [0.62, 0.68, 0.72, 0.76, 0.78, 0.79],
  },
  {
    file: 'compressor-v52-volume.csv',
    name: 'Spoolbook demo compressor V52 (volume flow)',
    tipDiameter: 0.066,
    maxSpeed: 155_000,
    speedFractions: [0.4, 0.55, 0.7, 0.8, 0.9, 1],
    peakEfficiency: 0.77,
    optimumFlowCoefficient: 0.1,
    chokeFlowCoefficient: 0.16,
    backsweep: 3,
    reference: reference(77, 'degF', 14.7, 'psi'),
    units: {
      flowAxis: 'volume',
      flowUnit: 'cfm',
      referenceTemperatureUnit: 'degF',
      referencePressureUnit: 'psi',
      efficiency: 'percent',
      speedUnit: 'krpm',
      maxSpeedUnit: 'krpm',
    },
    islandLevels: [0.6, 0.66, 0.7, 0.73, 0.75, 0.76],
  },
];

/**
 * The demo family: one invented wheel design (ported shroud, so a wide map) at ten tip diameters,
 * each rated at the same tip speed, so that the Candidates view has sizes to choose between.
 */
const FAMILY_DIAMETERS_MM = [44, 48, 52, 56, 60, 64, 68, 72, 76, 80];
/** Rated tip speed of the family, m/s (invented, a usual figure for aluminium wheels). */
const FAMILY_TIP_SPEED = 560;

function familySpecs(): CompressorSpec[] {
  return FAMILY_DIAMETERS_MM.map((mm) => ({
    file: `compressor-f${mm}.csv`,
    name: `Spoolbook demo compressor F${mm}`,
    tipDiameter: mm / 1000,
    // Rated speed for the tip speed, to the nearest 5 000 rpm as makers quote it.
    maxSpeed: Math.round((FAMILY_TIP_SPEED * 60) / (Math.PI * (mm / 1000)) / 5000) * 5000,
    speedFractions: [0.35, 0.5, 0.6, 0.7, 0.8, 0.9, 1],
    peakEfficiency: 0.77,
    optimumFlowCoefficient: 0.1,
    chokeFlowCoefficient: 0.17,
    backsweep: 3,
    surgeSideLoss: 0.15,
    reference: reference(298, 'K', 100, 'kPa'),
    units: {
      flowAxis: 'corrected-mass',
      flowUnit: 'kg/s',
      referenceTemperatureUnit: 'K',
      referencePressureUnit: 'kPa',
      efficiency: 'percent',
      speedUnit: 'rpm',
      maxSpeedUnit: 'rpm',
    },
    islandLevels: [0.6, 0.65, 0.7, 0.73, 0.75, 0.76],
  }));
}

// ---------------------------------------------------------------------------------------------
// Turbine

interface TurbineSpec {
  file: string;
  name: string;
  areaRatio: number;
  housing: 'single' | 'divided';
  /** Flow parameter at full saturation, kg·K^0.5/(s·Pa), for the whole housing. */
  saturatedFlowParameter: number;
  peakEfficiency: number;
  flowParameterUnit: string;
}

const TURBINE_WHEEL_DIAMETER = 0.064; // m
const TURBINE_SPEEDS = [60_000, 90_000, 120_000, 150_000];
const TURBINE_MAX_SPEED = 160_000;
/** Share of the wheel's power the invented bearings pass on: the demo turbine efficiencies count it (invented). */
const TURBINE_BEARING_EFFICIENCY = 0.95;
/** The turbine inlet temperature the speed lines' blade-speed ratio refers to, K. */
const TURBINE_INLET_TEMPERATURE = 1073;
const EXPANSION_RATIOS = [1.2, 1.35, 1.5, 1.7, 1.9, 2.2, 2.5, 2.8, 3.2, 3.6];

function turbineMap(spec: TurbineSpec): TurbineMap {
  const flowFactor = flowParameterScale(spec.flowParameterUnit);
  // A divided housing's file gives the flow of one scroll: a little under half of the whole,
  // because the dividing wall takes some of the area; efficiency is a little lower too.
  const perScroll = spec.housing === 'divided';
  const flowShare = perScroll ? 0.5 * 0.96 : 1;
  const efficiencyPenalty = perScroll ? 0.02 : 0;
  const curves: TurbineCurve[] = TURBINE_SPEEDS.map((speed) => {
    const u = (Math.PI * TURBINE_WHEEL_DIAMETER * speed) / 60;
    const uMax = (Math.PI * TURBINE_WHEEL_DIAMETER * TURBINE_MAX_SPEED) / 60;
    // Faster lines run at higher expansion ratios, as on a measured map.
    const speedShare = speed / TURBINE_SPEEDS[TURBINE_SPEEDS.length - 1];
    const firstRatio = 1.15 + 0.95 * speedShare ** 2;
    const lastRatio = 1.8 + 1.8 * speedShare;
    const points = EXPANSION_RATIOS.filter((er) => er >= firstRatio - 1e-9 && er <= lastRatio + 1e-9).map((er) => {
      const flowParameter = spec.saturatedFlowParameter * flowShare * Math.sqrt(1 - er ** -1.6) * (1 - 0.08 * (u / uMax) ** 2);
      const isentropicSpeed = Math.sqrt(2 * CP_EXHAUST * TURBINE_INLET_TEMPERATURE * (1 - er ** (-(GAMMA_EXHAUST - 1) / GAMMA_EXHAUST)));
      const bladeSpeedRatio = u / isentropicSpeed;
      const efficiency = TURBINE_BEARING_EFFICIENCY * (spec.peakEfficiency - efficiencyPenalty - 0.9 * (bladeSpeedRatio - 0.68) ** 2);
      return {
        expansionRatio: er,
        flowParameter: viaFile(flowParameter, flowFactor, (v) => roundSignificant(v, 4)),
        efficiency: roundDecimals(efficiency, 3),
        speed,
      };
    });
    return { kind: 'flow', label: String(speed), points };
  });
  return {
    kind: 'turbine',
    formatVersion: 1,
    name: spec.name,
    notes: [
      NOTE_INVENTED,
      `Wheel ${TURBINE_WHEEL_DIAMETER * 1000} mm; efficiency from the blade-speed ratio at a turbine inlet temperature of ${TURBINE_INLET_TEMPERATURE} K, times a bearing efficiency of ${TURBINE_BEARING_EFFICIENCY} (total-to-static, with bearing losses).`,
      NOTE_NOT_FOR_BUILD,
    ],
    housing: spec.housing,
    scrollFeed: spec.housing === 'divided' ? 'per-scroll' : null,
    areaRatio: spec.areaRatio,
    efficiencyKind: 'with-bearing-losses',
    curves,
    fileUnits: { flowParameterUnit: spec.flowParameterUnit, efficiency: 'fraction', speedUnit: 'rpm' },
  };
}

// Flow parameter of the A/R 0.64 housing, kg·K^0.5/(s·Pa): 0.2 kg/s at 1173 K and 200 kPa is about 3.4e-5.
const SATURATED_FLOW_PARAMETER_064 = 4.2e-5;

function turbineSpecs(): TurbineSpec[] {
  const specs: TurbineSpec[] = [];
  for (const [areaRatio, unit] of [
    [0.64, 'lb/min degR^0.5 / psi'],
    [0.82, 'kg/s K^0.5 / MPa'],
  ] as const) {
    for (const housing of ['single', 'divided'] as const) {
      const tag = String(areaRatio).replace('.', '');
      specs.push({
        file: `turbine-t64-ar${tag}-${housing}.csv`,
        name: `Spoolbook demo turbine T64, A/R ${areaRatio}, ${housing === 'single' ? 'single scroll' : 'divided (per scroll)'}`,
        areaRatio,
        housing,
        // A larger A/R passes more flow: roughly in proportion to the volute throat area.
        saturatedFlowParameter: SATURATED_FLOW_PARAMETER_064 * (areaRatio / 0.64) ** 0.85,
        peakEfficiency: 0.72,
        flowParameterUnit: unit,
      });
    }
  }
  // The demo housings of the Candidates view: the same wheel in five more single-scroll housings
  // and one more divided one, from a small A/R (early boost, high drive pressure) to a large one.
  for (const [areaRatio, housing] of [
    [0.48, 'single'],
    [0.56, 'single'],
    [0.56, 'divided'],
    [0.72, 'single'],
    [0.92, 'single'],
    [1.06, 'single'],
  ] as const) {
    const tag = String(areaRatio.toFixed(2)).replace('.', '');
    specs.push({
      file: `turbine-t64-ar${tag}-${housing}.csv`,
      name: `Spoolbook demo turbine T64, A/R ${areaRatio}, ${housing === 'single' ? 'single scroll' : 'divided (per scroll)'}`,
      areaRatio,
      housing,
      saturatedFlowParameter: SATURATED_FLOW_PARAMETER_064 * (areaRatio / 0.64) ** 0.85,
      peakEfficiency: 0.72,
      flowParameterUnit: 'kg/s K^0.5 / kPa',
    });
  }
  return specs;
}

// ---------------------------------------------------------------------------------------------

/** Every demo map with its file name, in SI; also used by the tests. */
export function demoMaps(): Array<{ file: string; map: CompressorMap | TurbineMap }> {
  return [
    ...[...COMPRESSORS, ...familySpecs()].map((spec) => ({ file: spec.file, map: compressorMap(spec) as CompressorMap | TurbineMap })),
    ...turbineSpecs().map((spec) => ({ file: spec.file, map: turbineMap(spec) as CompressorMap | TurbineMap })),
  ];
}

function main(): void {
  const folder = fileURLToPath(new URL('../data/maps/', import.meta.url));
  mkdirSync(folder, { recursive: true });
  for (const { file, map } of demoMaps()) {
    const text = writeMapFile(map);
    const check = parseMapFile(text);
    if (!check.ok) {
      throw new Error(`${file} does not read back:\n${check.problems.map((p) => `  line ${p.line}: ${p.message}`).join('\n')}`);
    }
    writeFileSync(path.join(folder, file), text);
    const rows = text.split('\n').filter((l) => l !== '' && !l.startsWith('#')).length - 1;
    console.log(`${file}: ${rows} rows`);
  }
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) main();
