import { Link, useParams } from 'react-router';
import { buttonClass } from '../components/Button';
import { Page } from '../components/Page';
import { LogsPage } from '../features/logs/components/LogsPage';
import { paths } from '../lib/paths';

/** `/teams/:teamId/studies/:studyId/logs`: the study's logged runs beside its prediction. */
export function StudyLogsRoute() {
  const { teamId = '', studyId = '' } = useParams();
  return (
    <Page
      title="Logged runs"
      eyebrow="Study"
      width="wide"
      description="Logs from the car set beside the prediction: where the engine really runs on the compressor map, how far that is from the plan, and the volumetric efficiency the logs say the engine has."
      actions={
        <Link to={paths.teamStudy.href(teamId, studyId)} className={buttonClass('secondary')}>
          Back to the study
        </Link>
      }
    >
      <LogsPage key={`${teamId}/${studyId}`} teamId={teamId} studyId={studyId} />
    </Page>
  );
}
