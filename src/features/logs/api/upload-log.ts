import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { LogMapping } from '#shared/logs/mapping';
import { logSummarySchema, type LogSummary } from '#shared/schemas/logs';
import { api, type ApiError } from '#src/lib/api-client';
import { logKeys, logsUrl } from './keys';

export interface UploadLogInput {
  file: File;
  mapping: LogMapping;
  name?: string;
  loggedOn?: string;
  notes?: string;
}

/** Sends the file itself with its mapping: the server reads it again and stores it only whole. */
export function useUploadLog(teamId: string, studyId: string) {
  const queryClient = useQueryClient();
  return useMutation<LogSummary, ApiError, UploadLogInput>({
    mutationFn: (input) => {
      const form = new FormData();
      form.append('mapping', JSON.stringify(input.mapping));
      if (input.name) form.append('name', input.name);
      if (input.loggedOn) form.append('loggedOn', input.loggedOn);
      if (input.notes) form.append('notes', input.notes);
      form.append('file', input.file);
      return api.upload(logsUrl(teamId, studyId), form, z.object({ log: logSummarySchema })).then((b) => b.log);
    },
    onSuccess: () => queryClient.invalidateQueries({ queryKey: logKeys.list(teamId, studyId) }),
  });
}
