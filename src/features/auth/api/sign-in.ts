import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { meSchema, signInSchema } from '../../../../shared/schemas/account';
import { api } from '../../../lib/api-client';
import { startSession } from '../../../lib/session';

export type SignInInput = z.infer<typeof signInSchema>;

export function signIn(input: SignInInput) {
  return api.post('/api/auth/sign-in', input, meSchema);
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (me) => startSession(queryClient, me),
  });
}
