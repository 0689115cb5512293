import { Link } from 'react-router';
import { Alert } from '../components/Alert';
import { Card } from '../components/Card';
import { Loading, Page } from '../components/Page';
import { ChangePasswordForm } from '../features/auth/components/ChangePasswordForm';
import { ConfirmEmailNotice } from '../features/auth/components/ConfirmEmailNotice';
import { ProfileForm } from '../features/auth/components/ProfileForm';
import { TwoFactorSettings } from '../features/auth/components/TwoFactorSettings';
import { UnitSystemForm } from '../features/auth/components/UnitSystemForm';
import { paths } from '../lib/paths';
import { useMe } from '../lib/session';
import { askingTitle, teamsAskingForSecondFactor } from '../lib/two-factor-rule';

export function SettingsRoute() {
  const me = useMe();
  if (!me.data) return <Loading />;
  const { user } = me.data;
  const asking = teamsAskingForSecondFactor(me.data);
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
      <Card title="Second factor" id="second-factor" className="scroll-mt-6">
        {asking.length > 0 && (
          <Alert tone="info" title={askingTitle(asking)} className="mb-4">
            Set it up here; {asking.length === 1 ? 'the team opens' : 'the teams open'} to you again as soon as it is on.
          </Alert>
        )}
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
