import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '#src/lib/api-client';
import { studyKeys, studyUrl } from './keys';

export function revokeShareLink(teamId: string, studyId: string, linkId: string) {
  return api.delete(`${studyUrl(teamId, studyId)}/share-links/${encodeURIComponent(linkId)}`);
}

export function useRevokeShareLink(teamId: string, studyId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (linkId: string) => revokeShareLink(teamId, studyId, linkId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: studyKeys.shareLinks(teamId, studyId) }),
  });
}
