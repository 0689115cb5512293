/**
 * Logged runs: read and map a 1,000,000-row, 20-channel log (the text a logger exports at 100 Hz
 * for 2 h 47 min); the size it is stored in; downsampling for the map. Timed in Node (the same
 * shared code the browser's worker runs; the worker itself is not timed here). Prints name,
 * median, p10–p90 and runs; checks nothing.
 *
 *   npx tsx tests/bench/logs.bench.ts
 *
 * Targets (the logged-runs issue): parse and map under 3 s, stored under 10 MB.
 */
import { deflateSync } from 'node:zlib';
import { applyMapping } from '#shared/logs/convert';
import { largestTriangleThreeBuckets } from '#shared/logs/downsample';
import { logMappingSchema } from '#shared/logs/mapping';
import { packChannels } from '#shared/logs/pack';
import { readLogTable } from '#shared/logs/read';

const ROWS = 1_000_000;

let seed = 7;
function uniform(): number {
  seed = (seed * 1_103_515_245 + 12_345) % 2_147_483_648;
  return seed / 2_147_483_648;
}

/** A plausible 20-column log: pulls every 20 s, sensor resolutions of a typical logger, a little noise. */
function logText(): string {
  const names = [
    'Time (s)',
    'RPM',
    'MAP (kPa)',
    'Throttle (%)',
    'IAT (°C)',
    'Charge temp (°C)',
    'MAF (g/s)',
    'Fuel flow (g/s)',
    'Lambda',
    'Turbo speed (rpm)',
    'EMAP (kPa)',
    'EGT (°C)',
    'Baro (kPa)',
    'Gear',
    'Oil pressure (kPa)',
    'Oil temp (°C)',
    'Coolant (°C)',
    'Knock (V)',
    'Battery (V)',
    'Speed (km/h)',
  ];
  const parts: string[] = [names.join(',')];
  for (let i = 0; i < ROWS; i++) {
    const t = i / 100;
    const phase = (t % 20) / 20;
    const rpm = 2500 + 5000 * phase;
    const map = 100 + 140 * Math.min(1, phase * 2);
    const n = () => uniform() - 0.5;
    parts.push(
      [
        t.toFixed(2),
        Math.round(rpm + 10 * n()),
        (map + n()).toFixed(1),
        phase < 0.95 ? '100.0' : '20.0',
        (25 + n() * 0.2).toFixed(1),
        (40 + 10 * phase + n() * 0.3).toFixed(1),
        (30 + 150 * phase + n()).toFixed(1),
        (3 + 15 * phase + n() * 0.1).toFixed(2),
        (0.8 + n() * 0.01).toFixed(3),
        Math.round(60000 + 90000 * phase + 300 * n()),
        (map * 1.3 + n()).toFixed(1),
        Math.round(700 + 250 * phase + n() * 3),
        '101.3',
        3,
        (400 + n() * 5).toFixed(0),
        (105 + n() * 0.2).toFixed(1),
        (88 + n() * 0.2).toFixed(1),
        (0.2 + n() * 0.05).toFixed(2),
        (13.8 + n() * 0.05).toFixed(2),
        Math.round(60 + 100 * phase),
      ].join(','),
    );
  }
  return parts.join('\n');
}

const mapping = logMappingSchema.parse({
  columns: [
    { column: 'Time (s)', quantity: 'time', unit: 's' },
    { column: 'RPM', quantity: 'engineSpeed', unit: 'rpm' },
    { column: 'MAP (kPa)', quantity: 'manifoldPressure', unit: 'kPa', reference: 'absolute' },
    { column: 'Throttle (%)', quantity: 'throttle', unit: 'percent' },
    { column: 'IAT (°C)', quantity: 'inletTemperature', unit: 'degC' },
    { column: 'Charge temp (°C)', quantity: 'manifoldTemperature', unit: 'degC' },
    { column: 'MAF (g/s)', quantity: 'massAirFlow', unit: 'g/s' },
    { column: 'Fuel flow (g/s)', quantity: 'fuelMassFlow', unit: 'g/s' },
    { column: 'Lambda', quantity: 'lambda', unit: 'lambda' },
    { column: 'Turbo speed (rpm)', quantity: 'shaftSpeed', unit: 'rpm' },
    { column: 'EMAP (kPa)', quantity: 'exhaustPressure', unit: 'kPa', reference: 'absolute' },
    { column: 'EGT (°C)', quantity: 'exhaustTemperature', unit: 'degC' },
    { column: 'Baro (kPa)', quantity: 'ambientPressure', unit: 'kPa' },
    { column: 'Gear', quantity: 'gear', unit: 'gear' },
  ],
});

const cpuTimes = new Map<string, number[]>();
let current = '';
function timed<T>(body: () => T): { ms: number; value: T } {
  const cpu = process.cpuUsage();
  const start = performance.now();
  const value = body();
  const ms = performance.now() - start;
  const used = process.cpuUsage(cpu);
  cpuTimes.set(current, [...(cpuTimes.get(current) ?? []), (used.user + used.system) / 1000]);
  return { ms, value };
}

function report(name: string, times: number[], target: string) {
  const sorted = [...times].sort((a, b) => a - b);
  const q = (p: number) => sorted[Math.round((sorted.length - 1) * p)];
  const cpu = [...(cpuTimes.get(current) ?? [])].sort((a, b) => a - b);
  // CPU time beside wall time: on a shared machine the wall clock also counts other people's work.
  console.log(
    `${name.padEnd(52)} median ${q(0.5).toFixed(0)} ms   p10–p90 ${q(0.1).toFixed(0)}–${q(0.9).toFixed(0)} ms   runs ${times.length}   (CPU median ${cpu[Math.floor(cpu.length / 2)].toFixed(0)} ms)   target ${target}`,
  );
}

const text = logText();
console.log(`log text: ${ROWS.toLocaleString('en')} rows × 20 columns, ${(text.length / 1024 / 1024).toFixed(1)} MB (14 columns mapped)`);
const runs = Number(process.env.BENCH_RUNS ?? 3);
current = 'parse';
const parseTimes: number[] = [];
let mapped: ReturnType<typeof applyMapping> | null = null;
for (let r = 0; r < runs; r++) {
  const { ms, value } = timed(() => {
    const names = new Set(mapping.columns.map((c) => c.column));
    const read = readLogTable(text, { keep: (n) => names.has(n) });
    if (!read.ok) throw new Error(read.problems[0].message);
    return applyMapping(read.table, mapping);
  });
  parseTimes.push(ms);
  mapped = value;
}
if (!mapped?.ok) throw new Error(mapped ? mapped.problems[0].message : 'not mapped');
report('read and map 1,000,000 rows (Node, shared/logs)', parseTimes, '< 3000 ms');

current = 'pack';
const packTimes: number[] = [];
let stored = 0;
for (let r = 0; r < runs; r++) {
  const { ms, value } = timed(() => deflateSync(packChannels(mapped.log.channels, mapped.log.rowCount), { level: 6 }));
  packTimes.push(ms);
  stored = value.length;
}
report('pack and deflate for storage', packTimes, '(none)');
console.log(`${'stored size'.padEnd(52)} ${(stored / 1024 / 1024).toFixed(2)} MB   target < 10 MB`);

current = 'lttb';
const lttbTimes: number[] = [];
const c = mapped.log.channels;
for (let r = 0; r < runs; r++) lttbTimes.push(timed(() => largestTriangleThreeBuckets(c.time!, c.manifoldPressure!, 4000)).ms);
report('downsample one channel to 4000 points (LTTB)', lttbTimes, '(none; drawing stays under 4000 points per trace)');
