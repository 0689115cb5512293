import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { studyDetailSchema, type saveStudySchema, type StudyDetail } from '#shared/schemas/study';
import { api, isApiError, type ApiError } from '#src/lib/api-client';
import { studyResponseSchema } from './get-study';
import { studyKeys, studyUrl } from './keys';

export type SaveStudyInput = z.input<typeof saveStudySchema>;

/** Saves the document as the next revision after `baseRevision`; a 409 means someone saved first. */
export function saveStudy(teamId: string, studyId: string, input: SaveStudyInput) {
  return api.put(studyUrl(teamId, studyId), input, studyResponseSchema).then((body) => body.study);
}

/** The newer study a 409 `stale_revision` answer carries, or null for any other error. */
export function staleRevisionOf(error: unknown): StudyDetail | null {
  if (!isApiError(error) || error.status !== 409 || error.code !== 'stale_revision') return null;
  const details = error.details as { current?: unknown } | undefined;
  const parsed = studyDetailSchema.safeParse(details?.current);
  return parsed.success ? parsed.data : null;
}

export function useSaveStudy(teamId: string, studyId: string) {
  const queryClient = useQueryClient();
  return useMutation<StudyDetail, ApiError, SaveStudyInput>({
    mutationFn: (input) => saveStudy(teamId, studyId, input),
    onSuccess: (study) => {
      queryClient.setQueryData(studyKeys.detail(teamId, studyId), study);
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: studyKeys.lists(teamId) }),
        queryClient.invalidateQueries({ queryKey: studyKeys.revisions(teamId, studyId) }),
      ]);
    },
  });
}
