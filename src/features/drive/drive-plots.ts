/** The drive view's plots: wheel force per gear beside the traction limit, boost against time, road speed against time. */
import type { Data, Layout } from 'plotly.js-dist-min';
import type { DriveFigures } from '#shared/drive/figures';
import type { PlanRun } from '#shared/drive/run';
import type { PlanSpool } from '#shared/drive/spool';
import type { PlotFigure } from '#src/components/plots/compressor-map-figure';
import { planColour, plotAxis, plotColours, plotFont, scenarioDash } from '#src/components/plots/style';
import type { UnitSystem } from '#src/lib/quantities';
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

/** One line per plan against time, in the plan's colour. */
function linesAgainstTime(plans: { planIndex: number; planName: string; points: { time: number; value: number }[] }[], unit: string): Data[] {
  return plans.map((p) => ({
    type: 'scatter',
    mode: 'lines',
    name: p.planName,
    x: p.points.map((x) => x.time),
    y: p.points.map((x) => x.value),
    line: { color: planColour(p.planIndex), width: 2 },
    hovertemplate: `${p.planName}<br>%{x:.2f} s<br>%{y:.1f} ${unit}<extra></extra>`,
  }));
}

/** Boost against time from the spool start, one line per plan with an estimate. */
export function spoolFigure(spools: PlanSpool[], system: UnitSystem, height: number): PlotFigure {
  const boost = boostUnit(system);
  const plans = spools
    .filter((s) => s.samples.length > 0)
    .map((s) => ({ ...s, points: s.samples.map((x) => ({ time: x.time, value: boost.fromSI(x.boost) })) }));
  return { data: linesAgainstTime(plans, boost.label), layout: layoutOf(height, 'Time from the start (s)', `Boost (${boost.label})`) };
}

/** Road speed against time through the gears, one line per plan that gets some way. */
export function runFigure(runs: PlanRun[], system: UnitSystem, height: number): PlotFigure {
  const speed = speedUnit(system);
  const plans = runs
    .filter((r) => r.samples.length > 1)
    .map((r) => ({ ...r, points: r.samples.map((x) => ({ time: x.time, value: speed.fromSI(x.roadSpeed) })) }));
  return { data: linesAgainstTime(plans, speed.label), layout: layoutOf(height, 'Time from rest (s)', `Road speed (${speed.label})`) };
}
