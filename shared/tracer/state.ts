import { z } from 'zod';
import { EFFICIENCY_SCALES, HOUSINGS, MAP_KINDS, SCROLL_FEEDS, TURBINE_EFFICIENCY_KINDS, UNIT_EXAMPLES, type MapKind } from '../maps/format';
import { AXIS_SCALES } from './axes';
import { REFERENCE_ROLES } from './calibration';

/**
 * A trace in progress, as the Tracer keeps it and the server stores it in a draft: what kind of
 * map it is, its header values, the calibration clicks and every traced line. Points are kept in
 * image pixels, so that a corrected calibration moves every traced value with it. Numbers the user
 * has not typed yet are null; the file built from the state (build.ts) says what is missing.
 */

export const TRACE_STATE_VERSION = 1;

/** Limits that keep a draft small (well under the API's 1 MB body) and the canvas quick. */
export const MAX_REFERENCE_CLICKS = 40;
export const MAX_TRACE_CURVES = 200;
export const MAX_CURVE_POINTS = 2000;
export const MAX_TRACE_POINTS = 10_000;
/** Longer than the file allows, so that the live file (not a refused autosave) says what is wrong. */
export const MAX_TRACE_NAME_LENGTH = 200;
export const MAX_TRACE_NOTES_LENGTH = 6000;

/** Lines a trace can hold: the compressor map's four and the turbine map's flow lines. */
export const TRACE_CURVE_KINDS = ['surge', 'choke', 'speed', 'island', 'flow'] as const;
export type TraceCurveKind = (typeof TRACE_CURVE_KINDS)[number];

export const COMPRESSOR_TRACE_KINDS: readonly TraceCurveKind[] = ['surge', 'choke', 'speed', 'island'];
export const TURBINE_TRACE_KINDS: readonly TraceCurveKind[] = ['flow'];

export function traceKindsOf(kind: MapKind): readonly TraceCurveKind[] {
  return kind === 'compressor' ? COMPRESSOR_TRACE_KINDS : TURBINE_TRACE_KINDS;
}

export const SPEED_UNITS = ['rpm', 'krpm'] as const;
export const COMPRESSOR_FLOW_AXES = ['corrected-mass', 'volume'] as const;

/** The unit choices the Tracer offers, from the map format's own list (shared/maps/format.ts). */
export const TRACE_UNIT_CHOICES = {
  correctedMassFlow: UNIT_EXAMPLES.correctedMassFlow,
  volumeFlow: UNIT_EXAMPLES.volumeFlow,
  temperature: UNIT_EXAMPLES.temperature,
  pressure: UNIT_EXAMPLES.pressure,
  flowParameter: UNIT_EXAMPLES.flowParameter,
  speed: SPEED_UNITS,
} as const;

const localId = z.string().regex(/^[A-Za-z0-9_-]{1,40}$/, 'must be 1 to 40 letters, digits, - or _');
/** Image pixels; generous bounds, since a point may sit just outside the picture's edge. */
const pixelCoordinate = z.number().min(-1e6).max(1e6);
const pixelSchema = z.strictObject({ x: pixelCoordinate, y: pixelCoordinate });
/** A typed number, or null while the field is empty. */
const typedNumber = z.number().min(-1e15).max(1e15).nullable();
const unitText = z.string().max(40);

export const referenceClickSchema = z.strictObject({
  id: localId,
  role: z.enum(REFERENCE_ROLES),
  pixel: pixelSchema.nullable(),
  x: typedNumber,
  y: typedNumber,
});

export const typedQuantitySchema = z.strictObject({ value: typedNumber, unit: unitText });

export const compressorTraceSettingsSchema = z.strictObject({
  flowAxis: z.enum(COMPRESSOR_FLOW_AXES),
  /** Unit of the horizontal axis: a mass flow unit (corrected mass) or a volume flow unit. */
  flowUnit: unitText,
  referenceTemperature: typedQuantitySchema,
  referencePressure: typedQuantitySchema,
  /** The wheel's rated speed limit in the trace's speed unit; null when not given. */
  maxSpeed: typedNumber,
});

export const turbineTraceSettingsSchema = z.strictObject({
  flowParameterUnit: unitText,
  /** Which axis of the picture carries the flow parameter (the other carries expansion ratio). */
  flowParameterAxis: z.enum(['x', 'y']),
  housing: z.enum(HOUSINGS),
  scrollFeed: z.enum(SCROLL_FEEDS),
  areaRatio: typedNumber,
  /** What the map's efficiency counts (the `efficiency kind` header); absent or null: the map does not say. */
  efficiencyKind: z.enum(TURBINE_EFFICIENCY_KINDS).nullable().optional(),
});

export const traceCurveSchema = z.strictObject({
  id: localId,
  kind: z.enum(TRACE_CURVE_KINDS),
  /** Speed of a speed line or turbine flow line, in the trace's speed unit. */
  speed: typedNumber,
  /** Efficiency of an island, in the trace's efficiency scale (percent or fraction). */
  efficiency: typedNumber,
  /** Clicked points, image pixels, in the order clicked. */
  points: z.array(pixelSchema).max(MAX_CURVE_POINTS, `must have at most ${MAX_CURVE_POINTS} points`),
});

