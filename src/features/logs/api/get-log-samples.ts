import { useQuery } from '@tanstack/react-query';
import { unpackChannels } from '#shared/logs/pack';
import { api } from '#src/lib/api-client';
import { logKeys, logUrl } from './keys';

/** The stored samples, inflated by the browser itself (they are stored deflated) and unpacked to SI channels. */
async function getSamples(teamId: string, studyId: string, logId: string) {
  const deflated = await api.bytes(`${logUrl(teamId, studyId, logId)}/samples`);
  const stream = new Blob([deflated]).stream().pipeThrough(new DecompressionStream('deflate'));
  const bytes = new Uint8Array(await new Response(stream).arrayBuffer());
  return unpackChannels(bytes);
}

export function useLogSamples(teamId: string, studyId: string, logId: string | null) {
  return useQuery({
    queryKey: logKeys.samples(teamId, studyId, logId ?? ''),
    queryFn: () => getSamples(teamId, studyId, logId!),
    enabled: logId !== null,
    // A stored log never changes under its id.
    staleTime: Infinity,
  });
}

/** Where points.csv and fit.csv are downloaded from (plain links: the browser sends the cookie). */
export function logCsvHref(teamId: string, studyId: string, logId: string, what: 'points' | 'fit', query = ''): string {
  return `${logUrl(teamId, studyId, logId)}/${what}.csv${query}`;
}
