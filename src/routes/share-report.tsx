import '../styles/print.css';
import { useParams, useSearchParams } from 'react-router';
import { Alert } from '../components/Alert';
import { Loading } from '../components/Page';
import { StudyReport } from '../features/report/components/StudyReport';
import { isLinkGone, useSharedStudy } from '../features/share/api/get-shared-study';
import { LinkGone, SharedPage } from '../features/share/components/SharedPage';
import { paths } from '../lib/paths';
import { UnitSystemProvider, useUnitSystem } from '../lib/quantities';

/** `/share/:token/report`: the printable report of a shared study. */
export function ShareReportRoute() {
  const { token = '' } = useParams();
  const shared = useSharedStudy(token);
  const [searchParams] = useSearchParams();
  const userSystem = useUnitSystem();
  // The shared view passes on the units its reader chose (they may have no account to remember them).
  const asked = searchParams.get('units');
  const system = asked === 'si' || asked === 'us' ? asked : userSystem;
  if (shared.isPending) return <Loading label="Opening the shared study…" />;
  if (shared.error) {
    return (
      <SharedPage>
        {isLinkGone(shared.error) ? (
          <LinkGone />
        ) : (
          <Alert tone="error" title="The shared study could not be opened">
            {shared.error.message}
          </Alert>
        )}
      </SharedPage>
    );
  }
  return (
    <UnitSystemProvider system={system}>
      <StudyReport data={shared.data} backHref={paths.share.href(token)} backLabel="Back to the shared study" source="A read-only share link" />
    </UnitSystemProvider>
  );
}
