import { useEffect, useId, useState } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router';
import { STUDY_STARTS, type StudyStart, type StudySummary } from '#shared/schemas/study';
import { Alert } from '#src/components/Alert';
import { Badge } from '#src/components/Badge';
import { Button } from '#src/components/Button';
import { ConfirmButton } from '#src/components/ConfirmButton';
import { Loading, Page } from '#src/components/Page';
import { inputClass } from '#src/components/TextField';
import { formatDateTime } from '#src/lib/format';
import { paths } from '#src/lib/paths';
import { useCreateStudy } from '../api/create-study';
import { useDeleteStudy } from '../api/delete-study';
import { useDuplicateStudy } from '../api/duplicate-study';
import { useStudies, type StudyListParams } from '../api/get-studies';
import { useUpdateStudyMeta } from '../api/update-study-meta';
import { useTeamAccess } from '#src/lib/team-access';
import { TitleDialog } from './TitleDialog';

const PAGE_SIZE = 20;
const ARCHIVED_OPTIONS = [
  { value: 'false', label: 'Current studies' },
  { value: 'true', label: 'Archived studies' },
  { value: 'all', label: 'Current and archived' },
] as const;

type Archived = NonNullable<StudyListParams['archived']>;

/** The list's filters live in the address, so Back and a shared link bring the same list. */
function useListParams() {
  const [search, setSearch] = useSearchParams();
  const archivedRaw = search.get('archived');
  const params: Required<Omit<StudyListParams, 'pageSize'>> = {
    q: search.get('q') ?? '',
    author: search.get('author') ?? '',
    archived: archivedRaw === 'true' || archivedRaw === 'all' ? archivedRaw : 'false',
    page: Math.max(1, Number.parseInt(search.get('page') ?? '1', 10) || 1),
  };
  function update(next: Partial<typeof params>) {
    const merged = { ...params, ...next };
    // Changing a filter starts again at page 1.
    if (!('page' in next)) merged.page = 1;
    const out = new URLSearchParams();
    if (merged.q) out.set('q', merged.q);
    if (merged.author) out.set('author', merged.author);
    if (merged.archived !== 'false') out.set('archived', merged.archived);
    if (merged.page > 1) out.set('page', String(merged.page));
    setSearch(out, { replace: true });
  }
  return [params, update] as const;
}

function SearchBox({ value, onChange }: { value: string; onChange: (q: string) => void }) {
  const id = useId();
  const [text, setText] = useState(value);
  // The search in the address changed (a search ran, or back and forward): show it.
  const [shownValue, setShownValue] = useState(value);
  if (value !== shownValue) {
    setShownValue(value);
    setText(value);
  }
  // A request per pause in typing, not per key.
  useEffect(() => {
    if (text === value) return;
    const timer = window.setTimeout(() => onChange(text.trim()), 300);
    return () => window.clearTimeout(timer);
  }, [text, value, onChange]);
  return (
    <div className="min-w-[16rem] flex-1 space-y-1">
      <label htmlFor={id} className="block text-sm font-semibold text-ink">
        Search title and engine
      </label>
      <input id={id} type="search" value={text} onChange={(e) => setText(e.target.value)} placeholder="e.g. hill-climb, 2.0 L, E85" className={inputClass} />
    </div>
  );
}

