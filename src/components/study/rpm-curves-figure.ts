import type { Annotation, Data, Layout, Shape } from 'plotly.js-dist-min';
import { DRIVE_PRESSURE_RATIO_WARNING } from '#shared/matching/exhaust/findings';
import { INJECTOR_DUTY_LIMIT, INJECTOR_DUTY_WARNING } from '#shared/matching/findings';
import { REQUIREMENT_DEFAULTS } from '#shared/matching/input/requirements';
import { mapRegionText } from '#shared/matching/results-table';
import type { PointValues, SolvedPoint } from '#shared/matching/result';
import type { PlotFigure } from '../plots/compressor-map-figure';
import { planColour, planMarker, plotAxis, plotColours, plotFont, scenarioDash, plotText } from '../plots/style';
import { sameRpm, type PointRef, type StudyLine } from './lines';
import { formatNumber, formatStudyValue, quantityUnit, type StudyQuantity, type UnitSystem } from '#src/lib/quantities';

/** What one panel plots against rpm: an SI value of a point and how to show it. */
interface Series {
  title: string;
  quantity: StudyQuantity;
  value: (v: PointValues) => number | null;
  /**
   * A second value drawn thin and dotted beside each line where it has one (the boost target
   * beside the boost the turbine holds, the valve fitted beside the valve needed).
   */
  companion?: { title: string; value: (v: PointValues) => number | null };
}

export interface CurveView {
  id: string;
  /** The button's words. */
  label: string;
  /** One or two panels side by side. */
  panels: Series[];
  /** The panels share one y scale (crank and wheel of the same quantity). */
  sameScale?: boolean;
  /** Only for studies with the exhaust side computed on some plan. */
  exhaust?: boolean;
}

/** Wheel torque referred to engine speed: wheel power over crank angular speed (gearing left out). */
const wheelTorque = (v: PointValues) => (v.wheelPower === null ? null : v.wheelPower / ((2 * Math.PI * v.rpm) / 60));

export const CURVE_VIEWS: CurveView[] = [
  {
    id: 'boost',
    label: 'Boost',
    panels: [
      {
        title: 'Boost',
        quantity: 'pressureGauge',
        value: (v) => v.boost,
        // With the exhaust side on, the boost drawn is what the turbine holds; the target beside it.
        companion: { title: 'Boost target', value: (v) => (v.targetHeld === null || v.targetHeld === undefined ? null : (v.boostTarget ?? null)) },
      },
    ],
  },
  { id: 'pressure-ratio', label: 'Pressure ratio', panels: [{ title: 'Pressure ratio', quantity: 'ratio', value: (v) => v.pressureRatio }] },
  {
    id: 'mass-flow',
    label: 'Mass flow',
    panels: [
      { title: 'Engine air flow', quantity: 'massFlow', value: (v) => v.engineMassFlow },
      { title: 'Corrected flow per turbocharger', quantity: 'massFlow', value: (v) => v.correctedMassFlow },
    ],
  },
  {
    id: 'power',
    label: 'Power',
    sameScale: true,
    panels: [
      { title: 'Power at the crank', quantity: 'power', value: (v) => v.brakePower },
      { title: 'Power at the wheels', quantity: 'power', value: (v) => v.wheelPower },
    ],
  },
  {
    id: 'torque',
    label: 'Torque',
    sameScale: true,
    panels: [
      { title: 'Torque at the crank', quantity: 'torque', value: (v) => v.torque },
      { title: 'Torque at the wheels (at engine speed, before gearing)', quantity: 'torque', value: wheelTorque },
    ],
  },
  { id: 'injector-duty', label: 'Injector duty', panels: [{ title: 'Injector duty cycle', quantity: 'fraction', value: (v) => v.injectorDuty }] },
  {
    id: 'outlet-temperature',
    label: 'Outlet temperature',
    panels: [{ title: 'Compressor outlet temperature', quantity: 'temperature', value: (v) => v.compressorOutletTemperature }],
  },
  {
    id: 'exhaust-pressure',
    label: 'Exhaust pressure',
    exhaust: true,
    panels: [
      { title: 'Turbine inlet pressure (absolute)', quantity: 'pressure', value: (v) => v.turbineInletPressure ?? null },
      { title: 'Drive pressure ratio, exhaust over intake manifold', quantity: 'ratio', value: (v) => v.drivePressureRatio ?? null },
    ],
  },
  {
    id: 'turbine-power',
    label: 'Turbine power',
    exhaust: true,
    sameScale: true,
    panels: [
      { title: 'Turbine power (per turbocharger)', quantity: 'power', value: (v) => v.turbinePower ?? null },
      {
        title: 'Compressor power (per turbocharger)',
        quantity: 'power',
        value: (v) => (v.turbinePower === null || v.turbinePower === undefined ? null : v.compressorPower),
      },
    ],
  },
  {
    id: 'wastegate',
    label: 'Wastegate',
    exhaust: true,
    panels: [
      { title: 'Wastegate share of exhaust', quantity: 'fraction', value: (v) => v.wastegateFraction ?? null },
      {
        title: 'Wastegate valve needed (each gate)',
        quantity: 'diameter',
        value: (v) => v.wastegateDiameterNeeded ?? null,
        companion: { title: 'Valve fitted', value: (v) => v.wastegateDiameterFitted ?? null },
      },
    ],
  },
];

