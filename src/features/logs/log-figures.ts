import type { Data } from 'plotly.js-dist-min';
import { finiteIndices, largestTriangleThreeBuckets } from '#shared/logs/downsample';
import type { SolvedPoint } from '#shared/matching/result';
import { compressorMapFigure, flowScale, type PlotFigure } from '#src/components/plots/compressor-map-figure';
import { legendUnderMap, mapPlotPaper, plotAxis, plotColours, plotFont } from '#src/components/plots/style';
import { mapLineViews } from '#src/components/study/lines';
import { displayUnitLabel, toDisplay, type UnitSystem } from '#src/lib/quantities';
import type { LogComparisonResult } from './comparison';

/**
 * Logged samples are drawn as plotly's SVG scatter, thinned to MAX_DRAWN_POINTS. Its WebGL scatter
 * (scattergl) compiles its drawing code at run time with \`new Function\` (regl), which the app's
 * Content-Security-Policy forbids (script-src 'self', no 'unsafe-eval'): under our headers it only
 * shows "WebGL is not supported". The thinning keeps the SVG scatter light instead.
 */
const LOGGED_TRACE = 'scatter' as const;

/** Most logged points drawn per trace: beyond this the picture does not change, only the frame rate drops. */
const MAX_DRAWN_POINTS = 4000;
const LOGGED = { color: 'rgba(213, 94, 0, 0.45)', size: 5 };

/** Indices of the used, finite samples to draw, thinned by largest-triangle-three-buckets over time. */
function drawnIndices(time: Float64Array, x: Float64Array, y: Float64Array, used: Uint8Array): number[] {
  const all = finiteIndices(x, y, used);
  if (all.length <= MAX_DRAWN_POINTS) return all;
  const t = all.map((i) => time[i]);
  const v = all.map((i) => y[i]);
  return largestTriangleThreeBuckets(t, v, MAX_DRAWN_POINTS).map((k) => all[k]);
}

function widen(base: PlotFigure, xs: number[], ys: number[]): PlotFigure {
  const layout = { ...base.layout };
  const xr = (layout.xaxis?.range as number[] | undefined) ?? [0, 0];
  const yr = (layout.yaxis?.range as number[] | undefined) ?? [1, 1];
  const maxX = Math.max(xr[1], ...xs.map((x) => x * 1.08));
  const maxY = Math.max(yr[1], ...ys.map((y) => 1 + (y - 1) * 1.06));
  layout.xaxis = { ...layout.xaxis, range: [0, maxX] };
  layout.yaxis = { ...layout.yaxis, range: [1, maxY] };
  return { data: base.data, layout };
}

/** The compressor map with the predicted operating line and the logged points (thinned, see LOGGED_TRACE). */
export function loggedMapFigure(c: LogComparisonResult, time: Float64Array, system: UnitSystem, height: number): PlotFigure {
  const base = compressorMapFigure({ map: c.map, lines: c.line ? mapLineViews([c.line]) : [], flowAxis: 'corrected', unitSystem: system, height });
  const scale = flowScale(c.map, 'corrected', system);
  const idx = drawnIndices(time, c.placed.correctedMassFlow, c.placed.pressureRatio, c.used);
  const xs = idx.map((i) => c.placed.correctedMassFlow[i] * scale.perCorrectedMassFlow);
  const ys = idx.map((i) => c.placed.pressureRatio[i]);
  const logged: Data = {
    type: LOGGED_TRACE,
    mode: 'markers',
    name: `Logged samples (${idx.length.toLocaleString('en')} drawn)`,
    x: xs,
    y: ys,
    marker: LOGGED,
    hovertemplate: 'Logged: %{x:.3f}, PR %{y:.3f}<extra></extra>',
  };
  const figure = widen(base, xs, ys);
  figure.data = [...figure.data, logged];
  figure.layout = { ...figure.layout, legend: { ...legendUnderMap } };
  return figure;
}

