/**
 * Side by side: the table of differences between two to four operating lines (Plan × Scenario ×
 * boost row). One row per figure, one cell per line, the best cell of each row marked. Pure and
 * SI, so the screen, the report and the tests read the same numbers.
 *
 * Best is only ever given to a value a builder could choose: never to a line whose plan does not
 * fit, never to a value found at a point past a limit (a negative margin, a point the compressor
 * cannot deliver, a point with a finding at a limit). Peaks are taken over reachable points only,
 * and counts are of points, not of findings.
 */
import type { VerdictStatus } from '../matching/verdict';
import type { ExhaustLineSummary, ValueAtRpm } from '../matching/exhaust/result';
import type { Severity } from '../matching/finding';
import type { OperatingLine, OperatingPoint, PointValues } from '../matching/result';
import type { WorkingKind } from '../matching/working';

/** Which end of a row is better; "none" rows are there to read beside another row. */
export type BestRule = 'highest' | 'lowest' | 'none';

export type CompareRowKey =
  | 'planVerdict'
  | 'minSurgeMargin'
  | 'minChokeMargin'
  | 'minSpeedMargin'
  | 'peakShaftSpeed'
  | 'peakBrakePower'
  | 'peakBrakePowerRpm'
  | 'peakWheelPower'
  | 'peakTorque'
  | 'peakInjectorDuty'
  | 'peakCompressorOutletTemperature'
  | 'peakPressureRatio'
  | 'boostThresholdRpm'
  | 'peakDrivePressureRatio'
  | 'wastegateDiameterNeeded'
  | 'wastegateDiameterFitted'
  | 'turbineInletPressureAtPeakPower'
  | 'timeToBoost'
  | 'runTime'
  | 'runDistance'
  | 'pointsAtLimit'
  | 'pointsWithWarnings'
  | 'pointsWithNotes';

export interface CompareCell {
  /** SI value of the figure for this line; null when no point of the line gives it (e.g. no map). */
  value: number | null;
  /** Engine speed of the point the minimum or peak was found at, rpm; null for counts and for missing values. */
  rpm: number | null;
  /**
   * Why an exhaust row's cell is empty, when the reason is known: "not-reached" when the line's
   * turbine holds the boost target at no engine speed (boost threshold row only), "no-exhaust"
   * when the line's Plan has no exhaust side (or no turbine map). Absent on every other cell.
   */
  note?: CompareCellNote;
  /** The plan's verdict (the verdict row only). */
  verdict?: VerdictStatus;
  /**
   * True when the value was found past a limit (a negative margin, a point the compressor cannot
   * deliver or one with a finding at a limit), or the line's plan does not fit: never marked best.
   */
  excluded?: boolean;
}

export type CompareCellNote = 'not-reached' | 'no-exhaust' | 'no-boost-asked' | 'unknown';

export interface CompareRow {
  key: CompareRowKey;
  label: string;
  /** Quantity kind of the value, so a screen shows it in the user's units ("fraction" shows as %). */
  kind: WorkingKind;
  best: BestRule;
  /** Plain words on what "best" means in this row. */
  bestMeaning: string;
  /** One cell per line, in the order the lines were given. */
  cells: CompareCell[];
  /**
   * Cells holding the best value (ties all marked). Empty when the row has no best, when fewer
   * than two lines give a value, or when every value is the same: there is nothing to choose then.
   */
  bestIndices: number[];
}

/** What compareLines reads of a line: its points, exhaust figures and its plan's verdict (a whole OperatingLine fits). */
export type ComparableLine = Pick<OperatingLine, 'points'> & {
  exhaust?: ExhaustLineSummary | null;
  /** The verdict of the line's plan (planVerdicts); absent: not judged here, and nothing is excluded for it. */
  planVerdict?: VerdictStatus | null;
  /** The drive figures of the line's plan (the study's vehicle); absent or null: the study has no vehicle. */
  drive?: PlanDriveFigures | null;
};

