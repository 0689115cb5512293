import { Link } from 'react-router';
import { Alert } from '#src/components/Alert';
import { Loading, Page } from '#src/components/Page';
import { SecondFactorNeededPage } from '#src/components/SecondFactorNotice';
import { isApiError, isTwoFactorRequired } from '#src/lib/api-client';
import { paths } from '#src/lib/paths';
import { useDraft } from '../api/get-draft';
import { useTeamAccess } from '#src/lib/team-access';
import { TraceEditor } from './TraceEditor';

/** One trace in progress: loads the draft, then hands it to the editor. */
export function TracerWorkspace({ teamId, draftId }: { teamId: string; draftId: string }) {
  const draft = useDraft(teamId, draftId);
  const access = useTeamAccess(teamId);
  const { teamName } = access;
  const canEdit = access.can('content:write');
  if (draft.isPending) return <Loading label="Loading the trace…" />;
  if (isTwoFactorRequired(draft.error)) return <SecondFactorNeededPage title="Tracer" teamName={teamName} />;
  if (draft.isError) {
    const missing = isApiError(draft.error) && (draft.error.status === 404 || draft.error.status === 403);
    return (
      <Page title={missing ? 'Trace not found' : 'Tracer'}>
        <Alert tone="error" title={missing ? 'This trace does not exist, or it is not in a team of yours.' : 'Could not load the trace.'}>
          {!missing && <p>{draft.error.message}</p>}
          <p>
            <Link to={paths.teamTracer.href(teamId)}>Back to the Tracer</Link>
          </p>
        </Alert>
      </Page>
    );
  }
  return <TraceEditor teamId={teamId} teamName={teamName} draft={draft.data} canEdit={canEdit} />;
}
