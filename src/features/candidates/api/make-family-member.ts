import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { familyRequestSchema } from '#shared/schemas/candidates';
import { api, type ApiError } from '#src/lib/api-client';

export type FamilyRequest = z.input<typeof familyRequestSchema>;

const familyAnswerSchema = z.object({ map: z.object({ id: z.string(), name: z.string() }).passthrough() });

/** Makes a new compressor map from one of the library by a family rule; answers the new map's id and name. */
function makeFamilyMember(teamId: string, mapId: string, request: FamilyRequest) {
  return api.post(`/api/teams/${encodeURIComponent(teamId)}/maps/${encodeURIComponent(mapId)}/family`, request, familyAnswerSchema).then((b) => b.map);
}

export function useMakeFamilyMember(teamId: string, mapId: string) {
  const queryClient = useQueryClient();
  return useMutation<{ id: string; name: string }, ApiError, FamilyRequest>({
    mutationFn: (request) => makeFamilyMember(teamId, mapId, request),
    // Every list of the team's maps (the library, the plans' pickers, the Candidates view) gains the new map.
    onSuccess: () => queryClient.invalidateQueries(),
  });
}
