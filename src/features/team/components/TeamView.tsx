import { Link } from 'react-router';
import { can, type Permission } from '#shared/permissions';
import type { TeamDetail, TeamSummary } from '#shared/schemas/account';
import { Alert } from '#src/components/Alert';
import { Badge } from '#src/components/Badge';
import { Card } from '#src/components/Card';
import { ConfirmButton } from '#src/components/ConfirmButton';
import { Loading, Page } from '#src/components/Page';
import { SecondFactorNeeded } from '#src/components/SecondFactorNotice';
import { isApiError, isTwoFactorRequired } from '#src/lib/api-client';
import { roleAbilities, roleNames } from '#src/lib/format';
import { paths } from '#src/lib/paths';
import { useMe } from '#src/lib/session';
import { useDeleteTeam } from '../api/delete-team';
import { useTeam } from '../api/get-team';
import { useLeaveTeam } from '../api/leave-team';
import { InviteForm } from './InviteForm';
import { MembersTable } from './MembersTable';
import { PendingInvitations } from './PendingInvitations';
import { RenameTeamForm } from './RenameTeamForm';
import { TeamActivity } from './TeamActivity';
import { TeamArchive } from './TeamArchive';
import { TeamTwoFactorRule } from './TeamTwoFactorRule';

/**
 * A team's page. What it offers follows the user's role: owners manage members, invitations
 * and the team; editors and viewers see the members and may leave; a site admin who is not a
 * member only looks.
 */
export function TeamView({ teamId, onGone }: { teamId: string; onGone: () => void }) {
  const team = useTeam(teamId);
  const me = useMe();

  // Data first: a failed background refetch keeps the page; the next action reports the problem.
  if (team.data !== undefined) return <TeamDetailView detail={team.data} onGone={onGone} />;
  if (team.isPending) return <Loading label="Loading the team…" />;
  if (isTwoFactorRequired(team.error)) {
    return <SecondFactorNeededView teamId={teamId} summary={me.data?.teams.find((t) => t.id === teamId) ?? null} onGone={onGone} />;
  }
  const missing = isApiError(team.error) && (team.error.status === 404 || team.error.status === 403);
  return (
    <Page title={missing ? 'Team not found' : 'Team'}>
      <Alert tone="error" title={missing ? 'This team does not exist, or you are not a member of it.' : 'Could not load the team.'}>
        {!missing && <p>{team.error.message}</p>}
        <p>
          <Link to={paths.teams.href()}>Back to your teams</Link>
        </p>
      </Alert>
    </Page>
  );
}

/** A member of a team that asks for a second factor they have not turned on: why, the way to the set-up, and the door. */
function SecondFactorNeededView({ teamId, summary, onGone }: { teamId: string; summary: TeamSummary | null; onGone: () => void }) {
  const name = summary?.name ?? null;
  return (
    <Page eyebrow="Team" title={name ?? 'Team'} width="narrow">
      <SecondFactorNeeded teamName={name} />
      {summary && !summary.personal && (
        <Card title="Leave the team">
          <p className="mb-4 text-sm text-ink-soft">If you would rather not use a second factor, you can leave the team instead.</p>
          <LeaveTeam teamId={teamId} teamName={summary.name} onLeft={onGone} />
        </Card>
      )}
    </Page>
  );
}

function TeamDetailView({ detail, onGone }: { detail: TeamDetail; onGone: () => void }) {
  const { team, members, invitations } = detail;
  const me = useMe();
  const may = (permission: Permission) => can(team.role, permission);
  const canDelete = may('team:delete');
  // The owner of a personal team keeps it: there is no leaving it.
  const canLeave = may('team:leave') && !(team.personal && canDelete);

  return (
    <Page
      eyebrow="Team"
      title={team.name}
      description={
        team.role ? (
          <>
            You are {team.role === 'owner' ? 'an' : 'a'} {roleNames[team.role].toLowerCase()} here: you can {roleAbilities[team.role]}.
          </>
        ) : (
          'You are not a member of this team; as a site admin you can see it.'
        )
      }
      actions={team.personal ? <Badge>Personal team</Badge> : undefined}
    >
      <Card title={`Members (${members.length})`}>
        <MembersTable teamId={team.id} members={members} currentUserId={me.data?.user.id ?? null} canManage={may('members:change-role')} />
      </Card>

      <Card title="Second factor">
        <TeamTwoFactorRule team={team} ownerHasSecondFactor={me.data?.user.twoFactor ?? false} />
      </Card>

      {may('members:invite') && (
        <Card title="Invitations">
          <div className="space-y-6">
            <InviteForm teamId={team.id} />
            <PendingInvitations teamId={team.id} invitations={invitations} />
          </div>
        </Card>
      )}

      {may('team:rename') && (
        <Card title="Team name">
          <RenameTeamForm key={team.name} team={team} />
        </Card>
      )}

      {may('team:export') && (
        <Card title="Archive">
          <TeamArchive teamId={team.id} />
        </Card>
      )}

      {may('audit:read') && (
        <Card title="Activity">
          <TeamActivity teamId={team.id} />
        </Card>
      )}

      {(canLeave || canDelete) && (
        <Card title={canDelete && !team.personal ? 'Leave or delete' : 'Leave the team'}>
          <div className="flex flex-wrap items-start gap-6">
            {canLeave && <LeaveTeam teamId={team.id} teamName={team.name} onLeft={onGone} />}
            {canDelete &&
              (team.personal ? (
                <p className="text-sm text-ink-soft">Your personal team cannot be deleted.</p>
              ) : (
                <DeleteTeam teamId={team.id} teamName={team.name} onDeleted={onGone} />
              ))}
          </div>
        </Card>
      )}
    </Page>
  );
}

function LeaveTeam({ teamId, teamName, onLeft }: { teamId: string; teamName: string; onLeft: () => void }) {
  const leave = useLeaveTeam(teamId);
  return (
    <div className="space-y-2">
      <ConfirmButton
        title={`Leave ${teamName}?`}
        description="You lose access to this team's studies and maps. An owner can invite you again."
        confirmLabel="Leave team"
        cancelLabel="Stay"
        onConfirm={async () => {
          await leave.mutateAsync();
          onLeft();
        }}
      >
        Leave team
      </ConfirmButton>
    </div>
  );
}

function DeleteTeam({ teamId, teamName, onDeleted }: { teamId: string; teamName: string; onDeleted: () => void }) {
  const remove = useDeleteTeam(teamId);
  return (
    <ConfirmButton
      title={`Delete ${teamName}?`}
      description="The team, its studies and its maps are deleted for every member. This cannot be undone."
      confirmLabel="Delete team"
      cancelLabel="Keep team"
      onConfirm={async () => {
        await remove.mutateAsync();
        onDeleted();
      }}
    >
      Delete team
    </ConfirmButton>
  );
}
