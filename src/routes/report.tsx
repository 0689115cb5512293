import '../styles/print.css';
import { useMemo } from 'react';
import { useParams } from 'react-router';
import { readStudyDocument, studyMapIds } from '#shared/study/document';
import { Alert } from '../components/Alert';
import { Loading, Page } from '../components/Page';
import { StudyReport } from '../features/report/components/StudyReport';
import { useMapModels } from '../features/maps/api';
import { useStudy } from '../features/studies/api';
import { paths } from '../lib/paths';

/** `/teams/:teamId/studies/:studyId/report`: the saved study as a report made for printing. */
export function ReportRoute() {
  const { teamId = '', studyId = '' } = useParams();
  const study = useStudy(teamId, studyId);
  const parsed = useMemo(() => (study.data ? readStudyDocument(study.data.document) : null), [study.data]);
  const mapIds = parsed?.ok ? studyMapIds(parsed.document.plans) : [];
  const maps = useMapModels(teamId, mapIds);

  if (study.isPending || (parsed?.ok && maps.loading)) return <Loading label="Preparing the report…" />;
  if (study.error || !parsed || !parsed.ok) {
    return (
      <main className="px-4 py-10">
        <Page title="The report could not be made" width="narrow">
          <Alert tone="error">
            {study.error ? study.error.message : parsed && !parsed.ok ? `The saved study does not read: ${parsed.message}` : 'No study.'}
          </Alert>
        </Page>
      </main>
    );
  }
  return (
    <div>
      {maps.errors.length > 0 && (
        <div className="report-toolbar mx-auto max-w-3xl px-4 pt-4">
          <Alert tone="error" title="Some maps could not be loaded">
            {maps.errors.map((e) => `${e.mapId}: ${e.message}`).join(' ')} Their plans are computed without a map.
          </Alert>
        </div>
      )}
      <StudyReport
        data={{
          title: study.data.title,
          revision: study.data.revision,
          updatedAt: study.data.updatedAt,
          document: parsed.document,
          mapsById: maps.mapsById,
          mapNames: maps.namesById,
        }}

        backHref={paths.teamStudy.href(teamId, studyId)}
        backLabel="Back to the study"
      />
    </div>
  );
}
