import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { createStudySchema } from '#shared/schemas/study';
import { api } from '#src/lib/api-client';
import { studyResponseSchema } from './get-study';
import { studiesUrl, studyKeys } from './keys';

/** `document` absent starts from the demo study. */
export type CreateStudyInput = z.input<typeof createStudySchema>;

export function createStudy(teamId: string, input: CreateStudyInput) {
  return api.post(studiesUrl(teamId), input, studyResponseSchema).then((body) => body.study);
}

export function useCreateStudy(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateStudyInput) => createStudy(teamId, input),
    onSuccess: (study) => {
      queryClient.setQueryData(studyKeys.detail(teamId, study.id), study);
      return queryClient.invalidateQueries({ queryKey: studyKeys.lists(teamId) });
    },
  });
}
