import { useMemo, useState } from 'react';
import { readStudyDocument, studyMapIds } from '#shared/study/document';
import { Alert } from '#src/components/Alert';
import { Card } from '#src/components/Card';
import { ConfirmButton } from '#src/components/ConfirmButton';
import { Loading } from '#src/components/Page';
import { StudyCaution } from '#src/components/study/StudyCaution';
import { formatNumber, useUnitSystem } from '#src/lib/quantities';
import { useMapModels } from '#src/features/maps/api';
import { useStudy } from '#src/features/studies/api';
import { useDeleteLog, useLogs } from '../api';
import { LogView } from './LogView';
import { UploadLog } from './UploadLog';

/** A study's logged runs: add one, pick one, see it beside the prediction and fit the model to it. */
export function LogsPage({ teamId, studyId }: { teamId: string; studyId: string }) {
  const study = useStudy(teamId, studyId);
  const logs = useLogs(teamId, studyId);
  const remove = useDeleteLog(teamId, studyId);
  const system = useUnitSystem();
  const [chosen, setChosen] = useState<string | null>(null);
  const read = useMemo(() => (study.data ? readStudyDocument(study.data.document) : null), [study.data]);
  const document = read?.ok ? read.document : null;
  const maps = useMapModels(teamId, document ? studyMapIds(document.plans) : []);

  if (study.isPending || logs.isPending || (document && maps.loading)) return <Loading label="Loading the study and its logs…" />;
  if (study.error || logs.error)
    return (
      <Alert tone="error" title="The study or its logs could not be loaded">
        {(study.error ?? logs.error)?.message}
      </Alert>
    );
  if (!document || !study.data)
    return (
      <Alert tone="error" title="The saved study does not read">
        {read && !read.ok ? read.message : ''}
      </Alert>
    );
  const list = logs.data ?? [];
  const current = list.find((l) => l.id === chosen) ?? list[0] ?? null;

  return (
    <div className="space-y-5">
      <StudyCaution />
      <Card title="Logged runs of this study">
        {list.length === 0 ? (
          <p className="text-sm">No logs yet.{study.data.canEdit ? ' Add one below.' : ''}</p>
        ) : (
          <ul className="divide-y divide-ink/10 text-sm">
            {list.map((l) => (
              <li key={l.id} className="flex flex-wrap items-center gap-3 py-2">
                <label className="inline-flex items-center gap-2">
                  <input type="radio" name="log" checked={current?.id === l.id} onChange={() => setChosen(l.id)} />
                  <span className="font-medium">{l.name}</span>
                </label>
                <span className="text-ink-soft tabular-nums">
                  {l.loggedOn ?? 'no date'} · {l.rows.toLocaleString('en')} rows · {formatNumber(l.duration, 4)} s · {l.channels.length} channels ·{' '}
                  {formatNumber(l.storedBytes / 1024, 3)} KiB stored
                  {l.skipped.length > 0 && ` · ${l.skipped.reduce((n, s) => n + s.rows, 0)} rows skipped`}
                </span>
                {study.data.canEdit && (
                  <ConfirmButton
                    title={`Delete the log “${l.name}”?`}
                    description="Its samples and segment choice go; the study and its revisions stay."
                    confirmLabel="Delete the log"
                    variant="destructive"
                    onConfirm={() => remove.mutateAsync(l.id)}
                  >
                    Delete
                  </ConfirmButton>
                )}
              </li>
            ))}
          </ul>
        )}
      </Card>
      {study.data.canEdit && <UploadLog teamId={teamId} studyId={studyId} onUploaded={setChosen} />}
      {current && <LogView key={current.id} teamId={teamId} study={study.data} document={document} mapsById={maps.mapsById} log={current} system={system} />}
    </div>
  );
}
