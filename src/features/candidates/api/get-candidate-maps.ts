import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import type { CandidateMap } from '#shared/candidates';
import { spoolbookMapSchema } from '#shared/schemas/map';
import { api } from '#src/lib/api-client';
import { candidateKeys } from './keys';

const candidateMapsSchema = z.object({
  maps: z.array(z.object({ id: z.string(), name: z.string(), origin: z.enum(['built-in', 'team', 'estimate']), map: spoolbookMapSchema })),
});

/** Every parsed map of one kind the team may rank: its own, then the built-in ones. */
function getCandidateMaps(teamId: string, kind: 'compressor' | 'turbine'): Promise<CandidateMap[]> {
  return api.get(`/api/teams/${encodeURIComponent(teamId)}/candidate-maps?kind=${kind}`, candidateMapsSchema).then((body) => body.maps);
}

const candidateMapsQueryOptions = (teamId: string, kind: 'compressor' | 'turbine') =>
  queryOptions({ queryKey: candidateKeys.maps(teamId, kind), queryFn: () => getCandidateMaps(teamId, kind), staleTime: 60_000 });

export function useCandidateMaps(teamId: string, kind: 'compressor' | 'turbine', options: { enabled?: boolean } = {}) {
  return useQuery({ ...candidateMapsQueryOptions(teamId, kind), enabled: options.enabled ?? true });
}
