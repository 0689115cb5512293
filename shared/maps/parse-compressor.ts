import { COMPRESSOR_OPTIONAL_KEYS, COMPRESSOR_REQUIRED_KEYS, HEADER_KEYS } from './format';
import {
  checkDistinctSpeeds,
  checkEfficiencyScale,
  checkEfficiency,
  checkIncreasing,
  checkPointCount,
  checkSameAlongLine,
  closeIsland,
  curveName,
  distinctPointCount,
  groupRows,
} from './curves';
import { checkKeysForKind, readQuantity, readUnitValue, type CommonHeader, type HeaderSection, type Quantity } from './header';
import { mergeCoincidentPoints } from './coincident';
import { quoteCell, type ProblemList } from './problems';
import type { DataRow } from './rows';
import type { CompressorCurve, CompressorFlowAxis, CompressorMap, MapProblem } from './types';
import { compressorFlowScale, efficiencyScale, speedScale } from './scales';
import { surfacePoints } from './surface-points';

const EXAMPLES: Record<string, string> = {
  [HEADER_KEYS.version]: '1',
  [HEADER_KEYS.kind]: 'compressor',
  [HEADER_KEYS.name]: 'Demo compressor 58',
  [HEADER_KEYS.flow]: 'corrected mass, kg/s',
  [HEADER_KEYS.referenceTemperature]: '298 K',
  [HEADER_KEYS.referencePressure]: '100 kPa',
  [HEADER_KEYS.efficiency]: 'percent',
};

/** Plausible reference conditions: outside them the number or its unit is almost surely a slip. */
const REFERENCE_TEMPERATURE_RANGE_K = [200, 400] as const;
const REFERENCE_PRESSURE_RANGE_PA = [20_000, 200_000] as const;
const MAX_SPEED_LIMIT_RPM = 1_000_000;

interface FlowHeader {
  axis: CompressorFlowAxis;
  unit: string;
}

function readFlowHeader(section: HeaderSection, problems: ProblemList): FlowHeader | null {
  const entry = section.entries.get(HEADER_KEYS.flow);
  if (!entry) return null;
  const match = /^(corrected mass|volume)\s*(?:,\s*(.*))?$/i.exec(entry.value);
  if (!match) {
    problems.add(
      'bad-value',
      entry.line,
      null,
      `flow must name the axis and its unit, such as "corrected mass, kg/s" or "volume, cfm" (found ${quoteCell(entry.value)})`,
    );
    return null;
  }
  const axis: CompressorFlowAxis = match[1].toLowerCase() === 'volume' ? 'volume' : 'corrected-mass';
  const unitText = (match[2] ?? '').trim();
  if (unitText === '') {
    problems.add(
      'missing-unit',
      entry.line,
      null,
      `flow needs a unit after the comma, such as "${axis === 'volume' ? 'volume, cfm' : 'corrected mass, kg/s'}"`,
    );
    return null;
  }
  const unit = readUnitValue({ ...entry, value: unitText }, axis === 'volume' ? 'volumeFlow' : 'massFlow', problems);
  return unit === null ? null : { axis, unit };
}

function readReference(section: HeaderSection, problems: ProblemList): { temperature: Quantity | null; pressure: Quantity | null } {
  const tEntry = section.entries.get(HEADER_KEYS.referenceTemperature);
  const pEntry = section.entries.get(HEADER_KEYS.referencePressure);
  let temperature = tEntry ? readQuantity(tEntry, 'temperature', '298 K', problems) : null;
  let pressure = pEntry ? readQuantity(pEntry, 'pressure', '100 kPa', problems) : null;
  if (tEntry && temperature) {
    const [low, high] = REFERENCE_TEMPERATURE_RANGE_K;
    if (!(temperature.si >= low && temperature.si <= high)) {
      problems.add(
        'out-of-range',
        tEntry.line,
        null,
        `reference temperature ${tEntry.value} is ${temperature.si.toFixed(1)} K; a map's reference inlet temperature lies between ${low} K and ${high} K (check the number and its unit)`,
      );
      temperature = null;
    }
  }
  if (pEntry && pressure) {
    const [low, high] = REFERENCE_PRESSURE_RANGE_PA;
    if (!(pressure.si >= low && pressure.si <= high)) {
      problems.add(
        'out-of-range',
        pEntry.line,
        null,
        `reference pressure ${pEntry.value} is ${(pressure.si / 1000).toFixed(1)} kPa; a map's reference inlet pressure is absolute and lies between ${low / 1000} and ${high / 1000} kPa (check the number and its unit)`,
      );
      pressure = null;
    }
  }
  return { temperature, pressure };
}

