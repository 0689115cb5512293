import { kindOfPath } from '#shared/study/diff';
import { asSentence } from '#src/lib/forms';
import { describePath } from '#src/features/studies/lib/describe-path';
import { localizeIssue } from '#src/features/studies/lib/localize-issue';
import { useUnitSystem } from '#src/lib/quantities';

/** The draft's problems in one list: the plots keep showing the last valid inputs meanwhile. */
export function ProblemsSummary({ issues, draft }: { issues: Record<string, string>; draft: unknown }) {
  const unitSystem = useUnitSystem();
  const entries = Object.entries(issues);
  if (entries.length === 0) return null;
  return (
    <div role="alert" className="rounded-md border border-copper/60 bg-copper-light/60 px-4 py-3 text-sm text-ink" data-testid="input-problems">
      <p className="font-semibold">
        {entries.length === 1 ? 'One input needs attention' : `${entries.length} inputs need attention`}: the plots show the last inputs that made sense.
      </p>
      <ul className="mt-1 list-disc space-y-0.5 pl-5 text-ink-soft">
        {entries.slice(0, 8).map(([path, message]) => (
          <li key={path}>
            <span className="font-medium text-ink">{describePath(path, draft)}</span>:{' '}
            {asSentence(localizeIssue(message, kindOfPath(path.split('.').map((k) => (/^\d+$/.test(k) ? Number(k) : k))) ?? 'text', unitSystem))}
          </li>
        ))}
        {entries.length > 8 && <li>…and {entries.length - 8} more, marked beside their fields.</li>}
      </ul>
    </div>
  );
}
