import type { ValueAtSpeed, ValueWhere } from '#shared/candidates';
import { formatStudyValue, type UnitSystem } from '#src/lib/quantities';

const rpm = (n: number) => Math.round(n).toLocaleString('en-US');

/** "12.3 %": a fraction as a percentage with one decimal. */
export const percent = (fraction: number) => `${(fraction * 100).toFixed(1)} %`;

/** Where a value was found: "2,500 rpm, “Sea level, 20 °C” · Full load". */
const where = (w: ValueWhere) => `${rpm(w.rpm)} rpm, “${w.scenarioName}” · ${w.rowLabel}`;

/** A worst margin with where it is; "none" when no point has that margin. */
export const marginText = (m: ValueWhere | null) => (m === null ? 'no margin on the map' : `${percent(m.value)} at ${where(m)}`);

/** An efficiency at one speed: "74.1 % at 6,500 rpm", or why there is none. */
export const atSpeedText = (v: ValueAtSpeed | null) =>
  v === null ? '—' : v.value === null ? `not reachable at ${rpm(v.rpm)} rpm` : `${percent(v.value)} at ${rpm(v.rpm)} rpm`;

export const temperatureText = (v: ValueWhere | null, system: UnitSystem) =>
  v === null ? '—' : `${formatStudyValue(v.value, 'temperature', system)} at ${rpm(v.rpm)} rpm`;

export const rpmText = (v: ValueWhere | null) => (v === null ? 'never' : `${rpm(v.value)} rpm (“${v.scenarioName}” · ${v.rowLabel})`);
