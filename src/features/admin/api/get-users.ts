import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { adminUserSchema } from '#shared/schemas/account';
import { api } from '#src/lib/api-client';

const usersResponseSchema = z.object({ users: z.array(adminUserSchema) });

/** Every account on the site (at most 100, by e-mail), or those whose name or e-mail holds `q`. */
export function getUsers(q: string) {
  const query = q ? `?q=${encodeURIComponent(q)}` : '';
  return api.get(`/api/admin/users${query}`, usersResponseSchema).then((body) => body.users);
}

/** The key every search of the user list starts with (a change refreshes them all). */
export const usersKey = ['admin', 'users'] as const;

export const usersQueryOptions = (q: string) =>
  queryOptions({
    queryKey: [...usersKey, q] as const,
    queryFn: () => getUsers(q),
    // While a new search runs, the last answer stays on screen instead of a blank table.
    placeholderData: keepPreviousData,
  });

export function useUsers(q: string) {
  return useQuery(usersQueryOptions(q));
}
