import { Card } from '../components/Card';
import { Page } from '../components/Page';
import { UsersTable } from '../features/admin/components/UsersTable';

export function AdminUsersRoute() {
  return (
    <Page
      eyebrow="Site admin"
      title="Users"
      description="Every account on this Spoolbook site: whether its address is confirmed, whether it uses a second factor, and where it is signed in."
    >
      <Card>
        <UsersTable />
      </Card>
    </Page>
  );
}
