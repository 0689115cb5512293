import type { Annotation, Data, Layout } from 'plotly.js-dist-min';
import { referenceDensity } from '#shared/maps/scales';
import type { CompressorCurve, CompressorMap } from '#shared/maps/types';
import { fromSI } from '#shared/units';
import { builtForMap } from './map-cache';
import {
  legendUnderMap,
  lineEndLabel,
  mapPlotPaper,
  notReachableMarker,
  operatingLineStyle,
  plotAxis,
  plotColours,
  plotFont,
  selectedPointMarker,
  plotText,
} from './style';
import type { CompressorMapPlotProps, HoverItem, OperatingLineView, OperatingPointView } from './types';
import { displayUnitOf, formatNumber, formatQuantity, krpmLabel, percentLabel, unitLabel, type UnitSystem } from '#src/lib/quantities';

/** What plotly draws: traces and layout. Built by a pure function so it can be checked without a browser. */
export interface PlotFigure {
  data: Data[];
  layout: Partial<Layout>;
}

type FigureInput = Pick<CompressorMapPlotProps, 'map' | 'lines' | 'flowAxis' | 'highlight'> & { unitSystem: UnitSystem; height: number };

/** How flows are put on the x axis: the unit shown and the factors from the SI values. */
export interface FlowScale {
  axis: 'corrected' | 'volume';
  /** mathjs unit name of the axis. */
  unit: string;
  /** Axis units per kg/s of the map's corrected mass flow. */
  perCorrectedMassFlow: number;
  /** Axis units per m³/s of inlet volume flow (volume axis only; NaN otherwise). */
  perVolumeFlow: number;
  /** Reference density the map's flows are turned into volume with, kg/m³ (volume axis with a map only). */
  referenceDensity: number | null;
}

export function flowScale(map: CompressorMap | null, axis: 'corrected' | 'volume', system: UnitSystem): FlowScale {
  if (axis === 'volume') {
    const unit = displayUnitOf('volumeFlow', system);
    const perVolumeFlow = fromSI(1, unit, 'volumeFlow');
    // The map's corrected flow is mass flow at its reference conditions: as a volume it is
    // Q = ṁc/ρ_ref with ρ_ref = p_ref/(R·T_ref), R = 287.05287 J/(kg·K) (docs/map-format.md).
    const density = map ? referenceDensity(map.reference) : null;
    return { axis, unit, perVolumeFlow, perCorrectedMassFlow: density ? perVolumeFlow / density : Number.NaN, referenceDensity: density };
  }
  const unit = displayUnitOf('massFlow', system);
  return { axis, unit, perCorrectedMassFlow: fromSI(1, unit, 'massFlow'), perVolumeFlow: Number.NaN, referenceDensity: null };
}

export function flowAxisTitle(scale: FlowScale, system: UnitSystem): string {
  const unit = unitLabel(scale.unit);
  if (scale.axis === 'corrected') return `Corrected mass flow (${unit})`;
  if (scale.referenceDensity === null) return `Inlet volume flow (${unit})`;
  const density = formatQuantity(scale.referenceDensity, 'density', system);
  return `Inlet volume flow (${unit}; corrected to the map's reference density ${density})`;
}

/**
 * Over a map, a point sits where the map would put it: its corrected flow, as a volume at the map's
 * reference density on the volume axis (the same physical place as on the mass axis). Without a
 * map the volume axis shows the actual inlet volume flow.
 */
function operatingX(point: OperatingPointView, scale: FlowScale): number {
  if (scale.axis === 'volume' && scale.referenceDensity === null) return point.volumeFlow * scale.perVolumeFlow;
  return point.correctedMassFlow * scale.perCorrectedMassFlow;
}

function curveEfficiency(curve: CompressorCurve): number | null {
  return curve.points.find((p) => p.efficiency !== null)?.efficiency ?? null;
}

function curveSpeed(curve: CompressorCurve): number | null {
  return curve.points.find((p) => p.speed !== null)?.speed ?? null;
}

/** Speed lines at or above the wheel's rated speed are drawn as limits. */
function isOverspeed(map: CompressorMap, speed: number | null): boolean {
  return map.maxSpeed !== null && speed !== null && speed >= map.maxSpeed * (1 - 1e-9);
}

