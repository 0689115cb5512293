import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { api, segment } from '#src/lib/api-client';
import { usersKey } from './get-users';

const endedSchema = z.object({ ended: z.number() });

/** Signs a user out everywhere: every session of theirs ends (the admin's own too, if it is them). */
export function endUserSessions(userId: string) {
  return api.post(`/api/admin/users/${segment(userId)}/end-sessions`, {}, endedSchema).then((body) => body.ended);
}

export function useEndUserSessions() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) => endUserSessions(userId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: usersKey }),
  });
}
