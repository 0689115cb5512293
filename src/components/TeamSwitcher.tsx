import { useId } from 'react';
import { useLocation, useNavigate } from 'react-router';
import { rememberTeam, useCurrentTeamId } from '../lib/current-team';
import { useMe } from '../lib/session';

/**
 * Where a team switch leads: the same area of the other team (`/teams/B/maps` from
 * `/teams/A/maps/x`, since x belongs to A), the other team's page from a team page, or nowhere
 * (the page stays) outside team-scoped pages.
 */
export function pathForTeamSwitch(pathname: string, teamId: string): string | null {
  const match = /^\/teams\/[^/]+(?:\/([^/]+))?/.exec(pathname);
  if (!match) return null;
  const area = match[1];
  const team = `/teams/${encodeURIComponent(teamId)}`;
  return area ? `${team}/${area}` : team;
}

/** Chooses the team that Maps and Studies open in; shown only to people in more than one team. */
export function TeamSwitcher() {
  const id = useId();
  const me = useMe();
  const currentTeamId = useCurrentTeamId();
  const navigate = useNavigate();
  const { pathname } = useLocation();
  const teams = (me.data?.teams ?? []).filter((team) => team.role !== null);
  if (teams.length < 2) return null;
  const known = teams.some((team) => team.id === currentTeamId);

  function choose(teamId: string) {
    rememberTeam(teamId);
    const next = pathForTeamSwitch(pathname, teamId);
    if (next && next !== pathname) navigate(next);
  }

  return (
    <div className="flex items-center gap-2">
      <label htmlFor={id} className="text-sm font-semibold text-ink-soft">
        Team
      </label>
      <select
        id={id}
        value={known ? (currentTeamId ?? '') : ''}
        onChange={(event) => choose(event.target.value)}
        className="max-w-60 truncate rounded-md border border-ink/25 bg-white/80 py-1 pl-2 pr-7 text-sm text-ink focus:border-teal"
      >
        {!known && (
          <option value="" disabled>
            Choose a team
          </option>
        )}
        {teams.map((team) => (
          <option key={team.id} value={team.id}>
            {team.personal ? `${team.name} (personal)` : team.name}
          </option>
        ))}
      </select>
    </div>
  );
}
