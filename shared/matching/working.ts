/**
 * The Working: every step of a computation with its formula, substituted values (SI, typed by
 * kind so a screen can show them in the user's units) and its source. Formulas are mathjs
 * expressions over the step's symbols; evaluating one with the step's values gives its result.
 */
import type { QuantityKind } from '../units';

/** What a Working value measures: a physical quantity kind, or a pure number of some sort. */
export type WorkingKind = QuantityKind | 'ratio' | 'fraction' | 'count' | 'none';

export interface WorkingValue {
  /** mathjs symbol name used in the formula (ASCII, underscores for subscripts). */
  symbol: string;
  /** SI value. */
  value: number;
  kind: WorkingKind;
  /** SI unit text for values of kind "none" that still have a unit (for example J/(kg K), K for a difference). */
  unit?: string;
}

export interface WorkingStep {
  id: string;
  title: string;
  /** Plain words a student can follow. */
  explanation: string;
  /** mathjs expression over the symbols in `values`; it evaluates to `result.value`. */
  formula: string;
  values: WorkingValue[];
  result: WorkingValue;
  source: string;
}

/** SI unit text of a specific heat or a gas constant. */
export const SPECIFIC_HEAT_UNIT = 'J/(kg K)';

/** Sources named in the Working, in one place so the wording stays the same everywhere. */
export const SOURCES = {
  isa: 'ISO 2533:1975 / ICAO Doc 7488, ISA troposphere',
  given: 'Given in the Study',
  definition: 'Definition',
  idealGas: 'Ideal-gas law, R = 287.05287 J/(kg K) (ISO 2533)',
  heywoodAirflow: 'Heywood, Internal Combustion Engine Fundamentals (1988), §2.10',
  correctedFlow: 'NASA Glenn Research Center, "Corrected airflow"; Isermann, Combustion Engine Diagnosis (2017), eqs. 5.4.14–15',
  compressorThermo: 'NASA Glenn Research Center, compressor thermodynamics (isentropic relation)',
  intercooler: 'Incropera & DeWitt, Fundamentals of Heat and Mass Transfer, §11.4 (effectiveness)',
  fuelProperties: 'Heywood (1988), App. D; US DOE AFDC fuel properties comparison',
  blend: 'Mass balance: volume percent to mass fractions through densities (petrol 745, ethanol 789 kg/m³)',
  power: 'Heywood, Internal Combustion Engine Fundamentals (1988), eq. 2.23 (fuel conversion efficiency), counting only the fuel that burns',
  similarity: 'Dixon & Hall, Fluid Mechanics and Thermodynamics of Turbomachinery, 7th ed. (2014), ch. 1 (similarity: head rises with tip speed squared)',
  injector: 'Orifice flow of a liquid: Q ∝ √ΔP',
  commonPractice: 'Common practice, no published source',
  map: 'Compressor map of the Plan',
  interpolation: 'Linear interpolation in the Study table by rpm, held flat outside its range',
  assumption: 'Assumption stated in the Study',
} as const;

/** A Working value. */
export function wv(symbol: string, value: number, kind: WorkingKind, unit?: string): WorkingValue {
  return unit === undefined ? { symbol, value, kind } : { symbol, value, kind, unit };
}

/** A Working step. */
export function step(
  id: string,
  title: string,
  explanation: string,
  formula: string,
  values: WorkingValue[],
  result: WorkingValue,
  source: string,
): WorkingStep {
  return { id, title, explanation, formula, values, result, source };
}

/**
 * The ratio of specific heats of an ideal gas from its cp and R (cv = cp − R): one relation, used
 * for the charge and for the exhaust gas. Symbols are the caller's; units J/(kg K).
 */
export function gammaStep(
  id: string,
  title: string,
  explanation: string,
  cp: [symbol: string, value: number],
  r: [symbol: string, value: number],
  gamma: [symbol: string, value: number],
): WorkingStep {
  return step(
    id,
    title,
    explanation,
    `${cp[0]} / (${cp[0]} - ${r[0]})`,
    [wv(cp[0], cp[1], 'none', 'J/(kg K)'), wv(r[0], r[1], 'none', 'J/(kg K)')],
    wv(gamma[0], gamma[1], 'ratio'),
    SOURCES.definition,
  );
}

/** Formats a number for messages and explanations: 4 significant figures, no exponent for everyday sizes. */
export function fmt(value: number, digits = 4): string {
  if (!Number.isFinite(value)) return String(value);
  const abs = Math.abs(value);
  if (abs !== 0 && (abs >= 1e7 || abs < 1e-3)) return value.toExponential(digits - 1);
  return Number(value.toPrecision(digits)).toString();
}

/** Formats a fraction as a percentage for messages. */
export function pct(fraction: number, digits = 3): string {
  return `${fmt(fraction * 100, digits)} %`;
}

/** Formats an absolute temperature in K with °C beside it. */
export function kelvin(value: number): string {
  return `${fmt(value)} K (${fmt(value - 273.15)} °C)`;
}
