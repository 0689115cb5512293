import { COMPRESSOR_COLUMNS, HEADER_KEYS, MAP_FORMAT_VERSION, TURBINE_COLUMNS, TURBINE_EFFICIENCY_KIND_WORDS } from '../maps/format';
import { parseMapFile } from '../maps/parse';
import type { MapParseResult, MapProblem } from '../maps/types';
import { headerLines as csvHeaderLines } from '../maps/write';
import { writeCsv } from '../csv';
import type { PlanePoint } from './affine';
import { calibrateClicks, dataToPixel, pixelToData, type CalibrationResult } from './calibration';
import { axisQuantities, type TraceCurve, type TraceState } from './state';

/**
 * From a trace to a Spoolbook map file: every clicked point through the calibration into axis
 * values, each line in the order the format wants, the header from the trace's settings. The file
 * is then read back with `parseMapFile`, the very check an upload gets, and each of its problems is
 * placed back on what the user can fix: a setting, a reference click, or a point of a line.
 */

/** Significant digits written for traced values: a click is good to about 1/1000 of an axis. */
export const TRACED_SIGNIFICANT_DIGITS = 5;

/** Where a problem is fixed in the Tracer. */
export type TraceArea = 'map' | 'axes' | 'lines' | 'file';

export interface TraceProblem {
  area: TraceArea;
  /** A setting (`name`, `referenceTemperature`, …) for `map` problems. */
  field: string | null;
  /** The reference click (index in the calibration) for `axes` problems. */
  clickIndex: number | null;
  /** The traced line for `lines` problems. */
  curveId: string | null;
  /** The clicked point (index in the line's clicks) the problem is at, when it is one point. */
  pointIndex: number | null;
  /** The line of the built file, when the file check found it. */
  fileLine: number | null;
  message: string;
}

/** One point of a line as written in the file. */
export interface TracedPoint {
  /** Index of the click in the trace's line (the closing copy of an island's first point repeats 0). */
  index: number;
  /** The axis values written, rounded as in the file (horizontal x, vertical y). */
  value: PlanePoint;
  /** Where the written values fall in the picture: the click, up to rounding. */
  pixel: PlanePoint;
}

export interface TracedLine {
  id: string;
  kind: TraceCurve['kind'];
  title: string;
  points: TracedPoint[];
}

export interface TraceBuild {
  calibration: CalibrationResult;
  /** Residual of each reference click in pixels (null when not used or not fitted). */
  residualsByClick: (number | null)[];
  /** The lines as written, in axis values (empty until the calibration fits). */
  lines: TracedLine[];
  /** The file text as it stands (header and column names even before anything is traced). */
  text: string;
  /** The file checked as an upload would be. */
  result: MapParseResult;
  /** Every problem, in the Tracer's words and places. Empty when the file can be saved. */
  problems: TraceProblem[];
}

/** A number rounded to the digits a traced value deserves. */
export function tracedNumber(value: number): number {
  return Number(value.toPrecision(TRACED_SIGNIFICANT_DIGITS));
}

function numberText(value: number): string {
  return String(value);
}

/** The line's name as the Tracer shows it. */
export function curveTitle(curve: TraceCurve, state: Pick<TraceState, 'speedUnit' | 'efficiency' | 'curves'>): string {
  const speed = curve.speed === null ? null : `${numberText(curve.speed)} ${state.speedUnit}`;
  switch (curve.kind) {
    case 'surge':
      return 'Surge line';
    case 'choke':
      return 'Choke limit';
    case 'speed':
      return speed ? `Speed line ${speed}` : 'Speed line (speed not typed yet)';
    case 'island': {
      if (curve.efficiency === null) return 'Efficiency island (value not typed yet)';
      return `Efficiency island ${numberText(curve.efficiency)}${state.efficiency === 'percent' ? ' %' : ''}`;
    }
    case 'flow': {
      if (speed) return `Flow line ${speed}`;
      const n = state.curves.filter((c) => c.kind === 'flow').indexOf(curve) + 1;
      return `Flow line ${n > 0 ? n : ''}`.trim();
    }
  }
}

