import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { duplicateStudySchema } from '#shared/schemas/study';
import { api } from '#src/lib/api-client';
import { studyResponseSchema } from './get-study';
import { studyKeys, studyUrl } from './keys';

/** `title` absent names the copy "<title> (copy)". */
export type DuplicateStudyInput = z.input<typeof duplicateStudySchema>;

export function duplicateStudy(teamId: string, studyId: string, input: DuplicateStudyInput = {}) {
  return api.post(`${studyUrl(teamId, studyId)}/duplicate`, input, studyResponseSchema).then((body) => body.study);
}

export function useDuplicateStudy(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ studyId, ...input }: DuplicateStudyInput & { studyId: string }) => duplicateStudy(teamId, studyId, input),
    onSuccess: (study) => {
      queryClient.setQueryData(studyKeys.detail(teamId, study.id), study);
      return queryClient.invalidateQueries({ queryKey: studyKeys.lists(teamId) });
    },
  });
}
