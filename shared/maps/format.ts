/**
 * The Spoolbook map file format, version 1: header keys, column names, curve kinds and limits.
 * The format is documented for users in docs/map-format.md; keep the two in step.
 */

/** The only format version this code reads and writes (`# spoolbook-map: 1`). */
export const MAP_FORMAT_VERSION = 1;

/** Largest file accepted, in bytes (2 MiB). Also the upload limit the server should set. */
export const MAX_MAP_FILE_BYTES = 2 * 1024 * 1024;

/** Largest number of data rows accepted (rows after the column names). */
export const MAX_MAP_DATA_ROWS = 50_000;

/** A refused file lists at most this many problems, then says how many more there were. */
export const MAX_REPORTED_PROBLEMS = 100;

/** Longest map name, in characters. */
export const MAX_MAP_NAME_LENGTH = 120;

/** Longest notes, in characters, counting the line breaks between `# note:` lines. */
export const MAX_NOTES_LENGTH = 5000;

/** Longest curve label, in characters. */
export const MAX_LABEL_LENGTH = 40;

/**
 * A text cell that a spreadsheet would run as a formula: `=`, `+`, `-`, `@`, tab, carriage return
 * or NUL first. Refused on read in text fields (name, labels) and escaped on write (shared/csv).
 */
export { FORMULA_START } from '../csv';

/** Specific gas constant of dry air, J/(kg·K) (ISO 2533 / ICAO Doc 7488 standard atmosphere). */
export const AIR_GAS_CONSTANT = 287.05287;

export const MAP_KINDS = ['compressor', 'turbine'] as const;
export type MapKind = (typeof MAP_KINDS)[number];

/** Curve kinds of a compressor map, in the order a file written by Spoolbook lists them. */
export const COMPRESSOR_CURVE_KINDS = ['surge', 'choke', 'speed', 'island'] as const;
export type CompressorCurveKind = (typeof COMPRESSOR_CURVE_KINDS)[number];

/** Curve kinds of a turbine map: one `flow` line per speed (or a single line). */
export const TURBINE_CURVE_KINDS = ['flow'] as const;
export type TurbineCurveKind = (typeof TURBINE_CURVE_KINDS)[number];

/** Column names of a compressor file, in their fixed order. */
export const COMPRESSOR_COLUMNS = ['curve', 'label', 'flow', 'pressure_ratio', 'efficiency', 'speed'] as const;

/** Column names of a turbine file, in their fixed order. */
export const TURBINE_COLUMNS = ['curve', 'label', 'expansion_ratio', 'flow_parameter', 'efficiency', 'speed'] as const;

/** Header keys, lower case with single spaces (keys are read case-insensitively). */
export const HEADER_KEYS = {
  version: 'spoolbook-map',
  kind: 'kind',
  name: 'name',
  note: 'note',
  efficiency: 'efficiency',
  speed: 'speed',
  flow: 'flow',
  referenceTemperature: 'reference temperature',
  referencePressure: 'reference pressure',
  maxSpeed: 'max speed',
  rotorInertia: 'rotor inertia',
  flowParameter: 'flow parameter',
  housing: 'housing',
  scrollFeed: 'scroll feed',
  areaRatio: 'a/r',
  efficiencyKind: 'efficiency kind',
} as const;

/** Keys a compressor file must carry. */
export const COMPRESSOR_REQUIRED_KEYS = [
  HEADER_KEYS.version,
  HEADER_KEYS.kind,
  HEADER_KEYS.name,
  HEADER_KEYS.flow,
  HEADER_KEYS.referenceTemperature,
  HEADER_KEYS.referencePressure,
  HEADER_KEYS.efficiency,
] as const;

/** Keys a compressor file may carry besides the required ones (`note` may repeat). */
export const COMPRESSOR_OPTIONAL_KEYS = [HEADER_KEYS.maxSpeed, HEADER_KEYS.rotorInertia, HEADER_KEYS.speed, HEADER_KEYS.note] as const;

/** Keys a turbine file must carry (`scroll feed` too when the housing is divided). */
export const TURBINE_REQUIRED_KEYS = [
  HEADER_KEYS.version,
  HEADER_KEYS.kind,
  HEADER_KEYS.name,
  HEADER_KEYS.flowParameter,
  HEADER_KEYS.housing,
  HEADER_KEYS.efficiency,
] as const;

/** Keys a turbine file may carry besides the required ones. */
export const TURBINE_OPTIONAL_KEYS = [HEADER_KEYS.scrollFeed, HEADER_KEYS.areaRatio, HEADER_KEYS.efficiencyKind, HEADER_KEYS.speed, HEADER_KEYS.note] as const;

/** Every key the format knows, for "did you mean" hints on unknown keys. */
export const ALL_HEADER_KEYS: readonly string[] = Object.values(HEADER_KEYS);

export const EFFICIENCY_SCALES = ['percent', 'fraction'] as const;
export type EfficiencyScale = (typeof EFFICIENCY_SCALES)[number];

export const HOUSINGS = ['single', 'divided'] as const;
export type Housing = (typeof HOUSINGS)[number];

/** How a divided housing's flow was measured: both scrolls fed together, or the flow of one scroll. */
export const SCROLL_FEEDS = ['both', 'per-scroll'] as const;
export type ScrollFeed = (typeof SCROLL_FEEDS)[number];

/**
 * What a turbine map's efficiency counts (the `efficiency kind` header): with the bearings'
 * losses (a gas-stand efficiency worked out from the compressor's power, total-to-static), or the
 * turbine wheel's aerodynamic efficiency alone. A file without the key is read as aerodynamic only.
 */
export const TURBINE_EFFICIENCY_KINDS = ['with-bearing-losses', 'aerodynamic'] as const;
export type TurbineEfficiencyKind = (typeof TURBINE_EFFICIENCY_KINDS)[number];
/** The words a file writes for each kind, exactly (read case-insensitively, spaces and hyphens loosely). */
export const TURBINE_EFFICIENCY_KIND_WORDS: Record<TurbineEfficiencyKind, string> = {
  'with-bearing-losses': 'total-to-static, with bearing losses',
  aerodynamic: 'aerodynamic only',
};

/** What a turbine map's efficiency kind means for a study, in words (absent: the file does not say). */
export function turbineEfficiencyKindMeaning(kind: TurbineEfficiencyKind | null | undefined): string {
  if (kind === 'with-bearing-losses')
    return `${TURBINE_EFFICIENCY_KIND_WORDS['with-bearing-losses']}: the bearings' losses are in it, so a plan's mechanical efficiency is not applied again`;
  if (kind === 'aerodynamic') return `${TURBINE_EFFICIENCY_KIND_WORDS.aerodynamic}: a plan's mechanical efficiency takes the bearings' share`;
  return "not stated, read as aerodynamic only: a plan's mechanical efficiency takes the bearings' share";
}

/** Units named in messages and docs as examples; any unit of the right kind that mathjs knows is read. */
export const UNIT_EXAMPLES = {
  correctedMassFlow: ['kg/s', 'lb/min', 'g/s'],
  volumeFlow: ['m3/s', 'cfm', 'm3/min'],
  temperature: ['K', 'degC', 'degF', 'degR'],
  pressure: ['Pa', 'kPa', 'bar', 'psi', 'inHg'],
  speed: ['rpm', 'krpm'],
  flowParameter: ['kg/s K^0.5 / kPa', 'kg/s K^0.5 / Pa', 'lb/min degR^0.5 / psi'],
  inertia: ['kg m^2', 'g cm^2', 'lb in^2'],
} as const;
