import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SpoolbookMap } from '#shared/maps/types';
import { spoolbookMapSchema } from '#shared/schemas/map';
import { sharedStudySchema, type StudyDocument } from '#shared/schemas/study';
import { readStudyDocument } from '#shared/study/document';
import { api, ApiError, segment } from '#src/lib/api-client';

/** A study opened through a share link: the document checked by the shared schema, and its maps. */
export interface SharedStudy {
  title: string;
  revision: number;
  /** ISO 8601 time of the revision. */
  updatedAt: string;
  document: StudyDocument;
  /** The maps the plans use, by map id, parsed with the shared map schema. */
  mapsById: Record<string, SpoolbookMap>;
}

function unreadable(what: string, details: unknown): ApiError {
  return new ApiError({
    status: 0,
    code: 'unexpected_response',
    message: `The shared study could not be read (${what}). Ask the team for a new link.`,
    details,
  });
}

/** Reads a shared study without signing in; 404 when the link is unknown, revoked or expired. */
export async function getSharedStudy(token: string): Promise<SharedStudy> {
  const body = await api.get(`/api/share/${segment(token)}`, sharedStudySchema);
  const document = readStudyDocument(body.document);
  if (!document.ok) throw unreadable('its document', document.issues);
  const mapsById: Record<string, SpoolbookMap> = {};
  for (const [id, raw] of Object.entries(body.maps)) {
    const map = spoolbookMapSchema.safeParse(raw);
    if (!map.success) throw unreadable(`map ${id}`, map.error.issues);
    mapsById[id] = map.data;
  }
  return { title: body.title, revision: body.revision, updatedAt: body.updatedAt, document: document.document, mapsById };
}

export const sharedStudyQueryOptions = (token: string) =>
  queryOptions({
    queryKey: ['share', token] as const,
    queryFn: () => getSharedStudy(token),
    // A revoked link should stop working when the page is opened again, not only after a reload.
    staleTime: 0,
  });

export function useSharedStudy(token: string) {
  return useQuery(sharedStudyQueryOptions(token));
}

/** The shared study's results as CSV: a plain link, nothing to sign in for. */
export function sharedResultsCsvHref(token: string): string {
  return `/api/share/${segment(token)}/results.csv`;
}

/** True when the answer means the link no longer works (unknown, revoked or expired). */
export function isLinkGone(error: unknown): boolean {
  return error instanceof ApiError && error.status === 404;
}
