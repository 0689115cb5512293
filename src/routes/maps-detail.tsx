import { useNavigate, useParams } from 'react-router';
import { FamilyPanel } from '../features/candidates/components/FamilyPanel';
import { MapView } from '../features/maps/components/MapView';
import { useTeamAccess } from '../lib/team-access';
import { paths } from '../lib/paths';

/** `/teams/:teamId/maps/:mapId`: one map of the library (and, for a compressor map, a family member made from it). */
export function MapsDetailRoute() {
  const { teamId = '', mapId = '' } = useParams();
  const navigate = useNavigate();
  const canEdit = useTeamAccess(teamId).can('content:write');
  return (
    <>
      <MapView key={`${teamId}/${mapId}`} teamId={teamId} mapId={mapId} onDeleted={() => navigate(paths.teamMaps.href(teamId), { replace: true })} />
      <div className="mx-auto mt-6 w-full max-w-5xl">
        <FamilyPanel key={`${teamId}/${mapId}`} teamId={teamId} mapId={mapId} canEdit={canEdit} />
      </div>
    </>
  );
}
