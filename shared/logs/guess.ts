/**
 * A first guess at the mapping from a log's column names, its unit text and its values. Only a
 * guess: the mapping step shows it and the user corrects it.
 */
import type { LogColumnMapping } from './mapping';
import { LOG_QUANTITY_INFO, type LogQuantity } from './quantities';
import type { LogTable } from './read';

/** Name patterns, tried in order: the first quantity whose pattern matches a column name wins it. */
const NAME_PATTERNS: [LogQuantity, RegExp][] = [
  ['time', /^(time|timestamp|t|sec|seconds|elapsed)\b|\btime\b/i],
  ['shaftSpeed', /turbo\s*(shaft\s*)?speed|shaft\s*speed|\btss\b|turbo\s*rpm|\bnt\b/i],
  ['engineSpeed', /\brpm\b|engine\s*speed|eng\s*spd|\bn_?eng\b|^n$/i],
  ['exhaustPressure', /\bemap\b|back\s*-?\s*pressure|exhaust\s*press|drive\s*press|\bp3\b|turbine\s*inlet\s*press/i],
  ['exhaustTemperature', /\begt\b|exhaust\s*(gas\s*)?temp|\bt3\b/i],
  ['ambientPressure', /\bbaro|ambient\s*press|atmos/i],
  ['manifoldPressure', /\bmap\b|manifold\s*(abs(olute)?\s*)?press|\bboost\b|\bp2\b|intake\s*press/i],
  ['manifoldTemperature', /charge\s*(air\s*)?temp|\bcat\b|\bmat\b|manifold\s*(air\s*)?temp|\bt2c\b|post\s*-?\s*(ic|intercooler)/i],
  ['inletTemperature', /\biat\b|intake\s*air\s*temp|inlet\s*(air\s*)?temp|air\s*temp|\bt1\b|ambient\s*temp/i],
  ['massAirFlow', /\bmaf\b|mass\s*air|air\s*(mass\s*)?flow/i],
  ['fuelMassFlow', /fuel\s*(mass\s*)?flow/i],
  ['lambda', /lambda|\bλ\b|\bafr\b|\bo2\b|wideband/i],
  ['throttle', /\btps\b|throttle|pedal|\bapp\b/i],
  ['gear', /\bgear\b/i],
];

/** Unit text as loggers write it, to our unit names. */
const UNIT_TEXT: [RegExp, string][] = [
  [/^k\s*pa$/i, 'kPa'],
  [/^h\s*pa$|^mbar$/i, 'hPa'],
  [/^pa$/i, 'Pa'],
  [/^bar$/i, 'bar'],
  [/^psi[ag]?$/i, 'psi'],
  [/^in\s*hg$/i, 'inHg'],
  [/^(°|deg\s*)?c$|^℃$/i, 'degC'],
  [/^(°|deg\s*)?f$|^℉$/i, 'degF'],
  [/^k$/i, 'K'],
  [/^rpm$|^1\/min$|^min-1$/i, 'rpm'],
  [/^krpm$/i, 'krpm'],
  [/^%$|^pct$|^percent$/i, 'percent'],
  [/^g\/s$/i, 'g/s'],
  [/^kg\/h$|^kg\/hr$/i, 'kg/h'],
  [/^kg\/s$/i, 'kg/s'],
  [/^lbs?\/min$/i, 'lb/min'],
  [/^lbs?\/h(r)?$/i, 'lb/h'],
  [/^s$|^sec$/i, 's'],
  [/^ms$/i, 'ms'],
  [/^min$/i, 'min'],
  [/^λ$|^lambda$/i, 'lambda'],
];

/** Our unit name for a logger's unit text, or null. */
export function unitFromText(text: string | null): string | null {
  if (!text) return null;
  const t = text.trim();
  for (const [re, unit] of UNIT_TEXT) if (re.test(t)) return unit;
  return null;
}

