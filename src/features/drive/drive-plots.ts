/** The drive view's plots: wheel force per gear beside the traction limit, boost against time, road speed against time. */
import type { Data, Layout } from 'plotly.js-dist-min';
import type { DriveFigures } from '#shared/drive/figures';
import type { PlanRun } from '#shared/drive/run';
import type { PlanSpool } from '#shared/drive/spool';
import type { PlotFigure } from '#src/components/plots/compressor-map-figure';
import { planColour, plotAxis, plotColours, plotFont, scenarioDash } from '#src/components/plots/style';
import type { UnitSystem } from '#src/lib/units';
import { boostUnit, forceUnit, speedUnit } from './drive-units';

function layoutOf(height: number, x: string, y: string): Partial<Layout> {
  const axis = { ...plotAxis, title: { font: { ...plotFont, size: 12 } } };
  return {
    height,
    autosize: true,
    paper_bgcolor: plotColours.paper,
    plot_bgcolor: plotColours.sheet,
    font: plotFont,
    margin: { l: 64, r: 16, t: 16, b: 48 },
    hovermode: 'closest',
    showlegend: true,
    legend: { orientation: 'h', x: 0, y: -0.2, yanchor: 'top', font: { ...plotFont, size: 11 }, bgcolor: 'rgba(0,0,0,0)' },
    xaxis: { ...axis, title: { ...axis.title, text: x }, rangemode: 'tozero' },
    yaxis: { ...axis, title: { ...axis.title, text: y }, rangemode: 'tozero' },
  };
}

/**
 * One plan's force at the wheels in every gear against road speed (its colour, one dash per gear;
 * points the compressor cannot give leave a gap), and the traction limit of each gear's speeds as
 * one ink line over all of them.
 */
export function wheelForceFigure(figures: DriveFigures, planIndex: number, system: UnitSystem, height: number): PlotFigure {
  const speed = speedUnit(system);
  const force = forceUnit(system);
  const gears = figures.gears.filter((g) => g.planIndex === planIndex);
  const data: Data[] = gears.map((g) => ({
    type: 'scatter',
    mode: 'lines+markers',
    name: `Gear ${g.gear}`,
    x: g.points.map((p) => speed.fromSI(p.roadSpeed)),
    y: g.points.map((p) => (p.wheelForce === null ? null : force.fromSI(p.wheelForce))),
    line: { color: planColour(planIndex), dash: scenarioDash(g.gear - 1), width: 2 },
    marker: { size: 4, color: planColour(planIndex) },
    connectgaps: false,
    hovertemplate: `Gear ${g.gear}<br>%{x:.1f} ${speed.label}<br>%{y:.0f} ${force.label}<extra></extra>`,
  }));
  const limit = gears.flatMap((g) => g.points.map((p) => ({ v: p.roadSpeed, f: p.tractionLimit }))).sort((a, b) => a.v - b.v);
  data.push({
    type: 'scatter',
    mode: 'lines',
    name: 'Traction limit',
    x: limit.map((p) => speed.fromSI(p.v)),
    y: limit.map((p) => force.fromSI(p.f)),
    line: { color: plotColours.ink, width: 3 },
    hovertemplate: `Traction limit<br>%{x:.1f} ${speed.label}<br>%{y:.0f} ${force.label}<extra></extra>`,
  });
  return { data, layout: layoutOf(height, `Road speed (${speed.label})`, `Force at the wheels (${force.label})`) };
}

/** Boost against time from the spool start, one line per plan with an estimate. */
export function spoolFigure(spools: PlanSpool[], system: UnitSystem, height: number): PlotFigure {
  const boost = boostUnit(system);
  const data: Data[] = spools
    .filter((s) => s.samples.length > 0)
    .map((s) => ({
      type: 'scatter',
      mode: 'lines',
      name: s.planName,
      x: s.samples.map((x) => x.time),
      y: s.samples.map((x) => boost.fromSI(x.boost)),
      line: { color: planColour(s.planIndex), width: 2 },
      hovertemplate: `${s.planName}<br>%{x:.2f} s<br>%{y:.1f} ${boost.label}<extra></extra>`,
    }));
  return { data, layout: layoutOf(height, 'Time from the start (s)', `Boost (${boost.label})`) };
}

/** Road speed against time through the gears, one line per plan that finishes or gets some way. */
export function runFigure(runs: PlanRun[], system: UnitSystem, height: number): PlotFigure {
  const speed = speedUnit(system);
  const data: Data[] = runs
    .filter((r) => r.samples.length > 1)
    .map((r) => ({
      type: 'scatter',
      mode: 'lines',
      name: r.planName,
      x: r.samples.map((x) => x.time),
      y: r.samples.map((x) => speed.fromSI(x.roadSpeed)),
      line: { color: planColour(r.planIndex), width: 2 },
      hovertemplate: `${r.planName}<br>%{x:.2f} s<br>%{y:.1f} ${speed.label}<extra></extra>`,
    }));
  return { data, layout: layoutOf(height, 'Time from rest (s)', `Road speed (${speed.label})`) };
}
