import { siUnitOf, unitConverter, type QuantityKind } from '#shared/units';
import { displayUnitOf } from './display-units';
import { unitLabel } from './unit-label';
import type { UnitSystem } from './unit-system';

const formatters = new Map<number, Intl.NumberFormat>();

/** A number to `significantDigits` significant digits, grouped, never in exponent form. */
export function formatNumber(value: number, significantDigits = 4): string {
  if (!Number.isFinite(value)) return '—';
  let formatter = formatters.get(significantDigits);
  if (!formatter) {
    formatter = new Intl.NumberFormat('en-US', { maximumSignificantDigits: significantDigits });
    formatters.set(significantDigits, formatter);
  }
  return formatter.format(value);
}

/**
 * A number for an input box: 5 significant figures (a converted 300 kPa reads 43.511 psi, not
 * 43.5113), none of the float noise a conversion leaves, no grouping commas (they would not
 * parse). Showing fewer digits changes nothing stored: the SI value changes only when typed over.
 */
export function inputText(value: number, significant = 5): string {
  if (!Number.isFinite(value)) return '';
  if (value === 0) return '0';
  return String(Number(value.toPrecision(significant)));
}

function isQuantityKind(kind: string): kind is QuantityKind {
  return Object.prototype.hasOwnProperty.call(siUnitOf, kind);
}

/** An SI value in the user's display unit (offsets of °C and °F applied). */
export function toDisplay(value: number, kind: QuantityKind, system: UnitSystem): number {
  return unitConverter(displayUnitOf(kind, system), kind).fromSI(value);
}

/** The display unit of a quantity kind, as people write it. */
export function displayUnitLabel(kind: QuantityKind, system: UnitSystem): string {
  return unitLabel(displayUnitOf(kind, system));
}

/**
 * One SI value as text in the display unit of its kind, as the plots, the map screens and the
 * lesson show it. `kind` is a quantity kind of shared/units or one of the pure-number kinds of the
 * Working: `fraction` (shown in percent), `ratio`, `count`, `none`. A study's own inputs and
 * results have units of their own (gauge pressure, litres, cc/min): `formatStudyValue`.
 */
export function formatQuantity(value: number | null, kind: string, system: UnitSystem): string {
  if (value === null || !Number.isFinite(value)) return '—';
  if (kind === 'fraction') return `${formatNumber(value * 100, 3)} %`;
  if (kind === 'ratio') return formatNumber(value, 4);
  if (kind === 'count') return formatNumber(Math.round(value), 21);
  if (kind === 'speed') return `${formatNumber(Math.round(value), 21)} rpm`;
  if (isQuantityKind(kind)) {
    return `${formatNumber(toDisplay(value, kind, system), 4)} ${displayUnitLabel(kind, system)}`;
  }
  return formatNumber(value, 4);
}

/** A shaft speed in krpm, the way speed lines are labelled: `117.5 krpm`. */
export function krpmLabel(rpm: number): string {
  return `${formatNumber(rpm / 1000, 4)} krpm`;
}

/** An efficiency (fraction) in percent: `77 %`. */
export function percentLabel(fraction: number): string {
  return `${formatNumber(fraction * 100, 3)} %`;
}
