import { useMemo } from 'react';
import type { Finding, FindingCode, Severity } from '../../../shared/matching/types';
import type { UnitSystem } from '../../lib/units';
import { formatNumber } from '../plots/quantities';
import { planColour } from '../plots/style';
import { sameRpm, type PointRef, type StudyLine } from './lines';
import { formatStudyValue } from './units';

/** One finding of one line, at every rpm where it was raised. */
export interface FindingGroup {
  id: string;
  severity: Severity;
  code: FindingCode;
  line: StudyLine;
  /** The first point's finding (its message is the one shown). */
  finding: Finding;
  rpms: number[];
}

const ORDER: Severity[] = ['limit', 'warning', 'info'];

const SEVERITY_TEXT: Record<Severity, { title: string; hint: string }> = {
  limit: { title: 'Limits crossed', hint: 'Hard limits: surge, overspeed, saturated injectors, stated limits.' },
  warning: { title: 'Warnings', hint: 'Close to a limit, or outside what the map or common practice covers.' },
  info: { title: 'Notes', hint: 'Worth knowing; usually expected (part throttle, light load).' },
};

/** The findings of the lines, one group per line and kind of finding, most severe first. */
export function groupFindings(lines: readonly StudyLine[]): FindingGroup[] {
  const groups = new Map<string, FindingGroup>();
  for (const line of lines) {
    for (const point of line.line.points) {
      for (const f of point.findings) {
        // Input findings repeat the same words on every line; key by message too so different ones stay apart.
        const id = `${line.key}|${f.code}|${f.severity}${f.code === 'input-out-of-range' ? `|${f.message.replace(/[\d.,−-]+/g, '#')}` : ''}`;
        const group = groups.get(id);
        if (group) {
          if (!group.rpms.some((r) => sameRpm(r, point.rpm))) group.rpms.push(point.rpm);
        } else groups.set(id, { id, severity: f.severity, code: f.code, line, finding: f, rpms: [point.rpm] });
      }
    }
  }
  return [...groups.values()].sort((a, b) => ORDER.indexOf(a.severity) - ORDER.indexOf(b.severity));
}

/**
 * A finding's words in the user's units. The engine words its messages in SI ("478 K (205 °C)",
 * "250 kPa"); for US customary those amounts are rewritten, the rest of the sentence stays.
 */
export function localizeMessage(message: string, system: UnitSystem): string {
  if (system === 'si') return message;
  return message
    .replace(/(-?[\d.]+(?:e[-+]?\d+)?) K \(−?-?[\d.]+ °C\)/g, (_m, kelvin: string) => formatStudyValue(Number(kelvin), 'temperature', system))
    .replace(/(−|-)?([\d.]+(?:e[-+]?\d+)?) kPa/g, (_m, minus: string | undefined, kpa: string) => formatStudyValue((minus ? -1 : 1) * Number(kpa) * 1000, 'pressure', system));
}

function rpmSpan(rpms: number[]): string {
  const sorted = [...rpms].sort((a, b) => a - b);
  const first = formatNumber(sorted[0], 21);
  return sorted.length === 1 ? `at ${first} rpm` : `at ${sorted.length} speeds, ${first}–${formatNumber(sorted[sorted.length - 1], 21)} rpm`;
}

const SEVERITY_STYLE: Record<Severity, { mark: string; box: string }> = {
  limit: { mark: 'bg-limit text-white', box: 'border-limit/40' },
  warning: { mark: 'bg-copper text-white', box: 'border-copper/40' },
  info: { mark: 'bg-teal-light text-teal-dark', box: 'border-paper-line' },
};

/**
 * The findings of a study grouped by severity (red only for limits). Clicking one selects its
 * first point (or the speed clicked): the map, the curves and the table highlight it.
 */
export function FindingsList({
  lines,
  unitSystem,
  selected,
  onSelect,
}: {
  lines: readonly StudyLine[];
  unitSystem: UnitSystem;
  selected: PointRef | null;
  onSelect: (point: PointRef) => void;
}) {
  const groups = useMemo(() => groupFindings(lines), [lines]);
  if (groups.length === 0) {
    return <p className="text-sm text-ink-soft">No findings: every point is inside the map with no limit crossed.</p>;
  }
  return (
    <div className="space-y-3" data-testid="findings">
      {ORDER.map((severity) => {
        const list = groups.filter((g) => g.severity === severity);
        if (list.length === 0) return null;
        const text = SEVERITY_TEXT[severity];
        return (
          <details key={severity} open={severity !== 'info'} className="group">
            <summary className="flex cursor-pointer items-baseline gap-2 py-1 marker:text-ink-faint">
              <span className={`rounded px-1.5 py-0.5 text-xs font-bold uppercase tracking-wide ${SEVERITY_STYLE[severity].mark}`}>{severity}</span>
              <span className="font-semibold text-ink">
                {text.title} ({list.length})
              </span>
              <span className="hidden text-xs text-ink-faint sm:inline">{text.hint}</span>
            </summary>
            <ul className="mt-1 space-y-1.5">
              {list.map((g) => {
                const isSelected = selected !== null && selected.lineKey === g.line.key && g.rpms.some((r) => sameRpm(r, selected.rpm));
                return (
                  <li key={g.id} className={`rounded-md border bg-white/70 text-sm ${SEVERITY_STYLE[severity].box} ${isSelected ? 'ring-2 ring-teal' : ''}`}>
                    <button
                      type="button"
                      onClick={() => onSelect({ lineKey: g.line.key, rpm: Math.min(...g.rpms) })}
                      className="block w-full px-3 pt-2 text-left hover:bg-paper-deep/40"
                      aria-label={`${localizeMessage(g.finding.message, unitSystem)} ${g.line.label}, ${rpmSpan(g.rpms)}. Show on the plots.`}
                    >
                      <span className="flex items-start gap-2">
                        <span aria-hidden="true" className="mt-1.5 inline-block size-2.5 shrink-0 rounded-full" style={{ background: planColour(g.line.planIndex) }} />
                        <span>
                          <span className="text-ink">{localizeMessage(g.finding.message, unitSystem)}</span>
                          <span className="block text-xs text-ink-soft">
                            {g.line.label} · {rpmSpan(g.rpms)}
                          </span>
                        </span>
                      </span>
                    </button>
                    {g.rpms.length > 1 ? (
                      <div className="flex flex-wrap gap-1 px-3 pb-2 pl-7 pt-1" role="group" aria-label="Speeds">
                        {[...g.rpms]
                          .sort((a, b) => a - b)
                          .map((rpm) => {
                            const here = selected !== null && selected.lineKey === g.line.key && sameRpm(selected.rpm, rpm);
                            return (
                              <button
                                key={rpm}
                                type="button"
                                aria-pressed={here}
                                onClick={() => onSelect({ lineKey: g.line.key, rpm })}
                                className={`numeric rounded border px-1.5 py-0.5 text-xs ${here ? 'border-teal bg-teal text-white' : 'border-ink/15 bg-white text-ink-soft hover:border-teal hover:text-teal-dark'}`}
                              >
                                {formatNumber(rpm, 21)}
                              </button>
                            );
                          })}
                      </div>
                    ) : (
                      <div className="pb-2" />
                    )}
                  </li>
                );
              })}
            </ul>
          </details>
        );
      })}
    </div>
  );
}
