/**
 * Speed of the matching engine: one whole study (3 plans × 4 scenarios × 60 rpm points) end to
 * end, as the Study screen recomputes it on every keystroke. Target: under 2 ms median, far
 * inside one 16 ms frame. Then the demo study (data/demo) with the demo maps, compressor only and
 * with the exhaust side on for every plan (target under 5 ms median). Prints the figures; asserts
 * nothing.
 *
 *   npx tsx tests/bench/engine.bench.ts
 */
import { readFileSync } from 'node:fs';
import { performance } from 'node:perf_hooks';
import { pointWorking } from '#shared/matching/explain-point';
import { runStudy, type RunStudyOptions } from '#shared/matching/run-study';
import type { ExhaustInput } from '#shared/matching/input/exhaust';
import { studyInputSchema, type StudyInput } from '#shared/matching/input/study';
import { parseStudyInput } from '#shared/schemas/study-input';
import { CC_PER_MIN, fakeModel } from '../unit/matching/fixtures';

function benchStudy(): StudyInput {
  const boostRow = (peak: number) => [
    { rpm: 2000, value: 30_000 },
    { rpm: 3500, value: peak * 0.8 },
    { rpm: 4500, value: peak },
    { rpm: 8000, value: peak * 0.9 },
  ];
  return {
    engine: {
      displacement: 0.002,
      cylinders: 4,
      strokes: 4,
      rpm: { kind: 'range', min: 2000, max: 8000 - 100, step: 100 }, // 60 points
      volumetricEfficiency: [
        { rpm: 2000, value: 0.86 },
        { rpm: 4000, value: 0.97 },
        { rpm: 6000, value: 1.02 },
        { rpm: 8000, value: 0.95 },
      ],
      limits: { maxRpm: 8500, maxCompressorOutletTemperature: 470 },
    },
    fuelSystem: {
      fuel: { kind: 'ethanol-blend', ethanolPercent: 85 },
      lambda: [
        { rpm: 2000, value: 0.9 },
        { rpm: 5000, value: 0.8 },
      ],
      injectors: {
        primary: { count: 4, ratedFlow: 1000 * CC_PER_MIN, ratedPressure: 3e5 },
        secondary: { count: 4, ratedFlow: 1000 * CC_PER_MIN, ratedPressure: 3e5, switchOverRpm: 5000 },
        fuelPressure: 4e5,
        regulator: 'manifold-referenced',
      },
      pumpFlowAvailable: 1e-4,
    },
    power: { basis: 'brake-thermal-efficiency', brakeThermalEfficiency: 0.33, drivetrainLoss: 0.12 },
    // Losses at a stated flow, so the manifold-temperature fixed point also settles the losses.
    losses: { inlet: { pressureLoss: 2500, referenceMassFlow: 0.25 }, chargeCooler: { pressureLoss: 10_000, referenceMassFlow: 0.25, referenceDensity: 2.4 } },
    intercooler: { kind: 'effectiveness', effectiveness: 0.75 },
    scenarios: [
      {
        name: 'Sea level, mild',
        ambient: { pressure: 101_325, temperature: 293.15 },
        boostSchedule: [{ label: 'Full load', kind: 'full-load', boost: boostRow(150_000) }],
      },
      {
        name: 'Hot day',
        ambient: { pressure: 100_000, temperature: 313.15, relativeHumidity: 0.5 },
        boostSchedule: [{ label: 'Full load', kind: 'full-load', boost: boostRow(150_000) }],
      },
      { name: 'Mountain pass', ambient: { altitude: 2200 }, boostSchedule: [{ label: 'Full load', kind: 'full-load', boost: boostRow(150_000) }] },
      {
        name: 'Gear 1',
        ambient: { pressure: 101_325, temperature: 293.15 },
        boostSchedule: [{ label: 'Gear 1', kind: 'gear', gear: 1, boost: boostRow(90_000) }],
      },
    ],
    plans: [
      { name: 'Small', turbochargers: 1, compressorEfficiency: 0.72, maxShaftSpeed: 190_000 },
      { name: 'Large', turbochargers: 1, compressorEfficiency: 0.74 },
      { name: 'Twin', turbochargers: 2, compressorEfficiency: 0.7 },
    ],
  };
}

