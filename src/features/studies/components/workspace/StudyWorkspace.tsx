import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useMemo, useRef, useState } from 'react';
import { Link, useNavigate } from 'react-router';
import type { StudyDetail } from '#shared/schemas/study';
import { Alert } from '#src/components/Alert';
import { Badge } from '#src/components/Badge';
import { Button, ButtonLink, buttonClass } from '#src/components/Button';
import { Card } from '#src/components/Card';
import { ConfirmButton } from '#src/components/ConfirmButton';
import { Loading, useDocumentTitle } from '#src/components/Page';
import type { PointRef } from '#src/components/study/lines';
import { StudyCaution } from '#src/components/study/StudyCaution';
import { isApiError } from '#src/lib/api-client';
import { useMapModels, useMaps } from '#src/features/maps/api';
import { formatDateTime } from '#src/lib/format';
import { paths } from '#src/lib/paths';
import { useCreateStudy } from '#src/features/studies/api/create-study';
import { useDeleteStudy } from '#src/features/studies/api/delete-study';
import { useStudy } from '#src/features/studies/api/get-study';
import { studyKeys } from '#src/features/studies/api/keys';
import { resultsCsvHref, resultsXlsxHref } from '#src/features/studies/api/results-csv';
import { staleRevisionOf, useSaveStudy } from '#src/features/studies/api/save-study';
import { useUpdateStudyMeta } from '#src/features/studies/api/update-study-meta';
import { AssumptionsSection } from '../editor/AssumptionsSection';
import { EditorContext, type Editor } from '../editor/context';
import { EngineSection } from '../editor/EngineSection';
import { FuelSection } from '../editor/FuelSection';
import { NotesSection } from '../editor/NotesSection';
import { PlansSection } from '../editor/PlansSection';
import { RequirementsSection } from '../editor/RequirementsSection';
import { ScenariosSection } from '../editor/ScenariosSection';
import { TitleDialog } from '../TitleDialog';
import { ConflictDialog } from './ConflictDialog';
import { HistoryPanel } from './HistoryPanel';
import { LeaveGuard } from './LeaveGuard';
import { ProblemsSummary } from './ProblemsSummary';
import { CopyToTeamDialog, useWritableTeams } from '../CopyToTeamDialog';
import { SaveControls } from './SaveControls';
import { SkipLink } from '#src/components/Nav';
import { SharePanel } from './SharePanel';
import { StudyPlots } from './StudyPlots';
import { editableDocument, mapIdsOf, useDraft, useStudyCompute } from './use-study-editor';
import { useUnitSystem } from '#src/lib/quantities';

/** The study page: loads the study, then hands it to the editor (fresh for each study). */
export function StudyWorkspace({ teamId, studyId }: { teamId: string; studyId: string }) {
  const study = useStudy(teamId, studyId);
  if (study.isPending) return <Loading label="Opening the study…" />;
  if (study.isError) {
    const gone = isApiError(study.error) && study.error.status === 404;
    return (
      <div className="mx-auto max-w-2xl space-y-4">
        <Alert tone="error" title={gone ? 'No such study' : 'The study could not be opened'}>
          {gone ? 'It may have been deleted, or it belongs to a team you are not in.' : study.error.message}
        </Alert>
        <ButtonLink to={paths.teamStudies.href(teamId)}>Back to the studies</ButtonLink>
      </div>
    );
  }
  return <LoadedStudy key={study.data.id} teamId={teamId} study={study.data} />;
}

type Panel = 'history' | 'share' | null;

