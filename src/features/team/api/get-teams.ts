import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { teamSummarySchema } from '#shared/schemas/account';
import { api } from '#src/lib/api-client';

const teamsResponseSchema = z.object({ teams: z.array(teamSummarySchema) });

/** The teams the user can see (a site admin sees every team, with `role` null where not a member). */
export function getTeams() {
  return api.get('/api/teams', teamsResponseSchema).then((body) => body.teams);
}

export const teamsQueryOptions = () => queryOptions({ queryKey: ['teams'] as const, queryFn: getTeams });

export function useTeams() {
  return useQuery(teamsQueryOptions());
}
