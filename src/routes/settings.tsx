import { Card } from '../components/Card';
import { Loading, Page } from '../components/Page';
import { ChangePasswordForm } from '../features/auth/components/ChangePasswordForm';
import { ProfileForm } from '../features/auth/components/ProfileForm';
import { UnitSystemForm } from '../features/auth/components/UnitSystemForm';
import { useMe } from '../lib/session';

export function SettingsRoute() {
  const me = useMe();
  if (!me.data) return <Loading />;
  const { user } = me.data;
  return (
    <Page title="Account settings" description="Your name, the units Spoolbook shows, and your password." width="narrow">
      <Card title="Profile">
        <ProfileForm user={user} />
      </Card>
      <Card title="Units">
        <p className="mb-4 text-sm text-ink-soft">Every page shows numbers in these units. Studies are stored in SI either way.</p>
        <UnitSystemForm value={user.unitSystem} />
      </Card>
      <Card title="Password">
        <ChangePasswordForm />
      </Card>
    </Page>
  );
}