/** Whether a logger's unit text says gauge (psig, "boost") or absolute (psia, kPa abs). */
function pressureReferenceFrom(name: string, unitText: string | null): 'absolute' | 'gauge' | null {
  const both = `${name} ${unitText ?? ''}`;
  if (/psig\b|\bgauge\b|\bg\)|\bboost\b|\brel/i.test(both)) return 'gauge';
  if (/psia\b|\babs\b|absolute|\bmap\b/i.test(both)) return 'absolute';
  return null;
}

function middle(values: Float64Array): number {
  const finite: number[] = [];
  const stride = Math.max(1, Math.floor(values.length / 2001));
  for (let i = 0; i < values.length; i += stride) if (Number.isFinite(values[i])) finite.push(values[i]);
  finite.sort((a, b) => a - b);
  return finite.length ? finite[Math.floor(finite.length / 2)] : Number.NaN;
}

function largest(values: Float64Array): number {
  let max = Number.NEGATIVE_INFINITY;
  for (const v of values) if (v > max) max = v;
  return max;
}

/** The unit a column's values suggest when its header names none (common practice, no source). */
function unitFromValues(
  quantity: LogQuantity,
  values: Float64Array,
  reference: 'absolute' | 'gauge' | null,
): { unit: string; reference?: 'absolute' | 'gauge' } {
  const m = middle(values);
  const info = LOG_QUANTITY_INFO[quantity];
  switch (quantity) {
    case 'manifoldPressure':
    case 'exhaustPressure':
    case 'ambientPressure': {
      const unit = m > 2_000 ? 'Pa' : m > 60 ? 'kPa' : m > 5 ? 'psi' : 'bar';
      const absoluteMin = { Pa: 5_000, kPa: 5, psi: 0.8, bar: 0.05 }[unit]!;
      // A gauge log reads near zero at idle: below the absolute floor it must be gauge.
      const ref =
        reference ??
        (quantity === 'ambientPressure' ? 'absolute' : m < absoluteMin || (unit !== 'Pa' && m < { kPa: 80, psi: 12, bar: 0.8 }[unit]!) ? 'gauge' : 'absolute');
      return info.pressure ? { unit, reference: ref } : { unit };
    }
    case 'inletTemperature':
    case 'manifoldTemperature':
    case 'exhaustTemperature':
      return { unit: m > 200 && quantity !== 'exhaustTemperature' ? 'K' : 'degC' };
    case 'throttle':
      return { unit: largest(values) > 1.5 ? 'percent' : 'fraction' };
    case 'engineSpeed':
    case 'shaftSpeed':
      return { unit: m < 500 && quantity === 'shaftSpeed' ? 'krpm' : 'rpm' };
    case 'massAirFlow':
      return { unit: m < 1 ? 'kg/s' : 'g/s' };
    case 'fuelMassFlow':
      return { unit: m < 0.1 ? 'kg/s' : 'g/s' };
    case 'time':
      return { unit: largest(values) - middle(values) > 100_000 ? 'ms' : 's' };
    default:
      return { unit: info.units[0].unit };
  }
}

/** One guess per column that looks like something we know; each quantity at most once. */
export function guessMapping(table: Pick<LogTable, 'names' | 'headerUnits' | 'columns'>): LogColumnMapping[] {
  const taken = new Set<LogQuantity>();
  const out: LogColumnMapping[] = [];
  table.names.forEach((name, j) => {
    const bare = name.replace(/\s*[([][^)\]]*[)\]]\s*$/, '');
    const found = NAME_PATTERNS.find(([q, re]) => !taken.has(q) && re.test(bare));
    if (!found) return;
    const quantity = found[0];
    const info = LOG_QUANTITY_INFO[quantity];
    const fromHeader = unitFromText(table.headerUnits[j]);
    const reference = info.pressure ? pressureReferenceFrom(name, table.headerUnits[j]) : null;
    const fromValues = unitFromValues(quantity, table.columns[j], reference);
    const unit = fromHeader && info.units.some((u) => u.unit === fromHeader) ? fromHeader : fromValues.unit;
    taken.add(quantity);
    out.push({ column: name, quantity, unit, ...(info.pressure ? { reference: reference ?? fromValues.reference ?? 'absolute' } : {}) });
  });
  return out;
}
