import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { shareLinkSchema } from '#shared/schemas/study';
import { api } from '#src/lib/api-client';
import { studyKeys, studyUrl } from './keys';

const shareLinksResponseSchema = z.object({ shareLinks: z.array(shareLinkSchema) });
export type ShareLink = z.infer<typeof shareLinkSchema>;

/** The study's share links, newest first, revoked ones included (editors and owners only). */
export function getShareLinks(teamId: string, studyId: string) {
  return api.get(`${studyUrl(teamId, studyId)}/share-links`, shareLinksResponseSchema).then((body) => body.shareLinks);
}

export const shareLinksQueryOptions = (teamId: string, studyId: string) =>
  queryOptions({ queryKey: studyKeys.shareLinks(teamId, studyId), queryFn: () => getShareLinks(teamId, studyId) });

export function useShareLinks(teamId: string, studyId: string, options: { enabled?: boolean } = {}) {
  return useQuery({ ...shareLinksQueryOptions(teamId, studyId), enabled: options.enabled ?? true });
}
