import { useMutation } from '@tanstack/react-query';
import { type z } from 'zod';
import { type resetRequestSchema } from '#shared/schemas/account';
import { api } from '#src/lib/api-client';

export type ResetRequestInput = z.infer<typeof resetRequestSchema>;

/** Answers the same whether or not the address has an account, so it cannot be used to probe. */
export function requestPasswordReset(input: ResetRequestInput) {
  return api.post('/api/auth/password-reset', input);
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
