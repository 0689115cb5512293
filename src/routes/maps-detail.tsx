import { useNavigate, useParams } from 'react-router';
import { MapView } from '../features/maps/components/MapView';
import { paths } from '../lib/paths';

/** `/teams/:teamId/maps/:mapId`: one map of the library. */
export function MapsDetailRoute() {
  const { teamId = '', mapId = '' } = useParams();
  const navigate = useNavigate();
  return <MapView key={`${teamId}/${mapId}`} teamId={teamId} mapId={mapId} onDeleted={() => navigate(paths.teamMaps.href(teamId), { replace: true })} />;
}
