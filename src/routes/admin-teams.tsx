import { Card } from '../components/Card';
import { Page } from '../components/Page';
import { AllTeamsTable } from '../features/admin/components/AllTeamsTable';

export function AdminTeamsRoute() {
  return (
    <Page eyebrow="Site admin" title="All teams" description="Every team on this Spoolbook site, including ones you are not a member of.">
      <Card>
        <AllTeamsTable />
      </Card>
    </Page>
  );
}
