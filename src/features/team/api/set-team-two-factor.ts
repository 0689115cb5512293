import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { teamSummarySchema, teamTwoFactorSchema } from '#shared/schemas/account';
import { api, segment } from '#src/lib/api-client';
import { meQueryOptions } from '#src/lib/session';
import { teamQueryOptions } from './get-team';
import { teamsQueryOptions } from './get-teams';

const teamTwoFactorResponseSchema = z.object({ team: teamSummarySchema });

/**
 * An owner asks every member to use a second factor, or stops asking. 400 `two_factor_needed`
 * when the owner has none of their own (they would lock themselves out).
 */
export function setTeamTwoFactor(teamId: string, required: boolean) {
  return api.put(`/api/teams/${segment(teamId)}/two-factor`, teamTwoFactorSchema.parse({ required }), teamTwoFactorResponseSchema).then((body) => body.team);
}

export function useSetTeamTwoFactor(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (required: boolean) => setTeamTwoFactor(teamId, required),
    // The rule shows on the team page, in the team list and in `me` (which the notices read).
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: teamQueryOptions(teamId).queryKey }),
        queryClient.invalidateQueries({ queryKey: teamsQueryOptions().queryKey }),
        queryClient.invalidateQueries({ queryKey: meQueryOptions().queryKey }),
      ]),
  });
}
