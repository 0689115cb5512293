import { useMutation, useQueryClient } from '@tanstack/react-query';
import { draftResponseSchema, imageResponseSchema } from '#shared/tracer/api';
import { api } from '#src/lib/api-client';
import { tracerKeys, tracerUrl } from './keys';

/** Sends one picture (multipart, the field `file` and nothing else); the server checks its bytes again. */
export function uploadPicture(teamId: string, file: File) {
  const form = new FormData();
  form.append('file', file, file.name);
  return api.upload(`${tracerUrl(teamId)}/images`, form, imageResponseSchema).then((body) => body.image);
}

/** Opens a new trace on a picture already stored for the team. */
export function createDraft(teamId: string, input: { imageId: string; name?: string }) {
  return api.post(`${tracerUrl(teamId)}/drafts`, input, draftResponseSchema).then((body) => body.draft);
}

/** Upload a picture and open a trace on it, in one step for the user. */
export function useStartTrace(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async ({ file, name }: { file: File; name: string }) => {
      const image = await uploadPicture(teamId, file);
      return createDraft(teamId, { imageId: image.id, name });
    },
    onSuccess: (draft) => {
      queryClient.setQueryData(tracerKeys.draft(teamId, draft.id), draft);
      return queryClient.invalidateQueries({ queryKey: tracerKeys.all(teamId) });
    },
  });
}

/** Trace a stored picture again (one kept with a saved map). */
export function useTraceAgain(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: { imageId: string; name: string }) => createDraft(teamId, input),
    onSuccess: (draft) => {
      queryClient.setQueryData(tracerKeys.draft(teamId, draft.id), draft);
      return queryClient.invalidateQueries({ queryKey: tracerKeys.drafts(teamId) });
    },
  });
}
