import { Button, type ButtonVariant } from '#src/components/Button';
import { paths } from '#src/lib/paths';
import { useSignOut } from '../api/sign-out';

/** Ends the session and opens `landing` (sign-in unless told; the invitation page stays put). */
export function SignOutButton({ landing = 'sign-in', variant = 'quiet' }: { landing?: 'sign-in' | 'here'; variant?: ButtonVariant }) {
  const signOut = useSignOut(() => (landing === 'here' ? `${window.location.pathname}${window.location.search}` : paths.signIn.href()));
  return (
    <Button variant={variant} pending={signOut.isPending || signOut.isSuccess} onClick={() => signOut.mutate()}>
      Sign out
    </Button>
  );
}
