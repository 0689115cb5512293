/**
 * What changed between two study documents, in words a person reads in the history panel:
 * "Engine › volumetric efficiency at 4500 rpm: 1.01 → 1.05". Pure; SI values pass through
 * untouched, each with the kind of quantity it is so a screen can show it in the user's units.
 *
 * Tables by rpm are matched by rpm (not by row index); plans, scenarios and boost rows by their
 * ids (`shared/schemas/item-ids.ts`), so duplicating a scenario is one addition, a new name is one
 * renaming and a reordering is no change.
 */
import { fillItemIds } from '../schemas/item-ids';

/**
 * What a changed value measures. Physical kinds name an SI unit (shared/units); the rest say how
 * to read a plain number. Gauge pressure and temperature differences are their own kinds
 * because they convert differently (no offset for a difference; "gauge" in the label).
 */
export type DiffValueKind =
  | 'pressure'
  | 'pressureGauge'
  | 'temperature'
  | 'temperatureDifference'
  | 'volume'
  | 'length'
  /** A small diameter, m (a wastegate valve: mm or in). */
  | 'diameter'
  | 'speed'
  /** Flow of one injector, m³/s (the trade reads cc/min). */
  | 'injectorFlow'
  /** Fuel flow of a pump or engine, m³/s (L/h or US gal/h). */
  | 'fuelFlow'
  /** Brake specific fuel consumption, kg/J. */
  | 'bsfc'
  | 'fraction'
  /** A number from 0 to 100 that is already a percentage (ethanol content). */
  | 'percent'
  | 'ratio'
  | 'count'
  /** Mass flow, kg/s. */
  | 'massFlow'
  /** Density, kg/m³. */
  | 'density'
  /** A short time, s (an injector's dead time: ms). */
  | 'duration'
  /** Electric potential, V. */
  | 'voltage'
  | 'text';

export interface DocumentChange {
  /** Readable location, e.g. `Scenario 2 “1,500 m, 35 °C” › boost row “Full load” › boost at 4000 rpm`. */
  path: string;
  /** The document keys of the value in the newer document (in the older one for removals). */
  keys: (string | number)[];
  /** `renamed`: a plan, scenario or boost row kept its identity and changed its name (`before`, `after`: the names). */
  change: 'changed' | 'added' | 'removed' | 'renamed';
  /** The older value (SI); undefined when added. Whole rows, plans and scenarios are objects. */
  before: unknown;
  /** The newer value (SI); undefined when removed. */
  after: unknown;
  /** What the value measures, when known; null for objects and unknown keys. */
  kind: DiffValueKind | null;
}

type Key = string | number;
type Json = unknown;

