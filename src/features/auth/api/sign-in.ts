import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { meSchema, secondFactorNeededSchema, type secondFactorSignInSchema, type signInSchema } from '#shared/schemas/account';
import { api } from '#src/lib/api-client';
import { startSession } from '#src/lib/session';

export type SignInInput = z.infer<typeof signInSchema>;
export type SecondFactorInput = z.infer<typeof secondFactorSignInSchema>;

/** A right password gives a session, or (with a second factor on) a challenge to answer with a code. */
const signInAnswerSchema = z.union([meSchema, secondFactorNeededSchema]);

export function signIn(input: SignInInput) {
  return api.post('/api/auth/sign-in', input, signInAnswerSchema);
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (answer) => {
      if ('user' in answer) startSession(queryClient, answer);
    },
  });
}

export function useSecondFactorSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SecondFactorInput) => api.post('/api/auth/sign-in/second-factor', input, meSchema),
    onSuccess: (me) => startSession(queryClient, me),
  });
}
