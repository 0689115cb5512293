import { siUnitOf, unitConverter, type QuantityKind } from '#shared/units';
import { displayUnitOf, type UnitSystem } from '#src/lib/units';

// Numbers as the plots and map screens show them: in the user's units, with the unit written the
// way people read it (°C, m³/s) rather than the way mathjs spells it (degC, m^3/s).

const UNIT_LABELS: Record<string, string> = {
  degC: '°C',
  degF: '°F',
  degR: '°R',
  'm^3/s': 'm³/s',
  'm^3/min': 'm³/min',
  'kg/m^3': 'kg/m³',
  'lb/ft^3': 'lb/ft³',
  'cm^2': 'cm²',
  'in^2': 'in²',
  'm^2': 'm²',
  'N m': 'N·m',
  'lbf ft': 'lbf·ft',
  cuin: 'in³',
  'kg/s K^0.5 / kPa': 'kg·K^0.5/(s·kPa)',
  'lb/min degR^0.5 / psi': 'lb·°R^0.5/(min·psi)',
};

/** A mathjs unit name as people write it. */
export function unitLabel(unit: string): string {
  return UNIT_LABELS[unit] ?? unit;
}

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
 * One SI value as text in the user's units. `kind` is a quantity kind of shared/units or one of
 * the pure-number kinds of the Working: `fraction` (shown in percent), `ratio`, `count`, `none`.
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

/** Text safe to put into plotly's hover and annotation strings, which read a little HTML. */
export function plotText(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');
}
