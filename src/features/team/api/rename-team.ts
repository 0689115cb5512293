import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { type renameTeamSchema, teamSummarySchema } from '#shared/schemas/account';
import { api, segment } from '#src/lib/api-client';
import { meQueryOptions } from '#src/lib/session';
import { teamQueryOptions } from './get-team';
import { teamsQueryOptions } from './get-teams';

export type RenameTeamInput = z.infer<typeof renameTeamSchema>;
const renameTeamResponseSchema = z.object({ team: teamSummarySchema });

export function renameTeam(teamId: string, input: RenameTeamInput) {
  return api.patch(`/api/teams/${segment(teamId)}`, input, renameTeamResponseSchema).then((body) => body.team);
}

export function useRenameTeam(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: RenameTeamInput) => renameTeam(teamId, input),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: teamsQueryOptions().queryKey }),
        queryClient.invalidateQueries({ queryKey: teamQueryOptions(teamId).queryKey }),
        queryClient.invalidateQueries({ queryKey: meQueryOptions().queryKey }),
      ]),
  });
}
