/**
 * Generates the invented demo log (data/demo/logs/hillclimb-pulls.csv) for the demo study
 * "Hill-climb 2.0: which compressor?": three full-throttle pulls and the holds between them, as a
 * data logger would export them (semicolons, decimal commas, a line of notes above the names,
 * units in brackets). Made from the study's own engine model so that the fit has something real
 * to find, and deterministic (a seeded generator), so running it again reproduces the file:
 *
 *   npx tsx scripts/generate-demo-log.ts
 *
 * What is built in (all invented):
 *   - the engine's true volumetric efficiency is the study's table times 0.93 at 2500 rpm rising
 *     linearly to 1.01 at 8000 rpm (ṁ = VE·ρ_man·V_d·N/(60·n_R), Heywood 1988 §2.10);
 *   - boost follows the sea-level full-load schedule but the turbo can only give
 *     150 kPa·s((N − 2700)/1700) (s a smoothstep), reached through a first-order lag of 0.35 s;
 *   - the manifold pressure sensor reads 2 kPa high; every channel has noise and the logger's
 *     resolution.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { valueAtRpm } from '#shared/matching/rpm-table';
import { studyDocumentSchema } from '#shared/schemas/study';

const root = new URL('../data/demo/', import.meta.url);
const doc = studyDocumentSchema.parse(JSON.parse(readFileSync(fileURLToPath(new URL('hillclimb-study.json', root)), 'utf8')));

let seed = 0x5b1c;
/** mulberry32 (a small public-domain generator): deterministic uniform numbers in [0, 1). */
function uniform(): number {
  seed = (seed + 0x6d2b79f5) | 0;
  let t = seed;
  t = Math.imul(t ^ (t >>> 15), t | 1);
  t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
  return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
}
/** Normal noise by Box–Muller. */
function noise(sigma: number): number {
  return sigma * Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}
const smoothstep = (x: number) => (x <= 0 ? 0 : x >= 1 ? 1 : x * x * (3 - 2 * x));
const round = (v: number, step: number) => Math.round(v / step) * step;
const decimal = (v: number, places: number) => v.toFixed(places).replace('.', ',');

const R = 287.05287;
const ambientPressure = 101_325;
const ambientTemperature = 293.15;
const displacement = doc.engine.displacement;
const schedule = doc.scenarios[0].boostSchedule[0].boost;
const trueVe = (rpm: number) => valueAtRpm(doc.engine.volumetricEfficiency, rpm) * (0.93 + (0.08 * (rpm - 2500)) / 5500);
const lambdaAt = (rpm: number) => valueAtRpm(doc.fuelSystem.lambda, rpm);

/** Engine speed (rpm) and throttle (fraction) through the run: hold, pull, lift, hold, pull, lift, hold, pull. */
function drive(t: number): { rpm: number; throttle: number } {
  const phases: [number, (u: number, d: number) => { rpm: number; throttle: number }][] = [
    [4, () => ({ rpm: 3000, throttle: 0.22 })],
    [7, (u, d) => ({ rpm: 2600 + (5200 * u) / d, throttle: 1 })],
    [2, (u, d) => ({ rpm: 7800 - (2800 * u) / d, throttle: 0 })],
    [5, () => ({ rpm: 4000, throttle: 0.3 })],
    [2, (u, d) => ({ rpm: 4000 - (1500 * u) / d, throttle: 0.1 })],
    [7.5, (u, d) => ({ rpm: 2500 + (5400 * u) / d, throttle: 1 })],
    [3, (u, d) => ({ rpm: 7900 - (3900 * u) / d, throttle: 0 })],
    [4, () => ({ rpm: 4000, throttle: 0.25 })],
    [2, (u, d) => ({ rpm: 4000 - (1400 * u) / d, throttle: 0.1 })],
    [7, (u, d) => ({ rpm: 2600 + (5300 * u) / d, throttle: 1 })],
    [2, (u, d) => ({ rpm: 7900 - (2900 * u) / d, throttle: 0 })],
  ];
  let start = 0;
  for (const [d, f] of phases) {
    if (t < start + d) return f(t - start, d);
    start += d;
  }
  return { rpm: 5000, throttle: 0 };
}
const DURATION = 45.5;
const STEP = 0.02;

const lines = [
  'Harrow Hill Motorsport logger export; car 7 hill-climb 2.0; run 3 (invented demo data)',
  'Time (s);Engine speed (rpm);MAP (kPa);Throttle (%);IAT (°C);Charge temp (°C);MAF (g/s);Lambda;Turbo speed (rpm);Gear',
];
let boost = -40_000;
for (let k = 0; Math.round(k * STEP * 1000) <= DURATION * 1000; k++) {
  const t = k * STEP;
  const { rpm, throttle } = drive(t);
  // Gauge pressure the throttle and turbo allow right now, then the lag.
  const available = 150_000 * smoothstep((rpm - 2700) / 1700);
  const wanted = throttle >= 0.9 ? Math.min(valueAtRpm(schedule, rpm), available) : -ambientPressure * (0.75 - 0.6 * throttle);
  boost += (wanted - boost) * (1 - Math.exp(-STEP / 0.35));
  const manifoldPressure = ambientPressure + boost;
  const inletTemperature = ambientTemperature + 5;
  const pressureRatio = Math.max(1, manifoldPressure / (ambientPressure - 2500));
  const outlet = inletTemperature * (1 + (Math.pow(pressureRatio, 0.2857) - 1) / 0.7);
  const manifoldTemperature = outlet - 0.75 * (outlet - ambientTemperature);
  const density = manifoldPressure / (R * manifoldTemperature);
  const massFlow = (trueVe(rpm) * density * displacement * rpm) / 120;
  const shaftSpeed = pressureRatio > 1.05 ? 40_000 + 75_000 * (pressureRatio - 1) + 50_000 * massFlow : 15_000 + 20_000 * throttle;
  const gear = t < 20 ? 3 : 4;
  lines.push(
    [
      decimal(t, 2),
      String(Math.round(rpm + noise(8))),
      decimal(round((manifoldPressure + 2_000 + noise(300)) / 1000, 0.1), 1),
      decimal(round(throttle * 100 + Math.abs(noise(0.3)), 0.1), 1),
      decimal(round(inletTemperature - 273.15 + noise(0.2), 0.1), 1),
      decimal(round(manifoldTemperature - 273.15 + noise(0.3), 0.1), 1),
      decimal(round(massFlow * 1000 * (1 + noise(0.01)), 0.1), 1),
      decimal(round(lambdaAt(rpm) + (throttle < 0.9 ? 0.15 : 0) + noise(0.005), 0.001), 3),
      String(Math.round(shaftSpeed + noise(300))),
      String(gear),
    ].join(';'),
  );
}
writeFileSync(fileURLToPath(new URL('logs/hillclimb-pulls.csv', root)), lines.join('\r\n') + '\r\n');
console.log(`wrote data/demo/logs/hillclimb-pulls.csv (${lines.length - 2} rows)`);