function LoadedStudy({ teamId, study }: { teamId: string; study: StudyDetail }) {
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const unitSystem = useUnitSystem();
  useDocumentTitle(study.title);

  const [initial] = useState(() => ({ revision: study.revision, document: editableDocument(study.document) }));
  const { base, draft, update, dirty, reset, saved } = useDraft(initial);
  const maps = useMapModels(teamId, mapIdsOf(draft));
  const { parsed, issues, valid, computed, stale } = useStudyCompute(draft, maps.mapsById, !maps.loading);
  const library = useMaps(teamId, 'compressor');
  const turbineLibrary = useMaps(teamId, 'turbine');

  const [selected, setSelected] = useState<PointRef | null>(null);
  const [panel, setPanel] = useState<Panel>(null);
  const [conflict, setConflict] = useState<StudyDetail | null>(null);
  const [saveError, setSaveError] = useState<string | null>(null);
  const [renaming, setRenaming] = useState(false);
  const [copying, setCopying] = useState(false);
  const writableTeams = useWritableTeams(teamId);
  const allowLeave = useRef(false);

  const save = useSaveStudy(teamId, study.id);
  const meta = useUpdateStudyMeta(teamId);
  const remove = useDeleteStudy(teamId);
  const createCopy = useCreateStudy(teamId);

  const readOnly = !study.canEdit || study.archived;
  const latestRevision = Math.max(study.revision, base.revision);
  const editor = useMemo<Editor>(() => ({ draft, update, issues, readOnly, unitSystem }), [draft, update, issues, readOnly, unitSystem]);

  const onSave = useCallback(
    (message: string) => {
      if (!parsed.success) return;
      setSaveError(null);
      const sent = draft;
      save.mutate(
        { baseRevision: base.revision, document: parsed.data, ...(message ? { message } : {}) },
        {
          onSuccess: (s) => saved(s.revision, sent),
          onError: (error) => {
            const theirs = staleRevisionOf(error);
            if (theirs) setConflict(theirs);
            else setSaveError(error.message);
          },
        },
      );
    },
    [parsed, draft, base.revision, save, saved],
  );

  function loadTheirs(theirs: StudyDetail) {
    queryClient.setQueryData(studyKeys.detail(teamId, study.id), theirs);
    reset({ revision: theirs.revision, document: editableDocument(theirs.document) });
    setConflict(null);
    setSaveError(null);
  }

  async function keepMineAsCopy(title: string) {
    const copy = await createCopy.mutateAsync({ title, document: parsed.success ? parsed.data : draft });
    allowLeave.current = true;
    setConflict(null);
    navigate(paths.teamStudy.href(teamId, copy.id));
  }

  function restored(next: StudyDetail) {
    reset({ revision: next.revision, document: editableDocument(next.document) });
  }

  const panelButton = (which: Exclude<Panel, null>, label: string) => (
    <Button onClick={() => setPanel((p) => (p === which ? null : which))} aria-expanded={panel === which} aria-controls={`panel-${which}`}>
      {label}
    </Button>
  );

  return (
    <EditorContext.Provider value={editor}>
      <div className="mx-auto w-full max-w-[112rem] space-y-5" data-testid="study-workspace">
        {/* With five plans the results hold hundreds of stops: these reach either side at once. */}
        <nav aria-label="Skip within the study" className="contents">
          <SkipLink target="study-results">Skip to results</SkipLink>
          <SkipLink target="study-inputs">Skip to inputs</SkipLink>
        </nav>
        <header className="space-y-3 border-b border-ink/15 pb-4">
          <div className="flex flex-wrap items-end justify-between gap-4">
            <div className="min-w-0 space-y-1">
              <p className="text-xs font-semibold uppercase tracking-[0.14em] text-copper-ink">
                <Link to={paths.teamStudies.href(teamId)} className="text-copper-ink">
                  Studies
                </Link>{' '}
                › Study
              </p>
              <h1 className="text-3xl font-semibold tracking-tight text-ink">
                {study.title} {study.archived && <Badge>archived</Badge>}
              </h1>
              <p className="text-sm text-ink-soft" data-testid="revision-line">
                {parsed.success ? parsed.data.engineLabel || 'No engine label' : String(draft.engineLabel ?? '')} · revision {base.revision}
                {study.updatedBy ? `, last saved by ${study.updatedBy}` : ''} on {formatDateTime(study.updatedAt)}
              </p>
            </div>
            {!readOnly && <SaveControls dirty={dirty} valid={valid} pending={save.isPending} nextRevision={latestRevision + 1} onSave={onSave} />}
          </div>
          <nav aria-label="Study tools" className="flex flex-wrap items-center gap-2">
            {panelButton('history', 'History')}
            {study.canEdit && panelButton('share', 'Share')}
            <ButtonLink to={paths.teamStudyCompare.href(teamId, study.id)}>Side by side</ButtonLink>
            <ButtonLink to={paths.teamStudyLogs.href(teamId, study.id)}>Logged runs</ButtonLink>
            <ButtonLink to={paths.teamStudyCandidates.href(teamId, study.id)}>Candidates</ButtonLink>
            <ButtonLink to={paths.teamStudyDrive.href(teamId, study.id)}>Drive</ButtonLink>
            <ButtonLink to={paths.teamStudyReport.href(teamId, study.id)}>Printable report</ButtonLink>
            <a
              href={resultsCsvHref(teamId, study.id)}
              download
              className={buttonClass('secondary')}
              title="Every point of the last saved revision, in SI units"
            >
              Results CSV
            </a>
            <a
              href={resultsXlsxHref(teamId, study.id)}
              download
              className={buttonClass('secondary')}
              title="The same results as a workbook, one sheet per plan, in SI units"
            >
              Results XLSX
            </a>
            {writableTeams.length > 0 && (
              <Button variant={study.canEdit ? 'quiet' : 'secondary'} onClick={() => setCopying(true)}>
                Copy to my team
              </Button>
            )}
            {study.canEdit && (
              <>
                <Button variant="quiet" onClick={() => setRenaming(true)}>
                  Rename
                </Button>
                <Button variant="quiet" pending={meta.isPending} onClick={() => meta.mutate({ studyId: study.id, archived: !study.archived })}>
                  {study.archived ? 'Bring back from the archive' : 'Archive'}
                </Button>
                <ConfirmButton
                  variant="quiet"
                  title={`Delete “${study.title}”?`}
                  description="The study, every revision and every share link are deleted for the whole team. This cannot be undone."
                  confirmLabel="Delete study"
                  cancelLabel="Keep it"
                  onConfirm={async () => {
                    await remove.mutateAsync(study.id);
                    allowLeave.current = true;
                    navigate(paths.teamStudies.href(teamId));
                  }}
                >
                  Delete
                </ConfirmButton>
              </>
            )}
          </nav>
          {dirty && <p className="text-xs text-ink-soft">Side by side, the report and the CSV show the last saved revision: save to include your changes.</p>}
        </header>

        {saveError && (
          <Alert tone="error" title="Not saved">
            {saveError}
          </Alert>
        )}
        {readOnly && (
          <Alert tone="info" title={study.archived ? 'This study is archived' : 'Read only'}>
            {study.archived
              ? study.canEdit
                ? 'Its inputs are locked. Bring it back from the archive to change it.'
                : 'Nothing can be changed while it is archived.'
              : `You are a viewer in this team: you can explore every input and result, and owners and editors change the study.${writableTeams.length > 0 ? ' “Copy to my team” makes a copy you can change.' : ''}`}
          </Alert>
        )}
        {maps.errors.length > 0 && (
          <Alert tone="error" title="A map could not be loaded">
            {maps.errors.map((e) => `${e.mapId}: ${e.message}`).join(' ')} Plans on it are judged with their default efficiency.
          </Alert>
        )}

        {panel === 'history' && (
          <Card
            id="panel-history"
            title="History"
            actions={
              <Button variant="quiet" onClick={() => setPanel(null)}>
                Close
              </Button>
            }
          >
            <HistoryPanel
              teamId={teamId}
              studyId={study.id}
              currentRevision={latestRevision}
              baseRevision={base.revision}
              canRestore={!readOnly}
              dirty={dirty}

              onRestored={restored}
              onConflict={setConflict}
            />
          </Card>
        )}
        {panel === 'share' && study.canEdit && (
          <Card
            id="panel-share"
            title="Share links"
            actions={
              <Button variant="quiet" onClick={() => setPanel(null)}>
                Close
              </Button>
            }
          >
            <SharePanel teamId={teamId} studyId={study.id} />
          </Card>
        )}

        <StudyCaution />

        <div className="grid items-start gap-5 lg:grid-cols-[minmax(0,1fr)_24rem] 2xl:grid-cols-[minmax(0,1fr)_28rem]">
          <div id="study-results" tabIndex={-1} aria-label="Results" role="region" className="min-w-0 space-y-4 focus:outline-none">
            <ProblemsSummary issues={issues} draft={draft} />
            <StudyPlots
              computed={computed}
              stale={stale}
              mapsById={maps.mapsById}
              namesById={maps.namesById}
              mapErrors={maps.errors}
              selected={selected}
              onSelect={setSelected}
              title={study.title}
            />
          </div>
          <aside
            id="study-inputs"
            tabIndex={-1}
            aria-label="Inputs"
            className="space-y-3 focus:outline-none lg:sticky lg:top-4 lg:max-h-[calc(100vh-2rem)] lg:overflow-y-auto lg:pr-1"
            data-testid="study-inputs"
          >
            <h2 className="text-lg font-semibold text-ink">Inputs {readOnly && <span className="text-sm font-normal text-ink-soft">(read only)</span>}</h2>
            <EngineSection />
            <FuelSection />
            <AssumptionsSection />
            <ScenariosSection />
            <PlansSection
              maps={library.data}
              mapsError={library.isError ? library.error.message : null}
              turbineMaps={turbineLibrary.data}
              turbineMapsError={turbineLibrary.isError ? turbineLibrary.error.message : null}
            />
            <RequirementsSection />
            <NotesSection />
          </aside>
        </div>

        <TitleDialog
          open={renaming}
          title="Rename study"
          initialTitle={study.title}
          submitLabel="Rename"
          onSubmit={(title) => meta.mutateAsync({ studyId: study.id, title })}
          onClose={() => setRenaming(false)}
        />
        <CopyToTeamDialog open={copying} teamId={teamId} studyId={study.id} studyTitle={study.title} onClose={() => setCopying(false)} />
        <ConflictDialog
          theirs={conflict}
          mine={parsed.success ? parsed.data : draft}
          baseRevision={base.revision}
          title={study.title}
          onLoadTheirs={loadTheirs}
          onKeepMineAsCopy={keepMineAsCopy}
          onClose={() => setConflict(null)}
        />
        <LeaveGuard dirty={dirty && !readOnly} allowRef={allowLeave} />
      </div>
    </EditorContext.Provider>
  );
}
