import { Alert } from '#src/components/Alert';
import { Button } from '#src/components/Button';
import { useResendConfirmation } from '../api/security';

/** Shown until the address is confirmed: what waits on it, and a way to have the link sent again. */
export function ConfirmEmailNotice({ email }: { email: string }) {
  const resend = useResendConfirmation();
  return (
    <Alert tone="info" title="Confirm your e-mail address">
      <p>
        We sent a link to {email}. Open it to confirm the address; until then you can work in your personal team, but not create or join other teams or invite
        anyone.
      </p>
      <p className="mt-2">
        {resend.isSuccess ? (
          'A new link is on its way.'
        ) : (
          <Button onClick={() => resend.mutate()} pending={resend.isPending}>
            Send the link again
          </Button>
        )}
      </p>
      {resend.isError && <p className="mt-2">{(resend.error as Error).message}</p>}
    </Alert>
  );
}
