import { Page } from '../components/Page';
import { useDemoMap } from '../features/learn/api/get-demo-map';
import { LearnLesson } from '../features/learn/components/LearnLesson';
import { useCurrentTeamId } from '../lib/current-team';

/** Learn: corrected flow and pressure ratio, taught with a live example on a built-in demo map. */
export function LearnRoute() {
  const teamId = useCurrentTeamId();
  const map = useDemoMap(teamId);
  const mapError = teamId === null ? 'You are in no team, so the map library cannot be reached.' : map.error ? map.error.message : null;
  return (
    <Page
      title="Learn: corrected flow and pressure ratio"
      eyebrow="Learn"
      description="Follow each number from the outside air to the point on the compressor map: air density, mass flow, corrected flow, pressure ratio and outlet temperature, with the formulas and where they come from."
    >
      <LearnLesson map={map.data ?? null} mapLoading={teamId !== null && map.isPending} mapError={mapError} />
    </Page>
  );
}