/** Which file column a line is ordered by: flow rises along speed lines, ratios along the limits and turbine lines. */
function sortKey(kind: TraceCurve['kind']): 'flow' | 'ratio' | null {
  if (kind === 'speed') return 'flow';
  if (kind === 'surge' || kind === 'choke' || kind === 'flow') return 'ratio';
  return null;
}

/** File column values of one traced point: [column 3, column 4]. */
function fileColumns(state: TraceState, value: PlanePoint): [number, number] {
  if (state.kind === 'compressor') return [value.x, value.y];
  // Turbine files list expansion ratio, then flow parameter.
  return state.turbine.flowParameterAxis === 'y' ? [value.x, value.y] : [value.y, value.x];
}

function safeHeaderText(text: string): string {
  return text.replace(/[\u0000-\u001f\u007f]+/g, ' ').trim();
}

interface Written {
  text: string;
  /** File line → the setting it writes. */
  headerFields: Map<number, string>;
  /** File line → the line and click it writes. */
  rowOrigins: Map<number, { curveId: string; pointIndex: number }>;
}

const SETTING_LABELS: Record<string, string> = {
  name: 'Name',
  notes: 'Notes',
  flowUnit: 'Flow unit',
  referenceTemperature: 'Reference temperature',
  referencePressure: 'Reference pressure',
  efficiency: 'Efficiency scale',
  maxSpeed: 'Rated speed limit',
  speedUnit: 'Speed unit',
  flowParameterUnit: 'Flow parameter unit',
  housing: 'Housing',
  scrollFeed: 'Scroll feed',
  areaRatio: 'A/R',
  efficiencyKind: 'Efficiency kind',
};

/** Header keys of the format → the Tracer setting that writes them. */
const KEY_FIELDS: Record<string, string> = {
  [HEADER_KEYS.name]: 'name',
  [HEADER_KEYS.flow]: 'flowUnit',
  [HEADER_KEYS.referenceTemperature]: 'referenceTemperature',
  [HEADER_KEYS.referencePressure]: 'referencePressure',
  [HEADER_KEYS.efficiency]: 'efficiency',
  [HEADER_KEYS.maxSpeed]: 'maxSpeed',
  [HEADER_KEYS.speed]: 'speedUnit',
  [HEADER_KEYS.flowParameter]: 'flowParameterUnit',
  [HEADER_KEYS.housing]: 'housing',
  [HEADER_KEYS.scrollFeed]: 'scrollFeed',
  [HEADER_KEYS.areaRatio]: 'areaRatio',
  [HEADER_KEYS.efficiencyKind]: 'efficiencyKind',
};

