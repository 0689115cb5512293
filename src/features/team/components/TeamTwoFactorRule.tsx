import { Link } from 'react-router';
import { can } from '#shared/permissions';
import type { TeamSummary } from '#shared/schemas/account';
import { Alert } from '#src/components/Alert';
import { Switch } from '#src/components/Switch';
import { paths } from '#src/lib/paths';
import { useSetTeamTwoFactor } from '../api/set-team-two-factor';

const whatMembersSee =
  'Members without one cannot open the team’s studies, maps or members: they see a message that takes them to set one up, and they can still leave the team.';

/**
 * Whether the team asks every member to use a second factor. Owners flip it (once they have one
 * themselves); everyone else reads which way it is set.
 */
export function TeamTwoFactorRule({ team, ownerHasSecondFactor }: { team: TeamSummary; ownerHasSecondFactor: boolean }) {
  const required = team.requireTwoFactor ?? false;
  if (!can(team.role, 'team:require-two-factor')) {
    return (
      <p className="text-sm text-ink-soft" data-testid="team-two-factor-state">
        {required
          ? `This team asks every member to use a second factor (an authenticator app at sign-in). ${whatMembersSee}`
          : 'This team does not ask its members to use a second factor. You may still turn one on for your own account.'}{' '}
        <Link to={paths.settings.href('second-factor')}>Your second factor</Link>
      </p>
    );
  }
  return <OwnerSwitch teamId={team.id} required={required} ownerHasSecondFactor={ownerHasSecondFactor} />;
}

function OwnerSwitch({ teamId, required, ownerHasSecondFactor }: { teamId: string; required: boolean; ownerHasSecondFactor: boolean }) {
  const setRule = useSetTeamTwoFactor(teamId);
  const shown = setRule.isPending ? (setRule.variables ?? required) : required;
  // Turning it off stays possible whatever the owner's own account has.
  const blocked = !ownerHasSecondFactor && !required;
  return (
    <div className="space-y-3">
      <Switch
        label="Members must use a second factor"
        description={`${shown ? 'On: every member signs in with a code from an authenticator app.' : 'Off: a password is enough.'} ${whatMembersSee}`}
        checked={shown}
        pending={setRule.isPending}
        disabled={blocked}
        onChange={(next) => setRule.mutate(next)}
      />
      {blocked && (
        <p className="text-sm text-ink-soft">
          Turn on your own second factor first, so that the rule cannot lock you out:{' '}
          <Link to={paths.settings.href('second-factor')}>set up a second factor</Link>.
        </p>
      )}
      {setRule.isError && <Alert tone="error">{setRule.error.message}</Alert>}
    </div>
  );
}
