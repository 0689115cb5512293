import { useMutation, useQueryClient } from '@tanstack/react-query';
import { meSchema } from '#shared/schemas/account';
import { api } from '#src/lib/api-client';
import { startSession } from '#src/lib/session';

/** The one-click demo sign-in of a development server (`POST /api/auth/demo-sign-in`). */
export function useDemoSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.post('/api/auth/demo-sign-in', {}, meSchema),
    onSuccess: (me) => startSession(queryClient, me),
  });
}
