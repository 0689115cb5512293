import { useMutation, useQueryClient } from '@tanstack/react-query';
import { type z } from 'zod';
import { meSchema, type updateProfileSchema } from '#shared/schemas/account';
import { api } from '#src/lib/api-client';
import { meQueryOptions } from '#src/lib/session';

export type UpdateProfileInput = z.infer<typeof updateProfileSchema>;

/** Changes the display name and/or the unit system; the answer is the new `me`. */
export function updateProfile(input: UpdateProfileInput) {
  return api.patch('/api/auth/me', input, meSchema);
}

export function useUpdateProfile() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateProfile,
    onSuccess: (me) => queryClient.setQueryData(meQueryOptions().queryKey, me),
  });
}