function StudyActions({ teamId, study }: { teamId: string; study: StudySummary }) {
  const rename = useUpdateStudyMeta(teamId);
  const duplicate = useDuplicateStudy(teamId);
  const remove = useDeleteStudy(teamId);
  const [dialog, setDialog] = useState<'rename' | 'duplicate' | null>(null);
  const [error, setError] = useState<string | null>(null);

  async function toggleArchived() {
    setError(null);
    try {
      await rename.mutateAsync({ studyId: study.id, archived: !study.archived });
    } catch (e) {
      setError(e instanceof Error ? e.message : 'Could not change the study.');
    }
  }

  return (
    <div className="flex flex-wrap items-center justify-end gap-1">
      <Button variant="quiet" onClick={() => setDialog('rename')} aria-label={`Rename ${study.title}`}>
        Rename
      </Button>
      <Button variant="quiet" onClick={() => setDialog('duplicate')} aria-label={`Duplicate ${study.title}`}>
        Duplicate
      </Button>
      <Button
        variant="quiet"
        onClick={toggleArchived}
        pending={rename.isPending && rename.variables?.archived !== undefined}
        aria-label={`${study.archived ? 'Bring back' : 'Archive'} ${study.title}`}
      >
        {study.archived ? 'Bring back' : 'Archive'}
      </Button>
      <ConfirmButton
        variant="quiet"
        title={`Delete “${study.title}”?`}
        description="The study and every saved revision and share link are deleted for the whole team. This cannot be undone. Archive it instead to keep it out of the list."
        confirmLabel="Delete study"
        cancelLabel="Keep it"
        onConfirm={() => remove.mutateAsync(study.id)}
        aria-label={`Delete ${study.title}`}
      >
        Delete
      </ConfirmButton>
      {error && (
        <p role="alert" className="w-full text-right text-sm text-copper-ink">
          {error}
        </p>
      )}
      <TitleDialog
        open={dialog === 'rename'}
        title="Rename study"
        initialTitle={study.title}
        submitLabel="Rename"
        onSubmit={(title) => rename.mutateAsync({ studyId: study.id, title })}
        onClose={() => setDialog(null)}
      />
      <TitleDialog
        open={dialog === 'duplicate'}
        title="Duplicate study"
        description="The copy starts at revision 1 with this study's latest saved document; its history and share links stay with the original."
        initialTitle={`${study.title} (copy)`.slice(0, 120)}
        submitLabel="Duplicate"
        onSubmit={(title) => duplicate.mutateAsync({ studyId: study.id, title })}
        onClose={() => setDialog(null)}
      />
    </div>
  );
}

/** What a new study starts from: blank or a demo study as a template. */
function StartChoice({ value, onChange }: { value: StudyStart; onChange: (start: StudyStart) => void }) {
  const order: StudyStart[] = ['blank', 'demo-hillclimb', 'demo-exhaust'];
  return (
    <fieldset className="space-y-2">
      <legend className="text-sm font-semibold text-ink">Start from</legend>
      {order.map((start) => (
        <label
          key={start}
          className="flex cursor-pointer items-start gap-2 rounded-md border border-paper-line bg-white/70 p-2 text-sm has-[:checked]:border-teal"
        >
          <input type="radio" name="start" value={start} checked={value === start} onChange={() => onChange(start)} className="mt-1 accent-teal" />
          <span>
            <span className="block font-semibold text-ink">{STUDY_STARTS[start].title}</span>
            <span className="block text-ink-soft">{STUDY_STARTS[start].description}</span>
          </span>
        </label>
      ))}
    </fieldset>
  );
}

/**
 * The team's studies: search by title and engine, filter by author and archived, newest change
 * first, paged by the server. Owners and editors create, rename, duplicate, archive and delete.
 */
