import type { DocumentChange } from '#shared/study/diff';
import { formatStudyValue, type UnitSystem, useUnitSystem } from '#src/lib/quantities';

/** A changed value in the user's units; whole plans, scenarios and rows by their name. */
export function changeValueText(change: DocumentChange, value: unknown, system: UnitSystem): string {
  if (value === undefined) return '—';
  // A map cleared from a plan is stored as null.
  if (value === null) return 'none';
  if (typeof value === 'object' && !Array.isArray(value)) {
    const named = value as { name?: unknown; label?: unknown };
    const name = typeof named.name === 'string' ? named.name : typeof named.label === 'string' ? named.label : null;
    return name ? `“${name}”` : '(a group of settings)';
  }
  if (change.kind === 'text' && typeof value === 'string') return value === '' ? '(empty)' : `“${value.length > 80 ? `${value.slice(0, 80)}…` : value}”`;
  if (typeof value === 'number' || Array.isArray(value)) return formatStudyValue(value, change.kind === 'text' ? null : change.kind, system);
  return String(value);
}

/** What changed between two documents: one line per change, before and after in the user's units. */
export function ChangeList({
  changes,
  beforeLabel,
  afterLabel,
  limit,
  caption,
}: {
  changes: readonly DocumentChange[];
  beforeLabel: string;
  afterLabel: string;
  /** Show at most this many, with a count of the rest. */
  limit?: number;
  caption: string;
}) {
  const unitSystem = useUnitSystem();
  if (changes.length === 0) return <p className="text-sm text-ink-soft">No differences in the inputs.</p>;
  const shown = limit ? changes.slice(0, limit) : changes;
  return (
    <div className="space-y-1">
      <div className="max-h-80 overflow-auto rounded-md border border-paper-line bg-white/80">
        <table className="w-full border-collapse text-left text-sm" data-testid="change-list">
          <caption className="sr-only">{caption}</caption>
          <thead className="sticky top-0 bg-paper text-xs uppercase tracking-wider text-ink-soft">
            <tr>
              <th scope="col" className="px-2 py-1.5 font-semibold">
                What
              </th>
              <th scope="col" className="px-2 py-1.5 font-semibold">
                {beforeLabel}
              </th>
              <th scope="col" className="px-2 py-1.5 font-semibold">
                {afterLabel}
              </th>
            </tr>
          </thead>
          <tbody className="divide-y divide-paper-line">
            {shown.map((c, i) => (
              <tr key={`${c.path}-${i}`}>
                <th scope="row" className="px-2 py-1.5 font-normal text-ink">
                  {c.path}
                  {c.change !== 'changed' && <span className="ml-1 text-xs text-ink-faint">({c.change})</span>}
                </th>
                <td className="numeric px-2 py-1.5 text-ink-soft">{changeValueText(c, c.before, unitSystem)}</td>
                <td className="numeric px-2 py-1.5 font-semibold text-ink">{changeValueText(c, c.after, unitSystem)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {limit && changes.length > limit && <p className="text-xs text-ink-soft">…and {changes.length - limit} more.</p>}
    </div>
  );
}
