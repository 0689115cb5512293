import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '#src/lib/api-client';
import { mapKeys, mapUrl } from './keys';
import type { MapSummary } from './schemas';

/** Deletes a map; the server answers 409 `map_in_use` (with the studies) while plans use it. */
export function deleteMap(teamId: string, mapId: string) {
  return api.delete(mapUrl(teamId, mapId));
}

export function useDeleteMap(teamId: string, mapId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => deleteMap(teamId, mapId),
    onSuccess: () => {
      // The map's own page is left right after this; refetching it now would only find a 404.
      queryClient.removeQueries({ queryKey: mapKeys.detail(teamId, mapId), exact: true });
      // The library is not on screen now, so invalidating alone would show the deleted map there
      // until its refetch lands: take it out of the cached lists at once.
      queryClient.setQueriesData<MapSummary[]>({ queryKey: mapKeys.lists(teamId) }, (maps) => maps?.filter((m) => m.id !== mapId));
      return queryClient.invalidateQueries({ queryKey: mapKeys.lists(teamId) });
    },
  });
}
