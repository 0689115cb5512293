import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { uploadMapFieldsSchema } from '#shared/schemas/map-library';
import { api } from '#src/lib/api-client';
import { mapKeys, mapsUrl } from './keys';
import { uploadMapResponseSchema } from './schemas';

export type UploadMapInput = z.infer<typeof uploadMapFieldsSchema> & { file: File };
export type UploadMapResult = z.infer<typeof uploadMapResponseSchema>;

/** Sends one map file as multipart/form-data through the shared API client. */
export function uploadMap(teamId: string, { file, name, notes }: UploadMapInput): Promise<UploadMapResult> {
  const body = new FormData();
  if (name !== undefined) body.append('name', name);
  if (notes !== undefined) body.append('notes', notes);
  body.append('file', file, file.name);
  return api.upload(mapsUrl(teamId), body, uploadMapResponseSchema);
}

export function useUploadMap(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UploadMapInput) => uploadMap(teamId, input),
    onSuccess: (result) => {
      queryClient.setQueryData(mapKeys.detail(teamId, result.map.id), result.map);
      return queryClient.invalidateQueries({ queryKey: mapKeys.lists(teamId) });
    },
  });
}
