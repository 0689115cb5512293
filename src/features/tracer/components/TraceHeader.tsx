import { Link } from 'react-router';
import { Alert } from '#src/components/Alert';
import { Button } from '#src/components/Button';
import { paths } from '#src/lib/paths';
import type { SyncStatus } from '../state/use-draft-sync';

function statusWords(status: SyncStatus): string {
  switch (status.kind) {
    case 'saved':
      return 'Draft saved';
    case 'pending':
      return 'Changes not saved yet…';
    case 'saving':
      return 'Saving the draft…';
    case 'error':
      return `Draft not saved: ${status.message}`;
    case 'conflict':
      return 'Draft changed elsewhere';
  }
}

/** The trace's name, whether the draft is saved, and undo and redo. */
export function TraceHeader({
  teamId,
  teamName,
  name,
  canEdit,
  status,
  onRetry,
  canUndo,
  canRedo,
  onUndo,
  onRedo,
}: {
  teamId: string;
  teamName: string | null;
  name: string;
  canEdit: boolean;
  status: SyncStatus;
  onRetry: () => void;
  canUndo: boolean;
  canRedo: boolean;
  onUndo: () => void;
  onRedo: () => void;
}) {
  return (
    <header className="flex flex-wrap items-end justify-between gap-4 border-b border-ink/15 pb-3">
      <div className="space-y-1">
        <p className="text-xs font-semibold uppercase tracking-[0.14em] text-copper-ink">
          <Link to={paths.teamTracer.href(teamId)} className="text-copper-ink">
            {teamName ? `${teamName} · Tracer` : 'Tracer'}
          </Link>
        </p>
        <h1 className="text-2xl font-semibold tracking-tight text-ink">{name}</h1>
      </div>
      <div className="flex flex-wrap items-center gap-2">
        {canEdit && (
          <p role="status" className={`text-sm ${status.kind === 'error' ? 'text-copper-ink' : 'text-ink-soft'}`}>
            {statusWords(status)}
            {status.kind === 'error' && (
              <Button variant="quiet" onClick={onRetry}>
                Try again
              </Button>
            )}
          </p>
        )}
        <Button onClick={onUndo} disabled={!canEdit || !canUndo} aria-keyshortcuts="Control+Z">
          Undo
        </Button>
        <Button onClick={onRedo} disabled={!canEdit || !canRedo} aria-keyshortcuts="Control+Shift+Z">
          Redo
        </Button>
      </div>
    </header>
  );
}

/** Someone saved the draft since it was opened: saving stops until the user chooses a version. */
export function ConflictAlert({ onTakeTheirs, onKeepMine }: { onTakeTheirs: () => void; onKeepMine: () => void }) {
  return (
    <Alert tone="error" title="This trace was saved elsewhere (another tab or another person) since you opened it.">
      <p>Saving has stopped so that neither version is lost without you choosing.</p>
      <div className="mt-2 flex flex-wrap gap-2">
        <Button onClick={onTakeTheirs}>Load the newer trace</Button>
        <Button variant="primary" onClick={onKeepMine}>
          Keep mine over it
        </Button>
      </div>
    </Alert>
  );
}
