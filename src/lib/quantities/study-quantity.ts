import type { DiffValueKind } from '#shared/study/diff';
import { unitConverter, type QuantityKind } from '#shared/units';
import { displayUnits } from './display-units';
import { formatNumber } from './format';
import { unitLabel } from './unit-label';
import type { UnitSystem } from './unit-system';

/**
 * The quantities a study shows and edits, beyond the plain kinds of shared/units: gauge
 * pressure (labelled so), temperature differences (converted by factor only: 1 K = 1.8 °F),
 * injector flow (cc/min in both systems, the trade's unit), fuel flow (L/h or US gal/h), BSFC,
 * injector dead time (ms), battery voltage (V), and plain numbers read as percentages.
 */
export type StudyQuantity = DiffValueKind | 'massFlow' | 'power' | 'torque' | 'volumeFlow' | 'density' | 'energyPerMass' | 'area';

export interface QuantityUnit {
  /** The unit as people write it, e.g. "kPa gauge", "°F", "%"; empty for plain numbers. */
  label: string;
  /** Short label for narrow table headers (no "gauge"). */
  short: string;
  /** From the shown unit to SI. */
  toSI: (shown: number) => number;
  /** From SI to the shown unit. */
  fromSI: (si: number) => number;
}

function mathUnit(unit: string, kind: QuantityKind, label: string, short = label): QuantityUnit {
  const converter = unitConverter(unit, kind);
  return { label, short, toSI: converter.toSI, fromSI: converter.fromSI };
}

function scaled(factor: number, label: string, short = label): QuantityUnit {
  return { label, short, toSI: (v) => v / factor, fromSI: (v) => v * factor };
}

const cache = new Map<string, QuantityUnit>();

/** How a quantity is shown and typed in a unit system. */
export function quantityUnit(quantity: StudyQuantity, system: UnitSystem): QuantityUnit {
  const key = `${quantity}|${system}`;
  let unit = cache.get(key);
  if (!unit) {
    unit = makeUnit(quantity, system);
    cache.set(key, unit);
  }
  return unit;
}

function makeUnit(quantity: StudyQuantity, system: UnitSystem): QuantityUnit {
  const us = system === 'us';
  const plain = (kind: QuantityKind) => mathUnit(displayUnits[system][kind], kind, unitLabel(displayUnits[system][kind]));
  switch (quantity) {
    case 'pressure':
      return plain('pressure');
    case 'pressureGauge': {
      const unit = displayUnits[system].pressure;
      return mathUnit(unit, 'pressure', `${unitLabel(unit)} gauge`, unitLabel(unit));
    }
    case 'temperature':
      return plain('temperature');
    case 'temperatureDifference':
      // A difference has no offset: 1 K = 1 °C = 1.8 °F.
      return us ? scaled(1.8, '°F') : scaled(1, 'K');
    case 'volume':
      return us ? mathUnit('ci', 'volume', 'ci') : mathUnit('L', 'volume', 'L');
    case 'length':
      return us ? mathUnit('ft', 'length', 'ft') : mathUnit('m', 'length', 'm');
    case 'diameter':
      return us ? mathUnit('in', 'length', 'in') : mathUnit('mm', 'length', 'mm');
    case 'speed':
      return scaled(1, 'rpm');
    case 'injectorFlow':
      return mathUnit('cc/min', 'volumeFlow', 'cc/min');
    case 'fuelFlow':
      return us ? mathUnit('gal/h', 'volumeFlow', 'US gal/h') : mathUnit('L/h', 'volumeFlow', 'L/h');
    case 'bsfc':
      return us ? { label: 'lb/(hp·h)', short: 'lb/(hp·h)', toSI: (v) => v * LB_PER_HP_H, fromSI: (v) => v / LB_PER_HP_H } : scaled(1 / G_PER_KWH, 'g/kWh');
    case 'duration':
      // Injector dead times are milliseconds in both systems (the trade's unit).
      return scaled(1000, 'ms');
    case 'voltage':
      return scaled(1, 'V');
    case 'fraction':
      return scaled(100, '%');
    case 'percent':
      return scaled(1, '%');
    case 'ratio':
    case 'count':
    case 'text':
      return scaled(1, '');
    default:
      return plain(quantity);
  }
}

/** kg/J in one g/kWh (1 g / 3.6e6 J). */
const G_PER_KWH = 1e-3 / 3.6e6;
/** kg/J in one lb/(hp·h): 0.45359237 kg / (745.69987 W × 3600 s) (NIST SP 811 pound and horsepower). */
const LB_PER_HP_H = 0.45359237 / (745.6998715822702 * 3600);

/** An SI value as text in the user's units: "140 kPa gauge", "85 %", "—" when missing. */
export function formatStudyValue(value: unknown, quantity: StudyQuantity | null, system: UnitSystem, digits = 4): string {
  if (value === null || value === undefined) return '—';
  if (typeof value === 'string') return value;
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (Array.isArray(value)) return value.map((v) => formatStudyValue(v, quantity, system, digits)).join(', ');
  if (typeof value !== 'number') return JSON.stringify(value);
  if (!Number.isFinite(value)) return '—';
  if (quantity === null || quantity === 'text') return formatNumber(value, 6);
  if (quantity === 'count') return formatNumber(value, 21);
  const unit = quantityUnit(quantity, system);
  const shown = formatNumber(unit.fromSI(value), quantity === 'speed' ? 21 : digits);
  return unit.label ? `${shown} ${unit.label}` : shown;
}

/**
 * A pressure loss as a study states it, in the user's units: "15 kPa at 0.38 kg/s and
 * 0.29 kg/m³" when it follows the flow, "12 kPa at every flow" when it is fixed.
 */
export function formatPressureLoss(
  loss: { pressureLoss: number; referenceMassFlow?: number; referenceDensity?: number } | undefined,
  system: UnitSystem,
): string {
  if (!loss || typeof loss !== 'object') return '—';
  const dp = formatStudyValue(loss.pressureLoss, 'pressure', system);
  if (loss.referenceMassFlow === undefined) return `${dp} at every flow`;
  const density =
    loss.referenceDensity === undefined
      ? `${formatStudyValue(1.225, 'density', system)} (standard air)`
      : formatStudyValue(loss.referenceDensity, 'density', system);
  return `${dp} at ${formatStudyValue(loss.referenceMassFlow, 'massFlow', system)} and ${density}`;
}
