import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { meSchema, signUpSchema } from '../../../../shared/schemas/account';
import { api } from '../../../lib/api-client';
import { startSession } from '../../../lib/session';

export type SignUpInput = z.infer<typeof signUpSchema>;

export function signUp(input: SignUpInput) {
  return api.post('/api/auth/sign-up', input, meSchema);
}

export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    onSuccess: (me) => startSession(queryClient, me),
  });
}
