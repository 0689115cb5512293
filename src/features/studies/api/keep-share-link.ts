import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { keepShareLinkSchema } from '#shared/schemas/study';
import { api } from '#src/lib/api-client';
import { studyKeys, studyUrl } from './keys';

const keepShareLinkResponseSchema = z.object({ kept: z.boolean() });

/**
 * An owner keeps a link working after its maker leaves the team, or lets it stop with them
 * again (owners only; 404 for a revoked link).
 */
export function keepShareLink(teamId: string, studyId: string, linkId: string, kept: boolean) {
  return api
    .put(`${studyUrl(teamId, studyId)}/share-links/${encodeURIComponent(linkId)}/kept`, keepShareLinkSchema.parse({ kept }), keepShareLinkResponseSchema)
    .then((body) => body.kept);
}

export function useKeepShareLink(teamId: string, studyId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ linkId, kept }: { linkId: string; kept: boolean }) => keepShareLink(teamId, studyId, linkId, kept),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: studyKeys.shareLinks(teamId, studyId) }),
  });
}
