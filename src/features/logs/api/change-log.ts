import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { logSummarySchema, type LogSummary, type updateLogSchema } from '#shared/schemas/logs';
import { api, type ApiError } from '#src/lib/api-client';
import { logKeys, logUrl } from './keys';

/** Renames a log, changes its notes or the segments it is compared on. */
export function useUpdateLog(teamId: string, studyId: string, logId: string) {
  const queryClient = useQueryClient();
  return useMutation<LogSummary, ApiError, z.input<typeof updateLogSchema>>({
    mutationFn: (changes) => api.patch(logUrl(teamId, studyId, logId), changes, z.object({ log: logSummarySchema })).then((b) => b.log),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: logKeys.list(teamId, studyId) }),
  });
}

export function useDeleteLog(teamId: string, studyId: string) {
  const queryClient = useQueryClient();
  return useMutation<void, ApiError, string>({
    mutationFn: (logId) => api.delete(logUrl(teamId, studyId, logId)),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: logKeys.list(teamId, studyId) }),
  });
}
