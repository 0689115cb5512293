import { useMemo } from 'react';
import { REQUIREMENT_DEFAULTS, type Requirements } from '#shared/matching/input/requirements';
import { planVerdicts, reasonWhere, VERDICT_WORDS, type PlanVerdict, type VerdictReason, type VerdictStatus } from '#shared/matching/verdict';
import type { PlanDriveFigures } from '#shared/study/compare';
import { sameRpm, type PointRef, type StudyLine } from './lines';
import { PlanSwatch } from './PlanSwatch';
import { formatNumber } from '#src/lib/quantities';

/** How each verdict looks: a stamp in the notebook's inks, red only where a limit is crossed. */
const STAMP: Record<VerdictStatus, { mark: string; stamp: string; edge: string }> = {
  fits: { mark: '✓', stamp: 'border-teal text-teal-dark bg-teal-light/60', edge: 'border-l-teal' },
  'fits-with-warnings': { mark: '!', stamp: 'border-copper text-copper-ink bg-copper-light/60', edge: 'border-l-copper' },
  'does-not-fit': { mark: '✕', stamp: 'border-limit text-limit bg-limit-light', edge: 'border-l-limit' },
  'not-judged': { mark: '?', stamp: 'border-ink/30 text-ink-soft bg-paper-deep/60', edge: 'border-l-ink/30' },
};

/** A verdict as a small stamp: "✕ Does not fit". */
export function VerdictStamp({ status, className = '' }: { status: VerdictStatus; className?: string }) {
  const look = STAMP[status];
  return (
    <span
      className={`inline-flex shrink-0 items-center gap-1 whitespace-nowrap rounded-sm border-2 px-1.5 py-px text-xs font-bold uppercase tracking-wide ${look.stamp} ${className}`}
      data-verdict={status}
    >
      <span aria-hidden="true">{look.mark}</span>
      {VERDICT_WORDS[status]}
    </span>
  );
}

/** The verdicts of the plans of some study lines, in plan order. */
export function verdictsOfLines(lines: readonly StudyLine[]): PlanVerdict[] {
  return planVerdicts({ lines: lines.map((l) => l.line) });
}

/** What a verdict says after its status, when it names no single reason: the headline's own words. */
function summaryWords(v: PlanVerdict): string {
  const prefix = `${VERDICT_WORDS[v.status]}: `;
  return v.headline.startsWith(prefix) ? v.headline.slice(prefix.length) : v.headline;
}

/** The first point a reason names: its line (plan, scenario, boost row) at its lowest engine speed. */
export function reasonPoint(lines: readonly StudyLine[], planIndex: number, reason: VerdictReason): PointRef | null {
  const candidates = lines.filter((l) => l.planIndex === planIndex && l.scenarioIndex === reason.scenarioIndex && l.line.rowLabel === reason.rowLabel);
  // Two boost rows may share a label: the one with this finding at that speed is the one meant.
  const line =
    candidates.find((l) => l.line.points.some((p) => sameRpm(p.rpm, reason.fromRpm) && p.findings.some((f) => f.code === reason.code))) ?? candidates[0];
  return line ? { lineKey: line.key, rpm: reason.fromRpm } : null;
}

function ReasonText({ reason }: { reason: VerdictReason }) {
  return (
    <>
      <span className="font-semibold">{reason.words}</span> <span>{reasonWhere(reason)}</span>
    </>
  );
}

/** "81 of 138 points at a limit · 3 with warnings"; empty when every point is clear. */
export function pointsText(v: Pick<PlanVerdict, 'pointsAtLimit' | 'pointsWithWarnings'>, total: number): string {
  const parts: string[] = [];
  if (v.pointsAtLimit > 0) parts.push(`${formatNumber(v.pointsAtLimit, 21)} of ${formatNumber(total, 21)} points at a limit`);
  if (v.pointsWithWarnings > 0)
    parts.push(
      parts.length > 0
        ? `${formatNumber(v.pointsWithWarnings, 21)} with warnings`
        : `${formatNumber(v.pointsWithWarnings, 21)} of ${formatNumber(total, 21)} points with warnings`,
    );
  return parts.join(' · ');
}

function ReasonButton({ reason, onSelect, selected }: { reason: VerdictReason; onSelect: () => void; selected: boolean }) {
  return (
    <button
      type="button"
      onClick={onSelect}
      aria-pressed={selected}
      className={`w-full rounded px-1.5 py-0.5 text-left hover:bg-paper-deep/50 ${selected ? 'bg-teal-light/70' : ''}`}
      title="Show this point on the plots and its Working"
    >
      <ReasonText reason={reason} />
    </button>
  );
}

/** The time-to-boost line of a plan whose study has a car: the figure, or why there is none. */
function TimeToBoost({ drive }: { drive: PlanDriveFigures }) {
  return (
    <p className="mt-0.5 text-xs text-ink-soft @3xl:pl-[calc(10rem+0.75rem)]" data-testid="verdict-time-to-boost">
      Time to 90 % boost with the study&apos;s car:{' '}
      {drive.timeToBoost !== null ? (
        <span className="numeric font-semibold text-ink">{formatNumber(drive.timeToBoost, 3)} s</span>
      ) : (
        `unknown (${drive.timeToBoostWhy})`
      )}
    </p>
  );
}