function mapPointHover(title: string, x: number, pressureRatio: number, efficiency: number | null, scale: FlowScale): string {
  const lines = [`<b>${plotText(title)}</b>`, `Flow ${formatNumber(x)} ${unitLabel(scale.unit)}`, `Pressure ratio ${formatNumber(pressureRatio)}`];
  if (efficiency !== null) lines.push(`Efficiency ${percentLabel(efficiency)}`);
  return lines.join('<br>');
}

function mapTraces(map: CompressorMap, scale: FlowScale): { data: Data[]; annotations: Partial<Annotation>[] } {
  const data: Data[] = [];
  const annotations: Partial<Annotation>[] = [];
  const xs = (curve: CompressorCurve) => curve.points.map((p) => p.correctedMassFlow * scale.perCorrectedMassFlow);
  const ys = (curve: CompressorCurve) => curve.points.map((p) => p.pressureRatio);

  // Islands first, so lines and points draw over their faint fill.
  const islands = map.curves.filter((c) => c.kind === 'island');
  const labelAt = islandLabelPoints(map, islands);
  islands.forEach((curve, i) => {
    const x = xs(curve);
    const y = ys(curve);
    data.push({
      type: 'scatter',
      mode: 'lines',
      name: 'Efficiency islands',
      legendgroup: 'islands',
      showlegend: i === 0,
      x,
      y,
      fill: 'toself',
      fillcolor: plotColours.tealFill,
      line: { color: plotColours.teal, width: 1, shape: 'linear' },
      hoverinfo: 'skip',
    });
    const efficiency = curveEfficiency(curve);
    const at = labelAt[i];
    if (efficiency !== null && at !== null) {
      annotations.push({
        x: x[at],
        y: y[at],
        text: percentLabel(efficiency),
        showarrow: false,
        font: { ...plotFont, size: 10, color: plotColours.tealDark },
        bgcolor: 'rgba(255, 253, 248, 0.85)',
        borderpad: 1,
      });
    }
  });

  const speedLines = map.curves
    .filter((c) => c.kind === 'speed')
    .map((curve) => ({ curve, speed: curveSpeed(curve) }))
    .sort((a, b) => (a.speed ?? 0) - (b.speed ?? 0));
  // Legend words for the lines drawn as limits: usually just the top line, at the rated speed.
  const overLimit = speedLines.some(({ speed }) => map.maxSpeed !== null && speed !== null && speed > map.maxSpeed * (1 + 1e-9));
  const limitName = overLimit ? 'Speed lines at or over rated speed' : 'Rated speed line';
  let shownNormal = false;
  let shownOverspeed = false;
  for (const { curve, speed } of speedLines) {
    const overspeed = isOverspeed(map, speed);
    const name = overspeed ? limitName : 'Speed lines';
    const showlegend = overspeed ? !shownOverspeed : !shownNormal;
    if (overspeed) shownOverspeed = true;
    else shownNormal = true;
    const label = speed !== null ? krpmLabel(speed) : curve.label;
    const x = xs(curve);
    const y = ys(curve);
    data.push({
      type: 'scatter',
      mode: 'lines',
      name,
      legendgroup: overspeed ? 'overspeed' : 'speed',
      showlegend,
      x,
      y,
      line: { color: overspeed ? plotColours.limit : plotColours.ink, width: overspeed ? 1.75 : 1.25 },
      text: curve.points.map((p, i) => mapPointHover(`Speed line ${label}`, x[i], p.pressureRatio, p.efficiency, scale)),
      hovertemplate: '%{text}<extra></extra>',
    });
    const last = x.length - 1;
    if (last >= 0) {
      annotations.push(lineEndLabel(x[last], y[last], plotText(label), overspeed ? plotColours.limit : plotColours.inkSoft));
    }
  }

  // The edges of the map: choke limit, then the surge line over it.
  const edges = [
    { kind: 'choke', name: 'Choke limit', colour: plotColours.copper, width: 2.25 },
    { kind: 'surge', name: 'Surge line', colour: plotColours.limit, width: 2.5 },
  ] as const;
  for (const edge of edges) {
    for (const curve of map.curves.filter((c) => c.kind === edge.kind)) {
      const x = xs(curve);
      data.push({
        type: 'scatter',
        mode: 'lines',
        name: edge.name,
        legendgroup: edge.kind,
        x,
        y: ys(curve),
        line: { color: edge.colour, width: edge.width },
        text: curve.points.map((p, i) => mapPointHover(edge.name, x[i], p.pressureRatio, null, scale)),
        hovertemplate: '%{text}<extra></extra>',
      });
    }
  }
  return { data, annotations };
}