/** Each document field in words, for change lists and problem lists. */
export const FIELD_WORDS: Record<string, string> = {
  schemaVersion: 'document version',
  engineLabel: 'Engine label',
  notes: 'Notes',
  engine: 'Engine',
  displacement: 'displacement',
  cylinders: 'cylinders',
  strokes: 'cycle (strokes)',
  rpm: 'rpm points',
  min: 'lowest rpm',
  max: 'highest rpm',
  step: 'rpm step',
  values: 'rpm list',
  limits: 'limits',
  maxRpm: 'rpm limit',
  maxManifoldPressure: 'manifold pressure limit',
  maxCompressorOutletTemperature: 'compressor outlet temperature limit',
  volumetricEfficiency: 'volumetric efficiency',
  fuelSystem: 'Fuel system',
  fuel: 'fuel',
  ethanolPercent: 'ethanol content',
  lambda: 'lambda',
  injectors: 'injectors',
  primary: 'primary set',
  secondary: 'secondary set',
  count: 'count',
  ratedFlow: 'rated flow',
  ratedPressure: 'rated pressure',
  switchOverRpm: 'switch-over rpm',
  fuelPressure: 'fuel pressure',
  regulator: 'regulator',
  pumpFlowAvailable: 'pump flow available',
  power: 'Power assumptions',
  basis: 'basis',
  brakeThermalEfficiency: 'brake thermal efficiency',
  bsfc: 'BSFC',
  drivetrainLoss: 'drivetrain loss',
  losses: 'Losses',
  inlet: 'inlet loss',
  chargeCooler: 'charge-cooler loss',
  inletTemperatureRise: 'intake heating',
  intercooler: 'Intercooler',
  manifoldTemperature: 'manifold temperature',
  effectiveness: 'effectiveness',
  coolantTemperature: 'coolant temperature',
  scenarios: 'Scenarios',
  ambient: 'ambient',
  pressure: 'barometric pressure',
  altitude: 'altitude',
  temperature: 'temperature',
  boostSchedule: 'boost schedule',
  label: 'label',
  gear: 'gear',
  boost: 'boost',
  plans: 'Plans',
  name: 'name',
  turbochargers: 'turbochargers',
  compressorEfficiency: 'default compressor efficiency',
  maxShaftSpeed: 'max wheel speed',
  compressorMapId: 'compressor map',
  exhaust: 'exhaust side',
  turbineMapId: 'turbine map',
  housing: 'turbine housing',
  wastegates: 'wastegates',
  valveDiameter: 'wastegate valve diameter',
  dischargeCoefficient: 'wastegate discharge coefficient',
  mechanicalEfficiency: 'mechanical efficiency',
  // An rpm table: its rows read "turbine inlet temperature at 4000 rpm".
  turbineInletTemperature: 'turbine inlet temperature',
  downstreamLoss: 'pressure loss after the turbine',
  pressureLoss: 'pressure loss',
  referenceMassFlow: 'at engine flow',
  referenceDensity: 'at gas density',
  relativeHumidity: 'relative humidity',
  trappingEfficiency: 'trapping efficiency',
  ratingFluidDensity: 'rating fluid density',
  deadTime: 'dead time',
  time: 'time',
  voltage: 'at battery voltage',
  pulseFactor: 'pulse-energy factor',
  turbineEfficiency: 'default turbine efficiency',
  mapReference: 'map reference',
  offMapEfficiency: 'off-map efficiency (assumption)',
  requirements: 'Required margins',
  minSurgeMargin: 'smallest surge margin',
  minChokeMargin: 'smallest choke margin',
  minSpeedMargin: 'smallest speed margin',
  lambdaWarningUnderBoost: 'lambda warning under boost',
  lambdaLimitUnderBoost: 'lambda limit under boost',
  underBoostFrom: 'under boost from',
  kind: 'kind',
  id: 'id',
};

function words(key: Key): string {
  return typeof key === 'number' ? `item ${key + 1}` : (FIELD_WORDS[key] ?? key);
}

/** Paths of the tables by rpm, as key patterns (`*` is any index). */
const RPM_TABLES: Key[][] = [
  ['engine', 'volumetricEfficiency'],
  ['fuelSystem', 'lambda'],
  ['scenarios', '*', 'boostSchedule', '*', 'boost'],
  ['plans', '*', 'exhaust', 'turbineInletTemperature'],
];

function matches(keys: Key[], pattern: Key[]): boolean {
  return keys.length === pattern.length && pattern.every((p, i) => p === '*' || p === keys[i]);
}

const isRpmTable = (keys: Key[]) => RPM_TABLES.some((p) => matches(keys, p));

/** The kind of the value at `keys` (a document path), or null when it is not a known leaf. */
export function kindOfPath(keys: Key[]): DiffValueKind | null {
  const last = keys[keys.length - 1];
  const parent = keys[keys.length - 2];
  const top = keys[0];
  if (last === 'value' && keys.length >= 2) {
    const table = keys.slice(0, -2);
    if (matches(table, RPM_TABLES[0])) return 'fraction';
    if (matches(table, RPM_TABLES[1])) return 'ratio';
    if (matches(table, RPM_TABLES[2])) return 'pressureGauge';
    if (matches(table, RPM_TABLES[3])) return 'temperature';
  }
  if (last === 'rpm' && keys.length >= 3) return 'speed';
  switch (last) {
    case 'displacement':
      return 'volume';
    case 'cylinders':
    case 'strokes':
    case 'count':
    case 'turbochargers':
    case 'gear':
    case 'schemaVersion':
      return 'count';
    case 'min':
    case 'max':
    case 'step':
    case 'maxRpm':
    case 'switchOverRpm':
    case 'maxShaftSpeed':
      return 'speed';
    case 'maxManifoldPressure':
    case 'ratedPressure':
    case 'inlet':
    case 'chargeCooler':
    case 'downstreamLoss':
    case 'pressureLoss':
      return 'pressure';
    case 'referenceMassFlow':
      return 'massFlow';
    case 'referenceDensity':
    case 'ratingFluidDensity':
      return 'density';
    case 'time':
      return parent === 'deadTime' ? 'duration' : null;
    case 'voltage':
      return 'voltage';
    case 'relativeHumidity':
    case 'trappingEfficiency':
      return 'fraction';
    case 'pressure':
      return 'pressure';
    case 'fuelPressure':
    case 'underBoostFrom':
      return 'pressureGauge';
    case 'maxCompressorOutletTemperature':
    case 'manifoldTemperature':
    case 'coolantTemperature':
    case 'temperature':
      return 'temperature';
    case 'inletTemperatureRise':
      return 'temperatureDifference';
    case 'ratedFlow':
      return 'injectorFlow';
    case 'pumpFlowAvailable':
      return 'fuelFlow';
    case 'bsfc':
      return 'bsfc';
    case 'brakeThermalEfficiency':
    case 'drivetrainLoss':
    case 'effectiveness':
    case 'compressorEfficiency':
    case 'dischargeCoefficient':
    case 'mechanicalEfficiency':
    case 'turbineEfficiency':
    case 'offMapEfficiency':
    case 'minSurgeMargin':
    case 'minChokeMargin':
    case 'minSpeedMargin':
      return 'fraction';
    case 'pulseFactor':
    case 'lambdaWarningUnderBoost':
    case 'lambdaLimitUnderBoost':
      return 'ratio';
    case 'valveDiameter':
      return 'diameter';
    case 'ethanolPercent':
      return 'percent';
    case 'altitude':
      return 'length';
    case 'name':
    case 'label':
    case 'kind':
    case 'basis':
    case 'regulator':
    case 'engineLabel':
    case 'notes':
    case 'compressorMapId':
    case 'turbineMapId':
    case 'housing':
    case 'id':
      return 'text';
    default:
      if (typeof last === 'number' && parent === 'values' && top === 'engine') return 'speed';
      return null;
  }
}

