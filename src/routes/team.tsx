import { useNavigate, useParams } from 'react-router';
import { TeamView } from '../features/team/components/TeamView';
import { paths } from '../lib/paths';

export function TeamRoute() {
  const { teamId = '' } = useParams();
  const navigate = useNavigate();
  return <TeamView key={teamId} teamId={teamId} onGone={() => navigate(paths.teams.href(), { replace: true })} />;
}