function header(state: TraceState, calibration: CalibrationResult): Array<[string, string, string | null]> {
  const entries: Array<[string, string, string | null]> = [
    [HEADER_KEYS.version, String(MAP_FORMAT_VERSION), null],
    [HEADER_KEYS.kind, state.kind, null],
    [HEADER_KEYS.name, safeHeaderText(state.name), 'name'],
  ];
  if (state.kind === 'compressor') {
    const c = state.compressor;
    entries.push([HEADER_KEYS.flow, `${c.flowAxis === 'volume' ? 'volume' : 'corrected mass'}, ${safeHeaderText(c.flowUnit)}`, 'flowUnit']);
    if (c.referenceTemperature.value !== null) {
      entries.push([
        HEADER_KEYS.referenceTemperature,
        `${numberText(c.referenceTemperature.value)} ${safeHeaderText(c.referenceTemperature.unit)}`,
        'referenceTemperature',
      ]);
    }
    if (c.referencePressure.value !== null) {
      entries.push([
        HEADER_KEYS.referencePressure,
        `${numberText(c.referencePressure.value)} ${safeHeaderText(c.referencePressure.unit)}`,
        'referencePressure',
      ]);
    }
    entries.push([HEADER_KEYS.efficiency, state.efficiency, 'efficiency']);
    if (c.maxSpeed !== null) entries.push([HEADER_KEYS.maxSpeed, `${numberText(c.maxSpeed)} ${state.speedUnit}`, 'maxSpeed']);
    entries.push([HEADER_KEYS.speed, state.speedUnit, 'speedUnit']);
  } else {
    const t = state.turbine;
    entries.push([HEADER_KEYS.flowParameter, safeHeaderText(t.flowParameterUnit), 'flowParameterUnit'], [HEADER_KEYS.housing, t.housing, 'housing']);
    if (t.housing === 'divided') entries.push([HEADER_KEYS.scrollFeed, t.scrollFeed === 'per-scroll' ? 'per scroll' : 'both', 'scrollFeed']);
    if (t.areaRatio !== null) entries.push([HEADER_KEYS.areaRatio, numberText(t.areaRatio), 'areaRatio']);
    entries.push([HEADER_KEYS.efficiency, state.efficiency, 'efficiency']);
    if (t.efficiencyKind) entries.push([HEADER_KEYS.efficiencyKind, TURBINE_EFFICIENCY_KIND_WORDS[t.efficiencyKind], 'efficiencyKind']);
    entries.push([HEADER_KEYS.speed, state.speedUnit, 'speedUnit']);
  }
  for (const note of state.notes.split(/\r\n|\r|\n/)) {
    const text = safeHeaderText(note);
    if (text) entries.push([HEADER_KEYS.note, text, 'notes']);
  }
  const how = calibration.ok
    ? `, calibrated from ${calibration.calibration.residuals.length} reference points (fit residual ${calibration.calibration.rmsResidual.toFixed(1)} px RMS)`
    : '';
  entries.push([HEADER_KEYS.note, `Traced in the Spoolbook Tracer from a picture${how}.`, 'notes']);
  return entries;
}

/** Island labels are their efficiency; a second island of the same value gets " (2)" so the lines stay apart. */
function labels(state: TraceState): Map<string, string> {
  const out = new Map<string, string>();
  const used = new Map<string, number>();
  let flowIndex = 0;
  for (const curve of state.curves) {
    let label = '';
    if (curve.kind === 'speed' && curve.speed !== null) label = numberText(curve.speed);
    if (curve.kind === 'flow') {
      flowIndex++;
      label = curve.speed !== null ? numberText(curve.speed) : `line ${flowIndex}`;
    }
    if (curve.kind === 'island' && curve.efficiency !== null) {
      const base = numberText(curve.efficiency);
      const n = (used.get(base) ?? 0) + 1;
      used.set(base, n);
      label = n === 1 ? base : `${base} (${n})`;
    }
    out.set(curve.id, label);
  }
  return out;
}

function tracedLines(state: TraceState, calibration: CalibrationResult): TracedLine[] {
  if (!calibration.ok) return [];
  const cal = calibration.calibration;
  return state.curves.map((curve) => {
    let points: TracedPoint[] = curve.points.map((pixel, index) => {
      const raw = pixelToData(cal, pixel);
      const value = { x: tracedNumber(raw.x), y: tracedNumber(raw.y) };
      return { index, value, pixel: dataToPixel(cal, value) ?? pixel };
    });
    const key = sortKey(curve.kind);
    if (key !== null) {
      const column = (p: TracedPoint) => fileColumns(state, p.value)[key === 'flow' ? 0 : state.kind === 'compressor' ? 1 : 0];
      points = [...points].sort((a, b) => column(a) - column(b));
    }
    if (curve.kind === 'island' && points.length >= 3) {
      const first = points[0];
      const last = points[points.length - 1];
      if (first.value.x !== last.value.x || first.value.y !== last.value.y) points = [...points, { ...first }];
    }
    return { id: curve.id, kind: curve.kind, title: curveTitle(curve, state), points };
  });
}

