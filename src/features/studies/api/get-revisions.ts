import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { revisionSummarySchema } from '#shared/schemas/study';
import { api } from '#src/lib/api-client';
import { studyKeys, studyUrl } from './keys';

const revisionsResponseSchema = z.object({ revisions: z.array(revisionSummarySchema) });

/** Every saved revision of a study, newest first. */
export function getRevisions(teamId: string, studyId: string) {
  return api.get(`${studyUrl(teamId, studyId)}/revisions`, revisionsResponseSchema).then((body) => body.revisions);
}

export const revisionsQueryOptions = (teamId: string, studyId: string) =>
  queryOptions({ queryKey: studyKeys.revisions(teamId, studyId), queryFn: () => getRevisions(teamId, studyId) });

export function useRevisions(teamId: string, studyId: string, options: { enabled?: boolean } = {}) {
  return useQuery({ ...revisionsQueryOptions(teamId, studyId), enabled: options.enabled ?? true });
}
