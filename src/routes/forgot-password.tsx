import { Link } from 'react-router';
import { Card } from '../components/Card';
import { Page } from '../components/Page';
import { ForgotPasswordForm } from '../features/auth/components/ForgotPasswordForm';
import { paths } from '../lib/paths';

export function ForgotPasswordRoute() {
  return (
    <Page title="Forgotten password" description="We will mail you a link to choose a new one." width="form">
      <Card className="border-l-4 border-l-copper/60">
        <ForgotPasswordForm />
      </Card>
      <p className="text-sm text-ink-soft">
        Remembered it? <Link to={paths.signIn.href()}>Sign in</Link>.
      </p>
    </Page>
  );
}
