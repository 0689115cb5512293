import { queryOptions, useQuery } from '@tanstack/react-query';
import { auditListSchema } from '#shared/schemas/account';
import { api, segment } from '#src/lib/api-client';

/** The newest entries of a team's audit record (owners only). */
export function getAudit(teamId: string, limit = 100) {
  return api.get(`/api/teams/${segment(teamId)}/audit?limit=${limit}`, auditListSchema);
}

export const auditQueryOptions = (teamId: string) => queryOptions({ queryKey: ['teams', teamId, 'audit'] as const, queryFn: () => getAudit(teamId) });

export function useAudit(teamId: string, enabled = true) {
  return useQuery({ ...auditQueryOptions(teamId), enabled });
}
