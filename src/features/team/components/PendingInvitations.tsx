import type { Invitation } from '#shared/schemas/account';
import { Alert } from '#src/components/Alert';
import { Button } from '#src/components/Button';
import { ConfirmButton } from '#src/components/ConfirmButton';
import { Table, td, th } from '#src/components/Table';
import { formatDateTime, roleNames } from '#src/lib/format';
import { useCancelInvitation } from '../api/cancel-invitation';
import { useResendInvitation } from '../api/resend-invitation';

/** Invitations nobody has accepted yet, with resend and cancel (owners only see this). */
export function PendingInvitations({ teamId, invitations }: { teamId: string; invitations: readonly Invitation[] }) {
  if (invitations.length === 0) {
    return <p className="text-sm text-ink-soft">No invitations are waiting for an answer.</p>;
  }
  return (
    <Table
      caption="Pending invitations"
      head={
        <tr>
          <th scope="col" className={th}>
            E-mail
          </th>
          <th scope="col" className={th}>
            Role
          </th>
          <th scope="col" className={`${th} hidden md:table-cell`}>
            Invited by
          </th>
          <th scope="col" className={th}>
            Expires
          </th>
          <th scope="col" className={th}>
            <span className="sr-only">Actions</span>
          </th>
        </tr>
      }
    >
      {invitations.map((invitation) => (
        <InvitationRow key={invitation.id} teamId={teamId} invitation={invitation} />
      ))}
    </Table>
  );
}

function InvitationRow({ teamId, invitation }: { teamId: string; invitation: Invitation }) {
  const resend = useResendInvitation(teamId);
  const cancel = useCancelInvitation(teamId);
  return (
    <tr>
      <th scope="row" className={`${td} font-semibold`}>
        {invitation.email}
      </th>
      <td className={td}>{roleNames[invitation.role]}</td>
      <td className={`${td} hidden text-ink-soft md:table-cell`}>{invitation.invitedBy}</td>
      <td className={`${td} text-ink-soft`}>
        <time dateTime={invitation.expiresAt}>{formatDateTime(invitation.expiresAt)}</time>
      </td>
      <td className={`${td} text-right`}>
        <div className="flex flex-wrap justify-end gap-2">
          <Button pending={resend.isPending} onClick={() => resend.mutate(invitation.id)} aria-label={`Resend link to ${invitation.email}`}>
            Resend
          </Button>
          <ConfirmButton
            title={`Cancel the invitation to ${invitation.email}?`}
            description="The link in the invitation mail stops working. You can invite the address again later."
            confirmLabel="Cancel invitation"
            cancelLabel="Keep invitation"
            aria-label={`Cancel invitation to ${invitation.email}`}
            onConfirm={() => cancel.mutateAsync(invitation.id)}
          >
            Cancel
          </ConfirmButton>
        </div>
        {resend.isSuccess && !resend.isPending && (
          <p role="status" className="mt-1 text-right text-sm text-teal-dark">
            New link sent.
          </p>
        )}
        {resend.isError && (
          <div className="mt-2 text-left">
            <Alert tone="error">{resend.error.message}</Alert>
          </div>
        )}
      </td>
    </tr>
  );
}
