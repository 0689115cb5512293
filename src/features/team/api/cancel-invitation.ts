import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, segment } from '#src/lib/api-client';
import { teamQueryOptions } from './get-team';

export function cancelInvitation(teamId: string, invitationId: string) {
  return api.delete(`/api/teams/${segment(teamId)}/invitations/${segment(invitationId)}`);
}

export function useCancelInvitation(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (invitationId: string) => cancelInvitation(teamId, invitationId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamQueryOptions(teamId).queryKey }),
  });
}
