/**
 * What a logged column can be, the units each may come in, and the limits outside which a value
 * cannot be that quantity in that unit (a wrong unit in the mapping, not a bad sensor). SI inside:
 * the unit names are mathjs's (shared/units), converted once per column as a straight line.
 */
import type { QuantityKind } from '../units';

export const LOG_QUANTITIES = [
  'time',
  'engineSpeed',
  'manifoldPressure',
  'throttle',
  'inletTemperature',
  'manifoldTemperature',
  'massAirFlow',
  'fuelMassFlow',
  'lambda',
  'shaftSpeed',
  'exhaustPressure',
  'exhaustTemperature',
  'ambientPressure',
  'gear',
] as const;
export type LogQuantity = (typeof LOG_QUANTITIES)[number];

/** A unit offered for a quantity: mathjs name and the label shown. */
interface LogUnit {
  unit: string;
  label: string;
}

const PRESSURE_UNITS: LogUnit[] = [
  { unit: 'kPa', label: 'kPa' },
  { unit: 'bar', label: 'bar' },
  { unit: 'psi', label: 'psi' },
  { unit: 'Pa', label: 'Pa' },
  { unit: 'hPa', label: 'hPa (mbar)' },
  { unit: 'inHg', label: 'inHg' },
];
const TEMPERATURE_UNITS: LogUnit[] = [
  { unit: 'degC', label: '°C' },
  { unit: 'degF', label: '°F' },
  { unit: 'K', label: 'K' },
];
const FRACTION_UNITS: LogUnit[] = [
  { unit: 'percent', label: '%' },
  { unit: 'fraction', label: 'fraction (0–1)' },
];
const SPEED_UNITS: LogUnit[] = [
  { unit: 'rpm', label: 'rpm' },
  { unit: 'krpm', label: 'krpm' },
];
const MASS_FLOW_UNITS: LogUnit[] = [
  { unit: 'g/s', label: 'g/s' },
  { unit: 'kg/h', label: 'kg/h' },
  { unit: 'lb/min', label: 'lb/min' },
  { unit: 'kg/s', label: 'kg/s' },
  { unit: 'lb/h', label: 'lb/h' },
];

export interface LogQuantityInfo {
  label: string;
  /** Conversion kind of shared/units, or a plain number ('count', 'fraction', 'time'). */
  kind: QuantityKind | 'time' | 'fraction' | 'count';
  units: LogUnit[];
  /** Pressures may be logged absolute or gauge. */
  pressure?: true;
  /** Every value must lie within, SI (absolute for pressures). */
  limits: [number, number];
  /** The column's median must lie within, SI: outside it the unit is almost surely wrong. */
  typical?: [number, number];
  /** Step the stored samples keep, SI (the stored log is quantised to it). */
  resolution: number;
  /** What the limits say in words, for the messages. */
  limitWords: string;
}

export const LOG_QUANTITY_INFO: Record<LogQuantity, LogQuantityInfo> = {
  time: {
    label: 'Time',
    kind: 'time',
    units: [
      { unit: 's', label: 's' },
      { unit: 'ms', label: 'ms' },
      { unit: 'min', label: 'min' },
    ],
    limits: [-1e7, 1e7],
    resolution: 1e-4,
    limitWords: 'within ±10 million seconds',
  },
  engineSpeed: {
    label: 'Engine speed',
    kind: 'speed',
    units: SPEED_UNITS,
    limits: [0, 20_000],
    resolution: 1,
    limitWords: '0 to 20 000 rpm',
  },
  manifoldPressure: {
    label: 'Manifold pressure',
    kind: 'pressure',
    units: PRESSURE_UNITS,
    pressure: true,
    // 0.1 kPa or 2 000 kPa absolute is no manifold pressure: a wrong unit or reference.
    limits: [5_000, 1_000_000],
    resolution: 1,
    limitWords: '5 to 1 000 kPa absolute',
  },
  throttle: { label: 'Throttle', kind: 'fraction', units: FRACTION_UNITS, limits: [-0.05, 1.05], resolution: 1e-4, limitWords: '0 to 100 %' },
  inletTemperature: {
    label: 'Compressor inlet temperature',
    kind: 'temperature',
    units: TEMPERATURE_UNITS,
    limits: [150, 450],
    resolution: 0.01,
    limitWords: '150 to 450 K (−123 to 177 °C)',
  },
  manifoldTemperature: {
    label: 'Manifold (charge) temperature',
    kind: 'temperature',
    units: TEMPERATURE_UNITS,
    limits: [150, 600],
    resolution: 0.01,
    limitWords: '150 to 600 K (−123 to 327 °C)',
  },
  massAirFlow: {
    label: 'Mass air flow',
    kind: 'massFlow',
    units: MASS_FLOW_UNITS,
    limits: [-0.01, 5],
    resolution: 1e-5,
    limitWords: '0 to 5 kg/s (0 to 5 000 g/s)',
  },
  fuelMassFlow: {
    label: 'Fuel mass flow',
    kind: 'massFlow',
    units: MASS_FLOW_UNITS,
    limits: [-0.001, 1],
    resolution: 1e-6,
    limitWords: '0 to 1 kg/s',
  },
  lambda: {
    label: 'Lambda',
    kind: 'count',
    units: [{ unit: 'lambda', label: 'λ (air-fuel ratio ÷ stoichiometric)' }],
    limits: [0.3, 16],
    // An air-fuel ratio (12.5 on petrol) mapped as lambda is refused here.
    typical: [0.5, 2.5],
    resolution: 1e-4,
    limitWords: '0.3 to 16, most samples 0.5 to 2.5',
  },
  shaftSpeed: {
    label: 'Turbo shaft speed',
    kind: 'speed',
    units: SPEED_UNITS,
    limits: [0, 400_000],
    resolution: 1,
    limitWords: '0 to 400 000 rpm',
  },
  exhaustPressure: {
    label: 'Exhaust (drive) pressure',
    kind: 'pressure',
    units: PRESSURE_UNITS,
    pressure: true,
    limits: [20_000, 1_500_000],
    resolution: 1,
    limitWords: '20 to 1 500 kPa absolute',
  },
  exhaustTemperature: {
    label: 'Exhaust temperature',
    kind: 'temperature',
    units: TEMPERATURE_UNITS,
    limits: [150, 1_700],
    resolution: 0.1,
    limitWords: '150 to 1 700 K',
  },
  ambientPressure: {
    label: 'Barometric pressure',
    kind: 'pressure',
    units: PRESSURE_UNITS,
    limits: [40_000, 110_000],
    resolution: 1,
    limitWords: '40 to 110 kPa absolute',
  },
  gear: { label: 'Gear', kind: 'count', units: [{ unit: 'gear', label: 'gear number' }], limits: [-1, 12], resolution: 1, limitWords: '−1 to 12' },
};

/** Quantities without which a log cannot be placed on the map. */
export const REQUIRED_QUANTITIES: readonly LogQuantity[] = ['time', 'engineSpeed', 'manifoldPressure'];

/** Pressure that a gauge reading is added to when no barometric pressure is logged or given, Pa (ISO 2533 sea level). */
export const DEFAULT_GAUGE_REFERENCE = 101_325;
