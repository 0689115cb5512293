import { useParams } from 'react-router';
import { TracerWorkspace } from '../features/tracer/components/TracerWorkspace';

/** `/teams/:teamId/tracer/:draftId`: one trace in progress. */
export function TracerDraftRoute() {
  const { teamId = '', draftId = '' } = useParams();
  return <TracerWorkspace key={`${teamId}/${draftId}`} teamId={teamId} draftId={draftId} />;
}
