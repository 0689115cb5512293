// The one table of units as people read them (°C, m³/s), by the name mathjs and the map file
// format spell them (degC, m^3/s, m3/s).
const UNIT_LABELS: Record<string, string> = {
  degC: '°C',
  degF: '°F',
  degR: '°R',
  m3: 'm³',
  'm^3/s': 'm³/s',
  'm3/s': 'm³/s',
  'm^3/min': 'm³/min',
  'm3/min': 'm³/min',
  'kg/m^3': 'kg/m³',
  'lb/ft^3': 'lb/ft³',
  'cm^2': 'cm²',
  'in^2': 'in²',
  'm^2': 'm²',
  'N m': 'N·m',
  'lbf ft': 'lbf·ft',
  cuin: 'in³',
  'kg/s K^0.5 / kPa': 'kg·K^0.5/(s·kPa)',
  'kg/s K^0.5 / Pa': 'kg·K^0.5/(s·Pa)',
  'lb/min degR^0.5 / psi': 'lb·°R^0.5/(min·psi)',
};

/** A unit name as people write it. */
export function unitLabel(unit: string): string {
  return UNIT_LABELS[unit] ?? unit;
}
