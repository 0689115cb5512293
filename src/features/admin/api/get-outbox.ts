import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { outboxSummarySchema } from '#shared/schemas/account';
import { api } from '#src/lib/api-client';

const outboxResponseSchema = z.object({ messages: z.array(outboxSummarySchema) });

/** Mail the local mail fake captured, newest first. */
export function getOutbox() {
  return api.get('/api/admin/outbox', outboxResponseSchema).then((body) => body.messages);
}

// New mail arrives while a developer watches the list: keep it fresh without a reload.
export const outboxQueryOptions = () => queryOptions({ queryKey: ['admin', 'outbox'] as const, queryFn: getOutbox, staleTime: 0, refetchInterval: 10_000 });

export function useOutbox() {
  return useQuery(outboxQueryOptions());
}