/** Distance from point p to the polyline, all in the same plane. */
function distanceToPolyline(p: number[], line: number[][]): number {
  let best = Infinity;
  for (let i = 1; i < line.length; i++) {
    const [ax, ay] = line[i - 1];
    const [bx, by] = line[i];
    const dx = bx - ax;
    const dy = by - ay;
    const t = dx === 0 && dy === 0 ? 0 : Math.max(0, Math.min(1, ((p[0] - ax) * dx + (p[1] - ay) * dy) / (dx * dx + dy * dy)));
    best = Math.min(best, Math.hypot(p[0] - (ax + t * dx), p[1] - (ay + t * dy)));
  }
  return best;
}

/** Closer than this (in the unit square of the map) to the map's edge, an island point is on the edge. */
const ON_EDGE = 0.012;
/** Labels of two islands no closer than this (unit square), when the contour allows. */
const LABEL_GAP = 0.06;

/**
 * Where each island's label goes: the point of its contour nearest a ray from the middle of the
 * innermost island towards the low end of the surge line. Nested islands then get their labels in
 * a row across the rings. Outer islands are often cut by the map's edges (surge, choke, lowest
 * and top speed lines); a label on the edge would sit on the other islands' labels, so points on
 * the edge are passed over, and so are points crowding a label already placed. Worked in a unit
 * square of the map's extent, so the axis units do not matter.
 */
export function islandLabelPoints(map: CompressorMap, islands: readonly CompressorCurve[]): (number | null)[] {
  const all = map.curves.flatMap((c) => c.points);
  const maxFlow = Math.max(...all.map((p) => p.correctedMassFlow));
  const maxRatio = Math.max(...all.map((p) => p.pressureRatio));
  const unit = (p: { correctedMassFlow: number; pressureRatio: number }) => [
    p.correctedMassFlow / maxFlow,
    maxRatio > 1 ? (p.pressureRatio - 1) / (maxRatio - 1) : 0,
  ];
  const byEfficiency = [...islands.keys()].sort((a, b) => (curveEfficiency(islands[b]) ?? -Infinity) - (curveEfficiency(islands[a]) ?? -Infinity));
  const peak = islands[byEfficiency[0]];
  if (!peak || peak.points.length === 0) return islands.map(() => null);
  const centre = peak.points
    .map(unit)
    .reduce((a, b) => [a[0] + b[0], a[1] + b[1]])
    .map((v) => v / peak.points.length);
  const surgeFoot = map.curves.find((c) => c.kind === 'surge')?.points[0];
  const target = surgeFoot ? unit(surgeFoot) : [0, 0];
  const length = Math.hypot(target[0] - centre[0], target[1] - centre[1]) || 1;
  const d = [(target[0] - centre[0]) / length, (target[1] - centre[1]) / length];

  const speedLines = map.curves.filter((c) => c.kind === 'speed').sort((a, b) => (curveSpeed(a) ?? 0) - (curveSpeed(b) ?? 0));
  const edges = [
    ...map.curves.filter((c) => c.kind === 'surge' || c.kind === 'choke'),
    ...(speedLines.length ? [speedLines[0], speedLines[speedLines.length - 1]] : []),
  ].map((c) => c.points.map(unit));
  const onEdge = (p: number[]) => edges.some((edge) => distanceToPolyline(p, edge) < ON_EDGE);

  const candidates = islands.map((island) =>
    island.points.map(unit).map((p, i) => ({
      i,
      p,
      along: (p[0] - centre[0]) * d[0] + (p[1] - centre[1]) * d[1],
      off: Math.abs((p[0] - centre[0]) * d[1] - (p[1] - centre[1]) * d[0]),
      edge: onEdge(p),
    })),
  );
  type Candidate = (typeof candidates)[number][number];
  const insideCount = candidates.map((list) => list.filter((c) => !c.edge).length);
  // The islands with the least room off the edge choose first (outer islands cut by the edges
  // have only a short stretch inside); among equals, the innermost first.
  const order = [...byEfficiency].sort((a, b) => insideCount[a] - insideCount[b] || byEfficiency.indexOf(a) - byEfficiency.indexOf(b));

  const placed: number[][] = [];
  const result: (number | null)[] = islands.map(() => null);
  for (const index of order) {
    const all = candidates[index];
    const inside = all.filter((c) => !c.edge);
    const forward = inside.filter((c) => c.along > 0);
    const room = (c: Candidate) => Math.min(Infinity, ...placed.map((q) => Math.hypot(c.p[0] - q[0], c.p[1] - q[1])));
    const roomy = (c: Candidate) => room(c) >= LABEL_GAP;
    const byRay = (list: Candidate[]) => [...list].sort((a, b) => a.off - b.off);
    const roomiest = (list: Candidate[]) => [...list].sort((a, b) => room(b) - room(a))[0];
    // Towards the surge foot if there is room, else anywhere off the edge with room, else wherever is least crowded.
    const chosen = byRay(forward).find(roomy) ?? byRay(inside).find(roomy) ?? roomiest(inside.length ? inside : all);
    if (chosen) {
      result[index] = chosen.i;
      placed.push(chosen.p);
    }
  }
  return result;
}

