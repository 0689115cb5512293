/**
 * Map speed: parse and check a 10,000-row map file; interpolate 100,000 points; read a study's
 * 720 points through a compressor model. Prints name, median, p10–p90 and runs; checks nothing.
 *
 *   npx tsx tests/bench/maps.bench.ts
 *
 * Targets (the maps issue): parse under 100 ms, 100,000 lookups under 50 ms, 720 reads under 2 ms.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { compressorModelFromMap, parseMapFile, triangulate } from '#shared/maps';
import type { CompressorMap } from '#shared/maps/types';

function quantile(sorted: number[], q: number): number {
  const at = (sorted.length - 1) * q;
  const low = Math.floor(at);
  const high = Math.ceil(at);
  return sorted[low] + (sorted[high] - sorted[low]) * (at - low);
}

function bench(name: string, runs: number, body: () => void): void {
  for (let i = 0; i < Math.min(5, runs); i++) body(); // warm up the JIT
  const times: number[] = [];
  const cpuTimes: number[] = [];
  for (let i = 0; i < runs; i++) {
    const cpuStart = process.cpuUsage();
    const start = performance.now();
    body();
    times.push(performance.now() - start);
    const cpu = process.cpuUsage(cpuStart);
    cpuTimes.push((cpu.user + cpu.system) / 1000);
  }
  times.sort((a, b) => a - b);
  cpuTimes.sort((a, b) => a - b);
  const f = (ms: number) => ms.toFixed(3);
  // CPU time beside wall time: on a shared machine the wall clock also counts other people's work.
  console.log(
    `${name.padEnd(48)} median ${f(quantile(times, 0.5))} ms   p10–p90 ${f(quantile(times, 0.1))}–${f(quantile(times, 0.9))} ms   runs ${runs}   (CPU median ${f(quantile(cpuTimes, 0.5))} ms)`,
  );
}

/** A map file of `speedLines` × `pointsPerLine` speed rows plus surge and choke lines (about 10,000 rows). */
function generatedMapText(speedLines: number, pointsPerLine: number): string {
  const lines = [
    '# spoolbook-map: 1',
    '# kind: compressor',
    '# name: Bench compressor',
    '# flow: corrected mass, lb/min',
    '# reference temperature: 545 degR',
    '# reference pressure: 13.95 psi',
    '# efficiency: percent',
    '# max speed: 150000 rpm',
    'curve,label,flow,pressure_ratio,efficiency,speed',
  ];
  const surge: string[] = [];
  const choke: string[] = [];
  const speeds: string[] = [];
  for (let s = 0; s < speedLines; s++) {
    const speed = 40_000 + s * 1000;
    const share = s / (speedLines - 1);
    const flowStart = 8 + 20 * share;
    const flowEnd = 20 + 35 * share;
    const topRatio = 1.2 + 2.6 * share;
    for (let k = 0; k < pointsPerLine; k++) {
      const along = k / (pointsPerLine - 1);
      const flow = flowStart + (flowEnd - flowStart) * along;
      const ratio = topRatio - 0.35 * share * along ** 3 - 0.05 * along;
      const efficiency = 78 - 30 * (along - 0.45) ** 2 - 8 * (share - 0.6) ** 2;
      speeds.push(`speed,${speed},${flow.toFixed(4)},${ratio.toFixed(4)},${efficiency.toFixed(2)},${speed}`);
      if (k === 0) surge.push(`surge,,${flow.toFixed(4)},${ratio.toFixed(4)},,`);
      if (k === pointsPerLine - 1) choke.push(`choke,,${flow.toFixed(4)},${ratio.toFixed(4)},,`);
    }
  }
  return [...lines, ...surge, ...choke, ...speeds].join('\n') + '\n';
}

const bigText = generatedMapText(98, 100); // 9,800 speed rows + 98 surge + 98 choke = 9,996 rows
const bigBytes = new TextEncoder().encode(bigText);
const rows = bigText.split('\n').filter((l) => l !== '' && !l.startsWith('#')).length - 1;
console.log(`map file: ${rows} rows, ${(bigBytes.length / 1024).toFixed(0)} KiB`);

bench(`parse + check, ${rows}-row map (bytes)`, 30, () => {
  if (!parseMapFile(bigBytes).ok) throw new Error('the bench map does not read');
});

const demoFile = fileURLToPath(new URL('../../data/maps/compressor-m58.csv', import.meta.url));
const demo = parseMapFile(readFileSync(demoFile, 'utf8'));
if (!demo.ok || demo.map.kind !== 'compressor') throw new Error('the M58 demo map does not read');
const demoMap: CompressorMap = demo.map;

// Query points spread over the map's bounding box (a fixed low-discrepancy sequence, not random).
const flows = demoMap.curves.flatMap((c) => c.points.map((p) => p.correctedMassFlow));
const ratios = demoMap.curves.flatMap((c) => c.points.map((p) => p.pressureRatio));
const [fMin, fMax, rMin, rMax] = [Math.min(...flows), Math.max(...flows), Math.min(...ratios), Math.max(...ratios)];
const queryCount = 100_000;
const queryFlow = new Float64Array(queryCount);
const queryRatio = new Float64Array(queryCount);
for (let i = 0; i < queryCount; i++) {
  queryFlow[i] = fMin + (fMax - fMin) * ((i * 0.6180339887498949) % 1);
  queryRatio[i] = rMin + (rMax - rMin) * ((i * 0.7548776662466927) % 1);
}

const points = demoMap.curves.flatMap((c) => c.points).filter((p) => p.efficiency !== null);
const surface = triangulate(
  points.map((p) => p.correctedMassFlow),
  points.map((p) => p.pressureRatio),
  [points.map((p) => p.efficiency!)],
);
console.log(`demo map M58: ${points.length} points with efficiency, ${surface.triangleCount} triangles`);

let sink = 0;
bench('interpolate 100,000 points (efficiency)', 30, () => {
  for (let i = 0; i < queryCount; i++) sink += surface.valueAt(queryFlow[i], queryRatio[i]) ?? 0;
});

const model = compressorModelFromMap(demoMap);
bench('compressor model: read 100,000 points', 30, () => {
  for (let i = 0; i < queryCount; i++) sink += model.read(queryFlow[i], queryRatio[i]).efficiency ?? 0;
});

// A study: 720 operating points along operating lines, read in order as the matching engine does.
const studyFlow = new Float64Array(720);
const studyRatio = new Float64Array(720);
for (let line = 0; line < 24; line++) {
  for (let k = 0; k < 30; k++) {
    studyFlow[line * 30 + k] = fMin + (fMax - fMin) * (0.1 + 0.8 * (k / 29));
    studyRatio[line * 30 + k] = rMin + (rMax - rMin) * (0.05 + 0.85 * (k / 29) * (0.5 + line / 48));
  }
}
bench('compressor model: read a 720-point study', 200, () => {
  for (let i = 0; i < 720; i++) sink += model.read(studyFlow[i], studyRatio[i]).surgeMargin ?? 0;
});

bench('compressorModelFromMap (build once per map)', 30, () => {
  sink += compressorModelFromMap(demoMap).maxSpeed ?? 0;
});

if (Number.isNaN(sink)) console.log('');
