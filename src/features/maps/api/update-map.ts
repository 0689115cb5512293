import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { updateMapSchema } from '#shared/schemas/map-library';
import { api } from '#src/lib/api-client';
import { mapKeys, mapUrl } from './keys';
import { mapResponseSchema, type MapSummary } from './schemas';

export type UpdateMapInput = z.infer<typeof updateMapSchema>;

/** Renames a map or changes its notes (editors and owners; built-in maps refuse). */
export function updateMap(teamId: string, mapId: string, input: UpdateMapInput) {
  return api.patch(mapUrl(teamId, mapId), input, mapResponseSchema).then((body) => body.map);
}

export function useUpdateMap(teamId: string, mapId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateMapInput) => updateMap(teamId, mapId, input),
    onSuccess: (map) => {
      // The library is not on screen here: show the new name there at once, not after its refetch.
      queryClient.setQueriesData<MapSummary[]>({ queryKey: mapKeys.lists(teamId) }, (maps) =>
        maps?.map((m) => (m.id === mapId ? { ...m, name: map.name, notes: map.notes, updatedAt: map.updatedAt } : m)),
      );
      // Every list (the library, a study's plan pickers) and the map itself (a study's plots and labels) read it again.
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: mapKeys.detail(teamId, mapId), exact: true }),
        queryClient.invalidateQueries({ queryKey: mapKeys.lists(teamId) }),
      ]);
    },
  });
}
