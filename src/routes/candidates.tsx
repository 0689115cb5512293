import { useMemo, useState } from 'react';
import { Link, useParams } from 'react-router';
import { withCandidatePlan } from '#shared/candidates';
import { readStudyDocument } from '#shared/study/document';
import { Alert } from '../components/Alert';
import { buttonClass } from '../components/Button';
import { Loading, Page } from '../components/Page';
import { CandidatesView } from '../features/candidates/components/CandidatesView';
import { staleRevisionOf, useSaveStudy, useStudy } from '../features/studies/api';
import { paths } from '../lib/paths';
import { useUnitSystem } from '../lib/quantities';

/** `/teams/:teamId/studies/:studyId/candidates`: every map of the library ranked against the saved study. */
export function CandidatesRoute() {
  const { teamId = '', studyId = '' } = useParams();
  const study = useStudy(teamId, studyId);
  const save = useSaveStudy(teamId, studyId);
  const system = useUnitSystem();
  const read = useMemo(() => (study.data ? readStudyDocument(study.data.document) : null), [study.data]);
  const document = read?.ok ? read.document : null;
  const [adding, setAdding] = useState<string | null>(null);
  const [added, setAdded] = useState<{ mapName: string; revision: number } | null>(null);
  const [problem, setProblem] = useState<string | null>(null);

  const addPlan = (candidate: { mapId: string; mapName: string }) => {
    if (!study.data || !document) return;
    const next = withCandidatePlan(document, candidate);
    if (!next.ok) {
      setProblem(next.message);
      return;
    }
    setAdding(candidate.mapId);
    setProblem(null);
    save.mutate(
      { baseRevision: study.data.revision, document: next.document, message: `Added ${candidate.mapName} as a plan from Candidates` },
      {
        onSuccess: (saved) => setAdded({ mapName: candidate.mapName, revision: saved.revision }),
        onError: (err) =>
          setProblem(
            staleRevisionOf(err)
              ? 'Someone saved this study since you opened it: reload the page to rank against their revision, then add the plan again.'
              : err.message,
          ),
        onSettled: () => setAdding(null),
      },
    );
  };

  const title = study.data ? `Candidates: ${study.data.title}` : 'Candidates';
  return (
    <Page
      title={title}
      eyebrow="Candidates"
      description="Every compressor map of your library and the built-in ones, judged against this study's engine, scenarios, boost rows and required margins, what fits first; and turbine housings for a chosen compressor. It ranks the saved revision."
      actions={
        <Link to={paths.teamStudy.href(teamId, studyId)} className={buttonClass('secondary')}>
          Back to the study
        </Link>
      }
    >
      {study.isPending ? (
        <Loading label="Loading the study…" />
      ) : study.error ? (
        <Alert tone="error" title="The study could not be loaded">
          {study.error.message}
        </Alert>
      ) : !document ? (
        <Alert tone="error" title="The saved study does not read">
          {read && !read.ok ? read.message : 'No study.'}
        </Alert>
      ) : (
        <>
          {added && (
            <Alert tone="success" title={`${added.mapName} is now a plan of the study`}>
              Saved as revision {added.revision}.{' '}
              <Link className="underline" to={paths.teamStudy.href(teamId, studyId)}>
                Open the study
              </Link>{' '}
              to see its verdict, map and Working.
            </Alert>
          )}
          {problem && (
            <Alert tone="error" title="The plan was not added">
              {problem}
            </Alert>
          )}
          <CandidatesView teamId={teamId} document={document} system={system} canEdit={study.data.canEdit} onAddPlan={addPlan} adding={adding} />
          <p className="text-xs text-ink-soft">
            Results are estimates from a quasi-steady model, and maps marked “estimate” are scaled from another map, not measured. Turbochargers overspeed and
            burst and surge damages bearings: confirm the chosen hardware against its maker&apos;s published map and limits, dyno and data-logged testing, and
            qualified professionals.
          </p>
        </>
      )}
    </Page>
  );
}
