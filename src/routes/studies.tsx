import { Navigate } from 'react-router';
import { Alert } from '../components/Alert';
import { Page } from '../components/Page';
import { useCurrentTeamId } from '../lib/current-team';
import { paths } from '../lib/paths';

/** "Studies" opens the current team's study list. */
export function StudiesRoute() {
  const teamId = useCurrentTeamId();
  if (teamId) return <Navigate to={paths.teamStudies.href(teamId)} replace />;
  return (
    <Page title="Studies">
      <Alert tone="info">Studies belong to a team. Create or join a team first, on the Team page.</Alert>
    </Page>
  );
}
