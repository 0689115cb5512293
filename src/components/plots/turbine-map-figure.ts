import type { Annotation, Data } from 'plotly.js-dist-min';
import type { TurbineMap } from '../../../shared/maps/types';
import { mapValueFromSI } from '../../../shared/maps/units';
import type { UnitSystem } from '../../lib/units';
import type { PlotFigure } from './compressor-map-figure';
import { formatNumber, krpmLabel, percentLabel, plotText, unitLabel } from './quantities';
import { mapPlotPaper, plotAxis, plotColours, plotFont } from './style';

/** The unit the flow parameter ṁ·√T3/p3 is shown in, by unit system (mathjs names). */
export const flowParameterDisplayUnit: Record<UnitSystem, string> = {
  si: 'kg/s K^0.5 / kPa',
  us: 'lb/min degR^0.5 / psi',
};

function flowParameterTitle(map: TurbineMap, system: UnitSystem): string {
  const what = map.scrollFeed === 'per-scroll' ? 'Flow parameter per scroll' : 'Flow parameter';
  return `${what} ṁ·√T3/p3 (${unitLabel(flowParameterDisplayUnit[system])})`;
}

/** A turbine map: flow parameter against expansion ratio, one line per speed, in the user's units. */
export function turbineMapFigure({ map, unitSystem, height }: { map: TurbineMap; unitSystem: UnitSystem; height: number }): PlotFigure {
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
    annotations.push({
      x: x[last],
      y: y[last],
      text: plotText(label),
      showarrow: false,
      xanchor: 'left',
      xshift: 4,
      font: { ...plotFont, size: 10, color: plotColours.inkSoft },
    });
  });
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
      showlegend: false,
      annotations,
    },
  };
}
