import { useMemo, useState } from 'react';
import type { StudyDetail } from '#shared/schemas/study';
import { diffDocuments } from '#shared/study/diff';
import { Alert } from '#src/components/Alert';
import { Button } from '#src/components/Button';
import { Dialog } from '#src/components/Dialog';
import { TextField } from '#src/components/TextField';
import { isApiError } from '#src/lib/api-client';
import { formatDateTime } from '#src/lib/format';
import { ChangeList } from './ChangeList';

/**
 * Someone saved the study after the revision this editor started from. Nothing is lost
 * silently: the user loads their version (and drops theirs, knowingly), keeps theirs as a new
 * study, or goes back to editing.
 */
export function ConflictDialog({
  theirs,
  mine,
  baseRevision,
  title,
  onLoadTheirs,
  onKeepMineAsCopy,
  onClose,
}: {
  theirs: StudyDetail | null;
  mine: unknown;
  baseRevision: number;
  title: string;
  onLoadTheirs: (theirs: StudyDetail) => void;
  onKeepMineAsCopy: (title: string) => Promise<unknown>;
  onClose: () => void;
}) {
  const [copying, setCopying] = useState(false);
  const [copyTitle, setCopyTitle] = useState(`${title} (my version)`.slice(0, 120));
  const [pending, setPending] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const changes = useMemo(() => (theirs ? diffDocuments(theirs.document, mine) : []), [theirs, mine]);

  if (!theirs) return null;
  const who = theirs.updatedBy ?? 'Someone';

  async function keepCopy() {
    const t = copyTitle.trim();
    if (!t) return setError('Give the copy a title.');
    setPending(true);
    setError(null);
    try {
      await onKeepMineAsCopy(t);
    } catch (e) {
      setError(isApiError(e) ? e.message : 'The copy could not be made. Your changes are still here; try again.');
    } finally {
      setPending(false);
    }
  }

  return (
    <Dialog
      open
      title="Someone saved this study first"
      onClose={() => !pending && onClose()}
      description={
        <p data-testid="conflict-description">
          {who} saved revision {theirs.revision} at {formatDateTime(theirs.updatedAt)}, after revision {baseRevision} that your changes start from. Your changes
          are <strong>not saved</strong>.
        </p>
      }
    >
      <div className="space-y-4">
        <div className="space-y-1">
          <p className="text-sm font-semibold text-ink">Their revision {theirs.revision} against your changes</p>
          <ChangeList
            changes={changes}

            beforeLabel="Theirs"
            afterLabel="Yours"
            limit={6}
            caption="Differences between their saved version and yours"
          />
        </div>
        {error && <Alert tone="error">{error}</Alert>}
        {copying ? (
          <form
            className="space-y-3"
            onSubmit={(e) => {
              e.preventDefault();
              void keepCopy();
            }}
          >
            <TextField label="Title of your copy" name="copyTitle" value={copyTitle} onChange={(e) => setCopyTitle(e.target.value)} maxLength={120} />
            <div className="flex flex-wrap justify-end gap-2">
              <Button onClick={() => setCopying(false)} disabled={pending}>
                Back
              </Button>
              <Button type="submit" variant="primary" pending={pending}>
                Save mine as a new study
              </Button>
            </div>
          </form>
        ) : (
          <div className="flex flex-col gap-2">
            <Button variant="primary" onClick={() => setCopying(true)}>
              Keep mine as a copy
            </Button>
            <Button variant="destructive" onClick={() => onLoadTheirs(theirs)}>
              Load their version (discards mine)
            </Button>
            <Button variant="quiet" onClick={onClose}>
              Back to editing (nothing saved)
            </Button>
          </div>
        )}
      </div>
    </Dialog>
  );
}