function readMaxSpeed(section: HeaderSection, problems: ProblemList): Quantity | null {
  const entry = section.entries.get(HEADER_KEYS.maxSpeed);
  if (!entry) return null;
  const quantity = readQuantity(entry, 'speed', '138000 rpm', problems);
  if (quantity && !(quantity.si > 0 && quantity.si <= MAX_SPEED_LIMIT_RPM)) {
    problems.add('out-of-range', entry.line, null, `max speed ${entry.value} must be above 0 and at most ${MAX_SPEED_LIMIT_RPM} rpm`);
    return null;
  }
  return quantity;
}

/** Most rotor inertia a file may give, kg·m² (far beyond any turbocharger's). */
const MAX_ROTOR_INERTIA = 0.01;

function readRotorInertia(section: HeaderSection, problems: ProblemList): Quantity | null {
  const entry = section.entries.get(HEADER_KEYS.rotorInertia);
  if (!entry) return null;
  const quantity = readQuantity(entry, 'inertia', '3.2e-5 kg m^2', problems);
  if (quantity && !(quantity.si > 0 && quantity.si <= MAX_ROTOR_INERTIA)) {
    problems.add('out-of-range', entry.line, null, `rotor inertia ${entry.value} must be above 0 and at most ${MAX_ROTOR_INERTIA} kg m^2`);
    return null;
  }
  return quantity;
}

function checkRow(row: DataRow, common: CommonHeader, problems: ProblemList): void {
  const [flow, pressureRatio, efficiency, speed] = row.values;
  if (flow === null) problems.add('missing-value', row.line, 3, 'flow is empty; every row needs a flow');
  else if (!(flow > 0)) problems.add('out-of-range', row.line, 3, `flow ${flow} must be above 0`);
  if (pressureRatio === null) problems.add('missing-value', row.line, 4, 'pressure_ratio is empty; every row needs a pressure ratio');
  else if (!(pressureRatio >= 1))
    problems.add(
      'pressure-ratio-below-one',
      row.line,
      4,
      `pressure ratio ${pressureRatio} is below 1; a compressor raises pressure, so the ratio is at least 1`,
    );
  if (efficiency !== null && common.efficiency) checkEfficiency(efficiency, common.efficiency, row.line, problems);
  if (row.curve === 'island' && efficiency === null) {
    problems.add('missing-value', row.line, 5, 'efficiency is empty; every row of an efficiency island gives its efficiency');
  }
  if (row.curve === 'speed' && speed === null) {
    problems.add('missing-value', row.line, 6, "speed is empty; every row of a speed line gives the line's speed");
  }
  if (speed !== null && !(speed > 0)) problems.add('out-of-range', row.line, 6, `speed ${speed} must be above 0`);
}