/** The views a study offers: the exhaust views only when some plan has its exhaust side computed. */
export function curveViewsFor(withExhaust: boolean): CurveView[] {
  return CURVE_VIEWS.filter((v) => withExhaust || !v.exhaust);
}

function axisTitle(series: Series, system: UnitSystem): string {
  const unit = quantityUnit(series.quantity, system).label;
  return unit ? `${series.title} (${unit})` : series.title;
}

function guide(y: number, colour: string, label: string, axis: number): { shape: Partial<Shape>; annotation: Partial<Annotation> } {
  const suffix = axis === 1 ? '' : String(axis);
  return {
    shape: {
      type: 'line',
      xref: `x${suffix} domain` as Shape['xref'],
      x0: 0,
      x1: 1,
      yref: `y${suffix}` as Shape['yref'],
      y0: y,
      y1: y,
      line: { color: colour, width: 1.25, dash: 'dot' },
    },
    annotation: {
      xref: `x${suffix} domain` as Annotation['xref'],
      x: 1,
      xanchor: 'right',
      yref: `y${suffix}` as Annotation['yref'],
      y,
      yanchor: 'bottom',
      text: plotText(label),
      showarrow: false,
      font: { ...plotFont, size: 10, color: colour },
    },
  };
}

/** Lines drawn across a panel where the engine raises a finding. */
function guides(view: CurveView, system: UnitSystem, outletTemperatureLimit: number | null, outletTemperatureAccepted: number) {
  const out: { shape: Partial<Shape>; annotation: Partial<Annotation> }[] = [];
  if (view.id === 'injector-duty') {
    out.push(guide(INJECTOR_DUTY_WARNING * 100, plotColours.copper, `${formatNumber(INJECTOR_DUTY_WARNING * 100)} % usual ceiling`, 1));
    out.push(guide(INJECTOR_DUTY_LIMIT * 100, plotColours.limit, `${formatNumber(INJECTOR_DUTY_LIMIT * 100)} % limit`, 1));
  }
  if (view.id === 'outlet-temperature') {
    const unit = quantityUnit('temperature', system);
    out.push(
      guide(unit.fromSI(outletTemperatureAccepted), plotColours.copper, `${formatStudyValue(outletTemperatureAccepted, 'temperature', system)} accepted`, 1),
    );
    if (outletTemperatureLimit !== null)
      out.push(
        guide(unit.fromSI(outletTemperatureLimit), plotColours.limit, `${formatStudyValue(outletTemperatureLimit, 'temperature', system)} stated limit`, 1),
      );
  }
  if (view.id === 'exhaust-pressure')
    out.push(guide(DRIVE_PRESSURE_RATIO_WARNING, plotColours.copper, `${formatNumber(DRIVE_PRESSURE_RATIO_WARNING)} high`, 2));
  return out;
}

/** Runs of consecutive engine speeds, in words: "2,500–2,750 and 5,000–8,000 rpm". */
function rpmRuns(rpms: readonly number[], all: readonly number[]): string {
  const runs: [number, number][] = [];
  let open: [number, number] | null = null;
  for (const rpm of all) {
    if (rpms.includes(rpm)) {
      if (open) open[1] = rpm;
      else open = [rpm, rpm];
    } else if (open) {
      runs.push(open);
      open = null;
    }
  }
  if (open) runs.push(open);
  const text = runs.map(([a, b]) => (a === b ? formatNumber(a, 21) : `${formatNumber(a, 21)}–${formatNumber(b, 21)}`));
  return `${text.length > 1 ? `${text.slice(0, -1).join(', ')} and ${text[text.length - 1]}` : text[0]} rpm`;
}

