import { useMemo } from 'react';
import type { Severity } from '#shared/matching/finding';
import { planColour } from '#src/components/plots/style';
import { groupFindings, localizeMessage } from '#src/components/study/FindingsList';
import type { StudyLine } from '#src/components/study/lines';
import { formatNumber, useUnitSystem } from '#src/lib/quantities';

const SECTIONS: { severity: Severity; title: string; mark: string }[] = [
  { severity: 'limit', title: 'Limits crossed', mark: 'bg-limit text-white' },
  { severity: 'warning', title: 'Warnings', mark: 'bg-copper-ink text-white' },
  { severity: 'info', title: 'Notes', mark: 'bg-teal-light text-teal-dark' },
];

function speeds(rpms: readonly number[]): string {
  const sorted = [...rpms].sort((a, b) => a - b);
  return sorted.length === 1 ? `${formatNumber(sorted[0], 21)} rpm` : `${sorted.length} speeds: ${sorted.map((r) => formatNumber(r, 21)).join(', ')} rpm`;
}

/** Every finding for paper: grouped by severity, each with its line and every engine speed it was raised at. */
export function PrintFindings({ lines }: { lines: readonly StudyLine[] }) {
  const system = useUnitSystem();
  const groups = useMemo(() => groupFindings(lines), [lines]);
  if (groups.length === 0) return <p className="text-sm text-ink-soft">No findings: every point is inside its map with no limit crossed.</p>;
  return (
    <div className="space-y-4">
      {SECTIONS.map(({ severity, title, mark }) => {
        const list = groups.filter((g) => g.severity === severity);
        if (list.length === 0) return null;
        return (
          <section key={severity} className="space-y-1.5" aria-label={title}>
            <h3 className="flex items-center gap-2 text-sm font-semibold text-ink">
              <span className={`rounded px-1.5 py-0.5 text-xs font-bold uppercase tracking-wide ${mark}`}>{severity}</span>
              {title} ({list.length})
            </h3>
            <ul className="space-y-1 text-sm">
              {list.map((g) => (
                <li key={g.id} className="report-finding flex gap-2 border-b border-paper-line/70 pb-1">
                  <span
                    aria-hidden="true"
                    className="mt-1.5 inline-block size-2.5 shrink-0 rounded-full"
                    style={{ background: planColour(g.line.planIndex) }}
                  />
                  <span>
                    <span className="text-ink">{localizeMessage(g.finding.message, system)}</span>
                    <span className="block text-xs text-ink-soft">
                      {g.line.label} · {speeds(g.rpms)}
                    </span>
                  </span>
                </li>
              ))}
            </ul>
          </section>
        );
      })}
    </div>
  );
}
