import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { copyStudySchema } from '#shared/schemas/study';
import { mapKeys } from '#src/features/maps/api';
import { api } from '#src/lib/api-client';
import { studyResponseSchema } from './get-study';
import { studyKeys, studyUrl } from './keys';

/** `teamId` is the team the copy goes into; `title` absent keeps the study's title. */
export type CopyStudyInput = z.input<typeof copyStudySchema>;

export function copyStudy(teamId: string, studyId: string, input: CopyStudyInput) {
  return api.post(`${studyUrl(teamId, studyId)}/copy`, input, studyResponseSchema).then((body) => body.study);
}

/** Copies a study of `teamId` into another team; the copy's team's lists are read again. */
export function useCopyStudy(teamId: string, studyId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CopyStudyInput) => copyStudy(teamId, studyId, input),
    onSuccess: (study) => {
      queryClient.setQueryData(studyKeys.detail(study.teamId, study.id), study);
      // The maps the study uses were copied into that team's library too.
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: studyKeys.lists(study.teamId) }),
        queryClient.invalidateQueries({ queryKey: mapKeys.all(study.teamId) }),
      ]);
    },
  });
}
