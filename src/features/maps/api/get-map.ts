import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api, segment } from '#src/lib/api-client';
import { mapDetailSchema } from './schemas';

const mapResponseSchema = z.object({ map: mapDetailSchema });

/** One map with its parsed SI model (the plot draws it). */
export function getMap(teamId: string, mapId: string) {
  return api.get(`/api/teams/${segment(teamId)}/maps/${segment(mapId)}`, mapResponseSchema).then((body) => body.map);
}

export const mapQueryOptions = (teamId: string, mapId: string) =>
  queryOptions({ queryKey: ['teams', teamId, 'maps', mapId] as const, queryFn: () => getMap(teamId, mapId) });

export function useMap(teamId: string, mapId: string) {
  return useQuery(mapQueryOptions(teamId, mapId));
}
