import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, type ApiError } from '#src/lib/api-client';
import type { StudyDetail } from '#shared/schemas/study';
import { studyResponseSchema } from './get-study';
import { studyKeys, studyUrl } from './keys';

/** Saves an old revision's document as a new revision; 409 like a save when someone saved since `baseRevision`. */
export function restoreRevision(teamId: string, studyId: string, revision: number, baseRevision: number) {
  return api.post(`${studyUrl(teamId, studyId)}/revisions/${revision}/restore`, { baseRevision }, studyResponseSchema).then((body) => body.study);
}

export function useRestoreRevision(teamId: string, studyId: string) {
  const queryClient = useQueryClient();
  return useMutation<StudyDetail, ApiError, { revision: number; baseRevision: number }>({
    mutationFn: ({ revision, baseRevision }) => restoreRevision(teamId, studyId, revision, baseRevision),
    onSuccess: (study) => {
      queryClient.setQueryData(studyKeys.detail(teamId, studyId), study);
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: studyKeys.lists(teamId) }),
        queryClient.invalidateQueries({ queryKey: studyKeys.revisions(teamId, studyId) }),
      ]);
    },
  });
}