/**
 * What a line's hover says of the points the compressor cannot deliver: at such a point a value
 * it still has (boost, pressure ratio, flow: where the engine asks to be) is marked so; a result it
 * lacks leaves a gap, and every point of the line names the speeds of the gap.
 */
function unreachableWords(points: readonly SolvedPoint[], series: Series): { at: (p: SolvedPoint) => string; line: string } {
  const unreachable = points.filter((p) => p.values.reachable === false);
  const gaps = unreachable.filter((p) => series.value(p.values) === null).map((p) => p.rpm);
  return {
    at: (p) => (p.values.reachable === false ? `<br><i>Not reachable with this compressor (${plotText(mapRegionText(p.values))})</i>` : ''),
    line:
      gaps.length > 0
        ? `<br><i>Not reachable with this compressor at ${rpmRuns(
            gaps,
            points.map((p) => p.rpm),
          )}: no ${plotText(series.title.toLowerCase())} there</i>`
        : '',
  };
}

/** The plotly figure of one curve view: one trace per line and panel, in the user's units. */
export function rpmCurvesFigure({
  lines,
  view,
  unitSystem,
  highlight,
  height,
  outletTemperatureLimit = null,
}: {
  lines: readonly StudyLine[];
  view: CurveView;
  unitSystem: UnitSystem;
  highlight: PointRef | null;
  height: number;
  /** The engine's stated compressor outlet temperature limit, K. */
  outletTemperatureLimit?: number | null;
}): PlotFigure {
  const data: Data[] = [];
  view.panels.forEach((series, panel) => {
    const unit = quantityUnit(series.quantity, unitSystem);
    const axis = panel === 0 ? '' : String(panel + 1);
    for (const l of lines) {
      const points = l.line.points.filter((p): p is SolvedPoint => p.solved);
      const x: number[] = [];
      const y: (number | null)[] = [];
      const text: string[] = [];
      const customdata: [string, number][] = [];
      const unreachable = unreachableWords(points, series);
      for (const p of points) {
        const si = series.value(p.values);
        x.push(p.rpm);
        y.push(si === null || !Number.isFinite(si) ? null : unit.fromSI(si));
        text.push(
          `<b>${plotText(l.label)}</b><br>${formatNumber(p.rpm, 21)} rpm<br>${plotText(series.title)}: ${plotText(formatStudyValue(si, series.quantity, unitSystem))}${unreachable.at(p)}${unreachable.line}`,
        );
        customdata.push([l.key, p.rpm]);
      }
      const colour = planColour(l.planIndex);
      const hollow = points.some((p) => p.values.reachable === false);
      data.push({
        type: 'scatter',
        mode: 'lines+markers',
        name: l.label,
        legendgroup: l.key,
        // plotly keys a line with its first marker; a hollow one would mark the whole line as not reachable.
        showlegend: panel === 0 && !hollow,
        xaxis: `x${axis}`,
        yaxis: `y${axis}`,
        x,
        y,
        line: { color: colour, width: 2, dash: scenarioDash(l.scenarioIndex) },
        // A point the compressor cannot deliver is hollow, as on the map.
        marker: {
          symbol: points.map((p) => (p.values.reachable === false ? `${planMarker(l.planIndex)}-open` : planMarker(l.planIndex))),
          size: 6,
          color: colour,
          line: { width: points.map((p) => (p.values.reachable === false ? 1.5 : 0)) },
        },
        connectgaps: false,
        customdata,
        text,
        hovertemplate: '%{text}<extra></extra>',
      } as Data);
      if (panel === 0 && hollow) {
        // The key alone, with the plan's filled marker: no points of its own.
        data.push({
          type: 'scatter',
          mode: 'lines+markers',
          name: l.label,
          legendgroup: l.key,
          xaxis: 'x',
          yaxis: 'y',
          x: [null],
          y: [null],
          line: { color: colour, width: 2, dash: scenarioDash(l.scenarioIndex) },
          marker: { symbol: planMarker(l.planIndex), size: 6, color: colour },
          hoverinfo: 'skip',
        } as Data);
      }
      const companion = series.companion;
      if (companion) {
        const csi = points.map((p) => {
          const c = companion.value(p.values);
          return c === null || !Number.isFinite(c) ? null : c;
        });
        const cy = csi.map((c) => (c === null ? null : unit.fromSI(c)));
        if (cy.some((c) => c !== null)) {
          data.push({
            type: 'scatter',
            mode: 'lines',
            name: `${l.label} · ${companion.title.toLowerCase()}`,
            legendgroup: l.key,
            showlegend: false,
            xaxis: `x${axis}`,
            yaxis: `y${axis}`,
            x,
            y: cy,
            line: { color: colour, width: 1.25, dash: 'dot' },
            opacity: 0.8,
            connectgaps: false,
            text: points.map(
              (p, i) =>
                `<b>${plotText(l.label)}</b><br>${formatNumber(p.rpm, 21)} rpm<br>${plotText(companion.title)}: ${plotText(formatStudyValue(csi[i], series.quantity, unitSystem))}`,
            ),
            hovertemplate: '%{text}<extra></extra>',
          } as Data);
        }
      }
    }
    const target = highlight ? lines.find((l) => l.key === highlight.lineKey) : undefined;
    const point = target?.line.points.find((p): p is SolvedPoint => p.solved && sameRpm(p.rpm, highlight!.rpm));
    const si = point ? series.value(point.values) : null;
    if (point && si !== null && Number.isFinite(si)) {
      data.push({
        type: 'scatter',
        mode: 'markers',
        name: 'Selected point',
        showlegend: false,
        xaxis: `x${axis}`,
        yaxis: `y${axis}`,
        x: [point.rpm],
        y: [unit.fromSI(si)],
        marker: { symbol: 'circle-open', size: 18, color: plotColours.ink, line: { width: 2.5, color: plotColours.ink } },
        hoverinfo: 'skip',
      } as Data);
    }
  });

  const axisBase = {
    ...plotAxis,
    title: { font: { ...plotFont, size: 12 } },
  };
  const g = guides(
    view,
    unitSystem,
    outletTemperatureLimit,
    lines[0]?.line.context.requirements?.maxCompressorOutletTemperature ?? REQUIREMENT_DEFAULTS.maxCompressorOutletTemperature,
  );
  const layout: Partial<Layout> = {
    height,
    autosize: true,
    paper_bgcolor: plotColours.paper,
    plot_bgcolor: plotColours.sheet,
    font: plotFont,
    margin: { l: 64, r: 16, t: 28, b: 48 },
    hovermode: 'closest',
    hoverlabel: { bgcolor: plotColours.sheet, bordercolor: plotColours.inkSoft, font: { ...plotFont, size: 12 }, align: 'left' },
    showlegend: true,
    legend: { orientation: 'h', x: 0, y: -0.22, yanchor: 'top', font: { ...plotFont, size: 11 }, bgcolor: 'rgba(0,0,0,0)' },
    shapes: g.map((x) => x.shape),
    annotations: [
      ...g.map((x) => x.annotation),
      ...(view.panels.length > 1
        ? view.panels.map((series, i): Partial<Annotation> => ({
            xref: `x${i === 0 ? '' : i + 1} domain` as Annotation['xref'],
            yref: 'paper',
            x: 0,
            y: 1,
            xanchor: 'left',
            yanchor: 'bottom',
            yshift: 4,
            text: `<b>${plotText(series.title)}</b>`,
            showarrow: false,
            font: { ...plotFont, size: 12 },
          }))
        : []),
    ],
    dragmode: 'zoom',
  };
  if (view.panels.length > 1) layout.grid = { rows: 1, columns: view.panels.length, pattern: 'independent', xgap: 0.12 };
  view.panels.forEach((series, i) => {
    const suffix = i === 0 ? '' : String(i + 1);
    (layout as Record<string, unknown>)[`xaxis${suffix}`] = { ...axisBase, title: { ...axisBase.title, text: 'Engine speed (rpm)' } };
    (layout as Record<string, unknown>)[`yaxis${suffix}`] = {
      ...axisBase,
      title: { ...axisBase.title, text: axisTitle(series, unitSystem) },
      rangemode: series.quantity === 'ratio' || series.quantity === 'temperature' ? 'normal' : 'tozero',
      ...(i > 0 && view.sameScale ? { matches: 'y' } : {}),
    };
  });
  return { data, layout };
}
