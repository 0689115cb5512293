import { useState } from 'react';
import { Link } from 'react-router';
import { Alert } from '#src/components/Alert';
import { Badge } from '#src/components/Badge';
import { ButtonLink } from '#src/components/Button';
import { Card } from '#src/components/Card';
import { Loading, Page } from '#src/components/Page';
import { SecondFactorNeededPage } from '#src/components/SecondFactorNotice';
import { isApiError, isTwoFactorRequired } from '#src/lib/api-client';
import { paths } from '#src/lib/paths';
import { useMaps } from '../api/get-maps';
import { useTeamAccess } from '#src/lib/team-access';
import { KindFilter, type KindChoice } from './KindFilter';
import { MapTable } from './MapTable';
import { MapUpload } from './MapUpload';

/**
 * A team's map library: its own maps, the built-in demo maps, and (for editors and owners) the
 * upload. Viewers see no upload at all.
 */
export function MapLibrary({ teamId }: { teamId: string }) {
  const maps = useMaps(teamId);
  const access = useTeamAccess(teamId);
  const { teamName } = access;
  const canEdit = access.can('content:write');
  const [kind, setKind] = useState<KindChoice>('all');

  if (isTwoFactorRequired(maps.error)) return <SecondFactorNeededPage title="Map library" teamName={teamName} />;
  if (maps.isError) {
    const missing = isApiError(maps.error) && (maps.error.status === 404 || maps.error.status === 403);
    return (
      <Page title={missing ? 'Map library not found' : 'Map library'}>
        <Alert tone="error" title={missing ? 'This team does not exist, or you are not a member of it.' : 'Could not load the map library.'}>
          {!missing && <p>{maps.error.message}</p>}
          <p>
            <Link to={paths.teams.href()}>Your teams</Link>
          </p>
        </Alert>
      </Page>
    );
  }

  const shown = (maps.data ?? []).filter((m) => kind === 'all' || m.kind === kind);
  const own = shown.filter((m) => !m.builtin);
  const demo = shown.filter((m) => m.builtin);
  const kindWords = kind === 'all' ? 'maps' : `${kind} maps`;

  return (
    <Page
      eyebrow={teamName ?? 'Team'}
      title="Map library"
      actions={canEdit ? <ButtonLink to={paths.teamTracer.href(teamId)}>Trace a picture</ButtonLink> : undefined}
      description="The team’s compressor and turbine maps, and built-in demo maps to try Spoolbook with. Open a map to see it drawn."
    >
      {canEdit && (
        <Card title="Add a map">
          <MapUpload teamId={teamId} />
        </Card>
      )}

      <div className="flex flex-wrap items-center justify-between gap-3">
        <KindFilter value={kind} onChange={setKind} />
        {!canEdit && <p className="text-sm text-ink-soft">You can read this team’s maps; editors and owners add and change them.</p>}
      </div>

      <Card title="Team maps" actions={maps.data ? <Badge>{own.length}</Badge> : undefined}>
        {maps.isPending ? (
          <Loading label="Loading the map library…" />
        ) : own.length > 0 ? (
          <MapTable teamId={teamId} maps={own} caption="The team's maps" showUpdated />
        ) : (
          <p className="text-sm text-ink-soft">
            No {kindWords} of this team yet.{canEdit ? ' Add one above, or start from a demo map below.' : ''}
          </p>
        )}
      </Card>

      <Card title="Built-in demo maps" actions={<Badge tone="copper">Invented, for trying Spoolbook</Badge>}>
        <p className="mb-3 text-sm text-ink-soft">
          Made by Spoolbook from a simple physical model of a compressor or turbine. They describe no real product: do not choose hardware from them.
        </p>
        {maps.isPending ? (
          <Loading label="Loading the demo maps…" />
        ) : demo.length > 0 ? (
          <MapTable teamId={teamId} maps={demo} caption="Built-in demo maps" showUpdated={false} />
        ) : (
          <p className="text-sm text-ink-soft">No demo {kindWords}.</p>
        )}
      </Card>
    </Page>
  );
}
