import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '#src/lib/api-client';
import { studyKeys } from './keys';

/** A row of the team's map library as a plan's map picker needs it. */
const mapListItemSchema = z.object({
  id: z.string(),
  kind: z.enum(['compressor', 'turbine']),
  name: z.string(),
  builtin: z.boolean(),
  summary: z
    .object({
      maxSpeed: z.number().nullable().optional(),
      topSpeed: z.number().nullable().optional(),
      housing: z.enum(['single', 'divided']).nullable().optional(),
      areaRatio: z.number().nullable().optional(),
      /** Turbine maps: what the efficiency counts; null when the file does not say. */
      efficiencyKind: z.enum(['with-bearing-losses', 'aerodynamic']).nullable().optional(),
    })
    .passthrough(),
});
const mapListSchema = z.object({ maps: z.array(mapListItemSchema) });
export type MapListItem = z.infer<typeof mapListItemSchema>;

/** The team's maps of one kind, then the built-in demo maps of that kind (ids `builtin-…`). */
export function getTeamMaps(teamId: string, kind: MapListItem['kind']) {
  return api.get(`/api/teams/${encodeURIComponent(teamId)}/maps?kind=${kind}`, mapListSchema).then((body) => body.maps);
}

export const teamMapsQueryOptions = (teamId: string, kind: MapListItem['kind']) =>
  queryOptions({ queryKey: [...studyKeys.maps(teamId), 'list', kind] as const, queryFn: () => getTeamMaps(teamId, kind) });

/** The compressor maps a plan's compressor picker offers. */
export function useCompressorMaps(teamId: string, options: { enabled?: boolean } = {}) {
  return useQuery({ ...teamMapsQueryOptions(teamId, 'compressor'), enabled: options.enabled ?? true });
}

/** The turbine maps a plan's exhaust side offers. */
export function useTurbineMaps(teamId: string, options: { enabled?: boolean } = {}) {
  return useQuery({ ...teamMapsQueryOptions(teamId, 'turbine'), enabled: options.enabled ?? true });
}
