import { queryOptions, useQuery } from '@tanstack/react-query';
import { draftResponseSchema } from '#shared/tracer/api';
import { api } from '#src/lib/api-client';
import { draftUrl, tracerKeys } from './keys';

/** One trace in progress with its whole state. */
export function getDraft(teamId: string, draftId: string) {
  return api.get(draftUrl(teamId, draftId), draftResponseSchema).then((body) => body.draft);
}

export const draftQueryOptions = (teamId: string, draftId: string) =>
  queryOptions({
    queryKey: tracerKeys.draft(teamId, draftId),
    queryFn: () => getDraft(teamId, draftId),
    // The open trace is the user's working copy: a background refetch must not replace it.
    staleTime: Infinity,
    refetchOnWindowFocus: false,
  });

export function useDraft(teamId: string, draftId: string) {
  return useQuery(draftQueryOptions(teamId, draftId));
}
