import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { teamSummarySchema } from '#shared/schemas/account';
import { api, segment } from '#src/lib/api-client';
import { meQueryOptions } from '#src/lib/session';
import { teamsQueryOptions } from './get-teams';

const acceptResponseSchema = z.object({ team: teamSummarySchema });

/** Joins the team; 403 `wrong_account` when signed in with another address than the invited one. */
export function acceptInvitation(token: string) {
  return api.post(`/api/invitations/${segment(token)}/accept`, undefined, acceptResponseSchema).then((body) => body.team);
}

export function useAcceptInvitation(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => acceptInvitation(token),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: teamsQueryOptions().queryKey }),
        queryClient.invalidateQueries({ queryKey: meQueryOptions().queryKey }),
      ]),
  });
}
