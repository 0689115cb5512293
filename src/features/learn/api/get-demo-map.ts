import { useCompressorMap } from '#src/features/maps/api';

/** The built-in demo compressor the Learn page puts its example on (served to every team). */
export const LEARN_MAP_ID = 'builtin-compressor-m58';

/** The demo map, read from the map library; nothing while there is no team to ask through. */
export function useDemoMap(teamId: string | null) {
  // Built-in maps only change with a new release.
  return useCompressorMap(teamId, LEARN_MAP_ID, { staleTime: Infinity });
}
