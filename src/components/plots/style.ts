// The plot colours of the engineering notebook (product brief, "Design language"), the same
// values as tailwind.config.ts: plotly draws on canvas and SVG and cannot read Tailwind classes.

export const plotColours = {
  paper: '#f7f3ea',
  /** The plot area: a shade lighter than the page, so the map reads as a sheet on it. */
  sheet: '#fffdf8',
  grid: '#e8e0cf',
  paperLine: '#ddd3bf',
  ink: '#2b2b2b',
  inkSoft: '#555049',
  inkFaint: '#8a8377',
  teal: '#0f766e',
  tealDark: '#115e59',
  tealFill: 'rgba(15, 118, 110, 0.06)',
  copper: '#b4632b',
  copperInk: '#8f4a1c',
  /** Hard limits only: surge, overspeed. */
  limit: '#b91c1c',
} as const;

/**
 * Plans are told apart by colour and by marker shape. The colours are the Okabe and Ito (2008)
 * colour-blind-safe palette, reordered so the first plans get the colours that read best on
 * paper (yellow last but one) and vermillion, closest to the limit red, comes late.
 */
export const planColours = ['#0072B2', '#E69F00', '#009E73', '#CC79A7', '#56B4E9', '#D55E00', '#F0E442', '#000000'] as const;

export const planMarkers = ['circle', 'square', 'diamond', 'triangle-up', 'triangle-down', 'cross', 'x', 'star'] as const;

/** Scenarios are told apart by line dash. */
export const scenarioDashes = ['solid', 'dash', 'dot', 'dashdot', 'longdash', 'longdashdot'] as const;

export function planColour(planIndex: number): string {
  return planColours[wrap(planIndex, planColours.length)];
}

export function planMarker(planIndex: number): (typeof planMarkers)[number] {
  return planMarkers[wrap(planIndex, planMarkers.length)];
}

export function scenarioDash(scenarioIndex: number): (typeof scenarioDashes)[number] {
  return scenarioDashes[wrap(scenarioIndex, scenarioDashes.length)];
}

function wrap(index: number, length: number): number {
  const i = Number.isInteger(index) ? index : 0;
  return ((i % length) + length) % length;
}

export const plotFont = { family: '"Roboto Flex", system-ui, "Helvetica Neue", Arial, sans-serif', size: 12, color: plotColours.ink };

/** The ruled axis every Spoolbook plot uses: ink frame, outside ticks, faint grid. */
export const plotAxis = {
  showline: true,
  linecolor: plotColours.inkSoft,
  mirror: true,
  ticks: 'outside' as const,
  tickcolor: plotColours.inkSoft,
  gridcolor: plotColours.grid,
  zeroline: false,
  automargin: true,
};

/** Paper, sheet, type and hover look shared by the map plots. */
export const mapPlotPaper = {
  autosize: true,
  paper_bgcolor: plotColours.paper,
  plot_bgcolor: plotColours.sheet,
  font: plotFont,
  margin: { l: 64, r: 20, t: 16, b: 56 },
  hovermode: 'closest' as const,
  hoverlabel: { bgcolor: plotColours.sheet, bordercolor: plotColours.inkSoft, font: { ...plotFont, size: 12 }, align: 'left' as const },
};

/** The key under a map plot, never over it: a study draws dozens of lines, and a key inside the frame would hide the map. */
export const legendUnderMap = {
  orientation: 'h' as const,
  x: 0,
  y: -0.16,
  xanchor: 'left' as const,
  yanchor: 'top' as const,
  bgcolor: 'rgba(255, 253, 248, 0.92)',
  bordercolor: plotColours.paperLine,
  borderwidth: 1,
  font: { ...plotFont, size: 11 },
};

const SEVERITY_OUTLINE = { limit: plotColours.limit, warning: plotColours.copper, info: plotColours.sheet } as const;

/**
 * How an operating line is drawn on a map: its plan's colour and marker, its scenario's dash, and
 * an outline on each point by its worst finding (red at a limit, copper for a warning). A point the
 * compressor cannot deliver is drawn hollow (`reachable` false); notReachableTrace adds its cross.
 */
export function operatingLineStyle(
  planIndex: number,
  scenarioIndex: number,
  severities: readonly ('info' | 'warning' | 'limit' | null | undefined)[],
  reachable: readonly (boolean | undefined)[] = [],
) {
  const colour = planColour(planIndex);
  const symbol = planMarker(planIndex);
  const hollow = `${symbol}-open` as const;
  return {
    line: { color: colour, width: 2, dash: scenarioDash(scenarioIndex) },
    marker: {
      symbol: reachable.some((r) => r === false) ? severities.map((_s, i) => (reachable[i] === false ? hollow : symbol)) : symbol,
      size: 9,
      color: colour,
      line: {
        color: severities.map((s) => SEVERITY_OUTLINE[s ?? 'info']),
        width: severities.map((s) => (s === 'limit' || s === 'warning' ? 2.5 : 1)),
      },
    },
  };
}

/** The cross laid over each point the compressor cannot deliver, so it reads apart from the points it can. */
export const notReachableMarker = { symbol: 'x-thin-open' as const, size: 9, color: plotColours.limit, line: { width: 2, color: plotColours.limit } };

/** The ring around the selected point on a map. */
export const selectedPointMarker = { symbol: 'circle-open' as const, size: 24, color: plotColours.ink, line: { width: 2.5, color: plotColours.ink } };

/** The label at the end of a speed line (or any map curve), just right of its last point. */
export function lineEndLabel(x: number, y: number, text: string, colour: string = plotColours.inkSoft) {
  return { x, y, text, showarrow: false, xanchor: 'left' as const, xshift: 4, font: { ...plotFont, size: 10, color: colour } };
}

/** Text safe to put into plotly's hover and annotation strings, which read a little HTML. */
export function plotText(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');
}
