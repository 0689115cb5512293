/**
 * The verdict: one judgment per plan (and per operating line) from its findings and the study's
 * required margins. A plan does not fit when any of its points crosses a limit (the compressor
 * cannot deliver it, a hard limit of the engine or fuel system is crossed); it fits with warnings
 * when a margin is thinner than required or another warning stands; it fits otherwise. A plan
 * without a compressor map is not judged on the compressor: its margins are unknown.
 */
import type { FindingCode, Severity } from './finding';
import type { OperatingLine, StudyResult } from './result';

export type VerdictStatus = 'fits' | 'fits-with-warnings' | 'does-not-fit' | 'not-judged';

/** One reason of a verdict: one kind of finding on one operating line, with the engine speeds it covers. */
export interface VerdictReason {
  code: FindingCode;
  severity: Exclude<Severity, 'info'>;
  /** Short words for the reason: "past choke". */
  words: string;
  scenarioIndex: number;
  scenarioName: string;
  rowLabel: string;
  /** Whether the scenario has more than one boost row (then the row is named where the reason is told). */
  namesRow: boolean;
  /** Lowest and highest engine speed with this finding, rpm. */
  fromRpm: number;
  toRpm: number;
  /** Points of the line with this finding. */
  points: number;
  /** The finding reaches the line's last engine speed. */
  toEnd: boolean;
}

export interface Verdict {
  status: VerdictStatus;
  /** Every reason, the first one first (see `firstReason`). */
  reasons: VerdictReason[];
  /** Points with at least one finding at a limit. */
  pointsAtLimit: number;
  /** Points with a warning and no limit. */
  pointsWithWarnings: number;
  /** The verdict in one line: "Does not fit: past choke from 4,750 rpm at “1,500 m, 35 °C”". */
  headline: string;
}

export interface PlanVerdict extends Verdict {
  planIndex: number;
  planName: string;
}

export const VERDICT_WORDS: Record<VerdictStatus, string> = {
  fits: 'Fits',
  'fits-with-warnings': 'Fits with warnings',
  'does-not-fit': 'Does not fit',
  'not-judged': 'Not judged',
};

/**
 * Words for each finding a verdict may name, in order of importance: where two reasons cover as
 * many points, the earlier one comes first.
 */
const REASON_WORDS: Partial<Record<FindingCode, string>> = {
  overspeed: 'over the speed limit',
  'map-left-of-surge': 'left of surge',
  'map-beyond-choke': 'past choke',
  'map-above-top-speed': 'above the map',
  'map-off-map': 'outside the speed lines',
  unsolvable: 'cannot be computed',
  'injector-saturated': 'injectors saturated',
  'injector-no-flow': 'no pressure across the injectors',
  'injector-duty-limit': 'injector duty over the limit',
  'fuel-pump-short': 'fuel pump too small',
  'lean-under-boost-limit': 'lean under boost',
  'compressor-outlet-temperature-limit': 'outlet temperature over the stated limit',
  'rpm-limit': "over the engine's rpm limit",
  'manifold-pressure-limit': 'manifold pressure over the stated limit',
  'surge-margin-thin': 'surge margin thinner than required',
  'choke-margin-thin': 'choke margin thinner than required',
  'speed-margin-thin': 'speed margin thinner than required',
  'lean-under-boost': 'leaner under boost than accepted',
  'compressor-outlet-temperature-high': 'outlet temperature above what the study accepts',
  'injector-duty-high': 'injector duty high',
  'fuel-pump-near-limit': 'fuel pump near its limit',
  'off-map-assumption': 'computed on the off-map efficiency assumption',
  'efficiency-off-map': 'no efficiency on the map',
  'boost-target-not-held': 'boost target not held',
  'wastegate-too-small': 'wastegate too small',
  'drive-pressure-ratio-high': 'drive pressure ratio high',
  'turbine-off-map': 'off the turbine map',
  'turbine-efficiency-assumed': 'turbine efficiency assumed',
  'turbine-map-missing': 'no turbine map',
  'turbine-housing-mismatch': 'turbine housing unlike the map',
  'exhaust-not-converged': 'exhaust side approximate',
  'not-converged': 'not settled',
  'input-out-of-range': 'an input outside the usual range',
};
const IMPORTANCE = Object.keys(REASON_WORDS) as FindingCode[];

const rank = (code: FindingCode) => {
  const i = IMPORTANCE.indexOf(code);
  return i === -1 ? IMPORTANCE.length : i;
};

/** "5,000": engine speeds in reasons, whole rpm with thousands marked. */
function rpmText(rpm: number): string {
  return Math.round(rpm).toLocaleString('en-US');
}

/** Where a reason holds, in words: "from 4,750 rpm at “1,500 m, 35 °C”". */
export function reasonWhere(r: VerdictReason): string {
  const speeds =
    r.points === 1 ? `at ${rpmText(r.fromRpm)} rpm` : r.toEnd ? `from ${rpmText(r.fromRpm)} rpm` : `at ${rpmText(r.fromRpm)}–${rpmText(r.toRpm)} rpm`;
  const row = r.namesRow ? `, ${r.rowLabel}` : '';
  return `${speeds} at “${r.scenarioName}${row}”`;
}

