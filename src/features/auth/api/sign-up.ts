import { useMutation, useQueryClient } from '@tanstack/react-query';
import { type z } from 'zod';
import { meSchema, type signUpSchema } from '#shared/schemas/account';
import { api } from '#src/lib/api-client';
import { startSession } from '#src/lib/session';

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
