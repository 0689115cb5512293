import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '#src/lib/api-client';
import { draftUrl, tracerKeys } from './keys';

/** Deletes a trace in progress (its picture too, unless a saved map keeps it). */
export function deleteDraft(teamId: string, draftId: string) {
  return api.delete(draftUrl(teamId, draftId));
}

export function useDeleteDraft(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (draftId: string) => deleteDraft(teamId, draftId),
    onSuccess: (_result, draftId) => {
      queryClient.removeQueries({ queryKey: tracerKeys.draft(teamId, draftId), exact: true });
      return queryClient.invalidateQueries({ queryKey: tracerKeys.all(teamId) });
    },
  });
}
