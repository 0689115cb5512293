import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api, segment } from '#src/lib/api-client';
import { mapSummarySchema } from './schemas';

const mapsResponseSchema = z.object({ maps: z.array(mapSummarySchema) });

/** The team's maps, then the built-in demo maps (both kinds: the library filters on screen). */
export function getMaps(teamId: string) {
  return api.get(`/api/teams/${segment(teamId)}/maps`, mapsResponseSchema).then((body) => body.maps);
}

export const mapsQueryOptions = (teamId: string) => queryOptions({ queryKey: ['teams', teamId, 'maps'] as const, queryFn: () => getMaps(teamId) });

export function useMaps(teamId: string) {
  return useQuery(mapsQueryOptions(teamId));
}
