import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { uploadMapFieldsSchema } from '#shared/schemas/map-library';
import { api, segment } from '#src/lib/api-client';
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

/** Sends one map file as multipart/form-data through the shared API client. */
export function uploadMap(teamId: string, { file, name, notes }: UploadMapInput): Promise<UploadMapResult> {
  const body = new FormData();
  if (name !== undefined) body.append('name', name);
  if (notes !== undefined) body.append('notes', notes);
  body.append('file', file, file.name);
  return api.upload(`/api/teams/${segment(teamId)}/maps`, body, uploadMapResponseSchema);
}

export function useUploadMap(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UploadMapInput) => uploadMap(teamId, input),
    onSuccess: (result) => {
      queryClient.setQueryData(mapQueryOptions(teamId, result.map.id).queryKey, result.map);
      return queryClient.invalidateQueries({ queryKey: mapsQueryOptions(teamId).queryKey, exact: true });
    },
  });
}
