import fc from 'fast-check';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { compressorModelFromMap, parseMapFile, turbineModelFromMap } from '#shared/maps';
import type { CompressorMap, SpoolbookMap, TurbineMap } from '#shared/maps/types';
import { demoMapFiles, demoMapsFolder, parseOk } from './helpers';

/**
 * Reading a map never depends on the order of its file's rows (physics.md §3 asks for readings
 * "independent of the order of the file's rows"). The demo maps are cut into their polylines,
 * the polylines shuffled, every island's contour started at another of its points and perhaps
 * walked the other way round (and sometimes left open, for the reader to close), and the file
 * read again: every reading on a fine grid over the map and just outside it must be identical
 * (===) to the reading of the file as it was. Rows of speed, surge, choke and turbine lines keep
 * their order: the format requires it.
 */

interface Block {
  curve: string;
  rows: string[];
}

interface SplitFile {
  head: string[];
  blocks: Block[];
}

/** Header lines and column names, then the data rows cut into polylines (consecutive rows of one curve and label). */
function splitFile(text: string): SplitFile {
  const lines = text.split('\n').filter((line) => line.trim() !== '');
  const columns = lines.findIndex((line) => !line.startsWith('#'));
  const blocks: Block[] = [];
  let key = '';
  for (const row of lines.slice(columns + 1)) {
    const [curve, label] = row.split(',');
    if (`${curve},${label}` !== key) blocks.push({ curve, rows: [] });
    key = `${curve},${label}`;
    blocks[blocks.length - 1].rows.push(row);
  }
  return { head: lines.slice(0, columns + 1), blocks };
}

interface IslandChange {
  start: number;
  reverse: boolean;
  leaveOpen: boolean;
}

/** The island's closed contour, started at another point, perhaps reversed, closed again (or left open). */
function rearrangeIsland(rows: string[], change: IslandChange): string[] {
  const cycle = rows.slice(0, -1); // a demo island repeats its first point at the end
  const start = change.start % cycle.length;
  let walked = [...cycle.slice(start), ...cycle.slice(0, start)];
  if (change.reverse) walked = [walked[0], ...walked.slice(1).reverse()];
  return change.leaveOpen ? walked : [...walked, walked[0]];
}

function reorderedFile(file: SplitFile, order: number[], islands: IslandChange[]): string {
  const rows = order.flatMap((i) => {
    const block = file.blocks[i];
    return block.curve === 'island' ? rearrangeIsland(block.rows, islands[i]) : block.rows;
  });
  return [...file.head, ...rows, ''].join('\n');
}

/** A reordering of a file: the polylines in any order, each island changed as above. */
function reorderings(file: SplitFile) {
  const n = file.blocks.length;
  const island = fc.record({ start: fc.nat(10_000), reverse: fc.boolean(), leaveOpen: fc.boolean() });
  return fc.tuple(fc.shuffledSubarray([...Array(n).keys()], { minLength: n, maxLength: n }), fc.array(island, { minLength: n, maxLength: n }));
}

/** `steps` + 1 values from `low` to `high`. */
function span(low: number, high: number, steps: number): number[] {
  return Array.from({ length: steps + 1 }, (_, i) => low + ((high - low) * i) / steps);
}

/** A fine grid over the map and a tenth beyond each edge, every map point, and the midpoints along every line. */
function compressorProbes(map: CompressorMap): Array<[number, number]> {
  const points = map.curves.flatMap((c) => c.points);
  const flows = points.map((p) => p.correctedMassFlow);
  const ratios = points.map((p) => p.pressureRatio);
  const [fLow, fHigh] = [Math.min(...flows), Math.max(...flows)];
  const [rLow, rHigh] = [Math.min(...ratios), Math.max(...ratios)];
  const probes: Array<[number, number]> = [];
  for (const f of span(fLow - 0.1 * (fHigh - fLow), fHigh + 0.1 * (fHigh - fLow), 60)) {
    for (const r of span(rLow - 0.1 * (rHigh - rLow), rHigh + 0.1 * (rHigh - rLow), 60)) probes.push([f, r]);
  }
  for (const curve of map.curves) {
    curve.points.forEach((p, i) => {
      probes.push([p.correctedMassFlow, p.pressureRatio]);
      const next = curve.points[i + 1];
      if (next) probes.push([(p.correctedMassFlow + next.correctedMassFlow) / 2, (p.pressureRatio + next.pressureRatio) / 2]);
    });
  }
  return probes;
}

function compressorReadings(map: CompressorMap, probes: Array<[number, number]>): unknown[][] {
  const model = compressorModelFromMap(map);
  return probes.map(([f, r]) => {
    const x = model.read(f, r);
    return [x.efficiency, x.shaftSpeed, x.surgeMargin, x.chokeMargin, x.speedMargin, x.location];
  });
}

/** Expansion ratios from 1 to a fifth beyond the map and every ratio of the file; reduced flows from 0 to a fifth past the top. */
function turbineProbes(map: TurbineMap): { ratios: number[]; flows: number[] } {
  const ratios = map.curves.flatMap((c) => c.points.map((p) => p.expansionRatio));
  const [low, high] = [Math.min(...ratios), Math.max(...ratios)];
  const top = turbineModelFromMap(map).read(high).flowParameter * high;
  return { ratios: [...span(1, high + 0.2 * (high - low), 400), ...ratios], flows: span(0, 1.2 * top, 400) };
}

function turbineReadings(map: TurbineMap, probes: { ratios: number[]; flows: number[] }): unknown[][] {
  const model = turbineModelFromMap(map);
  const readings: unknown[][] = [[model.capacityRule, ...model.expansionRatioRange]];
  for (const er of probes.ratios) {
    const x = model.read(er);
    readings.push([x.flowParameter, x.efficiency, x.location]);
  }
  for (const q of probes.flows) readings.push([model.expansionRatioForFlow!(q)]); // the map model always has the inverse
  return readings;
}

type Probes = Array<[number, number]> | { ratios: number[]; flows: number[] };

function probesOf(map: SpoolbookMap): Probes {
  return map.kind === 'compressor' ? compressorProbes(map) : turbineProbes(map);
}

function readingsOf(map: SpoolbookMap, probes: Probes): unknown[][] {
  if (map.kind === 'compressor') return compressorReadings(map, probes as Array<[number, number]>);
  return turbineReadings(map, probes as { ratios: number[]; flows: number[] });
}

/** Where two lists of readings first differ (=== on every field), or null when identical. */
function firstDifference(want: unknown[][], got: unknown[][]): string | null {
  if (want.length !== got.length) return `${want.length} readings became ${got.length}`;
  for (let i = 0; i < want.length; i++) {
    for (let k = 0; k < want[i].length; k++) {
      if (want[i][k] !== got[i][k]) return `reading ${i} field ${k}: ${String(want[i][k])} became ${String(got[i][k])}`;
    }
  }
  return null;
}

describe('reading a map does not depend on the order of its rows', () => {
  for (const file of demoMapFiles()) {
    it(`gives identical readings everywhere for any order of ${file}`, () => {
      const text = readFileSync(path.join(demoMapsFolder, file), 'utf8');
      const original = parseOk(text);
      const probes = probesOf(original);
      const want = readingsOf(original, probes);
      const split = splitFile(text);
      fc.assert(
        fc.property(reorderings(split), ([order, islands]) => {
          const result = parseMapFile(reorderedFile(split, order, islands));
          expect(result.ok).toBe(true);
          if (!result.ok) return;
          const difference = firstDifference(want, readingsOf(result.map, probes));
          expect(difference).toBeNull();
        }),
        { numRuns: 25, seed: 13 },
      );
    });
  }
});
