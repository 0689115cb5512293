import { queryOptions, useQuery } from '@tanstack/react-query';
import { invitationPreviewSchema } from '#shared/schemas/account';
import { api, segment } from '#src/lib/api-client';

/** What an invitation link offers; 404 when it is unknown, used, cancelled or expired. */
export function getInvitation(token: string) {
  return api.get(`/api/invitations/${segment(token)}`, invitationPreviewSchema);
}

export const invitationQueryOptions = (token: string) => queryOptions({ queryKey: ['invitations', token] as const, queryFn: () => getInvitation(token) });

export function useInvitation(token: string) {
  return useQuery(invitationQueryOptions(token));
}
