import { useRef, useState } from 'react';
import { Link } from 'react-router';
import { Alert } from '#src/components/Alert';
import { Button } from '#src/components/Button';
import { Dialog } from '#src/components/Dialog';
import { isApiError } from '#src/lib/api-client';
import { paths } from '#src/lib/paths';
import { useDeleteMap } from '../api/delete-map';
import { mapInUseDetailsSchema } from '../api/schemas';

type Refusal = { message: string; studies: { id: string; title: string }[] };

/**
 * Deletes a team map after asking. While studies use the map the server refuses (409 `map_in_use`)
 * and names them: they are listed here as links, so the user can change their plans first.
 */
export function DeleteMap({ teamId, mapId, mapName, onDeleted }: { teamId: string; mapId: string; mapName: string; onDeleted: () => void }) {
  const remove = useDeleteMap(teamId, mapId);
  const [open, setOpen] = useState(false);
  const [refusal, setRefusal] = useState<Refusal | null>(null);
  const [error, setError] = useState<string | null>(null);
  const cancelRef = useRef<HTMLButtonElement>(null);

  function close() {
    if (remove.isPending) return;
    setOpen(false);
    setRefusal(null);
    setError(null);
  }

  function confirm() {
    setError(null);
    remove.mutate(undefined, {
      onSuccess: () => {
        setOpen(false);
        onDeleted();
      },
      onError: (caught) => {
        if (isApiError(caught) && caught.code === 'map_in_use') {
          const details = mapInUseDetailsSchema.safeParse(caught.details);
          return setRefusal({ message: caught.message, studies: details.success ? details.data.studies : [] });
        }
        setError(isApiError(caught) ? caught.message : 'Something went wrong. Try again.');
      },
    });
  }

  return (
    <>
      <Button variant="destructive" onClick={() => setOpen(true)}>
        Delete map
      </Button>
      <Dialog
        open={open}
        title={`Delete ${mapName}?`}
        description="The map leaves the team’s library for good. A map that studies use cannot be deleted; Spoolbook will name them."
        onClose={close}
        initialFocusRef={cancelRef}
      >
        {refusal && (
          <Alert tone="error" title="This map is in use, so it was not deleted.">
            <p>{refusal.message}</p>
            {refusal.studies.length > 0 && (
              <ul className="list-disc space-y-1 pl-5">
                {refusal.studies.map((study) => (
                  <li key={study.id}>
                    <Link to={paths.teamStudy.href(teamId, study.id)}>{study.title}</Link>
                  </li>
                ))}
              </ul>
            )}
          </Alert>
        )}
        {error && <Alert tone="error">{error}</Alert>}
        <div className="flex flex-wrap justify-end gap-3">
          <Button ref={cancelRef} onClick={close} disabled={remove.isPending}>
            {refusal ? 'Close' : 'Keep map'}
          </Button>
          {!refusal && (
            <Button variant="destructive" pending={remove.isPending} onClick={confirm}>
              Delete map
            </Button>
          )}
        </div>
      </Dialog>
    </>
  );
}
