import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { revisionDetailSchema } from '#shared/schemas/study';
import { api } from '#src/lib/api-client';
import { studyKeys, studyUrl } from './keys';

const revisionResponseSchema = z.object({ revision: revisionDetailSchema });

/** One saved revision with its whole document. */
export function getRevision(teamId: string, studyId: string, revision: number) {
  return api.get(`${studyUrl(teamId, studyId)}/revisions/${revision}`, revisionResponseSchema).then((body) => body.revision);
}

export const revisionQueryOptions = (teamId: string, studyId: string, revision: number) =>
  queryOptions({
    queryKey: [...studyKeys.revisions(teamId, studyId), revision] as const,
    queryFn: () => getRevision(teamId, studyId, revision),
    // A saved revision never changes.
    staleTime: Infinity,
  });

export function useRevision(teamId: string, studyId: string, revision: number | null) {
  return useQuery({ ...revisionQueryOptions(teamId, studyId, revision ?? 0), enabled: revision !== null });
}
