import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { outboxMessageSchema } from '#shared/schemas/account';
import { api, segment } from '#src/lib/api-client';

const outboxMessageResponseSchema = z.object({ message: outboxMessageSchema });

export function getOutboxMessage(messageId: string) {
  return api.get(`/api/admin/outbox/${segment(messageId)}`, outboxMessageResponseSchema).then((body) => body.message);
}

export const outboxMessageQueryOptions = (messageId: string) =>
  queryOptions({ queryKey: ['admin', 'outbox', messageId] as const, queryFn: () => getOutboxMessage(messageId), staleTime: Infinity });

export function useOutboxMessage(messageId: string) {
  return useQuery(outboxMessageQueryOptions(messageId));
}
