import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, segment } from '#src/lib/api-client';
import { teamQueryOptions } from './get-team';

export function removeMember(teamId: string, userId: string) {
  return api.delete(`/api/teams/${segment(teamId)}/members/${segment(userId)}`);
}

export function useRemoveMember(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) => removeMember(teamId, userId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamQueryOptions(teamId).queryKey }),
  });
}