/** A plan's drive figures as Side by side reads them (shared/drive), SI; null where unknown, `why` saying so. */
export interface PlanDriveFigures {
  /** Time to 90 % of the boost target from the spool start, s. */
  timeToBoost: number | null;
  timeToBoostWhy: string | null;
  /** Time and distance of the acceleration run, s and m. */
  runTime: number | null;
  runDistance: number | null;
  runWhy: string | null;
}

const driveRows: { key: CompareRowKey; label: string; bestMeaning: string; value: (d: PlanDriveFigures) => number | null }[] = [
  { key: 'timeToBoost', label: 'Time to 90 % boost', bestMeaning: 'lowest: boost arrives sooner', value: (d) => d.timeToBoost },
  { key: 'runTime', label: 'Acceleration run time', bestMeaning: 'lowest: the car gets to the end speed sooner', value: (d) => d.runTime },
  { key: 'runDistance', label: 'Acceleration run distance', bestMeaning: 'lowest: the car gets to the end speed in less road', value: (d) => d.runDistance },
];

/** The drive rows, in order; compareLines adds them before the counts when some line has drive figures. */
export const DRIVE_ROW_KEYS: readonly CompareRowKey[] = driveRows.map((r) => r.key);

type Extreme = 'min' | 'max';

interface ValueRowSpec {
  key: CompareRowKey;
  label: string;
  kind: WorkingKind;
  best: BestRule;
  bestMeaning: string;
  /** Which point of the line gives the cell. */
  extreme: Extreme;
  value: (v: PointValues) => number | null;
  /** A margin: found at any point, reachable or not (a negative one is the news); peaks are taken over reachable points only. */
  margin?: boolean;
}

const valueRows: ValueRowSpec[] = [
  {
    key: 'minSurgeMargin',
    margin: true,
    label: 'Smallest surge margin',
    kind: 'fraction',
    best: 'highest',
    bestMeaning: 'highest: the line keeps furthest right of the surge line',
    extreme: 'min',
    value: (v) => v.surgeMargin,
  },
  {
    key: 'minChokeMargin',
    margin: true,
    label: 'Smallest choke margin',
    kind: 'fraction',
    best: 'highest',
    bestMeaning: 'highest: the line keeps furthest left of the choke limit',
    extreme: 'min',
    value: (v) => v.chokeMargin,
  },
  {
    key: 'minSpeedMargin',
    margin: true,
    label: 'Smallest speed margin',
    kind: 'fraction',
    best: 'highest',
    bestMeaning: 'highest: the wheel stays furthest below its speed limit',
    extreme: 'min',
    value: (v) => v.speedMargin,
  },
  {
    key: 'peakShaftSpeed',
    label: 'Peak shaft speed',
    kind: 'speed',
    best: 'lowest',
    bestMeaning: 'lowest: the wheel spins slowest (judge it against each wheel’s own limit with the speed margin)',
    extreme: 'max',
    value: (v) => v.shaftSpeed,
  },
  {
    key: 'peakBrakePower',
    label: 'Peak crank power',
    kind: 'power',
    best: 'highest',
    bestMeaning: 'highest: more power',
    extreme: 'max',
    value: (v) => v.brakePower,
  },
  {
    key: 'peakWheelPower',
    label: 'Peak wheel power',
    kind: 'power',
    best: 'highest',
    bestMeaning: 'highest: more power',
    extreme: 'max',
    value: (v) => v.wheelPower,
  },
  {
    key: 'peakTorque',
    label: 'Peak crank torque',
    kind: 'torque',
    best: 'highest',
    bestMeaning: 'highest: more torque',
    extreme: 'max',
    value: (v) => v.torque,
  },
  {
    key: 'peakInjectorDuty',
    label: 'Peak injector duty',
    kind: 'fraction',
    best: 'lowest',
    bestMeaning: 'lowest: the most fuel left in hand',
    extreme: 'max',
    value: (v) => v.injectorDuty,
  },
  {
    key: 'peakCompressorOutletTemperature',
    label: 'Peak compressor outlet temperature',
    kind: 'temperature',
    best: 'lowest',
    bestMeaning: 'lowest: less heat for the intercooler and the charge',
    extreme: 'max',
    value: (v) => v.compressorOutletTemperature,
  },
  {
    key: 'peakPressureRatio',
    label: 'Peak pressure ratio',
    kind: 'ratio',
    best: 'lowest',
    bestMeaning: 'lowest: the least work asked of the compressor',
    extreme: 'max',
    value: (v) => v.pressureRatio,
  },
];