function PlanVerdictRow({
  verdict,
  lines,
  selected,
  onSelect,
  drive,
}: {
  verdict: PlanVerdict;
  lines: readonly StudyLine[];
  selected: PointRef | null;
  onSelect?: (point: PointRef) => void;
  drive?: PlanDriveFigures;
}) {
  const [first, ...more] = verdict.reasons;
  const point = (r: VerdictReason) => reasonPoint(lines, verdict.planIndex, r);
  const isSelected = (r: VerdictReason) => {
    const p = point(r);
    return p !== null && selected !== null && p.lineKey === selected.lineKey && sameRpm(p.rpm, selected.rpm);
  };
  const select = (r: VerdictReason) => {
    const p = point(r);
    if (p && onSelect) onSelect(p);
  };
  const judgedWithoutMap = verdict.status === 'not-judged';
  const total = lines.reduce((n, l) => (l.planIndex === verdict.planIndex ? n + l.line.points.length : n), 0);
  const counts = pointsText(verdict, total);
  return (
    <li
      className={`rounded-md border border-l-4 border-paper-line bg-white/80 px-3 py-2 ${STAMP[verdict.status].edge}`}
      data-testid={`verdict-plan-${verdict.planIndex}`}
      data-verdict={verdict.status}
    >
      <div className="flex flex-wrap items-start gap-x-3 gap-y-1">
        <span className="flex min-w-[10rem] items-center gap-1.5 font-semibold text-ink">
          <PlanSwatch index={verdict.planIndex} />
          {verdict.planName}
        </span>
        <VerdictStamp status={verdict.status} />
        {counts && <span className="numeric ml-auto whitespace-nowrap pt-0.5 text-xs text-ink-soft @3xl:order-last">{counts}</span>}
        <div className="min-w-0 basis-full text-sm text-ink @3xl:basis-0 @3xl:flex-1" data-testid="verdict-reason">
          {first && !judgedWithoutMap ? (
            onSelect ? (
              <ReasonButton reason={first} onSelect={() => select(first)} selected={isSelected(first)} />
            ) : (
              <ReasonText reason={first} />
            )
          ) : (
            <span className="px-1.5 text-ink-soft">{summaryWords(verdict)}</span>
          )}
        </div>
      </div>
      {more.length > 0 && !judgedWithoutMap && onSelect && (
        <details className="mt-1 @3xl:pl-[calc(10rem+0.75rem)]">
          <summary className="cursor-pointer text-xs text-ink-soft marker:text-ink-faint hover:text-teal-dark">
            {more.length} more {more.length === 1 ? 'reason' : 'reasons'}
          </summary>
          <ul className="mt-1 space-y-0.5 text-sm">
            {more.map((r, i) => (
              <li key={`${r.code}|${r.scenarioIndex}|${r.rowLabel}|${i}`} className="flex items-start gap-1.5">
                <span
                  aria-label={r.severity === 'limit' ? 'limit' : 'warning'}
                  className={`mt-1.5 inline-block size-2 shrink-0 rounded-full ${r.severity === 'limit' ? 'bg-limit' : 'bg-copper'}`}
                />
                <ReasonButton reason={r} onSelect={() => select(r)} selected={isSelected(r)} />
              </li>
            ))}
          </ul>
        </details>
      )}
      {more.length > 0 && !judgedWithoutMap && !onSelect && (
        <p className="mt-0.5 text-xs text-ink-soft @3xl:pl-[calc(10rem+0.75rem)]">
          and {more.length} more {more.length === 1 ? 'reason' : 'reasons'}, every one among the findings
        </p>
      )}
      {drive && <TimeToBoost drive={drive} />}
    </li>
  );
}

/** The margins the verdicts applied, in words: "surge 5 %, choke 5 %, speed 3 % (common-practice defaults)". */
export function requiredMarginsText(requirements: Requirements | undefined): string {
  const r = requirements ?? REQUIREMENT_DEFAULTS;
  const pct = (x: number) => `${formatNumber(x * 100, 3)} %`;
  const defaults =
    r.minSurgeMargin === REQUIREMENT_DEFAULTS.minSurgeMargin &&
    r.minChokeMargin === REQUIREMENT_DEFAULTS.minChokeMargin &&
    r.minSpeedMargin === REQUIREMENT_DEFAULTS.minSpeedMargin;
  return `surge ${pct(r.minSurgeMargin)}, choke ${pct(r.minChokeMargin)}, speed ${pct(r.minSpeedMargin)}${defaults ? ' (common-practice defaults)' : ''}`;
}

/**
 * One verdict per plan, first thing on a study: fits, fits with warnings, does not fit or not
 * judged, with its first reason and where. With `onSelect` every reason is a button that selects
 * its first point (the plots ring it, the Working shows it) and the other reasons fold open on
 * demand; without it (paper) the first reason stands alone with a count of the rest.
 */
export function PlanVerdicts({
  lines,
  selected = null,
  onSelect,
  drive,
}: {
  lines: readonly StudyLine[];
  selected?: PointRef | null;
  onSelect?: (point: PointRef) => void;
  /** Each plan's drive figures by plan index, when the study has a car: the time to boost joins its verdict. */
  drive?: readonly PlanDriveFigures[] | null;
}) {
  const verdicts = useMemo(() => verdictsOfLines(lines), [lines]);
  if (verdicts.length === 0) return null;
  const requirements = lines[0]?.line.context.requirements;
  return (
    <section aria-labelledby="plan-verdicts-title" className="@container space-y-2" data-testid="plan-verdicts">
      <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-0.5">
        <h2 id="plan-verdicts-title" className="text-lg font-semibold text-ink">
          Verdict by plan
        </h2>
        <p className="text-xs text-ink-soft">Every point of every scenario and boost row, against the required margins: {requiredMarginsText(requirements)}.</p>
      </div>
      <ul className="space-y-1.5">
        {verdicts.map((v) => (
          <PlanVerdictRow key={v.planIndex} verdict={v} lines={lines} selected={selected} onSelect={onSelect} drive={drive?.[v.planIndex]} />
        ))}
      </ul>
    </section>
  );
}
