import { Link } from 'react-router';
import type { SavedToLibrary } from '#shared/tracer/api';
import type { TraceArea, TraceBuild, TraceProblem } from '#shared/tracer/build';
import { Alert } from '#src/components/Alert';
import { Button } from '#src/components/Button';
import { paths } from '#src/lib/paths';

const AREA_WORDS: Record<TraceArea, string> = { map: 'The map', axes: 'Axes', lines: 'Lines', file: 'The file' };

/** The problems of the trace, each a button that goes to where it is fixed. */
export function TraceProblemList({ problems, onGo }: { problems: readonly TraceProblem[]; onGo: (problem: TraceProblem) => void }) {
  return (
    <ol
      aria-label="Problems of the map file"
      className="max-h-[26rem] divide-y divide-paper-line overflow-y-auto rounded-md border border-paper-line bg-white/80"
    >
      {problems.map((problem, i) => (
        <li key={i}>
          <button type="button" onClick={() => onGo(problem)} className="block w-full px-3 py-2 text-left text-sm hover:bg-teal-light/40">
            <span className="font-semibold text-copper-ink">{AREA_WORDS[problem.area]}:</span> <span className="text-ink">{problem.message}</span>
          </button>
        </li>
      ))}
    </ol>
  );
}

/**
 * Step 4: the file. Every problem the upload check finds, in the Tracer's words and places; when
 * there are none, save to the map library (the picture is kept with the map) or download the file.
 */
export function FilePanel({
  teamId,
  build,
  canEdit,
  saving,
  saveError,
  saved,
  onSave,
  onDownload,
  onGo,
}: {
  teamId: string;
  build: TraceBuild;
  canEdit: boolean;
  saving: boolean;
  saveError: string | null;
  saved: SavedToLibrary | null;
  onSave: () => void;
  onDownload: () => void;
  onGo: (problem: TraceProblem) => void;
}) {
  const ready = build.result.ok && build.problems.length === 0;
  const lines = build.lines.length;
  const points = build.lines.reduce((n, l) => n + l.points.length, 0);
  return (
    <div className="space-y-4">
      {ready ? (
        <Alert tone="success" title="The file is ready: it passes every check an upload gets.">
          <p>
            {lines} {lines === 1 ? 'line' : 'lines'}, {points} rows. Saving adds it to the team’s map library and keeps the picture with it.
          </p>
        </Alert>
      ) : (
        <div className="space-y-2">
          <h3 className="font-semibold text-ink">
            {build.problems.length} {build.problems.length === 1 ? 'thing' : 'things'} to fix before the file can be saved
          </h3>
          <TraceProblemList problems={build.problems} onGo={onGo} />
        </div>
      )}

      {saved && (
        <Alert tone="success" title={`Saved “${saved.map.name}” to the map library.`}>
          <p>
            <Link to={paths.teamMap.href(teamId, saved.map.id)}>Open the map</Link>
          </p>
          <p>Changes from here on stay in this trace; save again to add them to the library as another map.</p>
        </Alert>
      )}
      {saveError && <Alert tone="error">{saveError}</Alert>}

      <div className="flex flex-wrap gap-2">
        {canEdit && (
          <Button variant="primary" onClick={onSave} disabled={!ready} pending={saving}>
            Save to library
          </Button>
        )}
        <Button onClick={onDownload}>Download CSV</Button>
      </div>
      {!ready && <p className="text-xs text-ink-soft">The download is the file as it stands, problems and all, for a look in a text editor.</p>}
    </div>
  );
}
