/**
 * Candidates in Node: ranking 60 compressor maps against the demo study (data/demo, 4 scenarios,
 * 6 boost rows × 23 rpm points per map). Target (printed, not asserted): under 150 ms median with
 * the maps' models built (as the page's worker keeps them after its first ranking). Also printed:
 * the first ranking, which builds every model. The browser runs the same code in a Web Worker, so
 * the page never waits on it; its progress is the worker's per-map step (rankInSteps).
 *
 *   npm run bench candidates
 */
import { readdirSync, readFileSync } from 'node:fs';
import os from 'node:os';
import { performance } from 'node:perf_hooks';
import { compressorRanking, judgeCompressor, sortCompressorCandidates, type CandidateMap } from '#shared/candidates';
import { parseMapFile } from '#shared/maps';
import { familyMember } from '#shared/maps/family/similarity';
import type { CompressorMap } from '#shared/maps/types';
import { studyDocumentSchema } from '#shared/schemas/study';
import { mapModelCache } from '#shared/study/run';

const folder = new URL('../../data/maps/', import.meta.url);
const builtins = readdirSync(folder)
  .filter((f) => f.startsWith('compressor-') && f.endsWith('.csv'))
  .sort()
  .map((f) => {
    const parsed = parseMapFile(readFileSync(new URL(f, folder), 'utf8'));
    if (!parsed.ok || parsed.map.kind !== 'compressor') throw new Error(`${f} does not read`);
    return { id: f, map: parsed.map as CompressorMap };
  });
// Sixty maps: the built-in ones, then family members of them at other diameters (each its own object, so each builds its own model).
const library: CandidateMap[] = builtins.map((b) => ({ id: b.id, name: b.map.name, origin: 'built-in', map: b.map }));
for (let i = 0; library.length < 60; i++) {
  const parent = builtins[i % builtins.length];
  const ratio = 0.85 + 0.05 * Math.floor(i / builtins.length);
  const made = familyMember(parent, { kind: 'diameter', diameterRatio: ratio, sizeEffect: i % 2 === 0 }, `${parent.map.name} × ${ratio.toFixed(2)}`);
  if (!made.ok) throw new Error(made.message);
  library.push({ id: `family-${i}`, name: made.map.name, origin: 'estimate', map: made.map });
}
const doc = studyDocumentSchema.parse(JSON.parse(readFileSync(new URL('../../data/demo/hillclimb-study.json', import.meta.url), 'utf8')));
const points = doc.scenarios.reduce((n, s) => n + s.boostSchedule.length, 0) * 23;

function rank(cache = mapModelCache()) {
  const ranking = compressorRanking(doc, doc.plans[0]);
  return sortCompressorCandidates(
    library.map((m) => judgeCompressor(ranking, m, cache)),
    'smallest',
  );
}

function measure(name: string, run: () => void, runs: number, warmUp: number, target: string): void {
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
  const at = (list: number[], q: number) => [...list].sort((a, b) => a - b)[Math.min(list.length - 1, Math.floor(q * list.length))];
  const ms = (x: number) => x.toFixed(1);
  // CPU time beside wall time: on a shared, busy machine the wall clock also counts time spent waiting for a core.
  console.log(
    `${name.padEnd(60)} median ${ms(at(times, 0.5))} ms   p10–p90 ${ms(at(times, 0.1))}–${ms(at(times, 0.9))} ms   CPU median ${ms(at(cpu, 0.5))} ms   runs ${runs}   (${target})`,
  );
}

console.log(
  `load average ${os
    .loadavg()
    .map((x) => x.toFixed(1))
    .join(' ')} on ${os.cpus().length} cores`,
);
const check = rank();
const fits = check.filter((c) => c.verdict.status === 'fits' || c.verdict.status === 'fits-with-warnings').length;
console.log(`candidates: ${library.length} compressor maps × ${points} points of the demo study; ${fits} fit`);
const warm = mapModelCache();
measure('rank 60 compressor maps, models built', () => rank(warm), Number(process.env.BENCH_RUNS ?? 30), 3, 'target under 150 ms median');
measure(
  'rank 60 compressor maps, first time (every model built)',
  () => rank(),
  Math.min(10, Number(process.env.BENCH_RUNS ?? 10)),
  1,
  'no target: once per worker',
);
