import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { updateStudyMetaSchema } from '#shared/schemas/study';
import { api } from '#src/lib/api-client';
import { studyResponseSchema } from './get-study';
import { studyKeys, studyUrl } from './keys';

/** Rename (`title`) or archive and bring back (`archived`). */
export type UpdateStudyMetaInput = z.input<typeof updateStudyMetaSchema>;

export function updateStudyMeta(teamId: string, studyId: string, input: UpdateStudyMetaInput) {
  return api.patch(studyUrl(teamId, studyId), input, studyResponseSchema).then((body) => body.study);
}

export function useUpdateStudyMeta(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ studyId, ...input }: UpdateStudyMetaInput & { studyId: string }) => updateStudyMeta(teamId, studyId, input),
    onSuccess: (study) => {
      // Title and archived live beside the document; the open editor's draft is not touched.
      queryClient.setQueryData(studyKeys.detail(teamId, study.id), (old: typeof study | undefined) =>
        old ? { ...old, title: study.title, archived: study.archived, updatedAt: study.updatedAt, updatedBy: study.updatedBy } : study,
      );
      return queryClient.invalidateQueries({ queryKey: studyKeys.lists(teamId) });
    },
  });
}
