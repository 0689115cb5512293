import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { changeRoleSchema, memberSchema, type Role } from '#shared/schemas/account';
import { api, segment } from '#src/lib/api-client';
import { meQueryOptions } from '#src/lib/session';
import { teamQueryOptions } from './get-team';
import { teamsQueryOptions } from './get-teams';

const changeRoleResponseSchema = z.object({ member: memberSchema });

/** 409 `last_owner` when it would leave the team without an owner. */
export function changeRole(teamId: string, userId: string, role: Role) {
  return api
    .patch(`/api/teams/${segment(teamId)}/members/${segment(userId)}`, changeRoleSchema.parse({ role }), changeRoleResponseSchema)
    .then((body) => body.member);
}

export function useChangeRole(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, role }: { userId: string; role: Role }) => changeRole(teamId, userId, role),
    // An owner may demote themself: their own role in `me` and the team list changes too.
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: teamQueryOptions(teamId).queryKey }),
        queryClient.invalidateQueries({ queryKey: teamsQueryOptions().queryKey }),
        queryClient.invalidateQueries({ queryKey: meQueryOptions().queryKey }),
      ]),
  });
}
