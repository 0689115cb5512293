import { useState } from 'react';
import { roleSchema, type Member, type Role } from '#shared/schemas/account';
import { Alert } from '#src/components/Alert';
import { Badge } from '#src/components/Badge';
import { Button } from '#src/components/Button';
import { ConfirmButton } from '#src/components/ConfirmButton';
import { SelectField } from '#src/components/SelectField';
import { Table, td, th } from '#src/components/Table';
import { isApiError } from '#src/lib/api-client';
import { formatDateTime, roleNames } from '#src/lib/format';
import { useChangeRole } from '../api/change-role';
import { useRemoveMember } from '../api/remove-member';

export const roleOptions = roleSchema.options.map((role) => ({ value: role, label: roleNames[role] }));

/**
 * The members of a team. Owners get a role picker and a remove button per row; everyone else
 * sees the list only (no disabled controls: a viewer has nothing to press).
 */
export function MembersTable({
  teamId,
  members,
  currentUserId,
  canManage,
}: {
  teamId: string;
  members: readonly Member[];
  currentUserId: string | null;
  canManage: boolean;
}) {
  return (
    <Table
      caption="Members"
      captionHidden
      head={
        <tr>
          <th scope="col" className={th}>
            Name
          </th>
          <th scope="col" className={th}>
            E-mail
          </th>
          <th scope="col" className={th}>
            Role
          </th>
          <th scope="col" className={`${th} hidden md:table-cell`}>
            Joined
          </th>
          {canManage && (
            <th scope="col" className={th}>
              <span className="sr-only">Actions</span>
            </th>
          )}
        </tr>
      }
    >
      {members.map((member) => (
        <MemberRow key={member.userId} teamId={teamId} member={member} isYou={member.userId === currentUserId} canManage={canManage} />
      ))}
    </Table>
  );
}

function MemberRow({ teamId, member, isYou, canManage }: { teamId: string; member: Member; isYou: boolean; canManage: boolean }) {
  const changeRole = useChangeRole(teamId);
  const removeMember = useRemoveMember(teamId);
  const [role, setRole] = useState<Role>(member.role);

  return (
    <tr>
      <th scope="row" className={`${td} font-semibold`}>
        {member.name} {isYou && <Badge tone="copper">you</Badge>}
      </th>
      <td className={`${td} text-ink-soft`}>{member.email}</td>
      <td className={td}>
        {canManage ? (
          <form
            className="flex items-center gap-2"
            onSubmit={(event) => {
              event.preventDefault();
              changeRole.mutate({ userId: member.userId, role }, { onError: () => setRole(member.role) });
            }}
          >
            <SelectField
              label={`Role of ${member.name}`}
              hideLabel
              name="role"
              options={roleOptions}
              value={role}
              onChange={(event) => setRole(roleSchema.parse(event.target.value))}
            />
            {role !== member.role && (
              <Button type="submit" variant="primary" pending={changeRole.isPending} aria-label={`Save role of ${member.name}`}>
                Save
              </Button>
            )}
          </form>
        ) : (
          roleNames[member.role]
        )}
        {changeRole.isError && (
          <div className="mt-2">
            <Alert tone="error">{isApiError(changeRole.error) ? changeRole.error.message : 'Could not change the role.'}</Alert>
          </div>
        )}
      </td>
      <td className={`${td} hidden text-ink-soft md:table-cell`}>
        <time dateTime={member.joinedAt}>{formatDateTime(member.joinedAt)}</time>
      </td>
      {canManage && (
        <td className={`${td} text-right`}>
          {!isYou && (
            <ConfirmButton
              title={`Remove ${member.name}?`}
              description={`${member.name} (${member.email}) loses access to this team's studies and maps. You can invite them again later.`}
              confirmLabel="Remove member"
              aria-label={`Remove ${member.name}`}
              onConfirm={() => removeMember.mutateAsync(member.userId)}
            >
              Remove
            </ConfirmButton>
          )}
        </td>
      )}
    </tr>
  );
}
