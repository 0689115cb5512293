import { Link, useNavigate } from 'react-router';
import { Alert } from '#src/components/Alert';
import { Badge } from '#src/components/Badge';
import { Button } from '#src/components/Button';
import { Card } from '#src/components/Card';
import { ConfirmButton } from '#src/components/ConfirmButton';
import { Loading, Page } from '#src/components/Page';
import { SecondFactorNeededPage } from '#src/components/SecondFactorNotice';
import { Table, td, th } from '#src/components/Table';
import { isApiError, isTwoFactorRequired } from '#src/lib/api-client';
import { formatDateTime } from '#src/lib/format';
import { paths } from '#src/lib/paths';
import { useDeleteDraft } from '../api/delete-draft';
import { useDrafts } from '../api/get-drafts';
import { usePictures } from '../api/get-pictures';
import { pictureUrl } from '../api/keys';
import { useTraceAgain } from '../api/start-trace';
import { useTeamAccess } from '#src/lib/team-access';
import { PictureDrop } from './PictureDrop';

/** The Tracer's start: a new trace from a picture, the traces in progress, and the pictures kept with saved maps. */
export function TracerHome({ teamId }: { teamId: string }) {
  const drafts = useDrafts(teamId);
  const pictures = usePictures(teamId);
  const access = useTeamAccess(teamId);
  const { teamName } = access;
  const canEdit = access.can('content:write');
  const remove = useDeleteDraft(teamId);
  const again = useTraceAgain(teamId);
  const navigate = useNavigate();

  if (isTwoFactorRequired(drafts.error)) return <SecondFactorNeededPage title="Tracer" teamName={teamName} />;
  if (drafts.isError) {
    const missing = isApiError(drafts.error) && (drafts.error.status === 404 || drafts.error.status === 403);
    return (
      <Page title="Tracer">
        <Alert tone="error" title={missing ? 'This team does not exist, or you are not a member of it.' : 'Could not load the traces.'}>
          {!missing && <p>{drafts.error.message}</p>}
          <p>
            <Link to={paths.teams.href()}>Your teams</Link>
          </p>
        </Alert>
      </Page>
    );
  }

  const kept = (pictures.data ?? []).filter((p) => p.mapId !== null);
  return (
    <Page
      eyebrow={
        <Link to={paths.teamMaps.href(teamId)} className="text-copper-ink">
          {teamName ? `${teamName} · Map library` : 'Map library'}
        </Link>
      }
      title="Tracer"
      description="Turn a picture of a compressor or turbine map into a map file: calibrate its axes, trace its lines, check the file, and save it to the map library with the picture."
    >
      {canEdit ? (
        <Card title="Start from a picture">
          <PictureDrop teamId={teamId} />
        </Card>
      ) : (
        <Alert tone="info">You can look at this team’s traces; editors and owners start and change them.</Alert>
      )}

      <Card title="Traces in progress" actions={drafts.data ? <Badge>{drafts.data.length}</Badge> : undefined}>
        {drafts.isPending ? (
          <Loading label="Loading the traces…" />
        ) : drafts.data.length === 0 ? (
          <p className="text-sm text-ink-soft">No traces yet. A trace is saved as you work, so you can stop half-way and come back to it here.</p>
        ) : (
          <Table
            caption="Traces in progress"
            captionHidden
            head={
              <tr>
                <th className={th}>Name</th>
                <th className={th}>Kind</th>
                <th className={th}>Traced</th>
                <th className={th}>Saved as</th>
                <th className={th}>Last changed</th>
                {canEdit && (
                  <th className={th}>
                    <span className="sr-only">Actions</span>
                  </th>
                )}
              </tr>
            }
          >
            {drafts.data.map((draft) => (
              <tr key={draft.id}>
                <th scope="row" className={`${td} font-semibold`}>
                  <Link to={paths.teamTracerDraft.href(teamId, draft.id)}>{draft.name}</Link>
                </th>
                <td className={td}>{draft.kind === 'compressor' ? 'Compressor' : 'Turbine'}</td>
                <td className={`${td} numeric`}>
                  {draft.curveCount} {draft.curveCount === 1 ? 'line' : 'lines'}, {draft.pointCount} {draft.pointCount === 1 ? 'point' : 'points'}
                </td>
                <td className={td}>
                  {draft.image.mapId ? (
                    <Link to={paths.teamMap.href(teamId, draft.image.mapId)}>{draft.image.mapName}</Link>
                  ) : (
                    <span className="text-ink-soft">not saved yet</span>
                  )}
                </td>
                <td className={`${td} text-ink-soft`}>
                  {formatDateTime(draft.updatedAt)}
                  {draft.createdBy ? ` · started by ${draft.createdBy}` : ''}
                </td>
                {canEdit && (
                  <td className={`${td} text-right`}>
                    <ConfirmButton
                      title={`Delete the trace “${draft.name}”?`}
                      description={
                        draft.image.mapId
                          ? 'The trace goes; the map saved from it stays in the library, with its picture.'
                          : 'The trace and its picture go. This cannot be undone.'
                      }
                      confirmLabel="Delete trace"
                      aria-label={`Delete the trace ${draft.name}`}
                      onConfirm={() => remove.mutateAsync(draft.id)}
                    >
                      Delete
                    </ConfirmButton>
                  </td>
                )}
              </tr>
            ))}
          </Table>
        )}
      </Card>

      {kept.length > 0 && (
        <Card title="Pictures kept with saved maps">
          <p className="mb-3 text-sm text-ink-soft">
            Each map saved from the Tracer keeps the picture it was traced from, to check it against or trace it again.
          </p>
          <ul className="divide-y divide-paper-line">
            {kept.map((picture) => (
              <li key={picture.id} className="flex flex-wrap items-center gap-3 py-2 text-sm">
                <Link to={paths.teamMap.href(teamId, picture.mapId!)} className="font-semibold">
                  {picture.mapName}
                </Link>
                <span className="numeric text-ink-soft">
                  {picture.width} × {picture.height} px, {picture.contentType === 'image/png' ? 'PNG' : 'JPEG'}
                </span>
                <a href={pictureUrl(teamId, picture.id)} target="_blank" rel="noreferrer" className="ml-auto">
                  View the picture
                </a>
                {canEdit && (
                  <Button
                    pending={again.isPending && again.variables?.imageId === picture.id}
                    onClick={() =>
                      again.mutate(
                        { imageId: picture.id, name: `${picture.mapName ?? 'Map'}, traced again` },
                        { onSuccess: (draft) => navigate(paths.teamTracerDraft.href(teamId, draft.id)) },
                      )
                    }
                  >
                    Trace again
                  </Button>
                )}
              </li>
            ))}
          </ul>
        </Card>
      )}
    </Page>
  );
}
