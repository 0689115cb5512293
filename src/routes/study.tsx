import { useParams } from 'react-router';
import { StudyWorkspace } from '../features/studies/components/workspace/StudyWorkspace';

/** One study: the workspace with plots in the centre and inputs beside them. */
export function StudyRoute() {
  const { teamId = '', studyId = '' } = useParams();
  return <StudyWorkspace key={`${teamId}/${studyId}`} teamId={teamId} studyId={studyId} />;
}
