import { useMutation, useQueryClient } from '@tanstack/react-query';
import { type z } from 'zod';
import { type resetConfirmSchema } from '#shared/schemas/account';
import { api } from '#src/lib/api-client';
import { meQueryOptions } from '#src/lib/session';

export type ResetConfirmInput = z.infer<typeof resetConfirmSchema>;

export function confirmPasswordReset(input: ResetConfirmInput) {
  return api.post('/api/auth/password-reset/confirm', input);
}

export function useConfirmPasswordReset() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: confirmPasswordReset,
    // The server ends every session of that user; ask again who this browser is signed in as.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: meQueryOptions().queryKey }),
  });
}
