import { queryOptions, useQuery } from '@tanstack/react-query';
import { draftsResponseSchema } from '#shared/tracer/api';
import { api } from '#src/lib/api-client';
import { tracerKeys, tracerUrl } from './keys';

/** The team's traces in progress, last changed first. */
export function getDrafts(teamId: string) {
  return api.get(`${tracerUrl(teamId)}/drafts`, draftsResponseSchema).then((body) => body.drafts);
}

export const draftsQueryOptions = (teamId: string) => queryOptions({ queryKey: tracerKeys.drafts(teamId), queryFn: () => getDrafts(teamId) });

export function useDrafts(teamId: string) {
  return useQuery(draftsQueryOptions(teamId));
}
