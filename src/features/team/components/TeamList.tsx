import { Link } from 'react-router';
import type { TeamSummary } from '#shared/schemas/account';
import { Badge } from '#src/components/Badge';
import { roleNames } from '#src/lib/format';
import { paths } from '#src/lib/paths';

/** The teams the user belongs to, each a link to its page. */
export function TeamList({ teams }: { teams: readonly TeamSummary[] }) {
  if (teams.length === 0) {
    return <p className="text-ink-soft">You are not in any team yet.</p>;
  }
  return (
    <ul className="grid gap-3 sm:grid-cols-2">
      {teams.map((team) => (
        <li key={team.id}>
          <Link
            to={paths.team.href(team.id)}
            className="group flex h-full items-center justify-between gap-3 rounded-lg border border-paper-line bg-white/75 px-4 py-3 no-underline shadow-sm hover:border-teal hover:no-underline"
          >
            <span className="font-semibold text-ink group-hover:text-teal-dark">{team.name}</span>
            <span className="flex shrink-0 gap-1.5">
              {team.personal && <Badge>Personal</Badge>}
              {team.role && <Badge tone={team.role === 'owner' ? 'teal' : 'neutral'}>{roleNames[team.role]}</Badge>}
            </span>
          </Link>
        </li>
      ))}
    </ul>
  );
}
