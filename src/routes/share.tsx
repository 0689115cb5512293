import { useState } from 'react';
import { Link, useParams } from 'react-router';
import { Alert } from '../components/Alert';
import { Badge } from '../components/Badge';
import { buttonClass } from '../components/Button';
import { Loading, useDocumentTitle } from '../components/Page';
import { ReadOnlyStudyView } from '../features/report/components/ReadOnlyStudyView';
import { isLinkGone, sharedResultsCsvHref, useSharedStudy } from '../features/share/api/get-shared-study';
import { LinkGone, SharedPage, ViewerUnitSwitch } from '../features/share/components/SharedPage';
import { formatDateTime } from '../lib/format';
import { paths } from '../lib/paths';
import { UnitSystemProvider, useUnitSystem, type UnitSystem } from '../lib/quantities';

/** `/share/:token`: a study opened through a share link, signed in or not. Nothing here can change it. */
export function ShareRoute() {
  const { token = '' } = useParams();
  const shared = useSharedStudy(token);
  const userSystem = useUnitSystem();
  const [chosen, setChosen] = useState<UnitSystem | null>(null);
  const system = chosen ?? userSystem;
  useDocumentTitle(shared.data ? `${shared.data.title} (shared)` : 'Shared study');

  if (shared.isPending) {
    return (
      <SharedPage>
        <Loading label="Opening the shared study…" />
      </SharedPage>
    );
  }
  if (shared.error) {
    return (
      <SharedPage>
        {isLinkGone(shared.error) ? (
          <LinkGone />
        ) : (
          <div className="mx-auto max-w-xl">
            <Alert tone="error" title="The shared study could not be opened">
              {shared.error.message}
            </Alert>
          </div>
        )}
      </SharedPage>
    );
  }
  const data = shared.data;
  return (
    <SharedPage end={<ViewerUnitSwitch value={system} onChange={setChosen} />}>
      <div className="mx-auto w-full max-w-7xl space-y-6">
        <header className="flex flex-wrap items-end justify-between gap-4 border-b border-ink/15 pb-4">
          <div className="space-y-1">
            <p className="flex items-center gap-2 text-xs font-semibold uppercase tracking-[0.14em] text-copper-ink">
              Shared study <Badge tone="teal">Read-only</Badge>
            </p>
            <h1 className="text-3xl font-semibold tracking-tight text-ink">{data.title}</h1>
            <p className="text-ink-soft">
              Revision {data.revision}, saved {formatDateTime(data.updatedAt)}
              {data.document.engineLabel ? ` · ${data.document.engineLabel}` : ''}
            </p>
          </div>
          <div className="flex flex-wrap gap-2">
            <Link to={`${paths.shareReport.href(token)}?units=${system}`} className={buttonClass('secondary')}>
              Printable report
            </Link>
            <a href={sharedResultsCsvHref(token)} className={buttonClass('secondary')} download>
              Results as CSV
            </a>
          </div>
        </header>
        <UnitSystemProvider system={system}>
          <ReadOnlyStudyView data={data} />
        </UnitSystemProvider>
      </div>
    </SharedPage>
  );
}
