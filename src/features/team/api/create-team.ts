import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { type createTeamSchema, teamSummarySchema } from '#shared/schemas/account';
import { api } from '#src/lib/api-client';
import { meQueryOptions } from '#src/lib/session';
import { teamsQueryOptions } from './get-teams';

export type CreateTeamInput = z.infer<typeof createTeamSchema>;
const createTeamResponseSchema = z.object({ team: teamSummarySchema });

export function createTeam(input: CreateTeamInput) {
  return api.post('/api/teams', input, createTeamResponseSchema).then((body) => body.team);
}

export function useCreateTeam() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createTeam,
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: teamsQueryOptions().queryKey }),
        queryClient.invalidateQueries({ queryKey: meQueryOptions().queryKey }),
      ]),
  });
}
