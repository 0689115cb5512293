import { csvLine, writeCsv } from '../csv';
import { COMPRESSOR_COLUMNS, FORMULA_START, HEADER_KEYS, MAP_FORMAT_VERSION, TURBINE_COLUMNS, TURBINE_EFFICIENCY_KIND_WORDS } from './format';
import { compressorFlowScale, efficiencyScale, flowParameterScale, speedScale } from './scales';
import type { CompressorMap, SpoolbookMap, TurbineMap } from './types';
import { mapValueFromSI, mapValueToSI, type MapQuantity } from './units';

/**
 * The shortest decimal that reads back to exactly `si` through `toSI`: 12 significant digits are
 * enough for any value that came from a file (so the file's own numbers come back), more only when
 * the SI value was computed elsewhere.
 */
export function fileNumber(si: number, fromSI: (si: number) => number, toSI: (file: number) => number): number {
  const raw = fromSI(si);
  for (const digits of [12, 15, 17]) {
    const candidate = Number(raw.toPrecision(digits));
    if (toSI(candidate) === si) return candidate;
  }
  return raw;
}

/** A column read as value·factor is written as the number that reads back to the same SI value. */
function scaled(si: number | null, factor: number): number | null {
  if (si === null) return null;
  return fileNumber(
    si,
    (v) => v / factor,
    (v) => v * factor,
  );
}

function quantityText(si: number, unit: string, kind: MapQuantity): string {
  const value = fileNumber(
    si,
    (v) => mapValueFromSI(v, unit, kind),
    (v) => mapValueToSI(v, unit, kind),
  );
  return `${value} ${unit}`;
}

/** Header text on one line, safe to open in a spreadsheet. */
function headerValue(text: string): string {
  const oneLine = text.replace(/[\u0000-\u001f\u007f]+/g, ' ').trim();
  return FORMULA_START.test(oneLine) ? `'${oneLine}` : oneLine;
}

/** `# key: value` lines, each written as one CSV cell (see csvLine). */
export function headerLines(entries: Array<[string, string]>, notes: string[] = []): string[] {
  const lines = entries.map(([key, value]) => csvLine(`# ${key}: ${value}`));
  for (const note of notes) lines.push(csvLine(`# ${HEADER_KEYS.note}: ${note.replace(/[\u0000-\u001f\u007f]+/g, ' ').trim()}`));
  return lines;
}

function table(columns: readonly string[], rows: Array<Array<string | number | null>>): string {
  return writeCsv(columns, rows, '\n');
}

function writeCompressor(map: CompressorMap): string {
  const units = map.fileUnits;
  const entries: Array<[string, string]> = [
    [HEADER_KEYS.version, String(MAP_FORMAT_VERSION)],
    [HEADER_KEYS.kind, 'compressor'],
    [HEADER_KEYS.name, headerValue(map.name)],
    [HEADER_KEYS.flow, `${units.flowAxis === 'volume' ? 'volume' : 'corrected mass'}, ${units.flowUnit}`],
    [HEADER_KEYS.referenceTemperature, quantityText(map.reference.temperature, units.referenceTemperatureUnit, 'temperature')],
    [HEADER_KEYS.referencePressure, quantityText(map.reference.pressure, units.referencePressureUnit, 'pressure')],
    [HEADER_KEYS.efficiency, units.efficiency],
  ];
  if (map.maxSpeed !== null) entries.push([HEADER_KEYS.maxSpeed, quantityText(map.maxSpeed, units.maxSpeedUnit, 'speed')]);
  // Written in SI: the file's own unit for it is not kept (it reads back to the same value).
  if (map.rotorInertia !== undefined) entries.push([HEADER_KEYS.rotorInertia, `${map.rotorInertia} kg m^2`]);
  entries.push([HEADER_KEYS.speed, units.speedUnit]);

  const flowFactor = compressorFlowScale(units, map.reference);
  const speedFactor = speedScale(units.speedUnit);
  const efficiencyFactor = efficiencyScale(units.efficiency);
  const rows = map.curves.flatMap((curve) =>
    curve.points.map((p) => [
      curve.kind,
      curve.label,
      scaled(p.correctedMassFlow, flowFactor),
      scaled(p.pressureRatio, 1),
      scaled(p.efficiency, efficiencyFactor),
      scaled(p.speed, speedFactor),
    ]),
  );
  return [...headerLines(entries, map.notes), table(COMPRESSOR_COLUMNS, rows)].join('\n') + '\n';
}

function writeTurbine(map: TurbineMap): string {
  const units = map.fileUnits;
  const entries: Array<[string, string]> = [
    [HEADER_KEYS.version, String(MAP_FORMAT_VERSION)],
    [HEADER_KEYS.kind, 'turbine'],
    [HEADER_KEYS.name, headerValue(map.name)],
    [HEADER_KEYS.flowParameter, units.flowParameterUnit],
    [HEADER_KEYS.housing, map.housing],
  ];
  if (map.housing === 'divided' && map.scrollFeed !== null) {
    entries.push([HEADER_KEYS.scrollFeed, map.scrollFeed === 'per-scroll' ? 'per scroll' : 'both']);
  }
  if (map.areaRatio !== null) entries.push([HEADER_KEYS.areaRatio, String(map.areaRatio)]);
  entries.push([HEADER_KEYS.efficiency, units.efficiency]);
  if (map.efficiencyKind !== undefined) entries.push([HEADER_KEYS.efficiencyKind, TURBINE_EFFICIENCY_KIND_WORDS[map.efficiencyKind]]);
  entries.push([HEADER_KEYS.speed, units.speedUnit]);

  const flowFactor = flowParameterScale(units.flowParameterUnit);
  const speedFactor = speedScale(units.speedUnit);
  const efficiencyFactor = efficiencyScale(units.efficiency);
  const rows = map.curves.flatMap((curve) =>
    curve.points.map((p) => [
      curve.kind,
      curve.label,
      scaled(p.expansionRatio, 1),
      scaled(p.flowParameter, flowFactor),
      scaled(p.efficiency, efficiencyFactor),
      scaled(p.speed, speedFactor),
    ]),
  );
  return [...headerLines(entries, map.notes), table(TURBINE_COLUMNS, rows)].join('\n') + '\n';
}

/**
 * Writes a map in the format it was read from, in the file's own units, with the header every
 * Spoolbook file carries. Numbers stay numbers; text cells a spreadsheet would run as formulas
 * are escaped. Parsing the result gives back the same map.
 */
export function writeMapFile(map: SpoolbookMap): string {
  return map.kind === 'compressor' ? writeCompressor(map) : writeTurbine(map);
}