export function StudyList({ teamId }: { teamId: string }) {
  const navigate = useNavigate();
  const access = useTeamAccess(teamId);
  const canEdit = access.can('content:write');
  const [params, setParams] = useListParams();
  const studies = useStudies(teamId, { ...params, pageSize: PAGE_SIZE });
  const create = useCreateStudy(teamId);
  const [creating, setCreating] = useState(false);
  const [start, setStart] = useState<StudyStart>('demo-hillclimb');
  const authorId = useId();
  const archivedId = useId();

  const data = studies.data;
  const pages = data ? Math.max(1, Math.ceil(data.total / data.pageSize)) : 1;
  const filtered = Boolean(params.q || params.author || params.archived !== 'false');

  return (
    <Page
      title="Studies"
      eyebrow={access.teamName ?? undefined}
      description="Each study holds an engine, its fuel system, the scenarios and the plans being judged, and shows whether each plan keeps every operating line inside its compressor map with margin."
      actions={
        canEdit ? (
          <Button variant="primary" onClick={() => setCreating(true)}>
            New study
          </Button>
        ) : undefined
      }
    >
      <section aria-label="Find studies" className="flex flex-wrap items-end gap-3">
        <SearchBox value={params.q} onChange={(q) => setParams({ q })} />
        <div className="space-y-1">
          <label htmlFor={authorId} className="block text-sm font-semibold text-ink">
            Started by
          </label>
          <select id={authorId} value={params.author} onChange={(e) => setParams({ author: e.target.value })} className={`${inputClass} pr-8`}>
            <option value="">Anyone</option>
            {data?.authors.map((a) => (
              <option key={a.id} value={a.id}>
                {a.name}
              </option>
            ))}
          </select>
        </div>
        <div className="space-y-1">
          <label htmlFor={archivedId} className="block text-sm font-semibold text-ink">
            Show
          </label>
          <select
            id={archivedId}
            value={params.archived}
            onChange={(e) => setParams({ archived: e.target.value as Archived })}
            className={`${inputClass} pr-8`}
          >
            {ARCHIVED_OPTIONS.map((o) => (
              <option key={o.value} value={o.value}>
                {o.label}
              </option>
            ))}
          </select>
        </div>
      </section>

      {studies.isPending ? (
        <Loading label="Loading the studies…" />
      ) : studies.isError && !data ? (
        <Alert tone="error" title="The studies could not be loaded">
          {studies.error.message}
        </Alert>
      ) : data && data.studies.length === 0 ? (
        <div className="rounded-lg border border-dashed border-paper-line bg-white/50 p-8 text-center text-ink-soft">
          {filtered ? (
            <p>No study matches these filters.</p>
          ) : (
            <>
              <p className="font-semibold text-ink">No studies in this team yet.</p>
              <p className="mt-1">{canEdit ? 'Start one blank or from a demo study with “New study”.' : 'Owners and editors of the team can start one.'}</p>
            </>
          )}
        </div>
      ) : data ? (
        <div className={`space-y-3 ${studies.isPlaceholderData ? 'opacity-70' : ''}`} aria-busy={studies.isFetching}>
          <div className="overflow-x-auto rounded-lg border border-paper-line bg-white/75">
            <table className="w-full border-collapse text-left text-sm">
              <caption className="sr-only">Studies of the team, most recently changed first</caption>
              <thead className="border-b-2 border-ink/20 text-xs uppercase tracking-wider text-ink-soft">
                <tr>
                  <th scope="col" className="px-3 py-2 font-semibold">
                    Study
                  </th>
                  <th scope="col" className="px-3 py-2 font-semibold">
                    Last change
                  </th>
                  <th scope="col" className="px-3 py-2 font-semibold">
                    Started by
                  </th>
                  {canEdit && (
                    <th scope="col" className="px-3 py-2 text-right font-semibold">
                      <span className="sr-only">Actions</span>
                    </th>
                  )}
                </tr>
              </thead>
              <tbody className="divide-y divide-paper-line">
                {data.studies.map((s) => (
                  <tr key={s.id} data-study-id={s.id}>
                    <td className="px-3 py-2.5 align-top">
                      <Link to={paths.teamStudy.href(teamId, s.id)} className="font-semibold">
                        {s.title}
                      </Link>
                      {s.archived && (
                        <span className="ml-2">
                          <Badge>archived</Badge>
                        </span>
                      )}
                      <span className="block text-ink-soft">{s.engineLabel || 'No engine label'}</span>
                    </td>
                    <td className="px-3 py-2.5 align-top">
                      <time dateTime={s.updatedAt}>{formatDateTime(s.updatedAt)}</time>
                      <span className="block text-ink-soft">
                        revision {s.revision}
                        {s.updatedBy ? ` by ${s.updatedBy}` : ''}
                      </span>
                    </td>
                    <td className="px-3 py-2.5 align-top">{s.createdBy ?? '—'}</td>
                    {canEdit && (
                      <td className="px-3 py-2.5 align-top">
                        <StudyActions teamId={teamId} study={s} />
                      </td>
                    )}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <nav aria-label="Pages of studies" className="flex flex-wrap items-center justify-between gap-2 text-sm text-ink-soft">
            <span>
              {data.total} {data.total === 1 ? 'study' : 'studies'} · page {data.page} of {pages}
            </span>
            <span className="flex gap-2">
              <Button onClick={() => setParams({ page: params.page - 1 })} disabled={params.page <= 1}>
                Previous page
              </Button>
              <Button onClick={() => setParams({ page: params.page + 1 })} disabled={params.page >= pages}>
                Next page
              </Button>
            </span>
          </nav>
        </div>
      ) : null}

      <TitleDialog
        open={creating}
        title="New study"
        description="Start blank or from one of the demo studies as a template. Change anything once it opens."
        initialTitle="New study"
        submitLabel="Create study"
        onSubmit={async (title) => {
          const study = await create.mutateAsync({ title, start });
          navigate(paths.teamStudy.href(teamId, study.id));
        }}
        onClose={() => setCreating(false)}
      >
        <StartChoice value={start} onChange={setStart} />
      </TitleDialog>
    </Page>
  );
}
