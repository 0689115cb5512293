import type { CompressorMap } from '#shared/maps/types';

/**
 * The contract between the compressor-map plot and the screens that use it (map library preview,
 * study page, Side by side, report). SI in; the plot converts to the user's units for axes and hover.
 */
export interface OperatingPointView {
  /** Engine speed, rpm. */
  rpm: number;
  /** Corrected mass flow of one turbocharger at the map's reference, kg/s. */
  correctedMassFlow: number;
  /** Volume flow at the compressor inlet, m³/s (for the volume-flow axis). */
  volumeFlow: number;
  pressureRatio: number;
  /** Every value of the point to show on hover: label → SI value and its quantity kind. */
  hover: HoverItem[];
  /** The point raised a finding of this severity, if any. */
  severity?: 'info' | 'warning' | 'limit' | null;
  /** False where the compressor cannot deliver the point: drawn hollow with a cross (absent: reachable). */
  reachable?: boolean;
}

/** One row of a point's hover box: an SI value and its quantity kind, or words in its place. */
export interface HoverItem {
  label: string;
  value: number | null;
  kind: string;
  /** Shown instead of the value (a region, "yes"/"no"). */
  text?: string;
  /** Shown when the value is null: "not reachable", or why the map gives no value. */
  missing?: string;
}

export interface OperatingLineView {
  /** Stable key, e.g. `${planId}|${scenarioIndex}|${rowIndex}`. */
  key: string;
  /** Legend text, e.g. "M58 mid wheel · Sea level · Full load". */
  label: string;
  /** Index of the plan: chooses colour (Okabe–Ito palette) and marker shape. */
  planIndex: number;
  /** Index of the scenario: chooses line dash. */
  scenarioIndex: number;
  points: OperatingPointView[];
}

export interface CompressorMapPlotProps {
  /** The map to draw; null draws the operating lines alone on plain axes. */
  map: CompressorMap | null;
  lines?: OperatingLineView[];
  /** 'corrected' (corrected mass flow) or 'volume' (inlet volume flow). */
  flowAxis?: 'corrected' | 'volume';
  /** When given, the plot shows a switch between the two flow axes and reports the choice here. */
  onFlowAxisChange?: (flowAxis: 'corrected' | 'volume') => void;
  /** A point to ring, e.g. the one a clicked finding refers to. */
  highlight?: { lineKey: string; rpm: number } | null;
  /** Called when the user clicks an operating point. */
  onPointClick?: (lineKey: string, rpm: number) => void;
  height?: number;
  /** Title used for exported PNG/SVG file names. */
  exportName?: string;
}

/** An operating point on a turbine map: where the turbine runs, SI in. */
export interface TurbineOperatingPointView {
  /** Engine speed, rpm. */
  rpm: number;
  /** Expansion ratio p3/p4. */
  expansionRatio: number;
  /** Flow parameter as the map draws it (per scroll on a per-scroll map), kg·K^0.5/(s·Pa). */
  flowParameter: number;
  hover: HoverItem[];
  severity?: 'info' | 'warning' | 'limit' | null;
}

export interface TurbineOperatingLineView {
  key: string;
  label: string;
  planIndex: number;
  scenarioIndex: number;
  points: TurbineOperatingPointView[];
}
