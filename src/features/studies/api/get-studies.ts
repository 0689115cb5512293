import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { studyListSchema } from '#shared/schemas/study';
import { api } from '#src/lib/api-client';
import { studiesUrl, studyKeys } from './keys';

/** What the study list asks for: search text, author id, archived filter and page (1-based). */
export interface StudyListParams {
  q?: string;
  author?: string;
  archived?: 'false' | 'true' | 'all';
  page?: number;
  pageSize?: number;
}

export function getStudies(teamId: string, params: StudyListParams) {
  const search = new URLSearchParams();
  if (params.q) search.set('q', params.q);
  if (params.author) search.set('author', params.author);
  search.set('archived', params.archived ?? 'false');
  search.set('page', String(params.page ?? 1));
  search.set('pageSize', String(params.pageSize ?? 20));
  return api.get(`${studiesUrl(teamId)}?${search}`, studyListSchema);
}

export const studiesQueryOptions = (teamId: string, params: StudyListParams) =>
  queryOptions({
    queryKey: [...studyKeys.lists(teamId), params] as const,
    queryFn: () => getStudies(teamId, params),
    // Typing in the search box keeps the last page on screen instead of flashing "Loading".
    placeholderData: keepPreviousData,
  });

export function useStudies(teamId: string, params: StudyListParams) {
  return useQuery(studiesQueryOptions(teamId, params));
}
