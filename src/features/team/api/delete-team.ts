import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, segment } from '#src/lib/api-client';
import { meQueryOptions } from '#src/lib/session';
import { teamsQueryOptions } from './get-teams';

export function deleteTeam(teamId: string) {
  return api.delete(`/api/teams/${segment(teamId)}`);
}

export function useDeleteTeam(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => deleteTeam(teamId),
    // Only the list (exact key): refetching this team's own page now would flash a 404 before
    // the page navigates away; its stale copy is collected later.
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: teamsQueryOptions().queryKey, exact: true }),
        queryClient.invalidateQueries({ queryKey: meQueryOptions().queryKey }),
      ]),
  });
}
