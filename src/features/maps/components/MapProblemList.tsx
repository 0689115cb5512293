import { useId, type ReactNode } from 'react';
import type { MapFileProblem } from '../api/schemas';

const EXCERPT_LENGTH = 140;

/** Where a problem is, in words: `Line 17, column 3`, `Line 4` or `Whole file`. */
export function problemPlace(problem: Pick<MapFileProblem, 'line' | 'column'>): string {
  if (problem.line === null) return 'Whole file';
  return problem.column === null ? `Line ${problem.line}` : `Line ${problem.line}, column ${problem.column}`;
}

function excerpt(lines: readonly string[] | null | undefined, line: number | null): string | null {
  if (!lines || line === null) return null;
  const text = lines[line - 1];
  if (text === undefined || text.trim() === '') return null;
  return text.length > EXCERPT_LENGTH ? `${text.slice(0, EXCERPT_LENGTH)}…` : text;
}

/**
 * Every problem of a refused map file, one per row: where it is, what is wrong in plain words,
 * and (when the file is at hand) the line itself, so the fix can be made without counting lines.
 */
export function MapProblemList({
  title,
  intro,
  problems,
  lines,
}: {
  title: ReactNode;
  intro?: ReactNode;
  problems: readonly MapFileProblem[];
  /** The file's lines, to quote the line a problem is on. */
  lines?: readonly string[] | null;
}) {
  const headingId = useId();
  return (
    <section aria-labelledby={headingId} className="space-y-3 rounded-md border border-copper/50 bg-copper-light/30 p-4">
      <div className="space-y-1">
        <h3 id={headingId} className="font-semibold text-ink">
          {title}
        </h3>
        {intro && <p className="text-sm text-ink-soft">{intro}</p>}
      </div>
      <ol
        aria-label="Problems in the file"
        className="max-h-[28rem] divide-y divide-paper-line overflow-y-auto rounded-md border border-paper-line bg-white/80"
      >
        {problems.map((problem, index) => {
          const quoted = excerpt(lines, problem.line);
          return (
            <li key={`${index}-${problem.code}`} className="space-y-1 px-3 py-2 text-sm">
              <p>
                <span className="numeric font-semibold text-copper-ink">{problemPlace(problem)}:</span> <span className="text-ink">{problem.message}</span>
              </p>
              {quoted && (
                <pre className="overflow-x-auto whitespace-pre rounded bg-paper-deep/60 px-2 py-1 font-mono text-xs text-ink-soft">
                  <span className="sr-only">The line reads: </span>
                  {quoted}
                </pre>
              )}
            </li>
          );
        })}
      </ol>
    </section>
  );
}
