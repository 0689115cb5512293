import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { type createInvitationSchema, invitationSchema } from '#shared/schemas/account';
import { api, segment } from '#src/lib/api-client';
import { teamQueryOptions } from './get-team';

export type CreateInvitationInput = z.infer<typeof createInvitationSchema>;
const invitationResponseSchema = z.object({ invitation: invitationSchema });

/** Mails a link to join; 409 when the address already belongs to a member. */
export function createInvitation(teamId: string, input: CreateInvitationInput) {
  return api.post(`/api/teams/${segment(teamId)}/invitations`, input, invitationResponseSchema).then((body) => body.invitation);
}

export function useCreateInvitation(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateInvitationInput) => createInvitation(teamId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamQueryOptions(teamId).queryKey }),
  });
}
