import { useMemo } from 'react';
import { Link, useParams } from 'react-router';
import { readStudyDocument, studyMapIds } from '#shared/study/document';
import { Alert } from '../components/Alert';
import { buttonClass } from '../components/Button';
import { Loading, Page } from '../components/Page';
import { DriveView } from '../features/drive/components/DriveView';
import { useMapModels } from '../features/maps/api';
import { useStudy } from '../features/studies/api';
import { paths } from '../lib/paths';
import { useUnitSystem } from '../lib/quantities';

/** `/teams/:teamId/studies/:studyId/drive`: the study's car, the force it can put down, usable boost, time to boost. */
export function DriveRoute() {
  const { teamId = '', studyId = '' } = useParams();
  const study = useStudy(teamId, studyId);
  const system = useUnitSystem();
  const read = useMemo(() => (study.data ? readStudyDocument(study.data.document) : null), [study.data]);
  const document = read?.ok ? read.document : null;
  const maps = useMapModels(teamId, document ? studyMapIds(document.plans) : []);
  const title = study.data ? `Drive: ${study.data.title}` : 'Drive';
  return (
    <Page
      title={title}
      eyebrow="Drive"
      description="The car the engine drives: force at the wheels per gear beside what the tyres can pass, the boost they can use, time to boost and an acceleration run for each plan. It works on the saved revision; what it writes is saved as a new one."
      actions={
        <Link to={paths.teamStudy.href(teamId, studyId)} className={buttonClass('secondary')}>
          Back to the study
        </Link>
      }
    >
      {study.isPending || (document && maps.loading) ? (
        <Loading label="Loading the study and its maps…" />
      ) : study.error ? (
        <Alert tone="error" title="The study could not be loaded">
          {study.error.message}
        </Alert>
      ) : !document || !study.data ? (
        <Alert tone="error" title="The saved study does not read">
          {read && !read.ok ? read.message : 'No study.'}
        </Alert>
      ) : (
        <DriveView teamId={teamId} study={study.data} document={document} mapsById={maps.mapsById} system={system} />
      )}
    </Page>
  );
}