function write(state: TraceState, calibration: CalibrationResult, lines: TracedLine[]): Written {
  const headerFields = new Map<number, string>();
  const entries = header(state, calibration);
  entries.forEach(([, , field], i) => {
    if (field) headerFields.set(i + 1, field);
  });
  const headerLines = csvHeaderLines(entries.map(([key, value]) => [key, value]));
  const labelOf = labels(state);
  const curveById = new Map(state.curves.map((c) => [c.id, c]));
  const rows: Array<Array<string | number | null>> = [];
  const rowOrigins = new Map<number, { curveId: string; pointIndex: number }>();
  // Header lines, then the column names, then the rows: row r is on file line headerLines + 2 + r.
  for (const line of lines) {
    const curve = curveById.get(line.id)!;
    for (const point of line.points) {
      const [third, fourth] = fileColumns(state, point.value);
      const efficiency = curve.kind === 'island' ? curve.efficiency : null;
      const speed = curve.kind === 'speed' || curve.kind === 'flow' ? curve.speed : null;
      rowOrigins.set(headerLines.length + 2 + rows.length, { curveId: line.id, pointIndex: point.index });
      rows.push([curve.kind, labelOf.get(curve.id) ?? '', third, fourth, efficiency, speed]);
    }
  }
  const columns = state.kind === 'compressor' ? COMPRESSOR_COLUMNS : TURBINE_COLUMNS;
  const table = writeCsv(columns, rows, '\n');
  return { text: `${[...headerLines, table].join('\n')}\n`, headerFields, rowOrigins };
}

function fileProblem(problem: MapProblem, written: Written, state: TraceState, lines: TracedLine[], calibrated: boolean): TraceProblem | null {
  const base = { field: null, clickIndex: null, curveId: null, pointIndex: null, fileLine: problem.line };
  if (problem.line !== null) {
    const field = written.headerFields.get(problem.line);
    if (field) return { ...base, area: 'map', field, message: `${SETTING_LABELS[field] ?? field}: ${problem.message}` };
    const origin = written.rowOrigins.get(problem.line);
    if (origin) {
      const line = lines.find((l) => l.id === origin.curveId);
      const along = line ? line.points.findIndex((p) => p.index === origin.pointIndex) + 1 : 0;
      // Cell problems are at one point; the others (too few points, a repeated label) are the line's.
      const where = along > 0 && problem.column !== null ? `, point ${along} along the line` : '';
      return {
        ...base,
        area: 'lines',
        curveId: origin.curveId,
        pointIndex: origin.pointIndex,
        message: `${line?.title ?? 'A line'}${where}: ${problem.message}`,
      };
    }
    return { ...base, area: 'file', message: `Line ${problem.line} of the file: ${problem.message}` };
  }
  if (problem.code === 'missing-key') {
    const key = /header key "([^"]+)"/.exec(problem.message)?.[1] ?? '';
    const field = KEY_FIELDS[key] ?? null;
    if (field)
      return { ...base, area: 'map', field, message: `${SETTING_LABELS[field]}: type it (the map gives it, usually near the title or the axis labels)` };
  }
  if (problem.code === 'no-data-rows') {
    // Before the calibration fits, nothing can be written; the calibration's problems say why.
    if (!calibrated) return null;
    return {
      ...base,
      area: 'lines',
      message: state.curves.length === 0 ? 'Nothing traced yet: add a line and click along it in the picture' : 'No line has any points yet',
    };
  }
  if (problem.code === 'missing-curve') return { ...base, area: 'lines', message: capitalise(problem.message) };
  return { ...base, area: 'file', message: capitalise(problem.message) };
}

