import { Link } from 'react-router';
import { Card } from '../components/Card';
import { Loading, Page } from '../components/Page';
import { ChangePasswordForm } from '../features/auth/components/ChangePasswordForm';
import { ConfirmEmailNotice } from '../features/auth/components/ConfirmEmailNotice';
import { ProfileForm } from '../features/auth/components/ProfileForm';
import { TwoFactorSettings } from '../features/auth/components/TwoFactorSettings';
import { UnitSystemForm } from '../features/auth/components/UnitSystemForm';
import { paths } from '../lib/paths';
import { useMe } from '../lib/session';

export function SettingsRoute() {
  const me = useMe();
  if (!me.data) return <Loading />;
  const { user } = me.data;
  return (
    <Page title="Account settings" description="Your name, the units Spoolbook shows, your password and how you sign in." width="narrow">
      {!user.emailConfirmed && <ConfirmEmailNotice email={user.email} />}
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
      <Card title="Second factor">
        <TwoFactorSettings />
      </Card>
      <Card title="Sessions">
        <p className="text-sm text-ink-soft">
          See every browser where you are signed in, and end the ones you do not use. <Link to={paths.sessions.href()}>Open your sessions</Link>
        </p>
      </Card>
    </Page>
  );
}
