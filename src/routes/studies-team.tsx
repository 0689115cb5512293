import { useParams } from 'react-router';
import { StudyList } from '../features/studies/components/StudyList';

/** A team's study list. */
export function StudiesTeamRoute() {
  const { teamId = '' } = useParams();
  return <StudyList key={teamId} teamId={teamId} />;
}
