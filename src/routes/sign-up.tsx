import { Link, useSearchParams } from 'react-router';
import { Card } from '../components/Card';
import { Page } from '../components/Page';
import { SignUpForm } from '../features/auth/components/SignUpForm';
import { paths } from '../lib/paths';

export function SignUpRoute() {
  const [searchParams] = useSearchParams();
  const next = searchParams.get('next');
  return (
    <Page title="Create an account" description="You get a personal team to keep your first studies in." width="form">
      <Card className="border-l-4 border-l-copper/60">
        <SignUpForm />
      </Card>
      <p className="text-sm text-ink-soft">
        Already have an account? <Link to={paths.signIn.href(next)}>Sign in</Link>.
      </p>
    </Page>
  );
}
