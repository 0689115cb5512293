import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import { resetRequestSchema } from '../../../../shared/schemas/account';
import { api } from '../../../lib/api-client';

export type ResetRequestInput = z.infer<typeof resetRequestSchema>;

/** Answers the same whether or not the address has an account, so it cannot be used to probe. */
export function requestPasswordReset(input: ResetRequestInput) {
  return api.post('/api/auth/password-reset', input);
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
