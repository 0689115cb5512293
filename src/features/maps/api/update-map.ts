import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { type updateMapSchema } from '#shared/schemas/map-library';
import { api, segment } from '#src/lib/api-client';
import { mapQueryOptions } from './get-map';
import { mapsQueryOptions } from './get-maps';
import { mapDetailSchema } from './schemas';

export type UpdateMapInput = z.infer<typeof updateMapSchema>;
const updateMapResponseSchema = z.object({ map: mapDetailSchema });

/** Renames a map or changes its notes (editors and owners; built-in maps refuse). */
export function updateMap(teamId: string, mapId: string, input: UpdateMapInput) {
  return api.patch(`/api/teams/${segment(teamId)}/maps/${segment(mapId)}`, input, updateMapResponseSchema).then((body) => body.map);
}

export function useUpdateMap(teamId: string, mapId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateMapInput) => updateMap(teamId, mapId, input),
    onSuccess: (map) => {
      // The library is not on screen here: show the new name there at once, not after its refetch.
      queryClient.setQueryData(mapsQueryOptions(teamId).queryKey, (maps) =>
        maps?.map((m) => (m.id === mapId ? { ...m, name: map.name, notes: map.notes, updatedAt: map.updatedAt } : m)),
      );
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: mapQueryOptions(teamId, mapId).queryKey, exact: true }),
        queryClient.invalidateQueries({ queryKey: mapsQueryOptions(teamId).queryKey, exact: true }),
      ]);
    },
  });
}
