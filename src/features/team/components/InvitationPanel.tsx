import type { ReactNode } from 'react';
import { Link } from 'react-router';
import type { InvitationPreview, TeamSummary } from '#shared/schemas/account';
import { Alert } from '#src/components/Alert';
import { Button } from '#src/components/Button';
import { Card } from '#src/components/Card';
import { Loading, Page } from '#src/components/Page';
import { isApiError } from '#src/lib/api-client';
import { formatDateTime, roleAbilities, roleNames } from '#src/lib/format';
import { paths } from '#src/lib/paths';
import { useMe } from '#src/lib/session';
import { useAcceptInvitation } from '../api/accept-invitation';
import { useInvitation } from '../api/get-invitation';

/**
 * The page an invitation mail links to. Shows what is offered, then what the visitor can do:
 * sign up or sign in (the page supplies those forms, prefilled with the invited address), join,
 * or, when signed in as someone else, sign out.
 */
export function InvitationPanel({
  token,
  signedOutActions,
  signOutButton,
  onAccepted,
}: {
  token: string;
  /** Sign-up and sign-in forms for the invited address. */
  signedOutActions: (invitedEmail: string) => ReactNode;
  signOutButton: ReactNode;
  onAccepted: (team: TeamSummary) => void;
}) {
  const invitation = useInvitation(token);
  const me = useMe();

  if (me.isPending || (invitation.data === undefined && invitation.isPending)) return <Loading label="Loading the invitation…" />;

  if (invitation.data === undefined) {
    const gone = isApiError(invitation.error) && invitation.error.status === 404;
    return (
      <Page title="Invitation" width="narrow">
        <Alert tone="error" title={gone ? 'This invitation link no longer works' : 'Could not load the invitation'}>
          <p>{gone ? 'It was already used or cancelled, or it has expired. Ask the team owner to send a new one.' : invitation.error.message}</p>
          {me.data && (
            <p>
              <Link to={paths.teams.href()}>Go to your teams</Link>
            </p>
          )}
        </Alert>
      </Page>
    );
  }

  const preview = invitation.data;
  const user = me.data?.user ?? null;
  const sameAddress = user !== null && user.email.toLowerCase() === preview.email.toLowerCase();

  return (
    <Page eyebrow="Invitation" title={`Join ${preview.teamName}`} width="narrow">
      <InvitationSummary preview={preview} />
      {user === null && signedOutActions(preview.email)}
      {user !== null && sameAddress && <AcceptCard token={token} preview={preview} onAccepted={onAccepted} signOutButton={signOutButton} />}
      {user !== null && !sameAddress && <WrongAccount invitedEmail={preview.email} signedInEmail={user.email} signOutButton={signOutButton} />}
    </Page>
  );
}

function InvitationSummary({ preview }: { preview: InvitationPreview }) {
  return (
    <Card>
      <dl className="grid gap-x-6 gap-y-3 sm:grid-cols-[10rem_1fr]">
        <dt className="text-sm font-semibold text-ink-soft">Team</dt>
        <dd className="font-semibold">{preview.teamName}</dd>
        <dt className="text-sm font-semibold text-ink-soft">Role</dt>
        <dd>
          {roleNames[preview.role]} <span className="text-ink-soft">(can {roleAbilities[preview.role]})</span>
        </dd>
        <dt className="text-sm font-semibold text-ink-soft">Invited address</dt>
        <dd>{preview.email}</dd>
        <dt className="text-sm font-semibold text-ink-soft">Invited by</dt>
        <dd>{preview.invitedBy}</dd>
        <dt className="text-sm font-semibold text-ink-soft">Link expires</dt>
        <dd>
          <time dateTime={preview.expiresAt}>{formatDateTime(preview.expiresAt)}</time>
        </dd>
      </dl>
    </Card>
  );
}

function AcceptCard({
  token,
  preview,
  onAccepted,
  signOutButton,
}: {
  token: string;
  preview: InvitationPreview;
  onAccepted: (team: TeamSummary) => void;
  signOutButton: ReactNode;
}) {
  const accept = useAcceptInvitation(token);
  const wrongAccount = isApiError(accept.error) && accept.error.code === 'wrong_account';
  if (wrongAccount) {
    return <WrongAccount invitedEmail={preview.email} signedInEmail={null} signOutButton={signOutButton} />;
  }
  return (
    <Card title="Accept the invitation">
      <div className="space-y-4">
        <p>
          You are signed in as <strong className="font-semibold">{preview.email}</strong>.
        </p>
        {accept.isError && <Alert tone="error">{accept.error.message}</Alert>}
        <Button variant="primary" pending={accept.isPending} onClick={() => accept.mutate(undefined, { onSuccess: onAccepted })}>
          Join {preview.teamName}
        </Button>
      </div>
    </Card>
  );
}

function WrongAccount({ invitedEmail, signedInEmail, signOutButton }: { invitedEmail: string; signedInEmail: string | null; signOutButton: ReactNode }) {
  return (
    <Card title="Signed in with another address">
      <div className="space-y-4">
        <p>
          This invitation is for <strong className="font-semibold">{invitedEmail}</strong>
          {signedInEmail ? (
            <>
              , but you are signed in as <strong className="font-semibold">{signedInEmail}</strong>
            </>
          ) : (
            ', not for the account you are signed in with'
          )}
          . Sign out, then sign in or create an account with {invitedEmail} to join.
        </p>
        {signOutButton}
      </div>
    </Card>
  );
}
