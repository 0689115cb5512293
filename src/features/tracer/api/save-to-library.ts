import { useMutation, useQueryClient } from '@tanstack/react-query';
import { savedToLibraryResponseSchema } from '#shared/tracer/api';
import type { TraceState } from '#shared/tracer/state';
import { mapKeys } from '#src/features/maps/api';
import { api } from '#src/lib/api-client';
import { draftUrl, tracerKeys } from './keys';

/**
 * Saves the trace as a map of the library: the server builds the file from the state and reads it
 * exactly as an upload; it also stores the state as the draft's next revision.
 */
export function saveTraceToLibrary(teamId: string, draftId: string, input: { baseRevision: number; state: TraceState }) {
  return api.post(`${draftUrl(teamId, draftId)}/save`, input, savedToLibraryResponseSchema);
}

export function useSaveTraceToLibrary(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ draftId, ...input }: { draftId: string; baseRevision: number; state: TraceState }) => saveTraceToLibrary(teamId, draftId, input),
    onSuccess: (saved) => {
      queryClient.setQueryData(tracerKeys.draft(teamId, saved.draft.id), saved.draft);
      // The map library and every study's plan pickers list the new map.
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: tracerKeys.drafts(teamId) }),
        queryClient.invalidateQueries({ queryKey: tracerKeys.images(teamId) }),
        queryClient.invalidateQueries({ queryKey: mapKeys.all(teamId) }),
      ]);
    },
  });
}