const isObject = (v: Json): v is Record<string, Json> => typeof v === 'object' && v !== null && !Array.isArray(v);
const nameOf = (v: Json, key: 'name' | 'label'): string | null => (isObject(v) && typeof v[key] === 'string' ? (v[key] as string) : null);
const isRpmRow = (v: Json): v is { rpm: number; value: Json } => isObject(v) && typeof v.rpm === 'number';

function sameValue(a: Json, b: Json): boolean {
  if (Object.is(a, b)) return true;
  if (Array.isArray(a) && Array.isArray(b)) return a.length === b.length && a.every((x, i) => sameValue(x, b[i]));
  if (isObject(a) && isObject(b)) {
    const keys = new Set([...Object.keys(a), ...Object.keys(b)]);
    for (const k of keys) if (!sameValue(a[k], b[k])) return false;
    return true;
  }
  return false;
}

interface Walk {
  out: DocumentChange[];
}

function push(walk: Walk, labels: string[], keys: Key[], change: DocumentChange['change'], before: Json, after: Json) {
  const value = before ?? after;
  const kind = Array.isArray(value) ? (value.every((x) => typeof x === 'number') ? kindOfPath([...keys, 0]) : null) : isObject(value) ? null : kindOfPath(keys);
  walk.out.push({ path: labels.join(' › '), keys, change, before, after, kind });
}

/** A change of a leaf or whole subtree: added, removed or changed. */
function leafChange(walk: Walk, labels: string[], keys: Key[], before: Json, after: Json) {
  if (before === undefined) push(walk, labels, keys, 'added', undefined, after);
  else if (after === undefined) push(walk, labels, keys, 'removed', before, undefined);
  else push(walk, labels, keys, 'changed', before, after);
}

function diffRpmTable(walk: Walk, labels: string[], keys: Key[], a: Json[], b: Json[]) {
  const what = labels[labels.length - 1];
  const head = labels.slice(0, -1);
  const byRpm = (rows: Json[]) => new Map(rows.filter(isRpmRow).map((r, i) => [r.rpm, { row: r, index: i }] as const));
  const before = byRpm(a);
  const after = byRpm(b);
  const rpms = [...new Set([...before.keys(), ...after.keys()])].sort((x, y) => x - y);
  for (const rpm of rpms) {
    const x = before.get(rpm);
    const y = after.get(rpm);
    const rowLabels = [...head, `${what} at ${rpm} rpm`];
    if (x && y) {
      if (!sameValue(x.row.value, y.row.value)) push(walk, rowLabels, [...keys, y.index, 'value'], 'changed', x.row.value, y.row.value);
    } else if (y) {
      push(walk, rowLabels, [...keys, y.index, 'value'], 'added', undefined, y.row.value);
    } else if (x) {
      push(walk, rowLabels, [...keys, x.index, 'value'], 'removed', x.row.value, undefined);
    }
  }
}