function measure(name: string, run: () => void, runs: number, warmUp = 100): void {
  for (let i = 0; i < warmUp; i++) run();
  const times: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < runs; i++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    run();
    times.push(performance.now() - t0);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1000);
  }
  times.sort((a, b) => a - b);
  cpu.sort((a, b) => a - b);
  const at = (list: number[], q: number) => list[Math.min(list.length - 1, Math.floor(q * list.length))];
  const ms = (x: number) => x.toFixed(3);
  // CPU time beside wall time: on a shared, busy machine the wall clock also counts time spent waiting for a core.
  console.log(
    `${name.padEnd(58)} median ${ms(at(times, 0.5))} ms   p10–p90 ${ms(at(times, 0.1))}–${ms(at(times, 0.9))} ms   CPU median ${ms(at(cpu, 0.5))} ms   runs ${runs}`,
  );
}

const study = benchStudy();
const models = [fakeModel(), fakeModel({ surgeSlope: 0.08, chokeFlow: 0.5 }), fakeModel({ chokeFlow: 0.3 })];
console.log(
  `load average ${(await import('node:os'))
    .loadavg()
    .map((x) => x.toFixed(1))
    .join(' ')} on ${(await import('node:os')).cpus().length} cores`,
);
const check = runStudy(parseStudyInput(study));
const points = check.lines.reduce((n, l) => n + l.points.length, 0);
console.log(
  `study: ${study.plans.length} plans × ${study.scenarios.length} scenarios × ${check.lines[0].points.length} rpm points = ${points} points (Node ${process.version})`,
);

// "Validated": checked by the study schema at the boundary first, then run.
const whole = (options: RunStudyOptions) => () => void runStudy(parseStudyInput(study), options);
measure('whole study, validated, Working lazy (the keystroke case)', whole({}), 1000);
measure('whole study, validated, stand-in compressor maps', whole({ compressorModels: models }), 1000);
measure('whole study, input already validated', () => void runStudy(study), 1000);
measure('whole study, validated, Working built for every point', whole({ working: 'eager' }), 300);
measure('schema validation of the study alone', () => void studyInputSchema.parse(study), 1000);
const line = check.lines[0];
measure('Working of one point, on demand', () => void pointWorking(line.context, line.points[40]), 5000);

// The demo compressor maps through the maps module, when it is there to read them.
try {
  const { compressorModelFromMap, parseMapFile } = await import('#shared/maps');
  const demo = ['s44', 'm58', 'l76'].map((name) => {
    const parsed = parseMapFile(readFileSync(new URL(`../../data/maps/compressor-${name}.csv`, import.meta.url), 'utf8'));
    if (!('map' in parsed) || !parsed.map || parsed.map.kind !== 'compressor') throw new Error(`demo map ${name} did not parse`);
    return compressorModelFromMap(parsed.map);
  });
  measure('whole study, validated, demo compressor maps (maps module)', whole({ compressorModels: demo }), 1000);
} catch (err) {
  console.log(`whole study with the demo compressor maps: skipped (${(err as Error).message})`);
}

