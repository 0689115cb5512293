import type { Annotation, Data } from 'plotly.js-dist-min';
import type { TurbineMap } from '#shared/maps/types';
import { mapValueFromSI } from '#shared/maps/units';
import type { PlotFigure } from './compressor-map-figure';
import { builtForMap } from './map-cache';
import { legendUnderMap, lineEndLabel, mapPlotPaper, operatingLineStyle, plotAxis, plotColours, plotFont, selectedPointMarker, plotText } from './style';
import type { TurbineOperatingLineView } from './types';
import { formatNumber, formatQuantity, krpmLabel, percentLabel, unitLabel, type UnitSystem } from '#src/lib/quantities';

/** The unit the flow parameter ṁ·√T3/p3 is shown in, by unit system (mathjs names). */
export const flowParameterDisplayUnit: Record<UnitSystem, string> = {
  si: 'kg/s K^0.5 / kPa',
  us: 'lb/min degR^0.5 / psi',
};

function flowParameterTitle(map: TurbineMap, system: UnitSystem): string {
  const what = map.scrollFeed === 'per-scroll' ? 'Flow parameter per scroll' : 'Flow parameter';
  return `${what} ṁ·√T3/p3 (${unitLabel(flowParameterDisplayUnit[system])})`;
}

/** The operating lines of a study on the map: one trace per line, told apart like on the compressor map. */
function operatingTraces(lines: readonly TurbineOperatingLineView[], perSI: number, system: UnitSystem): Data[] {
  return lines.map((line) => {
    return {
      type: 'scatter',
      mode: 'lines+markers',
      name: line.label,
      legendgroup: `line:${line.key}`,
      showlegend: true,
      x: line.points.map((p) => p.expansionRatio),
      y: line.points.map((p) => p.flowParameter * perSI),
      ...operatingLineStyle(
        line.planIndex,
        line.scenarioIndex,
        line.points.map((p) => p.severity),
      ),
      customdata: line.points.map((p) => [line.key, p.rpm]),
      text: line.points.map((p) =>
        [`<b>${plotText(line.label)}</b>`, ...p.hover.map((h) => `${plotText(h.label)}: ${formatQuantity(h.value, h.kind, system)}`)].join('<br>'),
      ),
      hovertemplate: '%{text}<extra></extra>',
    } satisfies Data;
  });
}

/** The map's own speed lines and their labels, with the extent they cover (display units). */
function turbineMapTraces(map: TurbineMap, unitSystem: UnitSystem) {
  const unit = flowParameterDisplayUnit[unitSystem];
  const perSI = mapValueFromSI(1, unit, 'flowParameter');
  const data: Data[] = [];
  const annotations: Partial<Annotation>[] = [];
  let maxX = 1;
  let maxY = 0;
  let minY = Infinity;
  map.curves.forEach((curve, index) => {
    const speed = curve.points.find((p) => p.speed !== null)?.speed ?? null;
    const label = speed !== null ? krpmLabel(speed) : curve.label || `Line ${index + 1}`;
    const x = curve.points.map((p) => p.expansionRatio);
    const y = curve.points.map((p) => p.flowParameter * perSI);
    maxX = Math.max(maxX, ...x);
    maxY = Math.max(maxY, ...y);
    minY = Math.min(minY, ...y);
    data.push({
      type: 'scatter',
      mode: 'lines+markers',
      name: 'Speed lines',
      legendgroup: 'speed',
      showlegend: false,
      x,
      y,
      line: { color: plotColours.ink, width: 1.25 },
      marker: { size: 4, color: plotColours.ink },
      text: curve.points.map((p, i) =>
        [
          `<b>${plotText(speed !== null ? `Speed line ${label}` : label)}</b>`,
          `Expansion ratio ${formatNumber(p.expansionRatio)}`,
          `Flow parameter ${formatNumber(y[i])} ${unitLabel(unit)}`,
          ...(p.efficiency !== null ? [`Efficiency ${percentLabel(p.efficiency)}`] : []),
        ].join('<br>'),
      ),
      hovertemplate: '%{text}<extra></extra>',
    });
    const last = x.length - 1;
    annotations.push(lineEndLabel(x[last], y[last], plotText(label)));
  });
  return { data, annotations, maxX, maxY, minY };
}

/**
 * A turbine map: flow parameter against expansion ratio, one line per speed, in the user's units;
 * with a study's operating lines over it when given (the study page).
 */
export function turbineMapFigure({
  map,
  unitSystem,
  height,
  lines = [],
  highlight = null,
}: {
  map: TurbineMap;
  unitSystem: UnitSystem;
  height: number;
  lines?: readonly TurbineOperatingLineView[];
  highlight?: { lineKey: string; rpm: number } | null;
}): PlotFigure {
  const perSI = mapValueFromSI(1, flowParameterDisplayUnit[unitSystem], 'flowParameter');
  const drawn = builtForMap(map, unitSystem, () => turbineMapTraces(map, unitSystem));
  const data: Data[] = [...drawn.data];
  let { maxX, maxY, minY } = drawn;
  for (const trace of operatingTraces(lines, perSI, unitSystem)) {
    data.push(trace);
    const x = (trace as { x: number[] }).x.filter(Number.isFinite);
    const y = (trace as { y: number[] }).y.filter(Number.isFinite);
    if (x.length) maxX = Math.max(maxX, ...x);
    if (y.length) {
      maxY = Math.max(maxY, ...y);
      minY = Math.min(minY, ...y);
    }
  }
  const ringLine = highlight ? lines.find((l) => l.key === highlight.lineKey) : undefined;
  const ringPoint = ringLine?.points.find((p) => Math.abs(p.rpm - highlight!.rpm) <= 1e-6 * Math.max(1, Math.abs(highlight!.rpm)));
  if (ringPoint) {
    data.push({
      type: 'scatter',
      mode: 'markers',
      name: 'Selected point',
      showlegend: false,
      x: [ringPoint.expansionRatio],
      y: [ringPoint.flowParameter * perSI],
      marker: selectedPointMarker,
      hoverinfo: 'skip',
    });
  }
  const axis = plotAxis;
  const xRange: [number, number] = [1, 1 + (maxX - 1) * 1.15];
  // The lines sit high on a flow parameter axis from 0; start where the data starts instead.
  const yRange: [number, number] = minY < maxY ? [Math.max(0, minY - (maxY - minY) * 0.1), maxY + (maxY - minY) * 0.1] : [0, maxY * 1.1 || 1];
  return {
    data,
    layout: {
      height,
      ...mapPlotPaper,
      xaxis: { ...axis, range: xRange, title: { text: 'Expansion ratio p3/p4', font: { ...plotFont, size: 13 } } },
      yaxis: { ...axis, range: yRange, title: { text: flowParameterTitle(map, unitSystem), font: { ...plotFont, size: 13 } } },
      showlegend: lines.length > 0,
      legend: legendUnderMap,
      annotations: drawn.annotations,
      dragmode: 'zoom',
    },
  };
}
