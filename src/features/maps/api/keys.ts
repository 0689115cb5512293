import { segment } from '#src/lib/api-client';
import type { MapKind } from './schemas';

/**
 * Query keys of the map library, one tree per team. Every feature that reads maps (the library,
 * a study's plans and plots, Side by side, the report, Learn) reads them under these keys, so one
 * invalidation after a rename, an upload or a map saved from the Tracer reaches every screen.
 * The tree sits under the team's key (`['teams', id]`), which an archive import invalidates whole.
 */
export const mapKeys = {
  all: (teamId: string) => ['teams', teamId, 'maps'] as const,
  lists: (teamId: string) => ['teams', teamId, 'maps', 'list'] as const,
  /** The team's maps (and the built-in ones) of one kind, or of both. */
  list: (teamId: string, kind: MapKind | 'all') => ['teams', teamId, 'maps', 'list', kind] as const,
  detail: (teamId: string, mapId: string) => ['teams', teamId, 'maps', 'detail', mapId] as const,
};

export function mapsUrl(teamId: string): string {
  return `/api/teams/${segment(teamId)}/maps`;
}

export function mapUrl(teamId: string, mapId: string): string {
  return `${mapsUrl(teamId)}/${segment(mapId)}`;
}
