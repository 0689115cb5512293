import { segment } from '#src/lib/api-client';

/** Query keys of the Tracer, one tree per team. */
export const tracerKeys = {
  all: (teamId: string) => ['tracer', teamId] as const,
  drafts: (teamId: string) => ['tracer', teamId, 'drafts'] as const,
  draft: (teamId: string, draftId: string) => ['tracer', teamId, 'drafts', draftId] as const,
  images: (teamId: string) => ['tracer', teamId, 'images'] as const,
};

export function tracerUrl(teamId: string): string {
  return `/api/teams/${segment(teamId)}/tracer`;
}

export function draftUrl(teamId: string, draftId: string): string {
  return `${tracerUrl(teamId)}/drafts/${segment(draftId)}`;
}

/**
 * Where a picture is fetched from: the server answers with the type its byte check found and a
 * generated name, so it can be drawn on a canvas or opened in a tab as it is.
 */
export function pictureUrl(teamId: string, imageId: string): string {
  return `${tracerUrl(teamId)}/images/${segment(imageId)}`;
}
