import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';
import { studyKeys } from './keys';

/** A row of the team's map library as a plan's map picker needs it. */
const mapListItemSchema = z.object({
  id: z.string(),
  kind: z.enum(['compressor', 'turbine']),
  name: z.string(),
  builtin: z.boolean(),
  summary: z.object({ maxSpeed: z.number().nullable().optional(), topSpeed: z.number().nullable().optional() }).passthrough(),
});
const mapListSchema = z.object({ maps: z.array(mapListItemSchema) });
export type MapListItem = z.infer<typeof mapListItemSchema>;

/** The team's compressor maps, then the built-in demo maps (ids `builtin-…`). */
export function getCompressorMaps(teamId: string) {
  return api.get(`/api/teams/${encodeURIComponent(teamId)}/maps?kind=compressor`, mapListSchema).then((body) => body.maps);
}

export const compressorMapsQueryOptions = (teamId: string) =>
  queryOptions({ queryKey: [...studyKeys.maps(teamId), 'list', 'compressor'] as const, queryFn: () => getCompressorMaps(teamId) });

export function useCompressorMaps(teamId: string, options: { enabled?: boolean } = {}) {
  return useQuery({ ...compressorMapsQueryOptions(teamId), enabled: options.enabled ?? true });
}
