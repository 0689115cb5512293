import type { CompressorCurveKind, EfficiencyScale, Housing, ScrollFeed, TurbineCurveKind, TurbineEfficiencyKind } from './format';

/**
 * The parsed map model. SI inside: corrected mass flow in kg/s at the map's own reference
 * conditions, temperatures in K, pressures in Pa (absolute), efficiency as a fraction, speeds in
 * rpm (the trade's unit, kept inside shared/). The units the file was written in are remembered
 * in `fileUnits` so that the map can be written back exactly as it came.
 */

/** The conditions a map's corrected flow refers to. */
export interface MapReferenceConditions {
  /** Reference inlet temperature, K. */
  temperature: number;
  /** Reference inlet pressure, Pa absolute. */
  pressure: number;
}

/** One row of a compressor file. */
export interface CompressorMapPoint {
  /** Corrected mass flow at the map's reference conditions, kg/s (volume maps are converted with ρ_ref). */
  correctedMassFlow: number;
  /** Total-to-total pressure ratio, ≥ 1. */
  pressureRatio: number;
  /** Isentropic efficiency, fraction in (0, 1]; null when the row gives none. */
  efficiency: number | null;
  /** Shaft speed of the line as the map labels it, rpm; null when the row gives none. */
  speed: number | null;
}

/** One polyline of a compressor map: the rows sharing a curve kind and label, in file order. */
export interface CompressorCurve {
  kind: CompressorCurveKind;
  /** The label cell as written (a speed line's speed, an island's efficiency or a name); may be empty. */
  label: string;
  points: CompressorMapPoint[];
}

/** How the flow axis of a compressor file is given. */
export type CompressorFlowAxis = 'corrected-mass' | 'volume';

/** The units a compressor file was written in, as written (unit texts are the file's own words). */
export interface CompressorFileUnits {
  flowAxis: CompressorFlowAxis;
  /** Unit text of the flow column, e.g. `lb/min` or `cfm`. */
  flowUnit: string;
  /** Unit text of the reference temperature, e.g. `degR`. */
  referenceTemperatureUnit: string;
  /** Unit text of the reference pressure, e.g. `psi`. */
  referencePressureUnit: string;
  efficiency: EfficiencyScale;
  /** Unit text of the speed column (rpm unless the file says otherwise). */
  speedUnit: string;
  /** Unit text of the `max speed` header value (rpm when the file gives none). */
  maxSpeedUnit: string;
}

export interface CompressorMap {
  kind: 'compressor';
  formatVersion: 1;
  name: string;
  /** The `# note:` lines, in file order. */
  notes: string[];
  reference: MapReferenceConditions;
  /** The wheel's rated speed limit, rpm; null when the file gives none. */
  maxSpeed: number | null;
  /** Polar moment of inertia of the whole rotor, kg·m², when the file gives it (time to boost reads it). */
  rotorInertia?: number;
  curves: CompressorCurve[];
  fileUnits: CompressorFileUnits;
  /** Set on a map made from another by a family rule (shared/maps/family): an estimate, not a measurement. Not part of the file. */
  estimate?: MapEstimate;
}

/** Where an estimated map comes from: its parent and the rule, in words too. */
interface MapEstimate {
  /** The parent's library id (a team map or a built-in one). */
  parentId: string;
  parentName: string;
  /** The rule in one line, as the map's first note says it. */
  rule: string;
}

/** One row of a turbine file. */
export interface TurbineMapPoint {
  /** Expansion ratio p3/p4, ≥ 1. */
  expansionRatio: number;
  /** Flow parameter ṁ·√T3/p3, kg·K^0.5/(s·Pa). */
  flowParameter: number;
  /** Turbine efficiency, fraction in (0, 1]; null when the row gives none. */
  efficiency: number | null;
  /** Shaft speed of the line, rpm; null when the row gives none. */
  speed: number | null;
}

export interface TurbineCurve {
  kind: TurbineCurveKind;
  label: string;
  points: TurbineMapPoint[];
}

export interface TurbineFileUnits {
  /** Unit text of the flow parameter column, e.g. `kg/s K^0.5 / kPa`. */
  flowParameterUnit: string;
  efficiency: EfficiencyScale;
  speedUnit: string;
}

export interface TurbineMap {
  kind: 'turbine';
  formatVersion: 1;
  name: string;
  notes: string[];
  housing: Housing;
  /** Divided housings only: whether the flow is for both scrolls fed together or for one scroll. */
  scrollFeed: ScrollFeed | null;
  /** Housing A/R as printed on the map; null when not given. */
  areaRatio: number | null;
  /**
   * What the efficiency counts: with the bearings' losses, or the wheel's aerodynamic efficiency
   * alone. Absent when the file does not say (then read as aerodynamic only).
   */
  efficiencyKind?: TurbineEfficiencyKind;
  curves: TurbineCurve[];
  fileUnits: TurbineFileUnits;
}

export type SpoolbookMap = CompressorMap | TurbineMap;

/** Machine-readable kind of a file problem; the message says it in words. */
export type MapProblemCode =
  | 'empty-file'
  | 'too-large'
  | 'too-many-rows'
  | 'not-text'
  | 'not-a-map-file'
  | 'header-syntax'
  | 'header-after-data'
  | 'unknown-key'
  | 'duplicate-key'
  | 'missing-key'
  | 'misplaced-key'
  | 'wrong-version'
  | 'unknown-kind'
  | 'bad-value'
  | 'missing-unit'
  | 'unknown-unit'
  | 'wrong-unit-kind'
  | 'formula-cell'
  | 'wrong-delimiter'
  | 'bad-columns'
  | 'column-count'
  | 'unclosed-quote'
  | 'decimal-comma'
  | 'unknown-curve'
  | 'not-a-number'
  | 'missing-value'
  | 'out-of-range'
  | 'pressure-ratio-below-one'
  | 'efficiency-out-of-range'
  | 'efficiency-scale'
  | 'too-few-points'
  | 'island-not-closed'
  | 'coincident-points-merged'
  | 'not-increasing'
  | 'duplicate-label'
  | 'inconsistent-line'
  | 'no-data-rows'
  | 'missing-curve'
  | 'too-many-problems';

/** A problem in a map file, placed by line (1-based, as a text editor counts) and column (1-based CSV column). */
export interface MapProblem {
  code: MapProblemCode;
  /** File line, 1-based; null for a problem of the whole file. */
  line: number | null;
  /** CSV column, 1-based; null for header lines and whole-line or whole-file problems. */
  column: number | null;
  /** Plain words for the user, naming the field and what to do. */
  message: string;
}

/** What reading a file gives: a map (with notes about what was adjusted) or every problem found. */
export type MapParseResult = { ok: true; map: SpoolbookMap; notes: MapProblem[] } | { ok: false; problems: MapProblem[] };
