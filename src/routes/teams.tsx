import { useNavigate } from 'react-router';
import { Alert } from '../components/Alert';
import { Card } from '../components/Card';
import { Loading, Page } from '../components/Page';
import { ConfirmEmailNotice } from '../features/auth/components/ConfirmEmailNotice';
import { CreateTeamForm } from '../features/team/components/CreateTeamForm';
import { TeamList } from '../features/team/components/TeamList';
import { useTeams } from '../features/team/api/get-teams';
import { paths } from '../lib/paths';
import { useMe } from '../lib/session';

export function TeamsRoute() {
  const teams = useTeams();
  const navigate = useNavigate();
  const user = useMe().data?.user;
  return (
    <Page title="Teams" description="A team shares its studies and maps. Owners invite people and choose what each may do.">
      {user && !user.emailConfirmed && <ConfirmEmailNotice email={user.email} />}
      <Card title="Your teams">
        {teams.isPending && <Loading label="Loading teams…" />}
        {teams.isError && <Alert tone="error">{teams.error.message}</Alert>}
        {/* A site admin is answered every team; this page lists only the ones they belong to. */}
        {teams.data && <TeamList teams={teams.data.filter((team) => team.role !== null)} />}
      </Card>
      <Card title="Create a team">
        <CreateTeamForm onCreated={(team) => navigate(paths.team.href(team.id))} />
      </Card>
    </Page>
  );
}
