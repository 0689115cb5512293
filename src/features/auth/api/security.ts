import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { meSchema, recoveryCodesSchema, sessionListSchema, twoFactorSetupSchema, twoFactorStatusSchema } from '#shared/schemas/account';
import { api } from '#src/lib/api-client';
import { meQueryOptions } from '#src/lib/session';

// The Sessions page, the second factor and the address confirmation: one file per area's endpoints.

export const sessionsQueryOptions = () =>
  queryOptions({ queryKey: ['auth', 'sessions'] as const, queryFn: () => api.get('/api/auth/sessions', sessionListSchema) });

export function useSessions() {
  return useQuery(sessionsQueryOptions());
}

export function useEndSession() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api.delete(`/api/auth/sessions/${encodeURIComponent(id)}`),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: sessionsQueryOptions().queryKey }),
  });
}

export function useEndOtherSessions() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.post('/api/auth/sessions/end-others', {}, z.object({ ended: z.number() })),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: sessionsQueryOptions().queryKey }),
  });
}

export const twoFactorQueryOptions = () =>
  queryOptions({ queryKey: ['auth', 'two-factor'] as const, queryFn: () => api.get('/api/auth/two-factor', twoFactorStatusSchema) });

export function useTwoFactorStatus() {
  return useQuery(twoFactorQueryOptions());
}

export function useBeginTwoFactor() {
  return useMutation({ mutationFn: (password: string) => api.post('/api/auth/two-factor/setup', { password }, twoFactorSetupSchema) });
}

export function useEnableTwoFactor() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (code: string) => api.post('/api/auth/two-factor/enable', { code }, recoveryCodesSchema),
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: twoFactorQueryOptions().queryKey });
      void queryClient.invalidateQueries({ queryKey: meQueryOptions().queryKey });
    },
  });
}

export function useDisableTwoFactor() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (password: string) => api.post('/api/auth/two-factor/disable', { password }, meSchema),
    onSuccess: (me) => {
      queryClient.setQueryData(meQueryOptions().queryKey, me);
      void queryClient.invalidateQueries({ queryKey: twoFactorQueryOptions().queryKey });
    },
  });
}

export function useNewRecoveryCodes() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (password: string) => api.post('/api/auth/two-factor/recovery-codes', { password }, recoveryCodesSchema),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: twoFactorQueryOptions().queryKey }),
  });
}

export function useConfirmEmail() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (token: string) => api.post('/api/auth/confirm-email', { token }, z.object({ confirmed: z.literal(true), email: z.string() })),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: meQueryOptions().queryKey }),
  });
}

export function useResendConfirmation() {
  return useMutation({ mutationFn: () => api.post('/api/auth/confirm-email/resend', {}) });
}
