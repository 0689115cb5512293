import { useEffect, useRef } from 'react';
import { Link, useSearchParams } from 'react-router';
import { Alert } from '../components/Alert';
import { Card } from '../components/Card';
import { Loading, Page } from '../components/Page';
import { useConfirmEmail } from '../features/auth/api/security';
import { paths } from '../lib/paths';

/** The page the confirmation mail links to: `/confirm-email?token=…`. */
export function ConfirmEmailRoute() {
  const [searchParams] = useSearchParams();
  const token = searchParams.get('token') ?? '';
  const confirm = useConfirmEmail();
  const sent = useRef(false);
  useEffect(() => {
    if (sent.current || !token) return;
    sent.current = true;
    confirm.mutate(token);
  }, [token, confirm]);
  return (
    <Page title="Confirm your e-mail address" width="form">
      <Card>
        {confirm.isSuccess ? (
          <Alert tone="success" title="Address confirmed">
            {confirm.data.email} is confirmed. You can now create teams, join them and invite people. <Link to={paths.teams.href()}>Go to your teams</Link>.
          </Alert>
        ) : confirm.isError || !token ? (
          <Alert tone="error" title="This link does not work">
            {confirm.error ? (confirm.error as Error).message : 'The link has no token.'} <Link to={paths.settings.href()}>Settings</Link> can send a new one.
          </Alert>
        ) : (
          <Loading label="Confirming…" />
        )}
      </Card>
    </Page>
  );
}
