import { useSearchParams } from 'react-router';
import { Card } from '../components/Card';
import { Page } from '../components/Page';
import { ResetPasswordForm } from '../features/auth/components/ResetPasswordForm';

/** The page the reset mail links to: `/reset-password?token=…`. */
export function ResetPasswordRoute() {
  const [searchParams] = useSearchParams();
  return (
    <Page title="Choose a new password" width="form">
      <Card className="border-l-4 border-l-copper/60">
        <ResetPasswordForm token={searchParams.get('token') ?? ''} />
      </Card>
    </Page>
  );
}