function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/**
 * Builds the map file from a trace and checks it as an upload would be. Pure and quick enough to
 * run on every change (a few thousand points).
 */
export function buildTrace(state: TraceState): TraceBuild {
  const quantities = axisQuantities(state);
  const { result: calibration, residualsByClick } = calibrateClicks(state.calibration.clicks, state.calibration.crossing, state.scales);
  const lines = tracedLines(state, calibration);
  const written = write(state, calibration, lines);
  const result = parseMapFile(written.text);
  // With no rows yet the reader stops before it judges the header; judge it on its own then, so
  // the map's settings are checked from the first keystroke.
  const headerCheck = written.rowOrigins.size === 0 ? headerOnlyProblems(state, written) : [];

  const problems: TraceProblem[] = [];
  const none = { field: null, clickIndex: null, curveId: null, pointIndex: null, fileLine: null };
  if (!calibration.ok) {
    for (const p of calibration.problems) {
      const axisWords = p.message.replace('horizontal value', `${quantities.x.short}`).replace('vertical value', `${quantities.y.short}`);
      problems.push({ ...none, area: 'axes', clickIndex: p.index, message: capitalise(axisWords) });
    }
  }
  for (const curve of state.curves) {
    if (curve.points.length === 0) {
      problems.push({
        ...none,
        area: 'lines',
        curveId: curve.id,
        message: `${curveTitle(curve, state)} has no points yet: choose it and click along the line in the picture`,
      });
    }
  }
  if (!result.ok || headerCheck.length > 0) {
    const found = [...headerCheck, ...(result.ok ? [] : result.problems)];
    // One message per line and kind of problem: later rows of a line repeat the first.
    const seen = new Set<string>();
    for (const p of found) {
      const placed = fileProblem(p, written, state, lines, calibration.ok);
      if (!placed) continue;
      const key = placed.curveId ? `${placed.curveId}|${p.code}` : `${placed.area}|${placed.field}|${placed.message}`;
      if (seen.has(key)) continue;
      seen.add(key);
      problems.push(placed);
    }
  }
  return { calibration, residualsByClick, lines, text: written.text, result, problems };
}

/** Rows that pass every check, in any units and either efficiency scale: only their header is in question. */
function sampleBody(state: TraceState): string {
  const e = state.efficiency === 'percent' ? 70 : 0.7;
  if (state.kind === 'turbine') return ['flow,1,1.5,2,,', 'flow,1,2,3,,'].join('\n');
  return [
    'surge,,1,1.5,,',
    'surge,,2,2.5,,',
    'choke,,3,1.2,,',
    'choke,,4,2.4,,',
    `speed,1,1,1.5,${e},1`,
    `speed,1,3,1.2,${e},1`,
    `speed,2,2,2.5,${e},2`,
    `speed,2,4,2.4,${e},2`,
    `island,i,2,1.6,${e},`,
    `island,i,2.5,1.8,${e},`,
    `island,i,2.4,1.5,${e},`,
    `island,i,2,1.6,${e},`,
  ].join('\n');
}

/** The header's own problems, read with sample rows after it (problems of those rows cannot arise). */
function headerOnlyProblems(state: TraceState, written: Written): MapProblem[] {
  const checked = parseMapFile(`${written.text}${sampleBody(state)}\n`);
  if (checked.ok) return [];
  const headerEnd = Math.max(0, ...written.headerFields.keys());
  return checked.problems.filter(
    (p) => (p.line !== null && p.line <= headerEnd) || (p.line === null && p.code !== 'missing-curve' && p.code !== 'too-many-problems'),
  );
}

/** A file name for the built map: letters, digits and dashes from its name. */
export function traceFileName(name: string): string {
  const base = name
    .normalize('NFKD')
    .replace(/[^A-Za-z0-9._ -]+/g, '')
    .trim()
    .replace(/\s+/g, '-')
    .slice(0, 80);
  return `${base || 'traced-map'}.csv`;
}