/** Reads and checks a compressor file's header and rows; builds the map only when nothing is wrong. */
export function readCompressor(
  section: HeaderSection,
  common: CommonHeader,
  rows: DataRow[],
  problems: ProblemList,
  notes: MapProblem[],
): CompressorMap | null {
  checkKeysForKind(section, 'compressor', COMPRESSOR_REQUIRED_KEYS, COMPRESSOR_OPTIONAL_KEYS, EXAMPLES, problems);
  const flow = readFlowHeader(section, problems);
  const reference = readReference(section, problems);
  const maxSpeed = readMaxSpeed(section, problems);
  const rotorInertia = readRotorInertia(section, problems);

  const scaleLine = section.entries.get(HEADER_KEYS.efficiency)?.line ?? null;
  const wrongScale = checkEfficiencyScale(rows, common.efficiency, scaleLine, problems);
  for (const row of rows) checkRow(row, wrongScale ? { ...common, efficiency: null } : common, problems);
  const groups = groupRows(rows, ['surge', 'choke'], problems);
  const closedRows = new Map<object, DataRow[]>();
  for (const group of groups) {
    if (group.duplicate) continue;
    if (group.curve === 'island') {
      checkSameAlongLine(group, 5, 'efficiency', problems);
      if (distinctPointCount(group.rows) < 3) {
        problems.add('too-few-points', group.rows[0].line, null, `${curveName(group)} has fewer than three distinct points; an island is a closed contour`);
      } else {
        closedRows.set(group, closeIsland(group, notes));
      }
      continue;
    }
    checkPointCount(group, 2, problems);
    if (group.curve === 'speed') {
      checkSameAlongLine(group, 6, 'speed', problems);
      checkIncreasing(group, 3, 'flow', "list a speed line's points from surge to choke", problems);
    } else {
      checkIncreasing(group, 4, 'pressure ratio', `list the ${group.curve} line's points from low to high pressure ratio`, problems);
    }
  }
  checkDistinctSpeeds(
    groups.filter((g) => g.curve === 'speed'),
    problems,
  );

  const count = (curve: string) => groups.filter((g) => g.curve === curve).length;
  if (rows.length > 0) {
    const missing: string[] = [];
    if (count('surge') === 0) missing.push('a surge line');
    if (count('choke') === 0) missing.push('a choke line');
    if (count('speed') < 2) missing.push(`at least two speed lines (found ${count('speed')})`);
    if (missing.length > 0)
      problems.add(
        'missing-curve',
        null,
        null,
        `a compressor map needs a surge line, a choke line and at least two speed lines; this file lacks ${missing.join(', ')}`,
      );
    const efficiencies = rows.map((r) => r.values[2]).filter((e): e is number => e !== null);
    if (efficiencies.length === 0 && rows.length > 0) {
      problems.add('missing-curve', null, null, 'no row gives an efficiency; add efficiencies on the speed lines or efficiency islands');
    }
  }

  if (!problems.isEmpty || !flow || !reference.temperature || !reference.pressure || !common.name || !common.efficiency) return null;

  const referenceSI = { temperature: reference.temperature.si, pressure: reference.pressure.si };
  const flowFactor = compressorFlowScale({ flowAxis: flow.axis, flowUnit: flow.unit }, referenceSI);
  const speedFactor = speedScale(common.speedUnit);
  const efficiencyFactor = efficiencyScale(common.efficiency);
  const curves: CompressorCurve[] = groups.map((group) => ({
    kind: group.curve as CompressorCurve['kind'],
    label: group.label,
    points: (closedRows.get(group) ?? group.rows).map((row) => ({
      correctedMassFlow: row.values[0]! * flowFactor,
      pressureRatio: row.values[1]!,
      efficiency: row.values[2] === null ? null : row.values[2] * efficiencyFactor,
      speed: row.values[3] === null ? null : row.values[3] * speedFactor,
    })),
  }));
  const map: CompressorMap = {
    kind: 'compressor',
    formatVersion: 1,
    name: common.name,
    notes: common.notes,
    reference: referenceSI,
    maxSpeed: maxSpeed?.si ?? null,
    ...(rotorInertia ? { rotorInertia: rotorInertia.si } : {}),
    curves,
    fileUnits: {
      flowAxis: flow.axis,
      flowUnit: flow.unit,
      referenceTemperatureUnit: reference.temperature.unit,
      referencePressureUnit: reference.pressure.unit,
      efficiency: common.efficiency,
      speedUnit: common.speedUnit,
      maxSpeedUnit: maxSpeed?.unit ?? 'rpm',
    },
  };
  const rowsOfCurve = groups.map((group) => closedRows.get(group) ?? group.rows);
  for (const quantity of ['efficiency', 'speed'] as const) {
    const note = coincidentPointsNote(map, quantity, (curve, point) => rowsOfCurve[curve][point].line);
    if (note) notes.push(note);
  }
  return map;
}

/**
 * Says how many places with points of different values were merged, by which rule, and where the
 * first one is, so that the upload shows what the map will read there. Never a problem: the rule
 * gives every place one value.
 */
function coincidentPointsNote(map: CompressorMap, quantity: 'efficiency' | 'speed', lineOf: (curve: number, point: number) => number): MapProblem | null {
  const points = surfacePoints(map, quantity);
  const { conflicts } = mergeCoincidentPoints(points);
  if (conflicts.length === 0) return null;
  const places = conflicts.map((place) => [...new Set(place.points.map((i) => lineOf(points[i].curve, points[i].point)))].sort((a, b) => a - b));
  places.sort((a, b) => a[0] - b[0]);
  const rowCount = places.reduce((sum, lines) => sum + lines.length, 0);
  const first = places[0];
  const firstLines = first.length === 1 ? `line ${first[0]}` : `lines ${first.slice(0, -1).join(', ')} and ${first[first.length - 1]}`;
  const placesHold = `${conflicts.length} ${conflicts.length === 1 ? 'place holds' : 'places hold'}`;
  const message =
    quantity === 'efficiency'
      ? `${placesHold} points with different efficiencies (${rowCount} rows); each place is read as one point: a speed line's efficiency where one passes through it (the mean where several do), otherwise the highest island's efficiency; the first is at ${firstLines}`
      : `${placesHold} speed-line points with different speeds (${rowCount} rows); each place is read as one point at the mean of their speeds; the first is at ${firstLines}`;
  return { code: 'coincident-points-merged', line: null, column: null, message };
}
