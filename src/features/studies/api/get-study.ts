import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { studyDetailSchema } from '#shared/schemas/study';
import { api } from '#src/lib/api-client';
import { studyKeys, studyUrl } from './keys';

export const studyResponseSchema = z.object({ study: studyDetailSchema });

export function getStudy(teamId: string, studyId: string) {
  return api.get(studyUrl(teamId, studyId), studyResponseSchema).then((body) => body.study);
}

export const studyQueryOptions = (teamId: string, studyId: string) =>
  queryOptions({
    queryKey: studyKeys.detail(teamId, studyId),
    queryFn: () => getStudy(teamId, studyId),
    // The open study is the user's working copy; a background refetch must not surprise them.
    staleTime: Infinity,
  });

export function useStudy(teamId: string, studyId: string) {
  return useQuery(studyQueryOptions(teamId, studyId));
}
