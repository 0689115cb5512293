import { useMutation } from '@tanstack/react-query';
import { api } from '#src/lib/api-client';

export function signOut() {
  return api.post('/api/auth/sign-out');
}

/**
 * Signs out, then loads `landing` afresh. A full page load is the surest way to forget every
 * cached answer of the user, and it avoids a race with the route guards, which would otherwise
 * see the user vanish and redirect before the chosen landing page.
 */
export function useSignOut(landing: () => string) {
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => window.location.assign(landing()),
  });
}