/** How items of an identified list are matched and named. */
interface ListOf {
  /** The key holding the item's own name: a change of it is reported as one renaming. */
  nameKey: 'name' | 'label';
  /** The item's words in a path, e.g. `Scenario 2 “Hot day”`; `i` is its position (from 0) in its own document. */
  label: (item: Json, i: number) => string;
}

const PLANS: ListOf = { nameKey: 'name', label: (p, i) => `Plan “${nameOf(p, 'name') ?? `#${i + 1}`}”` };
const SCENARIOS: ListOf = { nameKey: 'name', label: (s, i) => `Scenario ${i + 1} “${nameOf(s, 'name') ?? ''}”` };
const BOOST_ROWS: ListOf = { nameKey: 'label', label: (r, i) => `boost row “${nameOf(r, 'label') ?? i + 1}”` };

/**
 * A list whose items carry an `id` (plans, scenarios, boost rows), matched by identity: an item
 * in both is renamed and/or changed field by field, wherever it stands; an item in one only is
 * added or removed whole. Newer items in their order first, then the removed ones.
 */
function diffById(walk: Walk, labels: string[], keys: Key[], a: Json[], b: Json[], list: ListOf) {
  const idOf = (item: Json, i: number) => (isObject(item) && typeof item.id === 'string' ? item.id : `#${i}`);
  const before = new Map(a.map((item, i) => [idOf(item, i), item] as const));
  const afterIds = new Set(b.map(idOf));
  const head = labels.slice(0, -1);
  b.forEach((item, i) => {
    const old = before.get(idOf(item, i));
    const label = [...head, list.label(item, i)];
    if (old === undefined) return push(walk, label, [...keys, i], 'added', undefined, item);
    if (!isObject(old) || !isObject(item)) return diffValue(walk, label, [...keys, i], old, item);
    const name = list.nameKey;
    if (!sameValue(old[name], item[name])) push(walk, label, [...keys, i, name], 'renamed', old[name], item[name]);
    for (const k of [...new Set([...Object.keys(old), ...Object.keys(item)])]) {
      if (k !== name && k !== 'id') diffValue(walk, [...label, words(k)], [...keys, i, k], old[k], item[k]);
    }
  });
  a.forEach((item, i) => {
    if (!afterIds.has(idOf(item, i))) push(walk, [...head, list.label(item, i)], [...keys, i], 'removed', item, undefined);
  });
}

function diffValue(walk: Walk, labels: string[], keys: Key[], a: Json, b: Json): void {
  if (sameValue(a, b)) return;
  if (a === undefined || b === undefined) return leafChange(walk, labels, keys, a, b);
  if (Array.isArray(a) && Array.isArray(b)) {
    if (isRpmTable(keys)) return diffRpmTable(walk, labels, keys, a, b);
    if (keys.length === 1 && keys[0] === 'plans') return diffById(walk, labels, keys, a, b, PLANS);
    if (keys.length === 1 && keys[0] === 'scenarios') return diffById(walk, labels, keys, a, b, SCENARIOS);
    if (keys.length === 3 && keys[0] === 'scenarios' && keys[2] === 'boostSchedule') return diffById(walk, labels, keys, a, b, BOOST_ROWS);
    // Any other list (the rpm list): one change for the whole list reads better than per item.
    return push(walk, labels, keys, 'changed', a, b);
  }
  if (isObject(a) && isObject(b)) {
    const keysOf = [...new Set([...Object.keys(a), ...Object.keys(b)])];
    for (const k of keysOf) diffValue(walk, [...labels, words(k)], [...keys, k], a[k], b[k]);
    return;
  }
  leafChange(walk, labels, keys, a, b);
}

/**
 * Every difference from `a` (older) to `b` (newer), in document order. Equal documents give an
 * empty list. Both are plain JSON (a saved study document); neither is changed.
 */
export function diffDocuments(older: unknown, newer: unknown): DocumentChange[] {
  const walk: Walk = { out: [] };
  // Documents saved before scenarios and rows had ids get them as every reader gives them.
  const a = fillItemIds(older);
  const b = fillItemIds(newer);
  if (isObject(a) && isObject(b)) {
    const keys = [...new Set([...Object.keys(a), ...Object.keys(b)])];
    for (const k of keys) diffValue(walk, [words(k)], [k], a[k], b[k]);
  } else {
    diffValue(walk, ['Document'], [], a, b);
  }
  return walk.out;
}
