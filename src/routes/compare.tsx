import { useMemo } from 'react';
import { Link, useParams, useSearchParams } from 'react-router';
import type { StudyDocument } from '#shared/schemas/study';
import { readStudyDocument, studyMapIds } from '#shared/study/document';
import { Alert } from '../components/Alert';
import { buttonClass } from '../components/Button';
import { Loading, Page } from '../components/Page';
import { CompareView } from '../features/compare/components/CompareView';
import { selectionFromParam, selectionParam } from '../features/compare/selection';
import { useMapModels } from '../features/maps/api';
import { useStudy } from '../features/studies/api';
import { paths } from '../lib/paths';

function parseDocument(raw: unknown): StudyDocument | string {
  const read = readStudyDocument(raw);
  return read.ok ? read.document : read.message;
}

/** `/teams/:teamId/studies/:studyId/compare?lines=…`: Side by side of the saved study. */
export function CompareRoute() {
  const { teamId = '', studyId = '' } = useParams();
  const [searchParams, setSearchParams] = useSearchParams();
  const study = useStudy(teamId, studyId);
  const parsed = useMemo(() => (study.data ? parseDocument(study.data.document) : null), [study.data]);
  const document = parsed !== null && typeof parsed !== 'string' ? parsed : null;
  // Compressor maps, and the turbine maps of plans that have one (the engine needs both).
  const maps = useMapModels(teamId, document ? studyMapIds(document.plans) : []);
  const selection = useMemo(() => (document ? selectionFromParam(searchParams.get('lines'), document) : []), [document, searchParams]);

  const title = study.data ? `Side by side: ${study.data.title}` : 'Side by side';
  const actions = (
    <>
      <Link to={paths.teamStudy.href(teamId, studyId)} className={buttonClass('secondary')}>
        Back to the study
      </Link>
      <Link to={paths.teamStudyReport.href(teamId, studyId)} className={buttonClass('secondary')}>
        Printable report
      </Link>
    </>
  );
  return (
    <Page
      title={title}
      eyebrow="Side by side"
      description="Two to four plan and scenario combinations of this study on one compressor map and in one table of differences, the best of each figure marked. It compares the saved revision."
      actions={actions}
    >
      {study.isPending || (document && maps.loading) ? (
        <Loading label="Loading the study and its maps…" />
      ) : study.error ? (
        <Alert tone="error" title="The study could not be loaded">
          {study.error.message}
        </Alert>
      ) : !document ? (
        <Alert tone="error" title="The saved study does not read">
          {typeof parsed === 'string' ? parsed : 'No study.'}
        </Alert>
      ) : (
        <>
          {maps.errors.length > 0 && (
            <Alert tone="error" title="Some maps could not be loaded">
              {maps.errors.map((e) => `${e.mapId}: ${e.message}`).join(' ')} Their plans are computed without a map.
            </Alert>
          )}
          <CompareView
            document={document}
            mapsById={maps.mapsById}
            mapNames={maps.namesById}
            selection={selection}
            onSelectionChange={(keys) =>
              setSearchParams(
                (prev) => {
                  const next = new URLSearchParams(prev);
                  next.set('lines', selectionParam(keys));
                  return next;
                },
                { replace: true },
              )
            }
          />
        </>
      )}
    </Page>
  );
}
