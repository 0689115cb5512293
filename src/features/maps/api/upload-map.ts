import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { uploadMapFieldsSchema } from '../../../../shared/schemas/map-library';
import { ApiError, apiErrorFrom, isApiError, segment } from '../../../lib/api-client';
import { endSession } from '../../../lib/session';
import { mapQueryOptions } from './get-map';
import { mapsQueryOptions } from './get-maps';
import { mapDetailSchema, mapProblemSchema } from './schemas';

export type UploadMapInput = z.infer<typeof uploadMapFieldsSchema> & { file: File };

const uploadMapResponseSchema = z.object({
  map: mapDetailSchema,
  /** Advisories about what was adjusted (an island closed automatically). */
  notes: z.array(mapProblemSchema),
});
export type UploadMapResult = z.infer<typeof uploadMapResponseSchema>;

/**
 * Sends one map file as multipart/form-data (the one request of the app that is not JSON, so it
 * cannot go through `api`; it answers errors the same way, as an ApiError with the server's code
 * and details). The browser adds our Origin, which the server's CSRF check needs.
 */
export async function uploadMap(teamId: string, { file, name, notes }: UploadMapInput): Promise<UploadMapResult> {
  const body = new FormData();
  if (name !== undefined) body.append('name', name);
  if (notes !== undefined) body.append('notes', notes);
  body.append('file', file, file.name);

  let response: Response;
  try {
    response = await fetch(`/api/teams/${segment(teamId)}/maps`, { method: 'POST', body, credentials: 'same-origin', headers: { Accept: 'application/json' } });
  } catch {
    throw new ApiError({ status: 0, code: 'network_error', message: 'Could not reach the Spoolbook server. Check your connection and try again.' });
  }
  const text = await response.text();
  let json: unknown;
  try {
    json = text ? JSON.parse(text) : undefined;
  } catch {
    json = undefined;
  }
  if (!response.ok) throw apiErrorFrom(response.status, json, response.headers.get('Retry-After'));
  const parsed = uploadMapResponseSchema.safeParse(json);
  if (!parsed.success) {
    throw new ApiError({
      status: 0,
      code: 'unexpected_response',
      message: 'The server sent an answer this page does not understand. Reload the page and try again.',
      details: parsed.error.issues,
    });
  }
  return parsed.data;
}

export function useUploadMap(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UploadMapInput) => uploadMap(teamId, input),
    onSuccess: (result) => {
      queryClient.setQueryData(mapQueryOptions(teamId, result.map.id).queryKey, result.map);
      return queryClient.invalidateQueries({ queryKey: mapsQueryOptions(teamId).queryKey, exact: true });
    },
    onError: (error) => {
      // What the shared client does for every other request: a lost session signs the user out.
      if (isApiError(error) && error.status === 401) endSession(queryClient);
    },
  });
}
