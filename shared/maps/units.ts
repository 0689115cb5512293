import { math, toSI, fromSI } from '../units';
import { UNIT_EXAMPLES } from './format';

/** The kinds of quantity a map file names units for. */
export type MapQuantity = 'massFlow' | 'volumeFlow' | 'temperature' | 'pressure' | 'speed' | 'flowParameter' | 'inertia';

/** SI unit of the flow parameter ṁ·√T/p inside shared/. */
export const FLOW_PARAMETER_SI_UNIT = 'kg K^0.5 / (s Pa)';
/** SI unit of a rotor's polar moment of inertia. */
const INERTIA_SI_UNIT = 'kg m^2';

const QUANTITY_WORDS: Record<MapQuantity, string> = {
  massFlow: 'mass flow',
  volumeFlow: 'volume flow',
  temperature: 'temperature',
  pressure: 'pressure',
  speed: 'shaft speed',
  flowParameter: 'flow parameter (mass flow · √temperature / pressure)',
  inertia: 'moment of inertia (mass · length²)',
};

const EXAMPLES: Record<MapQuantity, readonly string[]> = {
  massFlow: UNIT_EXAMPLES.correctedMassFlow,
  volumeFlow: UNIT_EXAMPLES.volumeFlow,
  temperature: UNIT_EXAMPLES.temperature,
  pressure: UNIT_EXAMPLES.pressure,
  speed: UNIT_EXAMPLES.speed,
  flowParameter: UNIT_EXAMPLES.flowParameter,
  inertia: UNIT_EXAMPLES.inertia,
};

export function quantityWords(kind: MapQuantity): string {
  return QUANTITY_WORDS[kind];
}

export function unitExamples(kind: MapQuantity): string {
  return EXAMPLES[kind].join(', ');
}

export type UnitReading = { ok: true; unit: string } | { ok: false; reason: 'unknown-unit' | 'wrong-unit-kind'; message: string };

// One unit word, optionally with a power: kg, m3, K^0.5, s^-1. Digits elsewhere (such as "5 kg/s")
// would be swallowed by mathjs's unit parser without a word, so they are refused here.
const UNIT_TOKEN = /^[A-Za-z]+[23]?(\^-?\d+(\.\d+)?)?$/;

/** Spellings users type that mathjs does not know, mapped to ones it does. */
function normaliseUnitText(text: string): string {
  return text
    .trim()
    .replace(/°\s*C\b/g, 'degC')
    .replace(/°\s*F\b/g, 'degF')
    .replace(/°\s*R\b/g, 'degR')
    .replace(/°\s*K\b/g, 'K')
    .replace(/³/g, '3')
    .replace(/²/g, '2')
    .replace(/[·⋅]/g, ' ');
}

/** The unit text to hand to mathjs, or null when it has characters no unit has. */
function mathUnitText(text: string): string | null {
  const normal = normaliseUnitText(text);
  if (normal === '' || normal.length > 40) return null;
  const tokens = normal.split(/[\s*/()]+/).filter((t) => t !== '');
  if (tokens.length === 0 || !tokens.every((t) => UNIT_TOKEN.test(t))) return null;
  return normal;
}

function fail(reason: 'unknown-unit' | 'wrong-unit-kind', text: string, kind: MapQuantity): UnitReading {
  const examples = unitExamples(kind);
  return reason === 'unknown-unit'
    ? { ok: false, reason, message: `unknown unit "${text}"; use a ${quantityWords(kind)} unit such as ${examples}` }
    : { ok: false, reason, message: `"${text}" is not a unit of ${quantityWords(kind)}; use one such as ${examples}` };
}

/** Checks that `text` names a unit of `kind`; the unit is kept as the file wrote it. */
export function readUnit(text: string, kind: MapQuantity): UnitReading {
  const mathText = mathUnitText(text);
  if (mathText === null) return fail('unknown-unit', text, kind);
  let unit;
  try {
    unit = math.unit(1, mathText);
  } catch {
    return fail('unknown-unit', text, kind);
  }
  try {
    unit.toNumber(kind === 'flowParameter' ? FLOW_PARAMETER_SI_UNIT : kind === 'inertia' ? INERTIA_SI_UNIT : siTarget(kind));
  } catch {
    return fail('wrong-unit-kind', text, kind);
  }
  return { ok: true, unit: text.trim() };
}

function siTarget(kind: Exclude<MapQuantity, 'flowParameter' | 'inertia'>): string {
  return { massFlow: 'kg/s', volumeFlow: 'm^3/s', temperature: 'K', pressure: 'Pa', speed: 'rpm' }[kind];
}

function requireMathText(unitText: string): string {
  const mathText = mathUnitText(unitText);
  if (mathText === null) throw new Error(`unit "${unitText}" was not checked with readUnit`);
  return mathText;
}

/** Converts a value in a unit checked by readUnit to SI (offsets of °C and °F are applied). */
export function mapValueToSI(value: number, unitText: string, kind: MapQuantity): number {
  const mathText = requireMathText(unitText);
  if (kind === 'flowParameter') return math.unit(value, mathText).toNumber(FLOW_PARAMETER_SI_UNIT);
  if (kind === 'inertia') return math.unit(value, mathText).toNumber(INERTIA_SI_UNIT);
  return toSI(value, mathText, kind);
}

/** Converts an SI value to a unit checked by readUnit. */
export function mapValueFromSI(value: number, unitText: string, kind: MapQuantity): number {
  const mathText = requireMathText(unitText);
  if (kind === 'flowParameter') return math.unit(value, FLOW_PARAMETER_SI_UNIT).toNumber(mathText);
  if (kind === 'inertia') return math.unit(value, INERTIA_SI_UNIT).toNumber(mathText);
  return fromSI(value, mathText, kind);
}

/**
 * SI per file unit for quantities without an offset (flows, speeds, flow parameter): columns are
 * scaled by one factor, the same on read and write, so a written file reads back to the same numbers.
 */
export function scaleToSI(unitText: string, kind: Exclude<MapQuantity, 'temperature'>): number {
  return mapValueToSI(1, unitText, kind);
}
