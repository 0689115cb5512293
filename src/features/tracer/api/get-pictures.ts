import { queryOptions, useQuery } from '@tanstack/react-query';
import { imagesResponseSchema } from '#shared/tracer/api';
import { api } from '#src/lib/api-client';
import { tracerKeys, tracerUrl } from './keys';

/** The team's pictures, newest first (each says which map, if any, was traced from it). */
export function getPictures(teamId: string) {
  return api.get(`${tracerUrl(teamId)}/images`, imagesResponseSchema).then((body) => body.images);
}

export const picturesQueryOptions = (teamId: string) => queryOptions({ queryKey: tracerKeys.images(teamId), queryFn: () => getPictures(teamId) });

export function usePictures(teamId: string) {
  return useQuery(picturesQueryOptions(teamId));
}