function rpmFigure(args: {
  c: LogComparisonResult;
  rpm: Float64Array;
  time: Float64Array;
  measured: Float64Array;
  predicted: (p: SolvedPoint) => number | null | undefined;
  target?: (p: SolvedPoint) => number | null | undefined;
  toShown: (v: number) => number;
  yTitle: string;
  what: string;
  height: number;
}): PlotFigure {
  const { c, rpm, time, measured, toShown, height } = args;
  const idx = drawnIndices(time, rpm, measured, c.used);
  const points = c.line ? c.line.line.points.filter((p): p is SolvedPoint => p.solved) : [];
  const series = (pick: (p: SolvedPoint) => number | null | undefined) =>
    points.map((p) => {
      const v = pick(p);
      return typeof v === 'number' && Number.isFinite(v) ? toShown(v) : null;
    });
  const data: Data[] = [
    {
      type: LOGGED_TRACE,
      mode: 'markers',
      name: `Measured ${args.what}`,
      x: idx.map((i) => rpm[i]),
      y: idx.map((i) => toShown(measured[i])),
      marker: LOGGED,
      hovertemplate: `Measured: %{y:.4g} at %{x:.0f} rpm<extra></extra>`,
    },
    {
      type: 'scatter',
      mode: 'lines+markers',
      name: `Predicted ${args.what}`,
      x: points.map((p) => p.rpm),
      y: series(args.predicted),
      line: { color: plotColours.teal, width: 2.5 },
      marker: { size: 6, color: plotColours.teal },
      connectgaps: false,
    },
  ];
  if (args.target)
    data.push({
      type: 'scatter',
      mode: 'lines',
      name: 'Boost target',
      x: points.map((p) => p.rpm),
      y: series(args.target),
      line: { color: plotColours.inkSoft, width: 1.5, dash: 'dash' },
    });
  return {
    data,
    layout: {
      ...mapPlotPaper,
      height,
      xaxis: { ...plotAxis, title: { text: 'Engine speed (rpm)', font: { ...plotFont, size: 13 } } },
      yaxis: { ...plotAxis, title: { text: args.yTitle, font: { ...plotFont, size: 13 } } },
      legend: { ...legendUnderMap, y: -0.22 },
    },
  };
}

/** Measured against predicted boost (and the target) by engine speed. */
export function boostFigure(c: LogComparisonResult, rpm: Float64Array, time: Float64Array, system: UnitSystem, height: number): PlotFigure {
  return rpmFigure({
    c,
    rpm,
    time,
    measured: c.boost,
    predicted: (p) => p.values.boost,
    target: (p) => p.values.boostTarget,
    toShown: (v) => toDisplay(v, 'pressure', system),
    yTitle: `Boost, gauge (${displayUnitLabel('pressure', system)})`,
    what: 'boost',
    height,
  });
}

export function shaftSpeedFigure(c: LogComparisonResult, rpm: Float64Array, time: Float64Array, shaft: Float64Array, height: number): PlotFigure {
  return rpmFigure({
    c,
    rpm,
    time,
    measured: shaft,
    predicted: (p) => p.values.shaftSpeed,
    toShown: (v) => v / 1000,
    yTitle: 'Turbo shaft speed (krpm)',
    what: 'shaft speed',
    height,
  });
}

export function drivePressureFigure(
  c: LogComparisonResult,
  rpm: Float64Array,
  time: Float64Array,
  exhaust: Float64Array,
  system: UnitSystem,
  height: number,
): PlotFigure {
  return rpmFigure({
    c,
    rpm,
    time,
    measured: exhaust,
    predicted: (p) => p.values.turbineInletPressure,
    toShown: (v) => toDisplay(v, 'pressure', system),
    yTitle: `Turbine inlet (drive) pressure, absolute (${displayUnitLabel('pressure', system)})`,
    what: 'drive pressure',
    height,
  });
}
