import { useMutation, useQueryClient } from '@tanstack/react-query';
import { importResultSchema } from '#shared/schemas/account';
import { api, segment } from '#src/lib/api-client';

/** The address of a team's archive download (a plain link: the browser saves the file). */
export function exportArchiveHref(teamId: string) {
  return `/api/teams/${segment(teamId)}/archive/export`;
}

/** Imports an archive file into a team: all or nothing; problems come back by item. */
export function importArchive(teamId: string, file: File) {
  const form = new FormData();
  form.append('archive', file, file.name);
  return api.upload(`/api/teams/${segment(teamId)}/archive/import`, form, importResultSchema);
}

export function useImportArchive(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (file: File) => importArchive(teamId, file),
    // The team's studies, maps and audit record all change.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['teams', teamId] }),
  });
}
