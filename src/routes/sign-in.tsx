import { Link, useSearchParams } from 'react-router';
import { Card } from '../components/Card';
import { Page } from '../components/Page';
import { SignInForm } from '../features/auth/components/SignInForm';
import { paths } from '../lib/paths';

export function SignInRoute() {
  const [searchParams] = useSearchParams();
  const next = searchParams.get('next');
  return (
    <Page title="Sign in" description="Your studies, maps and team are waiting." width="form">
      <Card className="border-l-4 border-l-copper/60">
        <SignInForm />
      </Card>
      <p className="text-sm text-ink-soft">
        New to Spoolbook? <Link to={paths.signUp.href(next)}>Create an account</Link>.
      </p>
    </Page>
  );
}