/** Every value of an operating point, in the user's units, for its hover box. */
export function operatingPointHover(line: OperatingLineView, point: OperatingPointView, scale: FlowScale, system: UnitSystem): string {
  const rows = [`<b>${plotText(line.label)}</b>`];
  if (point.hover.length === 0) {
    rows.push(`Engine speed ${formatQuantity(point.rpm, 'speed', system)}`);
    rows.push(`Flow ${formatNumber(operatingX(point, scale))} ${unitLabel(scale.unit)}`);
    rows.push(`Pressure ratio ${formatNumber(point.pressureRatio)}`);
  }
  for (const item of point.hover) rows.push(`${plotText(item.label)}: ${hoverValue(item, system)}`);
  return rows.join('<br>');
}

/** One hover value: its words, the value in the user's units, or what stands in for a missing one. */
function hoverValue(item: HoverItem, system: UnitSystem): string {
  if (item.text !== undefined) return plotText(item.text);
  if (item.value === null && item.missing) return plotText(item.missing);
  return formatQuantity(item.value, item.kind, system);
}

function lineTraces(lines: readonly OperatingLineView[], scale: FlowScale, system: UnitSystem): Data[] {
  return lines.flatMap((line) => {
    const style = operatingLineStyle(
      line.planIndex,
      line.scenarioIndex,
      line.points.map((p) => p.severity),
      line.points.map((p) => p.reachable),
    );
    const hollow = line.points.some((p) => p.reachable === false);
    const trace = {
      type: 'scatter',
      mode: 'lines+markers',
      name: line.label,
      legendgroup: `line:${line.key}`,
      // plotly draws a line's key with its first marker; a hollow one would mark the whole line as not reachable.
      showlegend: !hollow,
      x: line.points.map((p) => operatingX(p, scale)),
      y: line.points.map((p) => p.pressureRatio),
      ...style,
      customdata: line.points.map((p) => [line.key, p.rpm]),
      text: line.points.map((p) => operatingPointHover(line, p, scale, system)),
      hovertemplate: '%{text}<extra></extra>',
    } satisfies Data;
    if (!hollow) return [trace];
    // The key alone, with the plan's filled marker: no points of its own.
    const key = { ...operatingLineStyle(line.planIndex, line.scenarioIndex, []) };
    return [
      trace,
      {
        type: 'scatter',
        mode: 'lines+markers',
        name: line.label,
        legendgroup: `line:${line.key}`,
        x: [null],
        y: [null],
        line: key.line,
        marker: { symbol: key.marker.symbol, size: key.marker.size, color: key.marker.color },
        hoverinfo: 'skip',
      } satisfies Data,
    ];
  });
}

