import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import type { CompressorMap } from '#shared/maps/types';
import { spoolbookMapSchema } from '#shared/schemas/map';
import { api, segment } from '#src/lib/api-client';

/** The built-in demo compressor the Learn page puts its example on (served to every team). */
export const LEARN_MAP_ID = 'builtin-compressor-m58';

const mapDetailResponseSchema = z.object({
  map: z.object({ id: z.string(), name: z.string(), map: spoolbookMapSchema }),
});

/** A compressor map of the team's library (built-in ones included), parsed with the shared map schema. */
export async function getCompressorMap(teamId: string, mapId: string): Promise<CompressorMap> {
  const body = await api.get(`/api/teams/${segment(teamId)}/maps/${segment(mapId)}`, mapDetailResponseSchema);
  if (body.map.map.kind !== 'compressor') throw new Error(`map ${mapId} is not a compressor map`);
  return body.map.map;
}

export const demoMapQueryOptions = (teamId: string) =>
  queryOptions({
    queryKey: ['teams', teamId, 'maps', LEARN_MAP_ID] as const,
    queryFn: () => getCompressorMap(teamId, LEARN_MAP_ID),
    // Built-in maps only change with a new release.
    staleTime: Infinity,
  });

/** The demo map, or nothing while there is no team to ask through. */
export function useDemoMap(teamId: string | null) {
  return useQuery({ ...demoMapQueryOptions(teamId ?? ''), enabled: teamId !== null });
}
