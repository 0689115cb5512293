/**
 * Speed of the drive figures. Targets: the drive figures of the demo compressor study (3 plans,
 * 4 gears: force per gear, traction limit, usable boost and the acceleration run) under 20 ms
 * median, so they can follow every edit; the time-to-boost integration for 3 plans (the demo
 * turbine housing study with a third plan, a copy of its first) under 50 ms median. Prints the
 * figures; asserts nothing.
 *
 *   npx tsx tests/bench/drive.bench.ts
 */
import { performance } from 'node:perf_hooks';
import { driveFigures } from '#shared/drive/figures';
import { accelerationRuns } from '#shared/drive/run';
import { planSpools } from '#shared/drive/spool';
import { computed, demoDriveDocument } from '../unit/drive/helpers';

function measure(name: string, target: number, run: () => void, runs: number, warmUp = 20): void {
  for (let i = 0; i < warmUp; i++) run();
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const start = performance.now();
    run();
    times.push(performance.now() - start);
  }
  times.sort((a, b) => a - b);
  const at = (q: number) => times[Math.min(times.length - 1, Math.floor(q * times.length))].toFixed(2);
  console.log(`${name.padEnd(62)} median ${at(0.5)} ms   p10–p90 ${at(0.1)}–${at(0.9)} ms   target < ${target} ms   runs ${runs}`);
}

const compressorStudy = demoDriveDocument('compressor');
const compressorRun = computed(compressorStudy).result;
measure(
  'drive figures, demo study (3 plans, 4 gears) with the run',
  20,
  () => {
    const figures = driveFigures(compressorStudy, compressorRun)!;
    accelerationRuns(figures, 2500);
  },
  100,
);

const housing = demoDriveDocument('turbineHousing');
const threePlans = { ...housing, plans: [...housing.plans, { ...housing.plans[0], id: 'plan-third', name: 'Third plan' }] };
const { result, models } = computed(threePlans);
measure('time to boost, 3 plans (demo turbine housing study)', 50, () => planSpools(threePlans, result, models), 30, 5);