/** A reason in one line: "past choke from 4,750 rpm at “1,500 m, 35 °C”". */
export function reasonText(r: VerdictReason): string {
  return `${r.words} ${reasonWhere(r)}`;
}

function lineReasons(line: OperatingLine, namesRow: boolean): VerdictReason[] {
  const byCode = new Map<FindingCode, VerdictReason>();
  const lastRpm = line.points.length > 0 ? line.points[line.points.length - 1].rpm : 0;
  for (const point of line.points) {
    const seen = new Set<FindingCode>();
    for (const f of point.findings) {
      if (f.severity === 'info' || seen.has(f.code)) continue;
      seen.add(f.code);
      const reason = byCode.get(f.code);
      if (reason) {
        // A limit and a warning with one code (never in practice) count as the limit.
        if (f.severity === 'limit') reason.severity = 'limit';
        reason.toRpm = point.rpm;
        reason.points += 1;
        reason.toEnd = point.rpm === lastRpm;
      } else {
        byCode.set(f.code, {
          code: f.code,
          severity: f.severity,
          words: REASON_WORDS[f.code] ?? f.code,
          scenarioIndex: line.scenarioIndex,
          scenarioName: line.scenarioName,
          rowLabel: line.rowLabel,
          namesRow,
          fromRpm: point.rpm,
          toRpm: point.rpm,
          points: 1,
          toEnd: point.rpm === lastRpm,
        });
      }
    }
  }
  return [...byCode.values()];
}

/**
 * Orders reasons: limits before warnings; then the kind of finding that covers the most points
 * over all the lines (the plan's main trouble); then importance; then the lowest engine speed.
 */
function orderReasons(reasons: VerdictReason[]): VerdictReason[] {
  const extent = new Map<string, number>();
  for (const r of reasons) extent.set(r.code, (extent.get(r.code) ?? 0) + r.points);
  return [...reasons].sort(
    (a, b) =>
      (a.severity === b.severity ? 0 : a.severity === 'limit' ? -1 : 1) ||
      extent.get(b.code)! - extent.get(a.code)! ||
      rank(a.code) - rank(b.code) ||
      a.fromRpm - b.fromRpm ||
      a.scenarioIndex - b.scenarioIndex,
  );
}

function countPoints(lines: readonly OperatingLine[]): { atLimit: number; withWarnings: number } {
  let atLimit = 0;
  let withWarnings = 0;
  for (const line of lines) {
    for (const point of line.points) {
      if (point.findings.some((f) => f.severity === 'limit')) atLimit++;
      else if (point.findings.some((f) => f.severity === 'warning')) withWarnings++;
    }
  }
  return { atLimit, withWarnings };
}

/** The verdict of some operating lines taken together (one plan's, or one line's). */
export function verdictOf(lines: readonly OperatingLine[], rowsPerScenario: (scenarioIndex: number) => number = () => 1): Verdict {
  const reasons = orderReasons(lines.flatMap((line) => lineReasons(line, rowsPerScenario(line.scenarioIndex) > 1)));
  const { atLimit, withWarnings } = countPoints(lines);
  const judged = lines.some((l) => l.context.hasMap);
  let status: VerdictStatus;
  if (reasons.some((r) => r.severity === 'limit')) status = 'does-not-fit';
  else if (!judged) status = 'not-judged';
  else if (reasons.length > 0) status = 'fits-with-warnings';
  else status = 'fits';
  const first = reasons[0];
  let headline: string;
  if (status === 'not-judged') {
    headline = `${VERDICT_WORDS[status]}: no compressor map, so surge, choke and speed margins are not checked${first ? ` (also ${reasonText(first)})` : ''}`;
  } else if (first) {
    const more = reasons.length - 1;
    headline = `${VERDICT_WORDS[status]}: ${reasonText(first)}${more > 0 ? ` (and ${more} more reason${more === 1 ? '' : 's'})` : ''}`;
  } else {
    headline = `${VERDICT_WORDS[status]}: every point on the map with the margins the study requires`;
  }
  return { status, reasons, pointsAtLimit: atLimit, pointsWithWarnings: withWarnings, headline };
}

/** The verdict of each plan of a study result, in plan order (plans with no lines are left out). */
export function planVerdicts(result: StudyResult): PlanVerdict[] {
  const rows = new Map<number, number>();
  for (const line of result.lines) rows.set(line.scenarioIndex, Math.max(rows.get(line.scenarioIndex) ?? 0, line.rowIndex + 1));
  const byPlan = new Map<number, OperatingLine[]>();
  for (const line of result.lines) {
    const list = byPlan.get(line.planIndex);
    if (list) list.push(line);
    else byPlan.set(line.planIndex, [line]);
  }
  return [...byPlan.entries()]
    .sort((a, b) => a[0] - b[0])
    .map(([planIndex, lines]) => ({ planIndex, planName: lines[0].planName, ...verdictOf(lines, (s) => rows.get(s) ?? 1) }));
}

/** Order of verdicts when ranking: what fits first. */
export const VERDICT_RANK: Record<VerdictStatus, number> = { fits: 0, 'fits-with-warnings': 1, 'not-judged': 2, 'does-not-fit': 3 };
