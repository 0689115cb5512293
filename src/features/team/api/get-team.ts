import { queryOptions, useQuery } from '@tanstack/react-query';
import { teamDetailSchema } from '#shared/schemas/account';
import { api, segment } from '#src/lib/api-client';

/** The team with its members and (for owners) pending invitations. */
export function getTeam(teamId: string) {
  return api.get(`/api/teams/${segment(teamId)}`, teamDetailSchema);
}

export const teamQueryOptions = (teamId: string) => queryOptions({ queryKey: ['teams', teamId] as const, queryFn: () => getTeam(teamId) });

export function useTeam(teamId: string) {
  return useQuery(teamQueryOptions(teamId));
}
