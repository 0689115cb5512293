import { useMemo, useState } from 'react';
import type { StudyDetail } from '#shared/schemas/study';
import { diffDocuments } from '#shared/study/diff';
import { Alert } from '#src/components/Alert';
import { Badge } from '#src/components/Badge';
import { ConfirmButton } from '#src/components/ConfirmButton';
import { Loading } from '#src/components/Page';
import { formatDateTime } from '#src/lib/format';
import { useRevision } from '#src/features/studies/api/get-revision';
import { useRevisions } from '#src/features/studies/api/get-revisions';
import { useRestoreRevision } from '#src/features/studies/api/restore-revision';
import { staleRevisionOf } from '#src/features/studies/api/save-study';
import { ChangeList } from './ChangeList';

/**
 * Every saved revision (author, time, message). Pick two to see what changed between them;
 * editors restore an old one, which saves its inputs as a new revision (nothing is rewritten).
 */
export function HistoryPanel({
  teamId,
  studyId,
  currentRevision,
  baseRevision,
  canRestore,
  dirty,
  onRestored,
  onConflict,
}: {
  teamId: string;
  studyId: string;
  currentRevision: number;
  baseRevision: number;
  canRestore: boolean;
  dirty: boolean;
  onRestored: (study: StudyDetail) => void;
  onConflict: (theirs: StudyDetail) => void;
}) {
  const revisions = useRevisions(teamId, studyId);
  const restore = useRestoreRevision(teamId, studyId);
  const [picked, setPicked] = useState<number[]>([]);
  const [older, newer] = [...picked].sort((a, b) => a - b);
  const olderRev = useRevision(teamId, studyId, picked.length === 2 ? older : null);
  const newerRev = useRevision(teamId, studyId, picked.length === 2 ? newer : null);
  const changes = useMemo(
    () => (olderRev.data && newerRev.data ? diffDocuments(olderRev.data.document, newerRev.data.document) : null),
    [olderRev.data, newerRev.data],
  );

  function toggle(revision: number) {
    setPicked((p) => (p.includes(revision) ? p.filter((r) => r !== revision) : [...p.slice(-1), revision]));
  }

  if (revisions.isPending) return <Loading label="Loading the history…" />;
  if (revisions.isError) return <Alert tone="error">{revisions.error.message}</Alert>;

  return (
    <div className="space-y-4" data-testid="history-panel">
      <p className="text-sm text-ink-soft">Tick two revisions to see what changed between them.</p>
      <ol className="divide-y divide-paper-line rounded-md border border-paper-line bg-white/80">
        {revisions.data.map((r) => (
          <li key={r.revision} className="flex flex-wrap items-start gap-3 px-3 py-2" data-revision={r.revision}>
            <input
              type="checkbox"
              checked={picked.includes(r.revision)}
              onChange={() => toggle(r.revision)}
              aria-label={`Compare revision ${r.revision}`}
              className="mt-1 size-4 accent-teal"
            />
            <div className="min-w-0 flex-1">
              <p className="font-semibold text-ink">
                Revision {r.revision} {r.revision === currentRevision && <Badge tone="teal">latest</Badge>}
              </p>
              <p className="text-sm text-ink-soft">
                {r.author ?? 'Someone'} · <time dateTime={r.createdAt}>{formatDateTime(r.createdAt)}</time>
              </p>
              {r.message && <p className="text-sm text-ink">“{r.message}”</p>}
            </div>
            {canRestore && r.revision !== currentRevision && (
              <ConfirmButton
                variant="quiet"
                confirmVariant="primary"
                title={`Restore revision ${r.revision}?`}
                description={`Its inputs are saved as a new revision ${currentRevision + 1}; every revision stays in the history.${dirty ? ' Your unsaved changes on this page are dropped.' : ''}`}
                confirmLabel={`Restore revision ${r.revision}`}
                cancelLabel="Keep as is"
                aria-label={`Restore revision ${r.revision}`}
                onConfirm={async () => {
                  try {
                    onRestored(await restore.mutateAsync({ revision: r.revision, baseRevision }));
                  } catch (error) {
                    const theirs = staleRevisionOf(error);
                    if (theirs) return onConflict(theirs);
                    throw error;
                  }
                }}
              >
                Restore
              </ConfirmButton>
            )}
          </li>
        ))}
      </ol>
      {picked.length === 2 && (
        <section aria-label={`Changes from revision ${older} to ${newer}`} className="space-y-2">
          <h4 className="font-semibold text-ink">
            From revision {older} to {newer}
          </h4>
          {changes ? (
            <ChangeList
              changes={changes}

              beforeLabel={`Revision ${older}`}
              afterLabel={`Revision ${newer}`}
              caption={`Changes from revision ${older} to ${newer}`}
            />
          ) : olderRev.isError || newerRev.isError ? (
            <Alert tone="error">{(olderRev.error ?? newerRev.error)?.message}</Alert>
          ) : (
            <Loading label="Loading both revisions…" />
          )}
        </section>
      )}
    </div>
  );
}
