import { Navigate } from 'react-router';
import { Alert } from '../components/Alert';
import { Page } from '../components/Page';
import { useCurrentTeamId } from '../lib/current-team';
import { paths } from '../lib/paths';

/** `/maps`: the map library of the current team (the last one used, else the personal team). */
export function MapsRoute() {
  const teamId = useCurrentTeamId();
  if (teamId) return <Navigate to={paths.teamMaps.href(teamId)} replace />;
  return (
    <Page title="Maps">
      <Alert tone="info">Maps belong to a team. Create a team or accept an invitation to one to start a map library.</Alert>
    </Page>
  );
}
