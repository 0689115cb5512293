import { useParams } from 'react-router';
import { MapLibrary } from '../features/maps/components/MapLibrary';

/** `/teams/:teamId/maps`: the team's map library. */
export function MapsLibraryRoute() {
  const { teamId = '' } = useParams();
  return <MapLibrary key={teamId} teamId={teamId} />;
}
