import { useMutation, useQueryClient } from '@tanstack/react-query';
import { type z } from 'zod';
import { type changePasswordSchema, meSchema } from '#shared/schemas/account';
import { api } from '#src/lib/api-client';
import { meQueryOptions } from '#src/lib/session';

export type ChangePasswordInput = z.infer<typeof changePasswordSchema>;

/** Every other session of the user ends; this one gets a new cookie. */
export function changePassword(input: ChangePasswordInput) {
  return api.post('/api/auth/password', input, meSchema);
}

export function useChangePassword() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: changePassword,
    onSuccess: (me) => queryClient.setQueryData(meQueryOptions().queryKey, me),
  });
}
