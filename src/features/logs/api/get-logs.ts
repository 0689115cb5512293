import { useQuery } from '@tanstack/react-query';
import { logListSchema } from '#shared/schemas/logs';
import { api } from '#src/lib/api-client';
import { logKeys, logsUrl } from './keys';

export function useLogs(teamId: string, studyId: string) {
  return useQuery({
    queryKey: logKeys.list(teamId, studyId),
    queryFn: () => api.get(logsUrl(teamId, studyId), logListSchema).then((b) => b.logs),
  });
}