export const traceStateSchema = z
  .strictObject({
    version: z.literal(TRACE_STATE_VERSION),
    kind: z.enum(MAP_KINDS),
    name: z.string().max(MAX_TRACE_NAME_LENGTH),
    notes: z.string().max(MAX_TRACE_NOTES_LENGTH),
    scales: z.strictObject({ x: z.enum(AXIS_SCALES), y: z.enum(AXIS_SCALES) }),
    efficiency: z.enum(EFFICIENCY_SCALES),
    speedUnit: z.enum(SPEED_UNITS),
    compressor: compressorTraceSettingsSchema,
    turbine: turbineTraceSettingsSchema,
    calibration: z.strictObject({
      clicks: z.array(referenceClickSchema).max(MAX_REFERENCE_CLICKS),
      /** Where the axes cross: the horizontal axis line's vertical value (y) and the vertical axis line's horizontal value (x). */
      crossing: z.strictObject({ x: typedNumber, y: typedNumber }),
    }),
    curves: z.array(traceCurveSchema).max(MAX_TRACE_CURVES),
  })
  .superRefine((state, ctx) => {
    const total = state.curves.reduce((n, c) => n + c.points.length, 0);
    if (total > MAX_TRACE_POINTS) ctx.addIssue({ code: 'custom', path: ['curves'], message: `must hold at most ${MAX_TRACE_POINTS} points in all (${total})` });
    const seen = new Set<string>();
    state.curves.forEach((curve, i) => {
      if (seen.has(curve.id)) ctx.addIssue({ code: 'custom', path: ['curves', i, 'id'], message: 'is used by another line' });
      seen.add(curve.id);
    });
    const clickIds = new Set<string>();
    state.calibration.clicks.forEach((click, i) => {
      if (clickIds.has(click.id)) ctx.addIssue({ code: 'custom', path: ['calibration', 'clicks', i, 'id'], message: 'is used by another reference point' });
      clickIds.add(click.id);
    });
  });

export type TraceState = z.infer<typeof traceStateSchema>;
export type TraceCurve = z.infer<typeof traceCurveSchema>;
export type TraceReferenceClick = z.infer<typeof referenceClickSchema>;

/** Where the axes usually cross on a map of this kind: zero flow and pressure ratio 1; expansion ratio 1 and zero flow parameter. */
export function usualCrossing(kind: MapKind, flowParameterAxis: 'x' | 'y' = 'y'): { x: number; y: number } {
  if (kind === 'compressor') return { x: 0, y: 1 };
  return flowParameterAxis === 'y' ? { x: 1, y: 0 } : { x: 0, y: 1 };
}

/**
 * A new trace: a compressor map in SI units, linear axes, two reference clicks waiting on each
 * axis and one at the corner where they cross, no lines yet. Reference conditions are left empty
 * on purpose: they are the map's own and must be read off the picture.
 */
export function newTraceState(name = ''): TraceState {
  return {
    version: TRACE_STATE_VERSION,
    kind: 'compressor',
    name,
    notes: '',
    scales: { x: 'linear', y: 'linear' },
    efficiency: 'percent',
    speedUnit: 'rpm',
    compressor: {
      flowAxis: 'corrected-mass',
      flowUnit: 'kg/s',
      referenceTemperature: { value: null, unit: 'K' },
      referencePressure: { value: null, unit: 'kPa' },
      maxSpeed: null,
    },
    turbine: { flowParameterUnit: 'kg/s K^0.5 / kPa', flowParameterAxis: 'y', housing: 'single', scrollFeed: 'both', areaRatio: null },
    calibration: {
      clicks: [
        { id: 'x1', role: 'x-axis', pixel: null, x: null, y: null },
        { id: 'x2', role: 'x-axis', pixel: null, x: null, y: null },
        { id: 'y1', role: 'y-axis', pixel: null, x: null, y: null },
        { id: 'y2', role: 'y-axis', pixel: null, x: null, y: null },
        // Optional: the corner adds a check, so that a bad click shows in the residual.
        { id: 'corner', role: 'crossing', pixel: null, x: null, y: null },
      ],
      crossing: usualCrossing('compressor'),
    },
    curves: [],
  };
}

/** What each axis of the picture shows, in words, with the unit (null for ratios). */
export interface AxisQuantity {
  name: string;
  /** Short name for tight labels. */
  short: string;
  unit: string | null;
}

export function axisQuantities(state: TraceState): { x: AxisQuantity; y: AxisQuantity } {
  if (state.kind === 'compressor') {
    const volume = state.compressor.flowAxis === 'volume';
    return {
      x: { name: volume ? 'Inlet volume flow' : 'Corrected mass flow', short: 'flow', unit: state.compressor.flowUnit },
      y: { name: 'Pressure ratio', short: 'pressure ratio', unit: null },
    };
  }
  const flowParameter: AxisQuantity = { name: 'Flow parameter', short: 'flow parameter', unit: state.turbine.flowParameterUnit };
  const expansionRatio: AxisQuantity = { name: 'Expansion ratio', short: 'expansion ratio', unit: null };
  return state.turbine.flowParameterAxis === 'y' ? { x: expansionRatio, y: flowParameter } : { x: flowParameter, y: expansionRatio };
}
