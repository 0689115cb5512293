import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { invitationSchema } from '#shared/schemas/account';
import { api, segment } from '#src/lib/api-client';
import { teamQueryOptions } from './get-team';

const invitationResponseSchema = z.object({ invitation: invitationSchema });

/** Mails a new link with a new expiry; the old link stops working. */
export function resendInvitation(teamId: string, invitationId: string) {
  return api
    .post(`/api/teams/${segment(teamId)}/invitations/${segment(invitationId)}/resend`, undefined, invitationResponseSchema)
    .then((body) => body.invitation);
}

export function useResendInvitation(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (invitationId: string) => resendInvitation(teamId, invitationId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamQueryOptions(teamId).queryKey }),
  });
}
