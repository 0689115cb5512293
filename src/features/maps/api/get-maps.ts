import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '#src/lib/api-client';
import { mapKeys, mapsUrl } from './keys';
import { mapListResponseSchema, type MapKind } from './schemas';

/** The team's maps, then the built-in demo maps (ids `builtin-…`): of one kind, or both for 'all'. */
export function getMaps(teamId: string, kind: MapKind | 'all' = 'all') {
  const url = kind === 'all' ? mapsUrl(teamId) : `${mapsUrl(teamId)}?kind=${kind}`;
  return api.get(url, mapListResponseSchema).then((body) => body.maps);
}

export const mapsQueryOptions = (teamId: string, kind: MapKind | 'all' = 'all') =>
  queryOptions({ queryKey: mapKeys.list(teamId, kind), queryFn: () => getMaps(teamId, kind) });

/** The library (both kinds: it filters on screen), or the maps a plan's picker offers. */
export function useMaps(teamId: string, kind: MapKind | 'all' = 'all', options: { enabled?: boolean } = {}) {
  return useQuery({ ...mapsQueryOptions(teamId, kind), enabled: options.enabled ?? true });
}
