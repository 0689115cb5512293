import { Card } from '../components/Card';
import { Page } from '../components/Page';
import { SessionsList } from '../features/auth/components/SessionsList';

/** Where this account is signed in, and ending those sessions. */
export function SessionsRoute() {
  return (
    <Page title="Sessions" description="Every browser where this account is signed in. End any you do not recognise, then change your password." width="wide">
      <Card>
        <SessionsList />
      </Card>
    </Page>
  );
}