const severityRows: { key: CompareRowKey; label: string; severity: Severity; bestMeaning: string }[] = [
  { key: 'pointsAtLimit', label: 'Points at a limit', severity: 'limit', bestMeaning: 'lowest: fewest points with a finding at a limit' },
  { key: 'pointsWithWarnings', label: 'Points with warnings', severity: 'warning', bestMeaning: 'lowest: fewest points whose worst finding is a warning' },
  { key: 'pointsWithNotes', label: 'Points with notes only', severity: 'info', bestMeaning: 'lowest: fewest points whose worst finding is a note' },
];

interface ExhaustRowSpec {
  key: CompareRowKey;
  label: string;
  kind: WorkingKind;
  best: BestRule;
  bestMeaning: string;
  cell: (summary: ExhaustLineSummary, line: ComparableLine) => CompareCell;
}

const fromValueAtRpm = (v: ValueAtRpm | null): CompareCell => (v ? { value: v.value, rpm: v.rpm } : { value: null, rpm: null });

/** True when some point of the line computed the exhaust side (its turbine held the target or not). */
const exhaustComputed = (line: ComparableLine) => line.points.some((p) => p.solved && typeof p.values?.targetHeld === 'boolean');

const exhaustRows: ExhaustRowSpec[] = [
  {
    key: 'boostThresholdRpm',
    label: 'Boost threshold (full boost from)',
    kind: 'speed',
    best: 'lowest',
    bestMeaning: 'lowest: full boost arrives sooner (a line that never holds its target comes last)',
    // The value is itself an engine speed: no "at … rpm" beside it.
    cell: (s, line) =>
      s.boostThresholdRpm !== null
        ? { value: s.boostThresholdRpm, rpm: null }
        : s.boostAsked === false
          ? { value: null, rpm: null, note: 'no-boost-asked' }
          : exhaustComputed(line)
            ? { value: null, rpm: null, note: 'not-reached' }
            : { value: null, rpm: null },
  },
  {
    key: 'peakDrivePressureRatio',
    label: 'Peak drive pressure ratio',
    kind: 'ratio',
    best: 'lowest',
    bestMeaning: 'lowest: less pumping loss and less hot exhaust held back in the cylinders',
    cell: (s) => fromValueAtRpm(s.peakDrivePressureRatio),
  },
  {
    key: 'wastegateDiameterNeeded',
    label: 'Wastegate valve needed (each gate)',
    kind: 'length',
    best: 'lowest',
    bestMeaning: 'lowest: a smaller valve bleeds off what the turbine does not need',
    cell: (s) => fromValueAtRpm(s.wastegateDiameterNeeded),
  },
  {
    key: 'wastegateDiameterFitted',
    label: 'Wastegate valve fitted (each gate)',
    kind: 'length',
    best: 'none',
    bestMeaning: 'no best: read it beside the valve needed',
    cell: (s) => ({ value: s.wastegateDiameterFitted, rpm: null }),
  },
  {
    key: 'turbineInletPressureAtPeakPower',
    label: 'Turbine inlet pressure at peak power',
    kind: 'pressure',
    best: 'lowest',
    bestMeaning: 'lowest: less back-pressure on the engine where it makes its most power',
    cell: (s) => fromValueAtRpm(s.turbineInletPressureAtPeakPower),
  },
];

/**
 * The row keys in the order compareLines returns them when no compared line has an exhaust side
 * (compressor-only studies). With an exhaust side, EXHAUST_ROW_KEYS come in after
 * 'peakPressureRatio': see compareRowKeys.
 */
export const COMPARE_ROW_KEYS: readonly CompareRowKey[] = [
  'planVerdict',
  'minSurgeMargin',
  'minChokeMargin',
  'minSpeedMargin',
  'peakShaftSpeed',
  'peakBrakePower',
  'peakBrakePowerRpm',
  'peakWheelPower',
  'peakTorque',
  'peakInjectorDuty',
  'peakCompressorOutletTemperature',
  'peakPressureRatio',
  'pointsAtLimit',
  'pointsWithWarnings',
  'pointsWithNotes',
];

