import { queryOptions, useQueries, useQuery } from '@tanstack/react-query';
import type { CompressorMap, SpoolbookMap } from '#shared/maps/types';
import { api } from '#src/lib/api-client';
import { mapKeys, mapUrl } from './keys';
import { mapResponseSchema } from './schemas';

/** One map with its parsed SI model (`map.map`, checked by the shared map schema). */
export function getMap(teamId: string, mapId: string) {
  return api.get(mapUrl(teamId, mapId), mapResponseSchema).then((body) => body.map);
}

export const mapQueryOptions = (teamId: string, mapId: string) =>
  queryOptions({ queryKey: mapKeys.detail(teamId, mapId), queryFn: () => getMap(teamId, mapId) });

/** A map's own page. */
export function useMap(teamId: string, mapId: string) {
  return useQuery(mapQueryOptions(teamId, mapId));
}

/** Maps a study computes with change rarely and are large: keep them for the session (a change here invalidates them). */
const MODEL_STALE_TIME = 10 * 60_000;

export interface MapModels {
  /** The parsed maps by id, for runStudyDocument. */
  mapsById: Record<string, SpoolbookMap | undefined>;
  /** Names of the maps by id, for labels. */
  namesById: Record<string, string>;
  /** True while any map is still loading. */
  loading: boolean;
  /** Map ids that could not be loaded, with the reason. */
  errors: { mapId: string; message: string }[];
}

/** Every map a study's plans name, loaded in parallel (the study page, Side by side, the report). */
export function useMapModels(teamId: string, mapIds: readonly string[]): MapModels {
  const ids = [...new Set(mapIds)].sort();
  return useQueries({
    queries: ids.map((mapId) => ({ ...mapQueryOptions(teamId, mapId), staleTime: MODEL_STALE_TIME })),
    // TanStack Query shares the combined value structurally, so it stays the same object (and the
    // study is not recomputed) until a map arrives or changes.
    combine: (results): MapModels => {
      const mapsById: Record<string, SpoolbookMap | undefined> = {};
      const namesById: Record<string, string> = {};
      const errors: { mapId: string; message: string }[] = [];
      results.forEach((r, i) => {
        if (r.data) {
          mapsById[ids[i]] = r.data.map;
          namesById[ids[i]] = r.data.name;
        } else if (r.error) errors.push({ mapId: ids[i], message: r.error.message });
      });
      return { mapsById, namesById, loading: results.some((r) => r.isPending), errors };
    },
  });
}

/** A compressor map of the library (built-in ones included), or an error when the map is of the other kind. */
export function useCompressorMap(teamId: string | null, mapId: string, options: { staleTime?: number } = {}) {
  return useQuery({
    ...mapQueryOptions(teamId ?? '', mapId),
    ...options,
    enabled: teamId !== null,
    select: (detail): CompressorMap => {
      if (detail.map.kind !== 'compressor') throw new Error(`map ${mapId} is not a compressor map`);
      return detail.map;
    },
  });
}
