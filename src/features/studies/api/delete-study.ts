import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '#src/lib/api-client';
import { studyKeys, studyUrl } from './keys';

export function deleteStudy(teamId: string, studyId: string) {
  return api.delete(studyUrl(teamId, studyId));
}

export function useDeleteStudy(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (studyId: string) => deleteStudy(teamId, studyId),
    onSuccess: (_none, studyId) => {
      queryClient.removeQueries({ queryKey: studyKeys.detail(teamId, studyId) });
      return queryClient.invalidateQueries({ queryKey: studyKeys.lists(teamId) });
    },
  });
}
