import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseMapFile } from '#shared/maps/parse';
import type { CompressorMap } from '#shared/maps/types';
import { compressorMapFigure, islandLabelPoints } from '#src/components/plots/compressor-map-figure';
import type { OperatingLineView } from '#src/components/plots/types';
import { formatQuantity } from '#src/lib/quantities';

// The compressor-map figure is built by a pure function; plotly itself cannot run under jsdom, so
// the traces and layout it is handed are checked here and the drawing in the browser test.

const root = path.resolve(import.meta.dirname, '..', '..', '..');

function demoMap(file: string): CompressorMap {
  const result = parseMapFile(readFileSync(path.join(root, 'data', 'maps', file), 'utf8'));
  if (!result.ok || result.map.kind !== 'compressor') throw new Error(`${file} does not read as a compressor map`);
  return result.map;
}

function expectClose(actual: number, expected: number, relTol: number) {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(relTol * Math.abs(expected));
}

type Trace = {
  name?: string;
  x?: number[];
  y?: number[];
  text?: string[];
  line?: { color?: string; dash?: string };
  marker?: { symbol?: string; color?: string };
};
const traces = (data: unknown[]) => data as Trace[];

const m58 = demoMap('compressor-m58.csv');
// First surge row of data/maps/compressor-m58.csv: 10.84 lb/min at PR 1.177.
const SURGE_FOOT_LB_PER_MIN = 10.84;
// 1 lb = 0.45359237 kg exactly (NIST SP 811, Appendix B.8).
const KG_PER_LB = 0.45359237;

const line: OperatingLineView = {
  key: 'plan-b|0|0',
  label: 'Plan B · Sea level · Full load',
  planIndex: 1,
  scenarioIndex: 1,
  points: [
    {
      rpm: 5000,
      correctedMassFlow: 0.2,
      volumeFlow: 0.17,
      pressureRatio: 2.2,
      hover: [
        { label: 'Manifold pressure', value: 200_000, kind: 'pressure' },
        { label: 'Surge margin', value: 0.123, kind: 'fraction' },
      ],
      severity: 'limit',
    },
    { rpm: 6000, correctedMassFlow: 0.25, volumeFlow: 0.21, pressureRatio: 2.4, hover: [] },
  ],
};

