import { Card } from '../components/Card';
import { Page } from '../components/Page';
import { OutboxList } from '../features/admin/components/OutboxList';

export function AdminOutboxRoute() {
  return (
    <Page eyebrow="Site admin" title="Outbox" description="Mail the server has sent, captured locally so you can follow reset and invitation links.">
      <Card>
        <OutboxList />
      </Card>
    </Page>
  );
}
