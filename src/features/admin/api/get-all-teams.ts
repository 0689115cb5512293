import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { teamSummarySchema } from '#shared/schemas/account';
import { api } from '#src/lib/api-client';

const teamsResponseSchema = z.object({ teams: z.array(teamSummarySchema) });

/** For a site admin, `GET /api/teams` lists every team on the site (`role` null where not a member). */
export function getAllTeams() {
  return api.get('/api/teams', teamsResponseSchema).then((body) => body.teams);
}

export const allTeamsQueryOptions = () => queryOptions({ queryKey: ['admin', 'teams'] as const, queryFn: getAllTeams });

export function useAllTeams() {
  return useQuery(allTeamsQueryOptions());
}
