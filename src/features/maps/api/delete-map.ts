import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, segment } from '#src/lib/api-client';
import { mapQueryOptions } from './get-map';
import { mapsQueryOptions } from './get-maps';

/** Deletes a map; the server answers 409 `map_in_use` (with the studies) while plans use it. */
export function deleteMap(teamId: string, mapId: string) {
  return api.delete(`/api/teams/${segment(teamId)}/maps/${segment(mapId)}`);
}

export function useDeleteMap(teamId: string, mapId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => deleteMap(teamId, mapId),
    onSuccess: () => {
      // The map's own page is left right after this; refetching it now would only find a 404.
      queryClient.removeQueries({ queryKey: mapQueryOptions(teamId, mapId).queryKey, exact: true });
      // The library is not on screen now, so invalidating alone would show the deleted map there
      // until its refetch lands: take it out of the cached list at once.
      queryClient.setQueryData(mapsQueryOptions(teamId).queryKey, (maps) => maps?.filter((m) => m.id !== mapId));
      return queryClient.invalidateQueries({ queryKey: mapsQueryOptions(teamId).queryKey, exact: true });
    },
  });
}