/** The exhaust rows, in order; compareLines adds them after 'peakPressureRatio' when some line has an exhaust side. */
export const EXHAUST_ROW_KEYS: readonly CompareRowKey[] = exhaustRows.map((r) => r.key);

/** Every row key in the order compareLines returns them, with or without the exhaust rows. */
export function compareRowKeys(withExhaust: boolean): CompareRowKey[] {
  if (!withExhaust) return [...COMPARE_ROW_KEYS];
  const at = COMPARE_ROW_KEYS.indexOf('peakPressureRatio') + 1;
  return [...COMPARE_ROW_KEYS.slice(0, at), ...EXHAUST_ROW_KEYS, ...COMPARE_ROW_KEYS.slice(at)];
}

/** Whether a point is past a limit: the compressor cannot deliver it, or it has a finding at a limit. */
function pastLimit(point: OperatingPoint): boolean {
  return point.values?.reachable === false || point.findings.some((f) => f.severity === 'limit');
}

/**
 * The point of a line with the smallest or largest value; the first such point (lowest rpm) on
 * ties. Unsolved points and values that are null or not finite are skipped, and so are points the
 * compressor cannot deliver unless `anyPoint` (margins, whose negative values are the news).
 */
function extremeOf(line: ComparableLine, value: (v: PointValues) => number | null, extreme: Extreme, anyPoint: boolean): CompareCell {
  let best: CompareCell = { value: null, rpm: null };
  let at: OperatingPoint | null = null;
  for (const point of line.points) {
    if (!point.solved || (!anyPoint && point.values.reachable === false)) continue;
    const x = value(point.values);
    if (x === null || !Number.isFinite(x)) continue;
    if (best.value === null || (extreme === 'min' ? x < best.value : x > best.value)) {
      best = { value: x, rpm: point.rpm };
      at = point;
    }
  }
  if (at && (pastLimit(at) || (anyPoint && best.value !== null && best.value < 0))) best.excluded = true;
  return best;
}

/** Points of the line whose worst finding has this severity. */
function countPoints(line: ComparableLine, severity: Severity): number {
  let n = 0;
  for (const point of line.points) {
    const worst = point.findings.reduce<Severity | null>(
      (w, f) => (w === 'limit' || f.severity === 'limit' ? 'limit' : w === 'warning' || f.severity === 'warning' ? 'warning' : 'info'),
      null,
    );
    if (worst === severity) n++;
  }
  return n;
}

/** Marks every cell of a line whose plan does not fit as excluded from best. */
function excludeUnfit(cells: CompareCell[], lines: readonly ComparableLine[]): CompareCell[] {
  return cells.map((c, i) => (lines[i]?.planVerdict === 'does-not-fit' ? { ...c, excluded: true } : c));
}

/** Values within this relative distance of each other are a tie (rounding in the engine, not a difference). */
const TIE_TOLERANCE = 1e-9;

function isTie(a: number, b: number): boolean {
  return Math.abs(a - b) <= TIE_TOLERANCE * Math.max(1, Math.abs(a), Math.abs(b));
}

/**
 * Indices of the best cells by the rule, among the cells not excluded; see CompareRow.bestIndices
 * for when there are none.
 */
export function bestIndicesOf(cells: readonly CompareCell[], rule: BestRule): number[] {
  if (rule === 'none') return [];
  const given = cells.flatMap((c, i) => (c.value === null ? [] : [{ i, value: c.value, excluded: c.excluded === true }]));
  if (given.length < 2) return [];
  const eligible = given.filter((c) => !c.excluded);
  if (eligible.length === 0) return [];
  const target = eligible.reduce((best, c) => (rule === 'highest' ? Math.max(best, c.value) : Math.min(best, c.value)), eligible[0].value);
  const winners = eligible.filter((c) => isTie(c.value, target)).map((c) => c.i);
  // Every value the same: there is nothing to choose.
  return given.every((c) => isTie(c.value, target)) ? [] : winners;
}

