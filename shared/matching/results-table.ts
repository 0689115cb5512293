import { siUnitOf } from '../units';
import { MAP_REGION_WORDS } from './compressor/reach';
import { planVerdicts, VERDICT_WORDS } from './verdict';
import type { OperatingLine, PointValues, StudyResult } from './result';
import type { WorkingKind } from './working';

/**
 * The columns of a study's results, in reading order, each with its quantity kind so a screen can
 * show it in the user's units. The CSV export writes the same columns in SI.
 */
export interface ResultColumn {
  key: keyof PointValues;
  label: string;
  kind: WorkingKind;
  /** Pressure columns that are gauge say so; the rest are absolute. */
  gauge?: boolean;
}

export const RESULT_COLUMNS: ResultColumn[] = [
  { key: 'rpm', label: 'Engine speed', kind: 'speed' },
  // "Boost" is the boost the point is solved at: the target, or what the turbine holds below it.
  { key: 'boost', label: 'Boost', kind: 'pressure', gauge: true },
  { key: 'boostTarget', label: 'Boost target', kind: 'pressure', gauge: true },
  { key: 'manifoldPressure', label: 'Manifold pressure', kind: 'pressure' },
  { key: 'manifoldTemperature', label: 'Manifold temperature', kind: 'temperature' },
  { key: 'volumetricEfficiency', label: 'Volumetric efficiency', kind: 'fraction' },
  { key: 'engineMassFlow', label: 'Engine air flow', kind: 'massFlow' },
  { key: 'massFlow', label: 'Air flow per turbocharger', kind: 'massFlow' },
  { key: 'correctedMassFlow', label: 'Corrected mass flow', kind: 'massFlow' },
  { key: 'inletVolumeFlow', label: 'Inlet volume flow', kind: 'volumeFlow' },
  { key: 'compressorInletPressure', label: 'Compressor inlet pressure', kind: 'pressure' },
  { key: 'compressorOutletPressure', label: 'Compressor outlet pressure', kind: 'pressure' },
  { key: 'pressureRatio', label: 'Pressure ratio', kind: 'ratio' },
  { key: 'compressorEfficiency', label: 'Compressor efficiency', kind: 'fraction' },
  { key: 'compressorOutletTemperature', label: 'Compressor outlet temperature', kind: 'temperature' },
  { key: 'compressorPower', label: 'Compressor power', kind: 'power' },
  { key: 'shaftSpeed', label: 'Shaft speed', kind: 'speed' },
  { key: 'surgeMargin', label: 'Surge margin', kind: 'fraction' },
  { key: 'chokeMargin', label: 'Choke margin', kind: 'fraction' },
  { key: 'speedMargin', label: 'Speed margin', kind: 'fraction' },
  { key: 'lambda', label: 'Lambda', kind: 'ratio' },
  { key: 'fuelMassFlow', label: 'Fuel mass flow', kind: 'massFlow' },
  { key: 'fuelVolumeFlow', label: 'Fuel volume flow', kind: 'volumeFlow' },
  { key: 'brakePower', label: 'Crank power', kind: 'power' },
  { key: 'wheelPower', label: 'Wheel power', kind: 'power' },
  { key: 'torque', label: 'Crank torque', kind: 'torque' },
  { key: 'injectorDuty', label: 'Injector duty', kind: 'fraction' },
  { key: 'pumpFlowRequired', label: 'Pump flow needed', kind: 'volumeFlow' },
  // The exhaust side (empty for Plans without one).
  { key: 'exhaustMassFlow', label: 'Exhaust flow per turbocharger', kind: 'massFlow' },
  { key: 'turbineInletTemperature', label: 'Turbine inlet temperature', kind: 'temperature' },
  { key: 'turbineInletPressure', label: 'Turbine inlet pressure', kind: 'pressure' },
  { key: 'turbineOutletPressure', label: 'Turbine outlet pressure', kind: 'pressure' },
  { key: 'expansionRatio', label: 'Expansion ratio', kind: 'ratio' },
  { key: 'drivePressureRatio', label: 'Drive pressure ratio', kind: 'ratio' },
  { key: 'turbineEfficiency', label: 'Turbine efficiency', kind: 'fraction' },
  { key: 'turbinePower', label: 'Turbine power', kind: 'power' },
  { key: 'wastegateFraction', label: 'Wastegate share of exhaust', kind: 'fraction' },
  { key: 'wastegateDiameterNeeded', label: 'Wastegate valve needed (each)', kind: 'length' },
  { key: 'wastegateMargin', label: 'Wastegate margin', kind: 'fraction' },
];

