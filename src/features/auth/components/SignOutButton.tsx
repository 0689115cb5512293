import { Button, type ButtonVariant } from '../../../components/Button';
import { useSignOut } from '../api/sign-out';

/** Ends the session; `onSignedOut` says where to go (the invitation page stays put). */
export function SignOutButton({ onSignedOut, variant = 'quiet' }: { onSignedOut?: () => void; variant?: ButtonVariant }) {
  const signOut = useSignOut();
  return (
    <Button variant={variant} pending={signOut.isPending} onClick={() => signOut.mutate(undefined, { onSuccess: onSignedOut })}>
      Sign out
    </Button>
  );
}