/**
 * A cross over every point the compressor cannot deliver, one trace for all lines with one legend
 * entry; it takes no hover or click, which stay with the point under it. Null when every point is reachable.
 */
export function notReachableTrace(lines: readonly OperatingLineView[], scale: FlowScale): Data | null {
  const x: number[] = [];
  const y: number[] = [];
  for (const line of lines) {
    for (const p of line.points) {
      if (p.reachable !== false) continue;
      x.push(operatingX(p, scale));
      y.push(p.pressureRatio);
    }
  }
  if (x.length === 0) return null;
  return {
    type: 'scatter',
    mode: 'markers',
    name: 'Not reachable (hollow, crossed)',
    legendgroup: 'not-reachable',
    x,
    y,
    marker: notReachableMarker,
    hoverinfo: 'skip',
  };
}

function highlightTrace(lines: readonly OperatingLineView[], highlight: CompressorMapPlotProps['highlight'], scale: FlowScale): Data | null {
  if (!highlight) return null;
  const line = lines.find((l) => l.key === highlight.lineKey);
  const point = line?.points.find((p) => Math.abs(p.rpm - highlight.rpm) <= 1e-6 * Math.max(1, Math.abs(highlight.rpm)));
  if (!point) return null;
  return {
    type: 'scatter',
    mode: 'markers',
    name: 'Selected point',
    showlegend: false,
    x: [operatingX(point, scale)],
    y: [point.pressureRatio],
    marker: selectedPointMarker,
    hoverinfo: 'skip',
  };
}

function finiteMax(values: number[]): number | null {
  let max: number | null = null;
  for (const v of values) if (Number.isFinite(v) && (max === null || v > max)) max = v;
  return max;
}

/** The compressor map and operating lines as plotly traces and layout, in the user's units. */
export function compressorMapFigure({ map, lines = [], flowAxis = 'corrected', unitSystem, highlight = null, height }: FigureInput): PlotFigure {
  const scale = flowScale(map, flowAxis, unitSystem);
  const drawn = map ? builtForMap(map, `${flowAxis}|${unitSystem}`, () => mapTraces(map, scale)) : { data: [], annotations: [] };
  const data: Data[] = [...drawn.data, ...lineTraces(lines, scale, unitSystem)];
  const crosses = notReachableTrace(lines, scale);
  if (crosses) data.push(crosses);
  const ring = highlightTrace(lines, highlight, scale);
  if (ring) data.push(ring);

  const allX: number[] = [];
  const allY: number[] = [];
  for (const trace of data) {
    if (trace.type === 'scatter' && Array.isArray(trace.x) && Array.isArray(trace.y)) {
      allX.push(...(trace.x as number[]));
      allY.push(...(trace.y as number[]));
    }
  }
  const maxX = finiteMax(allX);
  const maxY = finiteMax(allY);
  // Room on the right for the speed labels; pressure ratio starts at 1 (no compression).
  const xRange: [number, number] | undefined = maxX !== null ? [0, maxX * 1.12] : undefined;
  const yRange: [number, number] | undefined = maxY !== null ? [1, 1 + (maxY - 1) * 1.06 + 0.02] : undefined;

  const axis = {
    ...plotAxis,
    title: { font: { ...plotFont, size: 13 } },
  };
  return {
    data,
    layout: {
      height,
      ...mapPlotPaper,
      xaxis: { ...axis, title: { ...axis.title, text: flowAxisTitle(scale, unitSystem) }, ...(xRange ? { range: xRange } : { rangemode: 'tozero' }) },
      yaxis: { ...axis, title: { ...axis.title, text: 'Pressure ratio (total to total)' }, ...(yRange ? { range: yRange } : {}) },
      // Under the plot, never over it: a study draws dozens of lines, and a key inside the frame
      // would hide the surge side of the map where the low-rpm points sit.
      legend: legendUnderMap,
      annotations: drawn.annotations,
      dragmode: 'zoom',
    },
  };
}
