import { useState, type FormEvent } from 'react';
import { z } from 'zod';
import { importProblemSchema } from '#shared/schemas/account';
import { Alert } from '#src/components/Alert';
import { Button, buttonClass } from '#src/components/Button';
import { isApiError } from '#src/lib/api-client';
import { exportArchiveHref, useImportArchive } from '../api/import-archive';

const problemsSchema = z.object({ problems: z.array(importProblemSchema) });

/** Owners take the team's maps and studies out as one file, and bring an archive in. */
export function TeamArchive({ teamId }: { teamId: string }) {
  const importer = useImportArchive(teamId);
  const [file, setFile] = useState<File | null>(null);
  const problems = isApiError(importer.error) ? (problemsSchema.safeParse(importer.error.details).data?.problems ?? []) : [];

  function submit(event: FormEvent) {
    event.preventDefault();
    if (file) importer.mutate(file);
  }

  return (
    <div className="space-y-5">
      <div className="space-y-2">
        <p className="text-sm text-ink-soft">One JSON file with every map of the team (with its original file) and every study with its whole history.</p>
        <a className={buttonClass('secondary')} href={exportArchiveHref(teamId)} download>
          Download team archive
        </a>
      </div>
      <form className="space-y-3" onSubmit={submit} aria-label="Import an archive">
        <label className="block text-sm font-semibold" htmlFor="archive-file">
          Import an archive into this team
        </label>
        <input
          id="archive-file"
          type="file"
          accept="application/json,.json"
          className="block text-sm"
          onChange={(e) => {
            importer.reset();
            setFile(e.target.files?.[0] ?? null);
          }}
        />
        <p className="text-sm text-ink-soft">Everything in the file is checked first; if any item has a problem, nothing is imported.</p>
        <Button type="submit" variant="primary" disabled={!file} pending={importer.isPending}>
          Import
        </Button>
      </form>
      {importer.isSuccess && (
        <Alert tone="success">
          Imported {importer.data.imported.maps} maps and {importer.data.imported.studies} studies ({importer.data.imported.revisions} revisions).
        </Alert>
      )}
      {importer.isError && (
        <Alert tone="error" title={importer.error.message}>
          {problems.length > 0 && (
            <ul className="mt-2 list-disc space-y-1 pl-5 text-sm">
              {problems.map((p, i) => (
                <li key={i}>
                  <span className="font-semibold">{p.item}</span>: {p.message}
                </li>
              ))}
            </ul>
          )}
        </Alert>
      )}
    </div>
  );
}
