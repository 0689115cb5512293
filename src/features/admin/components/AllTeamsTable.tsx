import { Link } from 'react-router';
import { Alert } from '#src/components/Alert';
import { Badge } from '#src/components/Badge';
import { Loading } from '#src/components/Page';
import { Table, td, th } from '#src/components/Table';
import { roleNames } from '#src/lib/format';
import { paths } from '#src/lib/paths';
import { useAllTeams } from '../api/get-all-teams';

export function AllTeamsTable() {
  const teams = useAllTeams();
  if (teams.data === undefined) {
    return teams.isError ? <Alert tone="error">{teams.error.message}</Alert> : <Loading label="Loading teams…" />;
  }
  return (
    <Table
      caption={`${teams.data.length} ${teams.data.length === 1 ? 'team' : 'teams'}`}
      head={
        <tr>
          <th scope="col" className={th}>
            Team
          </th>
          <th scope="col" className={th}>
            Kind
          </th>
          <th scope="col" className={th}>
            Second factor
          </th>
          <th scope="col" className={th}>
            Your role
          </th>
        </tr>
      }
    >
      {teams.data.map((team) => (
        <tr key={team.id}>
          <th scope="row" className={`${td} font-semibold`}>
            <Link to={paths.team.href(team.id)}>{team.name}</Link>
          </th>
          <td className={td}>{team.personal ? <Badge>Personal</Badge> : 'Shared'}</td>
          <td className={`${td} text-ink-soft`}>{team.requireTwoFactor ? 'Required of members' : 'Not required'}</td>
          <td className={`${td} text-ink-soft`}>{team.role ? roleNames[team.role] : 'Not a member'}</td>
        </tr>
      ))}
    </Table>
  );
}
