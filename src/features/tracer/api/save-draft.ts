import { draftDetailSchema, draftResponseSchema, type DraftDetail } from '#shared/tracer/api';
import type { TraceState } from '#shared/tracer/state';
import { api, isApiError } from '#src/lib/api-client';
import { draftUrl } from './keys';

/** Stores the state as the draft's next revision; a 409 `stale_revision` means someone saved first. */
export function saveDraft(teamId: string, draftId: string, input: { baseRevision: number; state: TraceState }) {
  return api.put(draftUrl(teamId, draftId), input, draftResponseSchema).then((body) => body.draft);
}

/** The newer draft a 409 `stale_revision` answer carries, or null for any other error. */
export function staleDraftOf(error: unknown): DraftDetail | null {
  if (!isApiError(error) || error.status !== 409 || error.code !== 'stale_revision') return null;
  const parsed = draftDetailSchema.safeParse((error.details as { current?: unknown } | undefined)?.current);
  return parsed.success ? parsed.data : null;
}
