import { worstSeverity } from '#shared/matching/finding';
import { missingMarginWords, type MarginName } from '#shared/matching/compressor/margin-words';
import { mapRegionText } from '#shared/matching/results-table';
import type { OperatingLine, OperatingPoint, SolvedPoint, StudyResult } from '#shared/matching/result';
import type { HoverItem, OperatingLineView, OperatingPointView, TurbineOperatingLineView, TurbineOperatingPointView } from '../plots/types';

/** One operating line of a study with the key every view of the study uses for it. */
export interface StudyLine {
  /** `${planId}|${scenarioIndex}|${rowIndex}`: stable while the plan keeps its id. */
  key: string;
  /** "M58 mid wheel · Sea level, 20 °C · Full load". */
  label: string;
  planId: string;
  planIndex: number;
  scenarioIndex: number;
  rowIndex: number;
  line: OperatingLine;
}

/** A point of the study: its line's key and its engine speed, rpm. */
export interface PointRef {
  lineKey: string;
  rpm: number;
}

export function lineKeyOf(planId: string, scenarioIndex: number, rowIndex: number): string {
  return `${planId}|${scenarioIndex}|${rowIndex}`;
}

/** The lines of a result with their keys; `plans` are the document's plans (for their ids). */
export function studyLines(result: StudyResult, plans: readonly { id: string }[]): StudyLine[] {
  return result.lines.map((line) => {
    const planId = plans[line.planIndex]?.id ?? `plan-${line.planIndex + 1}`;
    return {
      key: lineKeyOf(planId, line.scenarioIndex, line.rowIndex),
      label: `${line.planName} · ${line.scenarioName} · ${line.rowLabel}`,
      planId,
      planIndex: line.planIndex,
      scenarioIndex: line.scenarioIndex,
      rowIndex: line.rowIndex,
      line,
    };
  });
}

/** Engine speeds are compared with a tolerance: they come from sums of steps. */
export function sameRpm(a: number, b: number): boolean {
  return Math.abs(a - b) <= 1e-6 * Math.max(1, Math.abs(a));
}

/** The point a reference names, if the lines still have it. */
export function findPoint(lines: readonly StudyLine[], ref: PointRef | null): { line: StudyLine; point: OperatingPoint } | null {
  if (!ref) return null;
  const line = lines.find((l) => l.key === ref.lineKey);
  const point = line?.line.points.find((p) => sameRpm(p.rpm, ref.rpm));
  return line && point ? { line, point } : null;
}

/** A margin for the hover box: the value, or "—" and why the map gives none. */
function marginHover(v: SolvedPoint['values'], label: string, value: number | null, margin: MarginName): HoverItem {
  const why = missingMarginWords(v, margin);
  return { label, value, kind: 'fraction', ...(why ? { missing: `— (${why})` } : {}) };
}

function pointView(point: SolvedPoint): OperatingPointView {
  const v = point.values;
  const reachable = v.reachable !== false;
  // At a point the compressor cannot deliver, its results are not given: say so, not a dash.
  const result = (label: string, value: number | null, kind: string): HoverItem => ({ label, value, kind, ...(reachable ? {} : { missing: 'not reachable' }) });
  return {
    rpm: v.rpm,
    correctedMassFlow: v.correctedMassFlow,
    volumeFlow: v.inletVolumeFlow,
    pressureRatio: v.pressureRatio,
    severity: worstSeverity(point.findings),
    reachable,
    hover: [
      { label: 'Engine speed', value: v.rpm, kind: 'speed' },
      ...(v.mapRegion ? [{ label: 'Where', value: null, kind: 'text', text: mapRegionText(v) }] : []),
      ...(v.mapRegion
        ? [
            {
              label: 'Reachable',
              value: null,
              kind: 'text',
              text: reachable ? (v.offMapAssumed ? 'yes, on the off-map efficiency assumption' : 'yes') : 'no: the compressor cannot deliver it',
            },
          ]
        : []),
      { label: 'Boost (gauge)', value: v.boost, kind: 'pressure' },
      { label: 'Pressure ratio', value: v.pressureRatio, kind: 'ratio' },
      { label: 'Corrected mass flow', value: v.correctedMassFlow, kind: 'massFlow' },
      { label: 'Shaft speed', value: v.shaftSpeed, kind: 'speed' },
      marginHover(v, 'Surge margin', v.surgeMargin, 'surge'),
      marginHover(v, 'Choke margin', v.chokeMargin, 'choke'),
      marginHover(v, 'Speed margin', v.speedMargin, 'speed'),
      result('Compressor efficiency', v.compressorEfficiency, 'fraction'),
      result('Compressor outlet temperature', v.compressorOutletTemperature, 'temperature'),
      result('Crank power', v.brakePower, 'power'),
    ],
  };
}

/** The lines as the compressor-map plot takes them (solved points only: an unsolved one has no place on a map). */
export function mapLineViews(lines: readonly StudyLine[]): OperatingLineView[] {
  return lines.map((l) => ({
    key: l.key,
    label: l.label,
    planIndex: l.planIndex,
    scenarioIndex: l.scenarioIndex,
    points: l.line.points.filter((p): p is SolvedPoint => p.solved).map(pointView),
  }));
}

function turbinePointView(point: SolvedPoint): TurbineOperatingPointView | null {
  const v = point.values;
  if (
    typeof v.expansionRatio !== 'number' ||
    typeof v.turbineMapFlowParameter !== 'number' ||
    !Number.isFinite(v.expansionRatio) ||
    !Number.isFinite(v.turbineMapFlowParameter)
  )
    return null;
  return {
    rpm: v.rpm,
    expansionRatio: v.expansionRatio,
    flowParameter: v.turbineMapFlowParameter,
    severity: worstSeverity(point.findings),
    hover: [
      { label: 'Engine speed', value: v.rpm, kind: 'speed' },
      { label: v.targetHeld === false ? 'Boost held (below target)' : 'Boost (gauge)', value: v.boost, kind: 'pressure' },
      { label: 'Expansion ratio', value: v.expansionRatio, kind: 'ratio' },
      { label: 'Turbine inlet pressure (abs.)', value: v.turbineInletPressure ?? null, kind: 'pressure' },
      { label: 'Drive pressure ratio', value: v.drivePressureRatio ?? null, kind: 'ratio' },
      { label: 'Turbine efficiency', value: v.turbineEfficiency ?? null, kind: 'fraction' },
      { label: 'Turbine power', value: v.turbinePower ?? null, kind: 'power' },
      { label: 'Wastegate share of exhaust', value: v.wastegateFraction ?? null, kind: 'fraction' },
      { label: 'Wastegate valve needed (each)', value: v.wastegateDiameterNeeded ?? null, kind: 'length' },
    ],
  };
}

/** The lines whose plan has an exhaust side, as the turbine-map plot takes them (points with a place on the map). */
export function turbineLineViews(lines: readonly StudyLine[]): TurbineOperatingLineView[] {
  return lines
    .filter((l) => l.line.context.exhaust?.turbine)
    .map((l) => ({
      key: l.key,
      label: l.label,
      planIndex: l.planIndex,
      scenarioIndex: l.scenarioIndex,
      points: l.line.points.flatMap((p) => {
        if (!p.solved) return [];
        const view = turbinePointView(p);
        return view ? [view] : [];
      }),
    }));
}

/** Whether any line of the study has its exhaust side computed (a plan with an exhaust block and a turbine map). */
export function hasExhaust(lines: readonly StudyLine[]): boolean {
  return lines.some((l) => l.line.context.exhaust?.turbine);
}
