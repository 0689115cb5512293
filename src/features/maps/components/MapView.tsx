import { Link } from 'react-router';
import { Alert } from '#src/components/Alert';
import { Badge } from '#src/components/Badge';
import { buttonClass } from '#src/components/Button';
import { Card } from '#src/components/Card';
import { Loading, Page } from '#src/components/Page';
import { SecondFactorNeededPage } from '#src/components/SecondFactorNotice';
import { isApiError, isTwoFactorRequired } from '#src/lib/api-client';
import { formatDateTime } from '#src/lib/format';
import { paths } from '#src/lib/paths';
import { useMap } from '../api/get-map';
import { mapFileHref } from '../api/map-file';
import type { MapDetail } from '../api/schemas';
import { useTeamAccess } from '#src/lib/team-access';
import { mapKindNames } from '../utils/map-facts';
import { DeleteMap } from './DeleteMap';
import { MapDetailsForm } from './MapDetailsForm';
import { MapFacts } from './MapFacts';
import { MapPlot } from './MapPlot';

/** One map of the library: drawn, described, downloadable; named, annotated and deleted by editors. */
export function MapView({ teamId, mapId, onDeleted }: { teamId: string; mapId: string; onDeleted: () => void }) {
  const map = useMap(teamId, mapId);
  const { teamName } = useTeamAccess(teamId);
  if (map.isPending) return <Loading label="Loading the map…" />;
  if (isTwoFactorRequired(map.error)) return <SecondFactorNeededPage title="Map" teamName={teamName} />;
  if (map.isError) {
    const missing = isApiError(map.error) && (map.error.status === 404 || map.error.status === 403);
    return (
      <Page title={missing ? 'Map not found' : 'Map'}>
        <Alert tone="error" title={missing ? 'This map does not exist, or it is not in a team of yours.' : 'Could not load the map.'}>
          {!missing && <p>{map.error.message}</p>}
          <p>
            <Link to={paths.teamMaps.href(teamId)}>Back to the map library</Link>
          </p>
        </Alert>
      </Page>
    );
  }
  return <MapDetailView teamId={teamId} detail={map.data} onDeleted={onDeleted} />;
}

function MapDetailView({ teamId, detail, onDeleted }: { teamId: string; detail: MapDetail; onDeleted: () => void }) {
  const access = useTeamAccess(teamId);
  const { teamName } = access;
  const editable = access.can('content:write') && !detail.builtin;
  const extra = [
    { term: 'File', value: detail.fileName },
    ...(detail.builtin ? [] : [{ term: 'Revision', value: String(detail.revision) }]),
    ...(detail.createdBy ? [{ term: 'Uploaded by', value: detail.createdBy }] : []),
    ...(detail.updatedAt ? [{ term: 'Last changed', value: formatDateTime(detail.updatedAt) }] : []),
  ];

  return (
    <Page
      eyebrow={
        <>
          <Link to={paths.teamMaps.href(teamId)} className="text-copper-ink">
            {teamName ? `${teamName} · Map library` : 'Map library'}
          </Link>{' '}
          · {mapKindNames[detail.kind]}
        </>
      }
      title={detail.name}
      actions={
        <>
          {detail.builtin && <Badge tone="copper">Built-in demo map</Badge>}
          <a href={mapFileHref(teamId, detail.id)} download className={buttonClass('secondary')}>
            Download CSV
          </a>
        </>
      }
    >
      {detail.builtin && (
        <Alert tone="info">
          Invented for Spoolbook from a simple physical model; it describes no real product. Demo maps cannot be changed: download one and add it to the library
          as your own to rename or annotate it.
        </Alert>
      )}

      <Card>
        <MapPlot map={detail.map} />
      </Card>

      <div className="grid gap-6 lg:grid-cols-2">
        <Card title="What the map holds">
          <MapFacts map={detail.map} extra={extra} />
        </Card>
        {editable ? (
          <Card title="Name and notes">
            <MapDetailsForm key={detail.id} teamId={teamId} map={detail} />
          </Card>
        ) : (
          <Card title="Notes">
            {detail.notes.trim() ? <p className="whitespace-pre-line text-sm text-ink">{detail.notes}</p> : <p className="text-sm text-ink-soft">No notes.</p>}
          </Card>
        )}
      </div>

      {editable && (
        <Card title="Delete">
          <div className="flex flex-wrap items-center gap-4">
            <DeleteMap teamId={teamId} mapId={detail.id} mapName={detail.name} onDeleted={onDeleted} />
            <p className="text-sm text-ink-soft">Refused while a study’s plan uses the map.</p>
          </div>
        </Card>
      )}
    </Page>
  );
}
