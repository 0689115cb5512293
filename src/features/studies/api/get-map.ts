import { queryOptions, useQueries, type UseQueryResult } from '@tanstack/react-query';
import { useCallback } from 'react';
import { z } from 'zod';
import { spoolbookMapSchema } from '#shared/schemas/map';
import type { SpoolbookMap } from '#shared/maps/types';
import { api } from '#src/lib/api-client';
import { studyKeys } from './keys';

const mapResponseSchema = z.object({
  map: z.object({ id: z.string(), name: z.string(), builtin: z.boolean(), map: spoolbookMapSchema }).passthrough(),
});

/** One map of the library with its parsed SI model (`map.map`). */
export function getMap(teamId: string, mapId: string) {
  return api.get(`/api/teams/${encodeURIComponent(teamId)}/maps/${encodeURIComponent(mapId)}`, mapResponseSchema).then((body) => body.map);
}

export const mapQueryOptions = (teamId: string, mapId: string) =>
  queryOptions({
    queryKey: [...studyKeys.maps(teamId), 'detail', mapId] as const,
    queryFn: () => getMap(teamId, mapId),
    // Maps change rarely and are large: keep them for the session.
    staleTime: 10 * 60_000,
  });

export interface StudyMaps {
  /** The parsed maps by id, for runStudyDocument. */
  mapsById: Record<string, SpoolbookMap | undefined>;
  /** Names of the maps by id, for labels. */
  namesById: Record<string, string>;
  /** True while any map is still loading. */
  loading: boolean;
  /** Map ids that could not be loaded, with the reason. */
  errors: { mapId: string; message: string }[];
}

/** Every map the plans name, loaded in parallel. */
export function useStudyMaps(teamId: string, mapIds: readonly string[]): StudyMaps {
  const idsKey = [...new Set(mapIds)].sort().join('\n');
  const unique = idsKey === '' ? [] : idsKey.split('\n');
  // A stable combine lets TanStack Query hand back the same object until a map arrives, so the
  // study is not recomputed on every render.
  const combine = useCallback(
    (results: UseQueryResult<Awaited<ReturnType<typeof getMap>>>[]): StudyMaps => {
      const ids = idsKey === '' ? [] : idsKey.split('\n');
      const mapsById: Record<string, SpoolbookMap | undefined> = {};
      const namesById: Record<string, string> = {};
      const errors: { mapId: string; message: string }[] = [];
      results.forEach((r, i) => {
        if (r.data) {
          mapsById[ids[i]] = r.data.map as SpoolbookMap;
          namesById[ids[i]] = r.data.name;
        } else if (r.error) errors.push({ mapId: ids[i], message: r.error.message });
      });
      return { mapsById, namesById, loading: results.some((r) => r.isPending), errors };
    },
    [idsKey],
  );
  return useQueries({ queries: unique.map((mapId) => mapQueryOptions(teamId, mapId)), combine });
}
