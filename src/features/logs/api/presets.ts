import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { LogMapping } from '#shared/logs/mapping';
import { mappingPresetSchema, presetListSchema, type MappingPreset } from '#shared/schemas/logs';
import { api, type ApiError } from '#src/lib/api-client';
import { logKeys, presetsUrl } from './keys';

export function useMappingPresets(teamId: string) {
  return useQuery({ queryKey: logKeys.presets(teamId), queryFn: () => api.get(presetsUrl(teamId), presetListSchema).then((b) => b.presets) });
}

/** Keeps a mapping under a name for the next log from the same logger (same name: replaced). */
export function useSavePreset(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation<MappingPreset, ApiError, { name: string; mapping: LogMapping }>({
    mutationFn: (input) => api.put(presetsUrl(teamId), input, z.object({ preset: mappingPresetSchema })).then((b) => b.preset),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: logKeys.presets(teamId) }),
  });
}