/**
 * Columns the CSV export appends after the plan's verdict, with their headers exactly as written:
 * they came later than the rest, so the earlier columns keep their places.
 */
const APPENDED_RESULT_COLUMNS: { key: keyof PointValues; header: string }[] = [
  { key: 'exhaustGasCp', header: 'Exhaust gas cp (J/(kg K))' },
  { key: 'exhaustGasGamma', header: 'Exhaust gas gamma' },
  { key: 'humidityRatio', header: 'Humidity ratio (kg/kg)' },
];

/** The SI unit text written beside a column in exports. */
function siUnitText(column: ResultColumn): string {
  switch (column.kind) {
    case 'ratio':
    case 'count':
    case 'none':
      return '';
    case 'fraction':
      return 'fraction';
    default: {
      const unit = siUnitOf[column.kind];
      return column.gauge ? `${unit} gauge` : unit;
    }
  }
}

interface ResultRow {
  plan: string;
  scenario: string;
  row: string;
  line: OperatingLine;
  values: PointValues | null;
  /** The point's findings as one text, most severe first. */
  findings: string;
}

/** One row per operating point of every line, in plan, scenario, boost-row, rpm order. */
function resultRows(result: StudyResult): ResultRow[] {
  const order = { limit: 0, warning: 1, info: 2 } as const;
  return result.lines.flatMap((line) =>
    line.points.map((p) => ({
      plan: line.planName,
      scenario: line.scenarioName,
      row: line.rowLabel,
      line,
      values: p.values,
      findings: [...p.findings]
        .sort((a, b) => order[a.severity] - order[b.severity])
        .map((f) => `${f.severity}: ${f.message}`)
        .join('; '),
    })),
  );
}

/** Where a point sits, in words, for a table or an export: "past choke"; "no map" without one, "not computed" when unsolved. */
export function mapRegionText(values: PointValues | null): string {
  if (!values) return 'not computed';
  return values.mapRegion ? MAP_REGION_WORDS[values.mapRegion] : 'no map';
}

/** "yes" where the point's results stand, "no" where the compressor cannot deliver it or it could not be computed. */
export function reachableText(values: PointValues | null): 'yes' | 'no' {
  return values && values.reachable !== false ? 'yes' : 'no';
}

/**
 * The results as plain records for a CSV writer: headers carry SI units; numbers stay numbers.
 * A point the compressor cannot deliver has empty result cells; "Reachable" says why, and the
 * plan's verdict is on every row of the plan. "Map region", "Reachable" and "Plan verdict" came
 * later than the value columns, and the exhaust gas's cp and gamma and the air's humidity ratio
 * later still (APPENDED_RESULT_COLUMNS): each group is appended, so that earlier columns keep their
 * places.
 */
export function resultRecords(result: StudyResult): {
  fields: string[];
  data: (string | number | null)[][];
  /** The plan (its index in the study) of each record, in the same order: the workbook's sheet. */
  planIndexes: number[];
} {
  const head = RESULT_COLUMNS.map((c) => {
    const unit = siUnitText(c);
    return unit ? `${c.label} (${unit})` : c.label;
  });
  const fields = [
    'Plan',
    'Scenario',
    'Boost row',
    ...head,
    'Findings',
    'Map region',
    'Reachable',
    'Plan verdict',
    ...APPENDED_RESULT_COLUMNS.map((c) => c.header),
  ];
  const verdicts = new Map(planVerdicts(result).map((v) => [v.planIndex, v]));
  const rows = resultRows(result);
  const data = rows.map((r) => {
    const verdict = verdicts.get(r.line.planIndex);
    return [
      r.plan,
      r.scenario,
      r.row,
      ...RESULT_COLUMNS.map((c) => {
        const v = r.values?.[c.key];
        return typeof v === 'number' ? v : v === null || v === undefined ? null : String(v);
      }),
      r.findings,
      mapRegionText(r.values),
      reachableText(r.values),
      verdict ? verdict.headline : VERDICT_WORDS['not-judged'],
      ...APPENDED_RESULT_COLUMNS.map((c) => {
        const v = r.values?.[c.key];
        return typeof v === 'number' ? v : null;
      }),
    ];
  });
  return { fields, data, planIndexes: rows.map((r) => r.line.planIndex) };
}
