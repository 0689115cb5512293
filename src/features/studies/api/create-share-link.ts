import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { shareLinkSchema, type createShareLinkSchema } from '#shared/schemas/study';
import { api } from '#src/lib/api-client';
import { studyKeys, studyUrl } from './keys';

export type CreateShareLinkInput = z.input<typeof createShareLinkSchema>;
const createShareLinkResponseSchema = z.object({ shareLink: shareLinkSchema });

/** A new read-only link; its `url` is in this answer only (the server keeps a hash of the token). */
export function createShareLink(teamId: string, studyId: string, input: CreateShareLinkInput) {
  return api.post(`${studyUrl(teamId, studyId)}/share-links`, input, createShareLinkResponseSchema).then((body) => body.shareLink);
}

export function useCreateShareLink(teamId: string, studyId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateShareLinkInput) => createShareLink(teamId, studyId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: studyKeys.shareLinks(teamId, studyId) }),
  });
}
