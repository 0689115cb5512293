import { useParams } from 'react-router';
import { TracerHome } from '../features/tracer/components/TracerHome';

/** `/teams/:teamId/tracer`: start a trace from a picture, or go on with one in progress. */
export function TracerRoute() {
  const { teamId = '' } = useParams();
  return <TracerHome key={teamId} teamId={teamId} />;
}