// The demo study with the demo maps: compressor only, then with the exhaust side on every plan.
try {
  const { compressorModelFromMap, parseMapFile, turbineModelFromMap } = await import('#shared/maps');
  const { studyDocumentSchema, toStudyInput } = await import('#shared/schemas/study');
  const mapOf = (file: string) => {
    const parsed = parseMapFile(readFileSync(new URL(`../../data/maps/${file}.csv`, import.meta.url), 'utf8'));
    if (!parsed.ok) throw new Error(`demo map ${file} did not parse`);
    return parsed.map;
  };
  const doc = studyDocumentSchema.parse(JSON.parse(readFileSync(new URL('../../data/demo/hillclimb-study.json', import.meta.url), 'utf8')));
  const demoInput = toStudyInput(doc);
  const compressors = doc.plans.map((p) => {
    const map = mapOf((p.compressorMapId ?? '').replace(/^builtin-/, ''));
    if (map.kind !== 'compressor') throw new Error('not a compressor map');
    return compressorModelFromMap(map);
  });
  // One invented exhaust side per plan: two single-scroll A/R sizes and a divided housing with two gates.
  const t3 = [
    { rpm: 2500, value: 1000 },
    { rpm: 5000, value: 1130 },
    { rpm: 8000, value: 1180 },
  ];
  const exhausts: { turbine: string; exhaust: ExhaustInput }[] = [
    {
      turbine: 'turbine-t64-ar064-single',
      exhaust: {
        housing: 'single',
        wastegates: { count: 1, valveDiameter: 0.044, dischargeCoefficient: 0.8 },
        mechanicalEfficiency: 0.95,
        turbineInletTemperature: t3,
        downstreamLoss: { pressureLoss: 15_000, referenceMassFlow: 0.26, referenceDensity: 0.6 },
      },
    },
    {
      turbine: 'turbine-t64-ar082-single',
      exhaust: {
        housing: 'single',
        wastegates: { count: 1, valveDiameter: 0.044, dischargeCoefficient: 0.8 },
        mechanicalEfficiency: 0.95,
        turbineInletTemperature: t3,
        downstreamLoss: { pressureLoss: 15_000, referenceMassFlow: 0.26, referenceDensity: 0.6 },
      },
    },
    {
      turbine: 'turbine-t64-ar082-divided',
      exhaust: {
        housing: 'divided',
        wastegates: { count: 2, valveDiameter: 0.038, dischargeCoefficient: 0.8 },
        mechanicalEfficiency: 0.95,
        turbineInletTemperature: t3,
        downstreamLoss: { pressureLoss: 15_000, referenceMassFlow: 0.26, referenceDensity: 0.6 },
        pulseFactor: 1,
      },
    },
  ];
  const withExhaust: StudyInput = { ...demoInput, plans: demoInput.plans.map((p, i) => ({ ...p, exhaust: exhausts[i % exhausts.length].exhaust })) };
  const turbines = doc.plans.map((_, i) => {
    const map = mapOf(exhausts[i % exhausts.length].turbine);
    if (map.kind !== 'turbine') throw new Error('not a turbine map');
    return turbineModelFromMap(map);
  });
  const demoCheck = runStudy(parseStudyInput(withExhaust), { compressorModels: compressors, turbineModels: turbines });
  const demoPoints = demoCheck.lines.reduce((n, l) => n + l.points.length, 0);
  const notHeld = demoCheck.lines.reduce((n, l) => n + l.points.filter((p) => p.values?.targetHeld === false).length, 0);
  console.log(
    `demo study: ${demoInput.plans.length} plans × ${demoCheck.lines.length / demoInput.plans.length} boost rows × ${demoCheck.lines[0].points.length} rpm points = ${demoPoints} points; ${notHeld} below target (boost re-solved)`,
  );
  measure('demo study, demo maps, compressor only', () => void runStudy(parseStudyInput(demoInput), { compressorModels: compressors }), 1000);
  measure(
    'demo study, demo maps, exhaust side on every plan',
    () => void runStudy(parseStudyInput(withExhaust), { compressorModels: compressors, turbineModels: turbines }),
    1000,
  );
  measure(
    'turbine models of the three demo turbine maps, built',
    () => void exhausts.map((e) => mapOf(e.turbine)).forEach((m) => m.kind === 'turbine' && turbineModelFromMap(m)),
    300,
    10,
  );
} catch (err) {
  console.log(`demo study with the exhaust side: skipped (${(err as Error).message})`);
}