/**
 * Best cells of the boost threshold row: lowest speed wins, and a line that never holds its
 * target ranks after every line that does (it is not merely missing). Lines without an exhaust
 * side are left out.
 */
function thresholdBest(cells: readonly CompareCell[]): number[] {
  // Number.MAX_VALUE, not Infinity: it compares after every speed and is no tie with any of them.
  const ranked = cells.map((c) => (c.note === 'not-reached' ? { ...c, value: Number.MAX_VALUE } : c));
  return bestIndicesOf(ranked, 'lowest');
}

function exhaustRow(spec: ExhaustRowSpec, lines: readonly ComparableLine[]): CompareRow {
  const cells = excludeUnfit(
    lines.map((line): CompareCell => (line.exhaust ? spec.cell(line.exhaust, line) : { value: null, rpm: null, note: 'no-exhaust' })),
    lines,
  );
  const bestIndices = spec.key === 'boostThresholdRpm' ? thresholdBest(cells) : bestIndicesOf(cells, spec.best);
  return { key: spec.key, label: spec.label, kind: spec.kind, best: spec.best, bestMeaning: spec.bestMeaning, cells, bestIndices };
}

/**
 * The table of differences of some operating lines: one row per figure in compareRowKeys order,
 * one cell per line in the order given. Minimum margins and peaks come from the solved points;
 * exhaust figures from each line's exhaust summary, and only when at least one line has one
 * (otherwise the rows are exactly COMPARE_ROW_KEYS); finding counts from every point.
 */
export function compareLines(lines: readonly ComparableLine[]): CompareRow[] {
  const rows: CompareRow[] = [
    {
      key: 'planVerdict',
      label: 'Plan verdict',
      kind: 'none',
      best: 'none',
      bestMeaning: 'no best: read it first; best values are marked only for plans that fit',
      cells: lines.map((line) => ({ value: null, rpm: null, verdict: line.planVerdict ?? 'not-judged' })),
      bestIndices: [],
    },
  ];
  for (const spec of valueRows) {
    const cells = excludeUnfit(
      lines.map((line) => extremeOf(line, spec.value, spec.extreme, spec.margin === true)),
      lines,
    );
    rows.push({
      key: spec.key,
      label: spec.label,
      kind: spec.kind,
      best: spec.best,
      bestMeaning: spec.bestMeaning,
      cells,
      bestIndices: bestIndicesOf(cells, spec.best),
    });
    if (spec.key === 'peakBrakePower') {
      // Where the peak comes matters as much as its size, but neither end is "better" by itself.
      const rpmCells = cells.map((c) => ({ value: c.rpm, rpm: c.rpm }));
      rows.push({
        key: 'peakBrakePowerRpm',
        label: 'Engine speed of peak crank power',
        kind: 'speed',
        best: 'none',
        bestMeaning: 'no best: read it beside the peak crank power',
        cells: rpmCells,
        bestIndices: [],
      });
    }
    if (spec.key === 'peakPressureRatio' && lines.some((l) => l.exhaust)) {
      for (const x of exhaustRows) rows.push(exhaustRow(x, lines));
    }
  }
  if (lines.some((l) => l.drive)) {
    for (const spec of driveRows) {
      const cells = excludeUnfit(
        lines.map((line): CompareCell => {
          const value = line.drive ? spec.value(line.drive) : null;
          return value !== null ? { value, rpm: null } : { value: null, rpm: null, note: 'unknown' };
        }),
        lines,
      );
      rows.push({
        key: spec.key,
        label: spec.label,
        kind: 'none',
        best: 'lowest',
        bestMeaning: spec.bestMeaning,
        cells,
        bestIndices: bestIndicesOf(cells, 'lowest'),
      });
    }
  }
  for (const spec of severityRows) {
    const cells = excludeUnfit(
      lines.map((line) => ({ value: countPoints(line, spec.severity), rpm: null })),
      lines,
    );
    rows.push({
      key: spec.key,
      label: spec.label,
      kind: 'count',
      best: 'lowest',
      bestMeaning: spec.bestMeaning,
      cells,
      bestIndices: bestIndicesOf(cells, 'lowest'),
    });
  }
  return rows;
}