describe('compressor map figure', () => {
  it('puts the map on the corrected-flow axis in the user units', () => {
    const si = traces(compressorMapFigure({ map: m58, unitSystem: 'si', height: 400 }).data).find((t) => t.name === 'Surge line')!;
    // 10.84 lb/min in kg/s: 10.84 × 0.45359237 / 60 (NIST SP 811 pound, 60 s a minute).
    expectClose(si.x![0], (SURGE_FOOT_LB_PER_MIN * KG_PER_LB) / 60, 1e-9);
    const us = traces(compressorMapFigure({ map: m58, unitSystem: 'us', height: 400 }).data).find((t) => t.name === 'Surge line')!;
    // Back in lb/min it is the file's own number (data/maps/compressor-m58.csv).
    expectClose(us.x![0], SURGE_FOOT_LB_PER_MIN, 1e-9);
    expect(us.y![0]).toBe(1.177);
  });

  it('turns the map into inlet volume flow at its reference density, and says so on the axis', () => {
    const figure = compressorMapFigure({ map: m58, unitSystem: 'si', flowAxis: 'volume', height: 400 });
    const surge = traces(figure.data).find((t) => t.name === 'Surge line')!;
    // M58 reference: 13.95 psi and 545 °R (data/maps/compressor-m58.csv). 1 psi = 6894.757 Pa
    // (NIST SP 811, B.8); 545 °R = 545/1.8 K; R = 287.05287 J/(kg·K) (ISO 2533), ρ = p/(R·T).
    const density = (13.95 * 6894.757) / (287.05287 * (545 / 1.8));
    expectClose(density, 1.10665, 1e-4); // the same formula worked by hand with a calculator
    expectClose(surge.x![0], (SURGE_FOOT_LB_PER_MIN * KG_PER_LB) / 60 / density, 1e-6);
    const title = (figure.layout.xaxis as { title: { text: string } }).title.text;
    expect(title).toContain('Inlet volume flow (m³/s');
    expect(title).toContain('reference density 1.107 kg/m³');
    const corrected = compressorMapFigure({ map: m58, unitSystem: 'us', height: 400 });
    expect((corrected.layout.xaxis as { title: { text: string } }).title.text).toBe('Corrected mass flow (lb/min)');
  });

  it('labels every speed line in krpm and draws the rated-speed line as a limit', () => {
    const figure = compressorMapFigure({ map: m58, unitSystem: 'si', height: 400 });
    const labels = (figure.layout.annotations ?? []).map((a) => a.text);
    // The seven speed lines of data/maps/compressor-m58.csv, 45 000 to 135 000 rpm.
    for (const speed of ['45 krpm', '70 krpm', '80 krpm', '95 krpm', '110 krpm', '120 krpm', '135 krpm']) expect(labels).toContain(speed);
    const limitLines = traces(figure.data).filter((t) => t.name === 'Rated speed line');
    // The file's max speed is 135000 rpm: only the top line is at the limit.
    expect(limitLines).toHaveLength(1);
    expect(limitLines[0].line?.color).toBe('#b91c1c');
    expect(traces(figure.data).find((t) => t.name === 'Surge line')!.line?.color).toBe('#b91c1c');
    expect(traces(figure.data).find((t) => t.name === 'Choke limit')!.line?.color).toBe('#b4632b');
  });

  it('labels every efficiency island once, and no two labels on one spot', () => {
    for (const file of ['compressor-s44.csv', 'compressor-m58.csv', 'compressor-l76.csv', 'compressor-v52-volume.csv']) {
      const map = demoMap(file);
      const islands = map.curves.filter((c) => c.kind === 'island');
      const at = islandLabelPoints(map, islands);
      expect(at.every((i) => i !== null)).toBe(true);
      const spots = at.map((i, k) => `${islands[k].points[i!].correctedMassFlow}:${islands[k].points[i!].pressureRatio}`);
      expect(new Set(spots).size).toBe(spots.length);
      const percents = (compressorMapFigure({ map, unitSystem: 'si', height: 400 }).layout.annotations ?? []).filter((a) => String(a.text).endsWith('%'));
      expect(percents).toHaveLength(islands.length);
    }
  });

  it('draws an operating line in its plan colour, marker and scenario dash, with every hover value in the user units', () => {
    const figure = compressorMapFigure({ map: m58, lines: [line], unitSystem: 'us', height: 400 });
    const trace = traces(figure.data).find((t) => t.name === line.label)!;
    // Plan 1 is the second colour of our order of the Okabe and Ito (2008) palette: orange.
    expect(trace.line?.color).toBe('#E69F00');
    expect(trace.marker?.symbol).toBe('square');
    expect(trace.line?.dash).toBe('dash');
    // 0.2 kg/s in lb/min: 0.2 × 60 / 0.45359237 (NIST SP 811 pound).
    expectClose(trace.x![0], (0.2 * 60) / KG_PER_LB, 1e-9);
    // 200 kPa = 29.01 psi (200000 / 6894.757, NIST SP 811 B.8); 0.123 as a percentage.
    expect(trace.text![0]).toContain('Manifold pressure: 29.01 psi');
    expect(trace.text![0]).toContain('Surge margin: 12.3 %');
    // A point with no hover values still says where it is.
    expect(trace.text![1]).toContain('Engine speed 6,000 rpm');
  });

  it('puts operating points where the map would on the volume axis: corrected flow at its reference density', () => {
    const figure = compressorMapFigure({ map: m58, lines: [line], unitSystem: 'si', flowAxis: 'volume', height: 400 });
    const trace = traces(figure.data).find((t) => t.name === line.label)!;
    // ρ_ref of M58 as above (13.95 psi, 545 °R, R = 287.05287): the same physical place as on the mass axis.
    const density = (13.95 * 6894.757) / (287.05287 * (545 / 1.8));
    expectClose(trace.x![0], 0.2 / density, 1e-6);
    expectClose(trace.x![1], 0.25 / density, 1e-6);
  });

  it('uses the actual inlet volume flow of operating points on the volume axis when there is no map', () => {
    const figure = compressorMapFigure({ map: null, lines: [line], unitSystem: 'si', flowAxis: 'volume', height: 400 });
    const trace = traces(figure.data).find((t) => t.name === line.label)!;
    expect(trace.x).toEqual([0.17, 0.21]);
  });

  it('rings the highlighted point and nothing when the highlight names no point', () => {
    const ringed = traces(compressorMapFigure({ map: m58, lines: [line], unitSystem: 'si', highlight: { lineKey: line.key, rpm: 6000 }, height: 400 }).data);
    const ring = ringed.find((t) => t.name === 'Selected point')!;
    expect(ring.x).toEqual([0.25]);
    expect(ring.y).toEqual([2.4]);
    const none = traces(compressorMapFigure({ map: m58, lines: [line], unitSystem: 'si', highlight: { lineKey: line.key, rpm: 5500 }, height: 400 }).data);
    expect(none.find((t) => t.name === 'Selected point')).toBeUndefined();
  });

  it('draws operating lines alone on plain axes when there is no map', () => {
    const figure = compressorMapFigure({ map: null, lines: [line], unitSystem: 'si', height: 400 });
    expect(traces(figure.data)).toHaveLength(1);
    expect(figure.layout.annotations).toEqual([]);
  });
});

describe('quantities as the plots show them', () => {
  it('converts to the user units and names them', () => {
    // 300 K = 26.85 °C (ITS-90 offset 273.15); 101325 Pa = 14.7 psi (NIST SP 811, B.8: 6894.757 Pa/psi).
    expect(formatQuantity(300, 'temperature', 'si')).toBe('26.85 °C');
    expect(formatQuantity(101_325, 'pressure', 'us')).toBe('14.7 psi');
    // 1 m³/s = 2118.88 cfm (1 ft = 0.3048 m exactly, NIST SP 811): 60 / 0.3048³.
    expect(formatQuantity(1, 'volumeFlow', 'us')).toBe('2,119 cfm');
    expect(formatQuantity(null, 'pressure', 'si')).toBe('—');
    expect(formatQuantity(2.345678, 'ratio', 'si')).toBe('2.346');
  });
});
